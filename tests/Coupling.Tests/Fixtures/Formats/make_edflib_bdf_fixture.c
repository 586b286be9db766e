/*
 * Writes a BDF+ fixture (24-bit samples) with EDFlib (the independent writer) and a JSON file with the digital values it
 * wrote. Two signals at 128 Hz in 1 s records, one using the whole 24-bit range and one a narrow range, and three
 * annotations. Usage: make_edflib_bdf_fixture OUT.bdf OUT.json
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <edflib.h>

#define RECORDS 4
#define SIGNALS 2
#define PER_RECORD 128

static const char *labels[SIGNALS] = {"EEG Oz", "EEG Pz"};
static const double phys_min[SIGNALS] = {-262144.0, -1000.0};
static const double phys_max[SIGNALS] = {262143.96875, 1000.0};
static const int dig_min[SIGNALS] = {-8388608, -100000};
static const int dig_max[SIGNALS] = {8388607, 100000};

struct note { long long onset; long long duration; const char *text; };
/* onset and duration in units of 100 microseconds (EDFlib convention); duration -1 = none */
static const struct note notes[] = {
    {5000, -1, "probe"},
    {17500, 2500, "target"},
    {30000, -1, "probe"},
};

/* digital value of sample n of signal s: a sine over most of the range, negative half the time */
static int digital(int s, int n)
{
    double x = sin(2.0 * M_PI * 6.0 * n / PER_RECORD + 0.3 * s) * (s == 0 ? 8000000.0 : 90000.0) + (n % 7) - 3;
    long d = lround(x);
    if (d < dig_min[s]) d = dig_min[s];
    if (d > dig_max[s]) d = dig_max[s];
    return (int)d;
}

int main(int argc, char **argv)
{
    if (argc != 3) { fprintf(stderr, "usage: %s OUT.bdf OUT.json\n", argv[0]); return 2; }
    int h = edfopen_file_writeonly(argv[1], EDFLIB_FILETYPE_BDFPLUS, SIGNALS);
    if (h < 0) { fprintf(stderr, "open failed: %d\n", h); return 1; }
    if (edf_set_startdatetime(h, 2022, 6, 7, 10, 11, 12)) return 1;
    for (int s = 0; s < SIGNALS; s++) {
        if (edf_set_samplefrequency(h, s, PER_RECORD)) return 1;
        if (edf_set_physical_minimum(h, s, phys_min[s])) return 1;
        if (edf_set_physical_maximum(h, s, phys_max[s])) return 1;
        if (edf_set_digital_minimum(h, s, dig_min[s])) return 1;
        if (edf_set_digital_maximum(h, s, dig_max[s])) return 1;
        if (edf_set_label(h, s, labels[s])) return 1;
        if (edf_set_physical_dimension(h, s, "uV")) return 1;
    }
    static int buf[PER_RECORD];
    for (int r = 0; r < RECORDS; r++)
        for (int s = 0; s < SIGNALS; s++) {
            for (int i = 0; i < PER_RECORD; i++) buf[i] = digital(s, r * PER_RECORD + i);
            if (edfwrite_digital_samples(h, buf)) { fprintf(stderr, "write failed\n"); return 1; }
        }
    int note_count = (int)(sizeof notes / sizeof notes[0]);
    for (int a = 0; a < note_count; a++)
        if (edfwrite_annotation_utf8(h, notes[a].onset, notes[a].duration, notes[a].text)) return 1;
    if (edfclose_file(h)) return 1;

    FILE *f = fopen(argv[2], "w");
    if (!f) return 1;
    fprintf(f, "{\n  \"writer\": \"EDFlib\",\n  \"edflib_version\": %d,\n  \"reserved\": \"BDF+C\",\n", edflib_version());
    fprintf(f, "  \"record_duration\": 1,\n  \"records\": %d,\n  \"signals\": [\n", RECORDS);
    for (int s = 0; s < SIGNALS; s++) {
        fprintf(f, "    {\"label\": \"%s\", \"physical_min\": %.17g, \"physical_max\": %.17g, \"digital_min\": %d, \"digital_max\": %d,\n",
                labels[s], phys_min[s], phys_max[s], dig_min[s], dig_max[s]);
        fprintf(f, "     \"samples_per_record\": %d,\n     \"digital\": [", PER_RECORD);
        for (int i = 0; i < RECORDS * PER_RECORD; i++) fprintf(f, "%s%d", i ? ", " : "", digital(s, i));
        fprintf(f, "]}%s\n", s + 1 < SIGNALS ? "," : "");
    }
    fprintf(f, "  ],\n  \"annotations\": [\n");
    for (int a = 0; a < note_count; a++)
        fprintf(f, "    {\"onset\": %.4f, \"duration\": %.4f, \"text\": \"%s\"}%s\n", notes[a].onset / 10000.0,
                notes[a].duration < 0 ? 0.0 : notes[a].duration / 10000.0, notes[a].text, a + 1 < note_count ? "," : "");
    fprintf(f, "  ]\n}\n");
    fclose(f);
    return 0;
}
