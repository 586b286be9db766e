/* Measures the floating-point rate of OpenBLAS dgemm/zgemm on this machine: a large square product (the practical
 * FP64 peak) and products of the shape the pairwise kernels compute per time point. See README.md beside this file.
 * Usage: gemm_peak [threads] [channels] [trials] */
#include <cblas.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

extern void openblas_set_num_threads(int);
extern char *openblas_get_corename(void);

static double now(void) {
    struct timespec t;
    clock_gettime(CLOCK_MONOTONIC, &t);
    return t.tv_sec + 1e-9 * t.tv_nsec;
}

static int compare(const void *a, const void *b) {
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

/* Median GFLOP/s of `repeats` timings, each of `inner` dgemm calls m x n x k. */
static double rate_dgemm(int m, int n, int k, int inner, int repeats) {
    double *a = malloc(sizeof(double) * m * k), *b = malloc(sizeof(double) * k * n), *c = malloc(sizeof(double) * m * n);
    for (long i = 0; i < (long)m * k; i++) a[i] = (double)(i % 17) / 17.0 - 0.5;
    for (long i = 0; i < (long)k * n; i++) b[i] = (double)(i % 13) / 13.0 - 0.5;
    double rates[64];
    cblas_dgemm(CblasRowMajor, CblasNoTrans, CblasTrans, m, n, k, 1.0, a, k, b, k, 0.0, c, n);
    for (int r = 0; r < repeats; r++) {
        double t0 = now();
        for (int i = 0; i < inner; i++)
            cblas_dgemm(CblasRowMajor, CblasNoTrans, CblasTrans, m, n, k, 1.0, a, k, b, k, 0.0, c, n);
        double seconds = (now() - t0) / inner;
        rates[r] = 2.0 * m * n * k / seconds / 1e9;
    }
    qsort(rates, repeats, sizeof(double), compare);
    free(a); free(b); free(c);
    return rates[repeats / 2];
}

/* Median GFLOP/s (8 real flops per complex multiply-add) of zgemm m x n x k, C = A * B^H. */
static double rate_zgemm(int m, int n, int k, int inner, int repeats) {
    double *a = malloc(sizeof(double) * 2 * m * k), *b = malloc(sizeof(double) * 2 * k * n), *c = malloc(sizeof(double) * 2 * m * n);
    for (long i = 0; i < 2L * m * k; i++) a[i] = (double)(i % 17) / 17.0 - 0.5;
    for (long i = 0; i < 2L * k * n; i++) b[i] = (double)(i % 13) / 13.0 - 0.5;
    double one[2] = {1, 0}, zero[2] = {0, 0}, rates[64];
    cblas_zgemm(CblasRowMajor, CblasNoTrans, CblasConjTrans, m, n, k, one, a, k, b, k, zero, c, n);
    for (int r = 0; r < repeats; r++) {
        double t0 = now();
        for (int i = 0; i < inner; i++)
            cblas_zgemm(CblasRowMajor, CblasNoTrans, CblasConjTrans, m, n, k, one, a, k, b, k, zero, c, n);
        double seconds = (now() - t0) / inner;
        rates[r] = 8.0 * m * n * k / seconds / 1e9;
    }
    qsort(rates, repeats, sizeof(double), compare);
    free(a); free(b); free(c);
    return rates[repeats / 2];
}

int main(int argc, char **argv) {
    int threads = argc > 1 ? atoi(argv[1]) : 1;
    int channels = argc > 2 ? atoi(argv[2]) : 64;
    int trials = argc > 3 ? atoi(argv[3]) : 100;
    openblas_set_num_threads(threads);
    printf("OpenBLAS core %s, %d thread(s)\n", openblas_get_corename(), threads);
    printf("dgemm 2000 x 2000 x 2000 (peak):                  %7.2f GFLOP/s\n", rate_dgemm(2000, 2000, 2000, 1, 7));
    printf("zgemm %3d x %3d x %3d (one time point, all pairs): %7.2f GFLOP/s\n", channels, channels, trials,
        rate_zgemm(channels, channels, trials, 2000, 7));
    printf("dgemm %3d x %3d x %3d (the same as one real product): %7.2f GFLOP/s\n", 2 * channels, 2 * channels, trials,
        rate_dgemm(2 * channels, 2 * channels, trials, 2000, 7));
    return 0;
}
