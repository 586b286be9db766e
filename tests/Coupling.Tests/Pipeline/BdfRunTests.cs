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
}
