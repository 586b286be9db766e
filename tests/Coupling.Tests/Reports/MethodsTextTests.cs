using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.Json.Serialization;
using Coupling.Outputs;
using Coupling.Plans;
using Coupling.Reports;
using Coupling.Spectral;

namespace Coupling.Tests.Reports;

/// <summary>
/// The methods paragraph of a Morlet plan with the evoked response subtracted and no contrasts, from a manifest built
/// the way the results writer builds it (plan serialised in snake_case with kebab-case enum values). Sources as in
/// docs/methods.md: Tallon-Baudry et al. 1996 for the wavelet, Vinck et al. 2010 for the PPC, Nolte et al. 2004 for
/// imaginary coherency.
/// </summary>
public class MethodsTextTests
{
    private static readonly JsonSerializerOptions PlanJson = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.KebabCaseLower) },
    };

    [Fact]
    public void A_wavelet_plan_is_described_with_its_cycles_its_sources_and_no_contrast()
    {
        var plan = PlanReader.Parse(new StringReader("""
            recording: rec.csv
            sample_rate: 500
            events: ev.tsv
            conditions: { reach: [reach] }
            trial: { start: -1, end: 2 }
            window: { start: 0.25, end: 1.25 }
            evoked: subtract
            bands: { theta: [5, 10] }
            decomposition: { method: morlet, cycles: 6 }
            measures: [ppc, imag-coherency]
            surrogates: 2000
            seed: 4021
            correction: { q: 0.01 }
            output: out
            """), "/data/plan.yaml");
        var manifest = new Manifest
        {
            Tool = new ToolInfo("coupling", "1.2.3+abc", ".NET 10.0.0", "Linux", new Dictionary<string, string>()),
            Started = DateTimeOffset.UnixEpoch,
            Finished = DateTimeOffset.UnixEpoch,
            Plan = JsonSerializer.SerializeToNode(plan, PlanJson),
            Seed = plan.Seed,
            Decompositions = [new DecompositionInfo("morlet", "theta", new Dictionary<string, double> { ["cycles"] = 6, ["centre_hz"] = 7.5 })],
            Conditions = [new ConditionTrials("reach", 48, ["trial 49 at 612.3 s runs past the end"])],
            TimeSteps = [new BandTimeStep("theta", 5, 0.01)],
            Extra = new JsonObject { ["sample_rate_hz"] = 500.0, ["channels"] = new JsonArray("C3", "C4", "Pz") },
        };
        var m = MethodsText.From(manifest);
        Assert.Contains("coupling 1.2.3 (.NET 10.0.0)", m.Paragraph);
        Assert.Contains("(rec.csv, 3 channels, sampled at 500 Hz)", m.Paragraph);
        Assert.Contains("reach (48 trials, 1 dropped at the recording's edges)", m.Paragraph);
        Assert.Contains("mean over trials (the evoked response) was subtracted", m.Paragraph);
        Assert.Contains("complex Morlet wavelet", m.Paragraph);
        Assert.Contains("6 cycles; Tallon-Baudry et al. 1996", m.Paragraph);
        Assert.Contains("the pairwise phase consistency (Vinck et al. 2010) and the imaginary part of coherency (Nolte et al. 2004)", m.Paragraph);
        Assert.Contains("every 5 samples of the analysis window 0.25 to 1.25 s", m.Paragraph);
        Assert.Contains("2000 trial-shuffle surrogates", m.Paragraph);
        Assert.Contains("seed 4021", m.Paragraph);
        Assert.Contains("false discovery rate of 0.01", m.Paragraph);
        Assert.DoesNotContain("Kaiser", m.Paragraph);
        Assert.DoesNotContain("Fisher", m.Paragraph);
        Assert.DoesNotContain("condition labels", m.Paragraph);
        Assert.Equal(5, m.References.Count); // wavelet, PPC, imaginary coherency, permutation p, FDR
        Assert.StartsWith("Tallon-Baudry C", m.References[0], StringComparison.Ordinal);
    }

    [Fact]
    public void A_values_only_plan_says_no_test_was_made_and_cites_no_test()
    {
        var plan = PlanReader.Parse(new StringReader("""
            recording: rec.edf
            conditions: { go: [go], stop: [stop] }
            contrasts: [[go, stop]]
            trial: { start: -1, end: 2 }
            window: { start: 0.25, end: 1.25 }
            bands: { alpha: [8, 12] }
            measures: [plv]
            surrogates: 0
            seed: 1
            output: out
            """), "/data/plan.yaml");
        var manifest = new Manifest
        {
            Tool = new ToolInfo("coupling", "1.0.0", ".NET 10.0.0", "Linux", new Dictionary<string, string>()),
            Started = DateTimeOffset.UnixEpoch,
            Finished = DateTimeOffset.UnixEpoch,
            Plan = JsonSerializer.SerializeToNode(plan, PlanJson),
            Decompositions = [new DecompositionInfo("fir-hilbert", "alpha", new Dictionary<string, double> { ["filter_taps"] = 401 })],
            Conditions = [new ConditionTrials("go", 20, []), new ConditionTrials("stop", 20, [])],
            TimeSteps = [new BandTimeStep("alpha", 4, 0.016)],
        };
        var m = MethodsText.From(manifest);
        Assert.Contains("No significance test was made (values only).", m.Paragraph);
        Assert.Contains("Differences between conditions (go vs stop) were computed without a test.", m.Paragraph);
        Assert.DoesNotContain("surrogates", m.Paragraph);
        Assert.DoesNotContain(MethodSources.Of("fdr-bh").Reference, m.References);
        Assert.DoesNotContain(MethodSources.Of("permutation-p").Reference, m.References);
    }

    [Fact]
    public void Every_measure_key_has_a_source_and_an_unknown_key_has_none()
    {
        foreach (var key in Coupling.Measures.MeasureCatalog.All.Select(Coupling.Measures.MeasureCatalog.Key))
            Assert.False(string.IsNullOrWhiteSpace(MethodSources.Of(key).Reference));
        Assert.Throws<ArgumentException>(() => MethodSources.Of("granger"));
    }
}
