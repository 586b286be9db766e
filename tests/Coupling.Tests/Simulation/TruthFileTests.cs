using Coupling.Measures;
using Coupling.Simulation;

namespace Coupling.Tests.Simulation;

[Collection(ScenarioCollection.Name)]
public sealed class TruthFileTests(ScenarioFixture fixture)
{
    [Fact]
    public void Truth_json_round_trips()
    {
        string dir = Directory.CreateTempSubdirectory("truth").FullName;
        try
        {
            string path = Path.Combine(dir, "truth.json");
            var truth = fixture.Scenario.Truth;
            TruthFile.Write(truth, path);
            Assert.False(File.Exists(path + ".tmp"));
            var back = TruthFile.Read(path);
            Assert.Equal(TruthFile.ToJson(truth), TruthFile.ToJson(back));
            Assert.Equal(truth.Pairs.Count, back.Pairs.Count);
            Assert.Equal(truth.Bands, back.Bands);
            Assert.Equal(truth.Pairs[2].DetectedBy, back.Pairs[2].DetectedBy);
            Assert.Equal(truth.WindowStart, back.WindowStart);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Truth_json_uses_the_kind_and_measure_keys()
    {
        string json = TruthFile.ToJson(fixture.Scenario.Truth);
        foreach (var key in new[] { "\"phase-coupled\"", "\"zero-lag-mixing\"", "\"envelope-only\"", "\"stimulus-locked\"",
                     "\"wpli-debiased\"", "\"imag-coherency\"", "\"aec-orth\"", "\"window_start\"", "\"trial_end\"" })
            Assert.Contains(key, json);
    }

    [Fact]
    public void The_truth_states_window_span_bands_and_the_expected_measures()
    {
        var t = fixture.Scenario.Truth;
        Assert.Equal((-0.5, 1.5, 0.2, 1.2), (t.TrialStart, t.TrialEnd, t.WindowStart, t.WindowEnd));
        Assert.Equal(["theta", "alpha", "beta", "gamma"], t.Bands.Select(b => b.Name));
        var mixing = t.Pairs.Single(p => p.Kind == TruthKind.ZeroLagMixing);
        Assert.Contains(Measure.Plv, mixing.DetectedBy);
        Assert.Contains(Measure.Wpli, mixing.NotDetectedBy);
        var envelope = t.Pairs.Single(p => p.Kind == TruthKind.EnvelopeOnly);
        Assert.Equal([Measure.Aec, Measure.AecOrth], envelope.DetectedBy);
        Assert.Empty(t.Pairs.Single(p => p.Kind == TruthKind.StimulusLocked).DetectedBy);
        foreach (var p in t.Pairs) Assert.Empty(p.DetectedBy.Intersect(p.NotDetectedBy));
    }

    [Fact]
    public void A_malformed_truth_file_is_refused_with_its_name()
    {
        string dir = Directory.CreateTempSubdirectory("truth").FullName;
        try
        {
            string path = Path.Combine(dir, "broken.json");
            File.WriteAllText(path, "{ \"pairs\": [ { \"kind\": \"no-such-kind\" } ] }");
            var e = Assert.Throws<InputException>(() => TruthFile.Read(path));
            Assert.Contains("broken.json", e.Message);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}
