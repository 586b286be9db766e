using System.Globalization;
using System.Text;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// A small CSV study written into a folder: <c>rec.csv</c> (a column per channel, independent Gaussian noise plus a
/// shared 10 Hz source on channels A and B, not locked to the events), <c>rec_events.tsv</c> and <c>plan.yaml</c>. Fast to analyse: a few
/// channels, 20 trials of one condition, a short span.
/// </summary>
internal static class SmallStudy
{
    public const double Rate = 200;

    public static readonly string[] Channels = ["A", "B", "C", "D"];

    /// <summary>Writes the recording; <paramref name="edit"/> may change cells (channel, sample) before writing.</summary>
    public static void WriteRecording(string folder, int trials = 20, int seed = 11, Func<int, int, double, double>? edit = null)
    {
        // One trial every 1.5 s from 3 s on, span -0.25..0.75 s: the first onset is 3 s in, the last 3.5 s before the end,
        // room for the padding of an 8-12 Hz band-pass (about 2 s at each end) without reflection.
        int samples = (int)((5 + 1.5 * trials) * Rate);
        var rng = new Random(seed);
        double Gauss() => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
        var csv = new StringBuilder(string.Join(",", Channels)).Append('\n');
        double phase = 0;
        for (int s = 0; s < samples; s++)
        {
            // The frequency wanders enough (sd 3 Hz per sample) that the phase forgets itself between onsets 1.5 s
            // apart: the source is coupling between A and B, not a response locked to the events.
            phase += 2 * Math.PI * (10 + 3 * Gauss()) / Rate;
            double shared = 2 * Math.Sin(phase);
            for (int c = 0; c < Channels.Length; c++)
            {
                double v = Gauss() + (c < 2 ? shared : 0);
                if (edit is not null) v = edit(c, s, v);
                if (c > 0) csv.Append(',');
                csv.Append(v.ToString("R", CultureInfo.InvariantCulture));
            }
            csv.Append('\n');
        }
        File.WriteAllText(Path.Combine(folder, "rec.csv"), csv.ToString());
        var events = new StringBuilder("onset\tduration\ttrial_type\n");
        for (int n = 0; n < trials; n++)
            events.Append(string.Create(CultureInfo.InvariantCulture, $"{3 + 1.5 * n:R}\t0\tgo\n"));
        File.WriteAllText(Path.Combine(folder, "rec_events.tsv"), events.ToString());
    }

    /// <summary>The plan text; each argument replaces the default value of its key.</summary>
    public static string PlanText(int surrogates = 50, int threads = 1, string channels = "[A, B, C, D]", string conditions = "{ go: [go] }",
        string bands = "{ alpha: [8, 12] }", string trial = "{ start: -0.25, end: 0.75 }", string recording = "rec.csv") =>
        $"""
        recording: {recording}
        events: rec_events.tsv
        sample_rate: {Rate.ToString(CultureInfo.InvariantCulture)}
        channels: {channels}
        conditions: {conditions}
        trial: {trial}
        window: {"{"} start: 0.0, end: 0.5 {"}"}
        bands: {bands}
        measures: [plv, wpli, aec]
        surrogates: {surrogates}
        seed: 42
        output: results
        figures: false
        threads: {threads}
        """;

    /// <summary>Writes recording, events and plan; returns the plan's path.</summary>
    public static string Write(string folder, int surrogates = 50, int threads = 1)
    {
        WriteRecording(folder);
        string plan = Path.Combine(folder, "plan.yaml");
        File.WriteAllText(plan, PlanText(surrogates, threads));
        return plan;
    }
}
