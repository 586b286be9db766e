using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Tests.Formats;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// A plan over a BDF+ recording (24-bit samples, the EDFlib fixture, Fixtures/Formats/README.md) runs like one over EDF:
/// the events come from its "BDF Annotations" signal (the samples' decoding is checked in EdfReaderTests).
/// </summary>
public sealed class BdfRunTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void A_plan_over_a_BDF_plus_file_cuts_its_annotated_trials_and_computes_values()
    {
        File.Copy(Fixtures.Path("edflib_bdf.bdf"), _folder["rec.bdf"]);
        string plan = _folder["plan.yaml"];
        File.WriteAllText(plan, """
            recording: rec.bdf
            conditions: { probe: [probe] }
            trial: { start: 0, end: 0.5 }
            window: { start: 0, end: 0.5 }
            bands: { alpha: [8, 12] }
            decomposition: { transition: 4, edge_effects: accept }
            measures: [plv, coherence]
            surrogates: 0
            seed: 1
            output: results
            figures: false
            """);
        var outcome = AnalysisRunner.Run(PlanReader.Read(plan), threads: 1);
        // The fixture's annotations: "probe" at 0.5 s and 3.0 s, "target" at 1.75 s.
        Assert.Equal(2, Assert.Single(outcome.Conditions).Trials);
        Assert.Equal(["EEG Oz", "EEG Pz"], outcome.Results[0].Channels);
        Assert.All(outcome.Results, r => Assert.True(double.IsFinite(r.Value[0]) && r.Value[0] is >= 0 and <= 1, $"{r.Measure}: {r.Value[0]}"));
        Assert.True(File.Exists(Path.Combine(outcome.OutputFolder, "edges.tsv")));
    }
    [Fact]
    public void A_plan_over_a_plain_BDF_file_uses_its_Status_trigger_codes_as_condition_labels()
    {
        // 12 records of 1 s at 64 Hz; code 5 starts at the beginning of every even record and code 9 of every odd one,
        // each held for a quarter second; two noisy channels sharing a 10 Hz rhythm.
        var random = new Random(8);
        var b = new EdfBuilder { Bdf = true, Reserved = "24BIT" };
        b.Signals.Add(new("A1", "uV", "-262144", "262143", "-8388608", "8388607", 64));
        b.Signals.Add(new("A2", "uV", "-262144", "262143", "-8388608", "8388607", 64));
        b.Signals.Add(new("Status", "Boolean", "-8388608", "8388607", "-8388608", "8388607", 64));
        for (int r = 0; r < 12; r++)
        {
            int[] Channel(double lag) => Enumerable.Range(0, 64)
                .Select(k => (int)(200_000 * Math.Sin(2 * Math.PI * 10 * (r + k / 64.0) - lag) + 100_000 * (random.NextDouble() - 0.5))).ToArray();
            b.Records.Add([Channel(0), Channel(0.5), Enumerable.Range(0, 64).Select(k => k < 16 ? (r % 2 == 0 ? 5 : 9) : 0).ToArray()]);
        }
        File.WriteAllBytes(_folder["rec.bdf"], b.Build());
        string plan = _folder["plan.yaml"];
        File.WriteAllText(plan, """
            recording: rec.bdf
            conditions: { five: ["5"], nine: [9] }
            trial: { start: 0, end: 0.5 }
            window: { start: 0, end: 0.5 }
            bands: { alpha: [8, 12] }
            decomposition: { transition: 4, edge_effects: accept }
            measures: [plv]
            surrogates: 0
            seed: 1
            output: results
            figures: false
            """);
        var outcome = AnalysisRunner.Run(PlanReader.Read(plan), threads: 1);
        // Six onsets of each code; the last code-9 trial (at 11 s) fits, as 11.5 s is inside the 12 s recording.
        Assert.Equal([("five", 6), ("nine", 6)], outcome.Conditions.Select(c => (c.Condition, c.Trials)));
        Assert.Equal(["A1", "A2"], outcome.Results[0].Channels);
        // The shared rhythm with a fixed lag locks the phases: PLV well above the chance level of 6 trials, about
        // sqrt(π/(4·6)) = 0.36 (mean resultant length of uniform phases, Fisher 1993, Statistical Analysis of Circular Data).
        Assert.All(outcome.Results, r => Assert.True(r.Value[0] > 0.8, $"{r.Condition}: {r.Value[0]}"));
    }
}
