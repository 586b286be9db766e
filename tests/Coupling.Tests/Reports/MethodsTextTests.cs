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
        Assert.DoesNotContain("also computed at", m.Paragraph);
        Assert.DoesNotContain("cluster", m.Paragraph);
        Assert.DoesNotContain("Maris", string.Concat(m.References));
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

    /// <summary>A manifest as the results writer builds it, for a plan with conditions go and stop.</summary>
    private static Manifest SpectrumManifest(string planText, JsonObject recorded, JsonArray? channels = null) => new()
    {
        Tool = new ToolInfo("coupling", "1.0.0", ".NET 10.0.0", "Linux", new Dictionary<string, string>()),
        Started = DateTimeOffset.UnixEpoch,
        Finished = DateTimeOffset.UnixEpoch,
        Plan = JsonSerializer.SerializeToNode(PlanReader.Parse(new StringReader(planText), "/data/plan.yaml"), PlanJson),
        Seed = 7,
        Decompositions = [new DecompositionInfo("fir-hilbert", "alpha", new Dictionary<string, double> { ["filter_taps"] = 401 })],
        Conditions = [new ConditionTrials("go", 30, []), new ConditionTrials("stop", 18, [])],
        TimeSteps = [new BandTimeStep("alpha", 4, 0.016)],
        Extra = channels is null ? new JsonObject { ["spectrum"] = recorded } : new JsonObject { ["spectrum"] = recorded, ["channels"] = channels },
    };

    private const string SpectrumPlanHead = """
        recording: rec.edf
        conditions: { go: [go], stop: [stop] }
        trial: { start: -1, end: 2 }
        window: { start: 0.25, end: 1.25 }
        bands: { alpha: [8, 12] }
        measures: [plv, coherence]
        surrogates: 199
        seed: 7
        output: out

        """;

    [Fact]
    public void A_wavelet_spectrum_with_a_cluster_test_names_its_settings_and_the_test_as_implemented()
    {
        // The recorded node has the shape SpectrumWriter.ManifestNode writes: trial counts 30 and 18, 499 draws, the
        // two-sided level 0.01 as |z| > 2.576 (the standard normal 0.995 quantile, from memory; the text only rounds it).
        var m = MethodsText.From(SpectrumManifest(SpectrumPlanHead + """
            evoked: subtract
            spectrum:
              frequencies: { from: 4, to: 12, step: 2 }
              cycles: 5
              pairs: [[C3, C4]]
              measures: [ppc, coherence]
              time: { width: 0.4, step: 0.2, baseline: { start: -0.6, end: -0.2 } }
              cluster_test: { pair: [C3, C4], measure: coherence, conditions: [go, stop], threshold: 0.01, draws: 499 }
            """, new JsonObject
        {
            ["method"] = "morlet",
            ["cycles"] = 5.0,
            ["time_bins_s"] = new JsonArray(-0.8, -0.6, -0.4, -0.2, 0.0, 0.2),
            ["cluster_test"] = new JsonObject
            {
                ["seed"] = 123456789012UL, ["draws"] = 499, ["threshold"] = 0.01, ["z_threshold"] = 2.5758293035489004,
                ["trials"] = new JsonArray(30, 18), ["evoked"] = "removed per group in every labelling",
            },
        }));
        Assert.Contains("For the channel pair C3-C4, the pairwise phase consistency and magnitude-squared coherence were also computed at " +
                        "5 frequencies (4, 6, 8, 10, 12 Hz), by convolution with a unit-energy complex Morlet wavelet of 5 cycles at each frequency " +
                        "(Tallon-Baudry et al. 1996), over the analysis window and in 6 time bins 0.4 s wide every 0.2 s (centres -0.8 to 0.2 s).", m.Paragraph);
        Assert.Contains("change from the baseline -0.6 to -0.2 s: the value less the mean of the bins centred in the baseline, per frequency.", m.Paragraph);
        Assert.Contains("The difference go minus stop in magnitude-squared coherence of the pair C3-C4 (30 and 18 trials) was tested over the " +
                        "frequency-by-time map by a cluster-based permutation test (Maris & Oostenveld 2007): 499 random permutations of the condition " +
                        "labels of the pooled trials keeping both group sizes; seed 123456789012; in every labelling, the observed one included, " +
                        "each group's mean over its trials (the evoked response) was removed from its trials.", m.Paragraph);
        Assert.Contains("over all 500 labellings", m.Paragraph);
        Assert.Contains("(|z| > 2.576, two-sided pointwise level 0.01)", m.Paragraph);
        Assert.Contains("sum of its standardised differences", m.Paragraph);
        Assert.Contains("largest absolute mass among its clusters", m.Paragraph);
        Assert.Contains("p = (1 + b)/(M + 1)", m.Paragraph);
        Assert.Contains("family-wise error over the whole map", m.Paragraph);
        Assert.Contains(MethodSources.Of("label-permutation").Reference, m.References);
        Assert.Single(m.References, r => r.StartsWith("Maris E, Oostenveld R (2007). Nonparametric statistical testing of EEG- and MEG-data. J Neurosci Methods 164:177-190.", StringComparison.Ordinal));
        Assert.DoesNotContain(m.References, r => r.StartsWith("Slepian", StringComparison.Ordinal));
    }

    [Fact]
    public void Spectrum_pairs_are_named_in_the_recording_s_channel_order_as_the_tables_name_them()
    {
        var m = MethodsText.From(SpectrumManifest(SpectrumPlanHead + """
            spectrum:
              frequencies: [10]
              cycles: 5
              pairs: [[C4, C3]]
              measures: [coherence]
              cluster_test: { pair: [C4, C3], measure: coherence, conditions: [go, stop], draws: 99 }
            """, new JsonObject { ["method"] = "morlet", ["cycles"] = 5.0 }, new JsonArray("C3", "C4", "Pz")));
        Assert.Contains("For the channel pair C3-C4,", m.Paragraph);
        Assert.Contains("of the pair C3-C4 was tested", m.Paragraph);
        Assert.DoesNotContain("C4-C3", m.Paragraph);
    }

    [Fact]
    public void A_multitaper_spectrum_without_time_or_test_cites_the_tapers_and_names_no_cluster_test()
    {
        var m = MethodsText.From(SpectrumManifest(SpectrumPlanHead + """
            spectrum:
              method: multitaper
              half_bandwidth: 4
              frequencies: [8, 10, 12, 20]
              measures: [coherence]
            """, new JsonObject
        {
            ["method"] = "multitaper",
            ["half_bandwidth_hz"] = 4.0,
            ["tapers_per_window"] = new JsonArray(7),
        }));
        Assert.Contains("For every channel pair, magnitude-squared coherence was also computed at 4 frequencies (8, 10, 12, 20 Hz), from the " +
                        "Fourier coefficients of each trial's mean-removed segment under discrete prolate spheroidal (DPSS) tapers (Slepian 1978) " +
                        "of half-bandwidth 4 Hz (7 tapers over the analysis window), each trial and taper counting as one observation " +
                        "(the multitaper method; Thomson 1982), over the analysis window.", m.Paragraph);
        Assert.DoesNotContain("cluster", m.Paragraph);
        Assert.DoesNotContain("baseline", m.Paragraph);
        Assert.DoesNotContain("evoked response) was removed", m.Paragraph);
        Assert.Contains("Slepian D (1978). Prolate spheroidal wave functions, Fourier analysis, and uncertainty V: the discrete case. Bell Syst Tech J 57:1371-1430.", m.References);
        Assert.Contains("Thomson DJ (1982). Spectrum estimation and harmonic analysis. Proc IEEE 70:1055-1096.", m.References);
        Assert.DoesNotContain(MethodSources.Of("label-permutation").Reference, m.References);
    }

    [Fact]
    public void Every_measure_key_has_a_source_and_an_unknown_key_has_none()
    {
        foreach (var key in Coupling.Measures.MeasureCatalog.All.Select(Coupling.Measures.MeasureCatalog.Key))
            Assert.False(string.IsNullOrWhiteSpace(MethodSources.Of(key).Reference));
        Assert.Throws<ArgumentException>(() => MethodSources.Of("granger"));
    }
}
