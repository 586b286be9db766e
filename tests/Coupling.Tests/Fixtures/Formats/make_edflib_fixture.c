/*
 * Writes an EDF+ fixture with EDFlib (the independent writer) and a JSON file with the values it wrote.
 * Three signals, record duration 0.5 s, two sampling rates (200 Hz and 50 Hz), five annotations.
 * Usage: make_edflib_fixture OUT.edf OUT.json
 */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <edflib.h>

#define RECORDS 8
#define SIGNALS 3

static const char *labels[SIGNALS] = {"EEG Fz", "EEG Cz", "Resp belt"};
static const char *units[SIGNALS] = {"uV", "uV", "mV"};
static const char *transducers[SIGNALS] = {"AgAgCl electrode", "AgAgCl electrode", "strain gauge"};
static const char *prefilters[SIGNALS] = {"HP:0.1Hz LP:75Hz", "HP:0.1Hz LP:75Hz", "LP:10Hz"};
static const int per_record[SIGNALS] = {100, 100, 25};
static const double phys_min[SIGNALS] = {-3276.8, -500.0, -1.0};
static const double phys_max[SIGNALS] = {3276.7, 500.0, 1.0};
static const int dig_min[SIGNALS] = {-32768, -2048, 0};
static const int dig_max[SIGNALS] = {32767, 2047, 1000};

struct note { long long onset; long long duration; const char *text; };
/* onset and duration in units of 100 microseconds (EDFlib convention); duration -1 = none */
static const struct note notes[] = {
    {2500, -1, "stim A"},
    {10000, 5000, "stim B"},
    {17325, -1, "response"},
    {25000, -1, "stim A"},
    {31000, 7500, "artifact"},
};

/* the physical signal the program intends to store, in the signal's unit */
static double intended(int sig, int n)
{
    double rate = per_record[sig] / 0.5;
    double t = n / rate;
    switch (sig) {
    case 0: return 3000.0 * sin(2.0 * M_PI * 7.0 * t);
    case 1: return 380.0 * cos(2.0 * M_PI * 3.0 * t) - 0.1 * n;
    default: return 0.9 * sin(2.0 * M_PI * 0.5 * t);
    }
}

static int to_digital(int sig, double x)
{
    double gain = (phys_max[sig] - phys_min[sig]) / (double)(dig_max[sig] - dig_min[sig]);
    long d = lround((x - phys_min[sig]) / gain + dig_min[sig]);
    if (d < dig_min[sig]) d = dig_min[sig];
    if (d > dig_max[sig]) d = dig_max[sig];
    return (int)d;
}

int main(int argc, char **argv)
{
    if (argc != 3) { fprintf(stderr, "usage: %s OUT.edf OUT.json\n", argv[0]); return 2; }
    int h = edfopen_file_writeonly(argv[1], EDFLIB_FILETYPE_EDFPLUS, SIGNALS);
    if (h < 0) { fprintf(stderr, "open failed: %d\n", h); return 1; }
    if (edf_set_datarecord_duration(h, 50000)) return 1; /* 0.5 s in units of 10 us */
    if (edf_set_startdatetime(h, 2021, 3, 4, 9, 8, 7)) return 1;
    edf_set_patientcode(h, "SIM-001");
    edf_set_patientname(h, "Simulated");
    edf_set_equipment(h, "simulator");
    for (int s = 0; s < SIGNALS; s++) {
        if (edf_set_samplefrequency(h, s, per_record[s])) return 1;
        if (edf_set_physical_minimum(h, s, phys_min[s])) return 1;
        if (edf_set_physical_maximum(h, s, phys_max[s])) return 1;
        if (edf_set_digital_minimum(h, s, dig_min[s])) return 1;
        if (edf_set_digital_maximum(h, s, dig_max[s])) return 1;
        if (edf_set_label(h, s, labels[s])) return 1;
        if (edf_set_physical_dimension(h, s, units[s])) return 1;
        if (edf_set_transducer(h, s, transducers[s])) return 1;
        if (edf_set_prefilter(h, s, prefilters[s])) return 1;
    }
    static short buf[128];
    for (int r = 0; r < RECORDS; r++)
        for (int s = 0; s < SIGNALS; s++) {
            for (int i = 0; i < per_record[s]; i++)
                buf[i] = (short)to_digital(s, intended(s, r * per_record[s] + i));
            if (edfwrite_digital_short_samples(h, buf)) { fprintf(stderr, "write failed\n"); return 1; }
        }
    int note_count = (int)(sizeof notes / sizeof notes[0]);
    for (int a = 0; a < note_count; a++)
        if (edfwrite_annotation_utf8(h, notes[a].onset, notes[a].duration, notes[a].text)) return 1;
    if (edfclose_file(h)) return 1;

    FILE *f = fopen(argv[2], "w");
    if (!f) return 1;
    fprintf(f, "{\n  \"writer\": \"EDFlib\",\n  \"edflib_version\": %d,\n", edflib_version());
    fprintf(f, "  \"reserved\": \"EDF+C\",\n  \"start\": \"2021-03-04T09:08:07\",\n");
    fprintf(f, "  \"record_duration\": 0.5,\n  \"records\": %d,\n  \"signals\": [\n", RECORDS);
    for (int s = 0; s < SIGNALS; s++) {
        int n = RECORDS * per_record[s];
        fprintf(f, "    {\"label\": \"%s\", \"unit\": \"%s\", \"transducer\": \"%s\", \"prefilter\": \"%s\",\n",
                labels[s], units[s], transducers[s], prefilters[s]);
        fprintf(f, "     \"physical_min\": %.17g, \"physical_max\": %.17g, \"digital_min\": %d, \"digital_max\": %d,\n",
                phys_min[s], phys_max[s], dig_min[s], dig_max[s]);
        fprintf(f, "     \"samples_per_record\": %d,\n     \"digital\": [", per_record[s]);
        for (int i = 0; i < n; i++) fprintf(f, "%s%d", i ? ", " : "", to_digital(s, intended(s, i)));
        fprintf(f, "],\n     \"intended\": [");
        for (int i = 0; i < n; i++) fprintf(f, "%s%.17g", i ? ", " : "", intended(s, i));
        fprintf(f, "]}%s\n", s + 1 < SIGNALS ? "," : "");
    }
    fprintf(f, "  ],\n  \"annotations\": [\n");
    for (int a = 0; a < note_count; a++)
        fprintf(f, "    {\"onset\": %.4f, \"duration\": %.4f, \"text\": \"%s\"}%s\n", notes[a].onset / 10000.0,
                notes[a].duration < 0 ? 0.0 : notes[a].duration / 10000.0, notes[a].text,
                a + 1 < note_count ? "," : "");
    fprintf(f, "  ]\n}\n");
    fclose(f);
    return 0;
}
