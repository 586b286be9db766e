using Coupling.Plans;

namespace Coupling.Tests.Plans;

/// <summary>
/// The plan key <c>surrogate_figure</c>: read into the plan, and refused with the line, the key and what is allowed when
/// it names something the plan does not have. YAML line numbers are 1-based (YAML 1.2 spec, section 5.4).
/// </summary>
public sealed class SurrogateFigureKeyTests
{
    private static readonly string Source = Path.Combine(Path.GetTempPath(), "coupling-plan-tests", "study.yaml");

    private static readonly string[] Minimal =
    [
        "recording: rec.edf",
        "conditions: { cue: [cue-a], rest: [rest] }",
        "trial: { start: -0.5, end: 1.5 }",
        "window: { start: 0.0, end: 1.0 }",
        "bands: { theta: [4, 8] }",
        "measures: [plv, wpli]",
        "seed: 7",
        "output: results",
    ];

    private static Plan Parse(string line) => PlanReader.Parse(new StringReader(string.Join("\n", Minimal.Append(line)) + "\n"), Source);

    [Fact]
    public void The_edge_is_read_and_its_absence_leaves_the_default()
    {
        var plan = Parse("surrogate_figure: { condition: rest, band: theta, measure: wpli, channels: [C4, C3] }");
        Assert.Equal(new SurrogateFigureSpec("rest", "theta", "wpli", "C4", "C3"), plan.SurrogateFigure);
        Assert.Null(Parse("figures: true").SurrogateFigure);
    }

    [Theory]
    [InlineData("{ condition: go, band: theta, measure: wpli, channels: [C3, C4] }", "surrogate_figure.condition", "'go' is not a condition")]
    [InlineData("{ condition: cue, band: beta, measure: wpli, channels: [C3, C4] }", "surrogate_figure.band", "'beta' is not a band")]
    [InlineData("{ condition: cue, band: theta, measure: aec, channels: [C3, C4] }", "surrogate_figure.measure", "'aec' is not a measure of the plan")]
    [InlineData("{ condition: cue, band: theta, measure: plv, channels: [C3] }", "surrogate_figure.channels", "expected two channel labels")]
    [InlineData("{ condition: cue, band: theta, measure: plv, channels: [C3, C3] }", "surrogate_figure.channels", "listed twice")]
    [InlineData("{ condition: cue, band: theta, measure: plv }", "surrogate_figure.channels", "required key is missing")]
    [InlineData("{ condition: cue, band: theta, measure: plv, channels: [C3, C4], colour: red }", "surrogate_figure.colour", "unknown key")]
    public void A_wrong_edge_is_refused_with_line_key_and_reason(string value, string key, string reason)
    {
        var e = Assert.Throws<InputException>(() => Parse("surrogate_figure: " + value));
        Assert.Contains($"{Source}, line 9: {key}:", e.Message);
        Assert.Contains(reason, e.Message);
    }
}
