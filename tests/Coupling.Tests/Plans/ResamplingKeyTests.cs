using Coupling.Plans;

namespace Coupling.Tests.Plans;

/// <summary>The keys <c>intervals</c> and <c>match_trials</c> (docs/user-guide.md).</summary>
public sealed class ResamplingKeyTests
{
    private static readonly string Source = Path.Combine(Path.GetTempPath(), "coupling-plan-tests", "study.yaml");

    private static Plan Parse(params string[] extra) => PlanReader.Parse(new StringReader(string.Join("\n",
        ["recording: rec.edf", "conditions:", "  cue: [cue-a]", "trial: { start: -0.5, end: 1.5 }",
         "window: { start: 0.0, end: 1.0 }", "bands:", "  theta: [4, 8]", "measures: [plv]", "seed: 7", "output: results",
         .. extra]) + "\n"), Source);

    [Fact]
    public void Defaults_are_no_intervals_and_no_matching()
    {
        var plan = Parse();
        Assert.False(plan.JackknifeIntervals);
        Assert.Equal(0, plan.MatchTrials);
    }

    [Fact]
    public void Intervals_and_matching_are_read()
    {
        var plan = Parse("intervals: jackknife", "match_trials: 50", "direction: true");
        Assert.True(plan.Direction);
        Assert.False(Parse().Direction);
        Assert.True(plan.JackknifeIntervals);
        Assert.Equal(50, plan.MatchTrials);
    }

    [Fact]
    public void Wrong_values_are_refused_naming_the_key_and_line()
    {
        var e = Assert.Throws<InputException>(() => Parse("intervals: bootstrap"));
        Assert.Contains("line 11: intervals:", e.Message);
        Assert.Contains("'none' or 'jackknife'", e.Message);
        e = Assert.Throws<InputException>(() => Parse("match_trials: -3"));
        Assert.Contains("line 11: match_trials:", e.Message);
    }
}
