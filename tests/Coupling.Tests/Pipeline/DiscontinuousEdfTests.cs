using System.Globalization;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Tests.Formats;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// A run over an EDF+D recording with a gap between its data records (Kemp and Olivan 2003, EDF+ section 2.2.4: each
/// record's time-keeping stamp gives its start): with <c>unusable_data: drop-trials</c> the trials that reach into the gap
/// are dropped with the reason, and every other trial gives exactly what the same samples give from an EDF+C file.
/// </summary>
public sealed class DiscontinuousEdfTests : IDisposable
{
    private const int Rate = 100, Records = 30, GapStart = 15, GapRecords = 2;
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>Digital values of data record <paramref name="r"/> (of the recorded ones) and channel c: a shared 10 Hz
    /// rhythm with a lag between the channels plus seeded noise, so the measures have something to find.</summary>
    private static short[] Values(int r, int c, Random random) =>
        Enumerable.Range(0, Rate).Select(k =>
        {
            double t = (r * Rate + k) / (double)Rate;
            return (short)Math.Round(800 * Math.Sin(2 * Math.PI * 10 * t - 0.6 * c) + 600 * (random.NextDouble() - 0.5));
        }).ToArray();

    /// <summary>An EDF+ file of 1 s records; stamps[r] = null writes a record that is not stamped (for EDF+C).</summary>
    private static byte[] Edf(string reserved, IReadOnlyList<(double Stamp, short[] A, short[] B)> records)
    {
        var b = new EdfBuilder { Reserved = reserved };
        b.Signals.Add(new("EEG A", "uV", "-3276.8", "3276.7", "-32768", "32767", Rate));
        b.Signals.Add(new("EEG B", "uV", "-3276.8", "3276.7", "-32768", "32767", Rate));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 10));
        foreach (var (stamp, a, bValues) in records)
        {
            var annotation = new byte[20];
            EdfBuilder.Tal($"+{stamp.ToString(CultureInfo.InvariantCulture)}||").CopyTo(annotation, 0);
            b.Records.Add([a, bValues, annotation]);
        }
        return b.Build();
    }

    private string Plan(string name, string recording, string events) =>
        WritePlan(name, $"""
        recording: {recording}
        events: {events}
        conditions: {"{"} cue: [cue] {"}"}
        trial: {"{"} start: 0, end: 0.5 {"}"}
        window: {"{"} start: 0, end: 0.5 {"}"}
        bands: {"{"} alpha: [8, 12] {"}"}
        decomposition: {"{"} edge_effects: accept {"}"}
        measures: [plv, wpli, coherence, aec]
        surrogates: 0
        seed: 3
        unusable_data: drop-trials
        output: results-{name}
        figures: false
        threads: 1
        """);

    private string WritePlan(string name, string text)
    {
        string path = _folder[$"plan-{name}.yaml"];
        File.WriteAllText(path, text);
        return path;
    }

    private static string EventsTsv(IEnumerable<double> onsets) =>
        "onset\tduration\ttrial_type\n" + string.Concat(onsets.Select(o => $"{o.ToString(CultureInfo.InvariantCulture)}\t0\tcue\n"));

    [Fact]
    public void Trials_reaching_into_a_gap_are_dropped_and_the_others_equal_the_continuous_file()
    {
        var random = new Random(41);
        var recorded = Enumerable.Range(0, Records).Select(r => (A: Values(r, 0, random), B: Values(r, 1, random))).ToArray();
        var filler = Enumerable.Range(0, GapRecords).Select(_ => (A: Values(0, 1, random), B: Values(0, 0, random))).ToArray();
        // EDF+D: records 0..14 at 0..14 s, records 15..29 at 17..31 s (nothing recorded from 15 to 17 s).
        double Stamp(int r) => r < GapStart ? r : r + GapRecords;
        File.WriteAllBytes(_folder["d.edf"], Edf("EDF+D", recorded.Select((x, r) => ((double)Stamp(r), x.A, x.B)).ToArray()));
        // EDF+C: the same records with two filler records where the gap is.
        var continuous = recorded.Take(GapStart).Concat(filler).Concat(recorded.Skip(GapStart)).Select((x, r) => ((double)r, x.A, x.B)).ToArray();
        File.WriteAllBytes(_folder["c.edf"], Edf("EDF+C", continuous));

        var onsets = Enumerable.Range(0, 20).Select(k => 1.5 + 1.5 * k).ToArray();   // 1.5 .. 30 s
        File.WriteAllText(_folder["all_events.tsv"], EventsTsv(onsets));
        var discontinuous = AnalysisRunner.Run(PlanReader.Read(Plan("d", "d.edf", "all_events.tsv")));

        // A trial is dropped when its samples with the band's padding, [onset − pad, onset + 0.5 s + pad), reach into 15..17 s.
        double pad = BandDecompositions.Create("fir-hilbert", new Band("alpha", 8, 12), Rate).PadSamples / (double)Rate;
        var reaching = onsets.Where(o => o - pad < GapStart + GapRecords && o + 0.5 + pad > GapStart).ToArray();
        Assert.NotEmpty(reaching);
        var summary = Assert.Single(discontinuous.Conditions);
        Assert.Equal(onsets.Length - reaching.Length, summary.Trials);
        Assert.Equal(reaching.Length, summary.Dropped.Count);
        Assert.All(summary.Dropped, d => Assert.Contains("unrecorded (a gap between data records)", d));

        File.WriteAllText(_folder["kept_events.tsv"], EventsTsv(onsets.Except(reaching)));
        var whole = AnalysisRunner.Run(PlanReader.Read(Plan("c", "c.edf", "kept_events.tsv")));
        Assert.Equal(summary.Trials, Assert.Single(whole.Conditions).Trials);
        Assert.Equal(whole.Results.Count, discontinuous.Results.Count);
        for (int i = 0; i < whole.Results.Count; i++)
        {
            Assert.Equal(whole.Results[i].Measure, discontinuous.Results[i].Measure);
            Assert.Equal(whole.Results[i].Value.Select(BitConverter.DoubleToInt64Bits), discontinuous.Results[i].Value.Select(BitConverter.DoubleToInt64Bits));
        }
    }
}
