using Coupling.Plans;
using Coupling.Statistics;

namespace Coupling.Tests.Plans;

/// <summary>The correction key: every method by name, its level key (q or alpha), the Pareto tail and the threshold.</summary>
public sealed class CorrectionKeyTests
{
    private static readonly string Source = Path.Combine(Path.GetTempPath(), "coupling-plan-tests", "study.yaml");

    private static readonly string[] Minimal =
    [
        "recording: rec.edf", "conditions:", "  cue: [cue-a]", "trial: { start: -0.5, end: 1.5 }",
        "window: { start: 0.0, end: 1.0 }", "bands:", "  theta: [4, 8]", "measures: [plv]", "seed: 7", "output: results",
    ];

    private static Plan Parse(string correction) =>
        PlanReader.Parse(new StringReader(string.Join("\n", [.. Minimal, correction]) + "\n"), Source);

    private static void AssertRefused(string correction, params string[] fragments)
    {
        var e = Assert.Throws<InputException>(() => Parse(correction));
        Assert.Contains($"{Source}, line 11:", e.Message);
        foreach (var f in fragments) Assert.Contains(f, e.Message);
    }

    [Theory]
    [InlineData("correction: { method: benjamini-hochberg, q: 0.1 }", CorrectionMethod.BenjaminiHochberg, 0.1)]
    [InlineData("correction: { method: benjamini-yekutieli, q: 0.02 }", CorrectionMethod.BenjaminiYekutieli, 0.02)]
    [InlineData("correction: { method: max-statistic, alpha: 0.01 }", CorrectionMethod.MaxStatistic, 0.01)]
    [InlineData("correction: { method: network-based, alpha: 0.05 }", CorrectionMethod.NetworkBased, 0.05)]
    [InlineData("correction: { method: none, alpha: 0.001 }", CorrectionMethod.None, 0.001)]
    [InlineData("correction: { q: 0.2 }", CorrectionMethod.BenjaminiHochberg, 0.2)]
    public void Each_method_is_read_with_its_level(string line, CorrectionMethod method, double level)
    {
        var plan = Parse(line);
        Assert.Equal(method, plan.Correction.Method);
        Assert.Equal(level, plan.Q);
        Assert.False(plan.Correction.ParetoTail);
    }

    [Fact]
    public void The_old_short_code_is_refused_with_the_new_name()
    {
        AssertRefused("correction: { method: fdr-bh, q: 0.05 }", "correction.method:", "'fdr-bh'", "'benjamini-hochberg'");
    }

    [Fact]
    public void An_unknown_method_is_refused_listing_the_methods() =>
        AssertRefused("correction: { method: holm }", "'holm' is not allowed",
            "benjamini-hochberg, benjamini-yekutieli, max-statistic, network-based, none");

    [Fact]
    public void The_level_key_must_match_the_kind_of_error_controlled()
    {
        AssertRefused("correction: { method: max-statistic, q: 0.05 }", "correction.q:", "give its level as 'alpha'");
        AssertRefused("correction: { method: benjamini-yekutieli, alpha: 0.05 }", "correction.alpha:", "give its level as 'q'");
    }

    [Fact]
    public void The_pareto_tail_and_the_network_threshold_are_read_and_checked()
    {
        Assert.True(Parse("correction: { method: benjamini-hochberg, tail: pareto }").Correction.ParetoTail);
        Assert.False(Parse("correction: { tail: counted }").Correction.ParetoTail);
        Assert.Equal(2.5, Parse("correction: { method: network-based, threshold: 2.5 }").Correction.Threshold);
        Assert.Equal(CorrectionSpec.DefaultThreshold, Parse("correction: { method: network-based }").Correction.Threshold);
        AssertRefused("correction: { tail: fitted }", "correction.tail:", "'counted'", "'pareto'");
        AssertRefused("correction: { method: max-statistic, tail: pareto }", "correction.tail:", "maxima over pairs");
        AssertRefused("correction: { method: benjamini-hochberg, threshold: 3 }", "correction.threshold:", "'network-based' only");
    }
}
