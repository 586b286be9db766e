using Coupling.Measures;
using Coupling.Plans;

namespace Coupling.Tests.Plans;

/// <summary>The plan's spectrum key: read with its defaults, and refused with the file, line and key named.</summary>
public sealed class SpectrumPlanTests
{
    private static readonly string Source = Path.Combine(Path.GetTempPath(), "coupling-plan-tests", "study.yaml");

    private static readonly string[] Minimal =
    [
        "recording: rec.edf",
        "conditions:",
        "  cue: [cue-a, cue-b]",
        "  rest: [rest]",
        "trial: { start: -0.5, end: 1.5 }",
        "window: { start: 0.0, end: 1.0 }",
        "bands:",
        "  theta: [4, 8]",
        "measures: [plv, aec]",
        "seed: 7",
        "output: results",
        "surrogates: 300",
        "spectrum:",                           // 13
    ];

    private static Plan Parse(params string[] spectrum) =>
        PlanReader.Parse(new StringReader(string.Join("\n", Minimal.Concat(spectrum)) + "\n"), Source);

    private static void AssertRefused(int line, string[] spectrum, params string[] fragments)
    {
        var e = Assert.Throws<InputException>(() => Parse(spectrum));
        Assert.True(e.Message.Contains($"{Source}, line {line}:", StringComparison.Ordinal), e.Message);
        foreach (var f in fragments) Assert.True(e.Message.Contains(f, StringComparison.Ordinal), e.Message);
    }

    [Fact]
    public void A_spectrum_key_is_read_with_its_defaults()
    {
        var spec = Parse("  frequencies: { from: 4, to: 5, step: 0.1 }").Spectrum!;
        Assert.Equal("morlet", spec.Method);
        Assert.Equal(11, spec.Frequencies.Count);
        Assert.Equal(4.3, spec.Frequencies[3]);
        Assert.Equal(5.0, spec.Frequencies[^1]);
        Assert.Equal(5, spec.Cycles);
        Assert.Null(spec.Pairs);
        Assert.Equal([Measure.Plv, Measure.Aec], spec.Measures);
        Assert.Null(spec.Time);
        Assert.Null(spec.ClusterTest);
        Assert.Null(PlanReader.Parse(new StringReader(string.Join("\n", Minimal[..^1]) + "\n"), Source).Spectrum);
    }

    [Fact]
    public void Time_course_cluster_test_and_pairs_are_read()
    {
        var spec = Parse(
            "  frequencies: [4, 8, 12]",
            "  pairs: [[C3, C4], [Fz, Pz]]",
            "  time: { width: 0, step: 0.02, baseline: { start: -0.4, end: -0.1 } }",
            "  cluster_test: { pair: [C3, C4], measure: plv, conditions: [rest, cue], threshold: 0.01 }",
            "  figure_pair: [C4, C3]").Spectrum!;
        Assert.Equal([new ChannelPairSpec("C3", "C4"), new ChannelPairSpec("Fz", "Pz")], spec.Pairs);
        Assert.Equal(new TimeCourseSpec(0, 0.02, new TimeRange(-0.4, -0.1)), spec.Time);
        // Single time points leave out the envelope correlation of the plan's measures.
        Assert.Equal([Measure.Plv], spec.Measures);
        Assert.Equal(new ClusterTestSpec(new ChannelPairSpec("C3", "C4"), Measure.Plv, "rest", "cue", 0.01, 300), spec.ClusterTest);
        Assert.Equal(new ChannelPairSpec("C4", "C3"), spec.FigurePair);
    }

    [Fact]
    public void Multitaper_keeps_the_amplitude_weighted_measures_and_refuses_others_by_name()
    {
        var spec = Parse("  method: multitaper", "  half_bandwidth: 3", "  frequencies: [10]", "  measures: all").Spectrum!;
        Assert.Equal([Measure.Wpli, Measure.Coherence, Measure.ImagCoherency], spec.Measures.Order());
        Assert.Equal(3, spec.HalfBandwidthHz);
        AssertRefused(16, ["  method: multitaper", "  frequencies: [10]", "  measures: [plv]"], "spectrum.measures", "'plv'", "multitaper offers");
        AssertRefused(14, ["  method: multitaper", "  frequencies: [10]"], "spectrum.measures", "none of the plan's measures");
    }

    [Fact]
    public void Bad_values_are_refused_with_the_line_and_key()
    {
        AssertRefused(14, ["  frequencies: [8, 4]"], "spectrum.frequencies", "must increase");
        AssertRefused(14, ["  frequncies: [8]"], "spectrum.frequncies", "unknown key");
        AssertRefused(14, ["  method: morlet"], "spectrum.frequencies", "required");
        AssertRefused(15, ["  frequencies: [8]", "  method: wavelets"], "spectrum.method", "'wavelets'");
        AssertRefused(15, ["  frequencies: [8]", "  half_bandwidth: 2"], "spectrum.half_bandwidth", "applies to method 'multitaper' only");
        AssertRefused(15, ["  frequencies: [8]", "  pairs: [[C3, C3]]"], "spectrum.pairs", "paired with itself");
        AssertRefused(15, ["  frequencies: [8]", "  pairs: [[C3, C4], [C4, C3]]"], "listed twice");
        AssertRefused(15, ["  frequencies: [8]", "  time: { width: 0.2, step: 0.1, baseline: { start: -0.9, end: 0 } }"],
            "spectrum.time.baseline", "inside the trial span");
        AssertRefused(15, ["  frequencies: [8]", "  cluster_test: { pair: [A, B], measure: wpli, conditions: [cue, rest] }"],
            "spectrum.cluster_test.measure", "not among the spectrum's measures");
        AssertRefused(15, ["  frequencies: [8]", "  cluster_test: { pair: [A, B], measure: plv, conditions: [cue, sleep] }"],
            "'sleep' is not a condition");
        AssertRefused(16, ["  frequencies: [8]", "  pairs: [[A, B]]", "  figure_pair: [A, C]"], "spectrum.figure_pair");
    }

    [Fact]
    public void A_values_only_plan_needs_the_cluster_tests_own_draws()
    {
        var lines = Minimal.Select(l => l == "surrogates: 300" ? "surrogates: 0" : l)
            .Concat(["  frequencies: [8]", "  cluster_test: { pair: [A, B], measure: plv, conditions: [cue, rest] }"]);
        var e = Assert.Throws<InputException>(() => PlanReader.Parse(new StringReader(string.Join("\n", lines) + "\n"), Source));
        Assert.Contains("spectrum.cluster_test.draws", e.Message);
        var plan = PlanReader.Parse(new StringReader(string.Join("\n", lines).Replace("rest] }", "rest], draws: 99 }") + "\n"), Source);
        Assert.Equal(99, plan.Spectrum!.ClusterTest!.Draws);
    }
}
