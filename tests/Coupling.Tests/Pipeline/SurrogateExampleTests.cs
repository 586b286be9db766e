using Coupling.Pipeline;
using Coupling.Plans;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// The edge whose surrogate distribution the report draws: the plan's choice when given, and a channel the run does not
/// analyse is refused naming the plan and the key. The draws equal those of the test (p = (b+1)/(M+1), Phipson and Smyth
/// 2010, Stat Appl Genet Mol Biol 9:39).
/// </summary>
public sealed class SurrogateExampleTests
{
    private static string PlanWith(string folder, string extra)
    {
        SmallStudy.WriteRecording(folder);
        string plan = Path.Combine(folder, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText().Replace("figures: false", "figures: true") + "\n" + extra + "\n");
        return plan;
    }

    [Fact]
    public void The_plan_names_the_edge_and_its_draws_give_the_tested_p()
    {
        using var folder = new TempFolder();
        var outcome = AnalysisRunner.Run(PlanReader.Read(PlanWith(folder.Path,
            "surrogate_figure: { condition: go, band: alpha, measure: wpli, channels: [C, A] }")));
        var d = outcome.SurrogateExample ?? throw new Xunit.Sdk.XunitException("no surrogate example");
        Assert.Equal(("go", "alpha", "wpli", "A", "C", "plan"), (d.Condition, d.Band, d.Measure, d.ChannelA, d.ChannelB, d.Chosen));
        var table = outcome.Results.Single(r => r.Measure == "wpli");
        int k = Coupling.Measures.PairIndex.Of(0, 2, 4);
        Assert.Equal(table.P[k], d.P);
        Assert.Equal(50, d.Draws.Length);
        Assert.True(File.Exists(Path.Combine(outcome.OutputFolder, "figures", Coupling.Reports.HtmlReport.SurrogateFile)));
    }

    [Fact]
    public void A_channel_that_is_not_analysed_is_refused_and_nothing_is_written()
    {
        using var folder = new TempFolder();
        string plan = PlanWith(folder.Path, "surrogate_figure: { condition: go, band: alpha, measure: plv, channels: [A, Z] }");
        var e = Assert.Throws<InputException>(() => AnalysisRunner.Run(PlanReader.Read(plan)));
        Assert.Contains("plan.yaml: surrogate_figure.channels: 'Z' is not an analysed channel", e.Message);
        Assert.False(Directory.Exists(Path.Combine(folder.Path, "results")));
    }
}
