/*
 * Reads an EDF+ file with EDFlib (the independent reader) and prints, as JSON, what EDFlib sees:
 * file type, record layout, each signal's header and physical samples, and all annotations.
 * Usage: read_with_edflib IN.edf OUT.json
 */
#include <stdio.h>
#include <stdlib.h>
#include <edflib.h>

int main(int argc, char **argv)
{
    if (argc != 3) { fprintf(stderr, "usage: %s IN.edf OUT.json\n", argv[0]); return 2; }
    struct edf_hdr_struct h;
    if (edfopen_file_readonly(argv[1], &h, EDFLIB_READ_ALL_ANNOTATIONS)) { fprintf(stderr, "open failed: %d\n", h.filetype); return 1; }
    FILE *f = fopen(argv[2], "w");
    if (!f) return 1;
    fprintf(f, "{\n  \"reader\": \"EDFlib\",\n  \"edflib_version\": %d,\n  \"filetype\": %d,\n", edflib_version(), h.filetype);
    fprintf(f, "  \"records\": %lld,\n  \"record_duration_100ns\": %lld,\n  \"signals\": [\n", h.datarecords_in_file, h.datarecord_duration);
    for (int s = 0; s < h.edfsignals; s++) {
        struct edf_param_struct *p = &h.signalparam[s];
        long long n = p->smp_in_file;
        double *buf = malloc(sizeof(double) * (size_t)n);
        if (!buf || edfread_physical_samples(h.handle, s, (int)n, buf) != n) { fprintf(stderr, "read failed\n"); return 1; }
        fprintf(f, "    {\"label\": \"%s\", \"unit\": \"%s\", \"physical_min\": %.17g, \"physical_max\": %.17g,\n",
                p->label, p->physdimension, p->phys_min, p->phys_max);
        fprintf(f, "     \"digital_min\": %d, \"digital_max\": %d, \"samples_per_record\": %d,\n     \"physical\": [",
                p->dig_min, p->dig_max, p->smp_in_datarecord);
        for (long long i = 0; i < n; i++) fprintf(f, "%s%.17g", i ? ", " : "", buf[i]);
        fprintf(f, "]}%s\n", s + 1 < h.edfsignals ? "," : "");
        free(buf);
    }
    fprintf(f, "  ],\n  \"annotations\": [\n");
    for (long long a = 0; a < h.annotations_in_file; a++) {
        struct edf_annotation_struct an;
        if (edf_get_annotation(h.handle, (int)a, &an)) return 1;
        fprintf(f, "    {\"onset_100ns\": %lld, \"duration\": \"%s\", \"text\": \"%s\"}%s\n", an.onset, an.duration,
                an.annotation, a + 1 < h.annotations_in_file ? "," : "");
    }
    fprintf(f, "  ]\n}\n");
    fclose(f);
    edfclose_file(h.handle);
    return 0;
}
