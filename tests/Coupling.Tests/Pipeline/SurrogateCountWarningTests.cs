using Coupling.Pipeline;
using Coupling.Plans;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// With M surrogates no p is below 1/(M+1), and the Benjamini-Hochberg step (Benjamini &amp; Hochberg 1995) rejects
/// k of m pairs only if the k-th smallest p is at most k·q/m: with 6 pairs at q = 0.05, one pair alone needs
/// 1/(M+1) ≤ 0.05/6, i.e. M ≥ 119; all six together need 1/(M+1) ≤ 0.05, i.e. M ≥ 19.
/// </summary>
public sealed class SurrogateCountWarningTests
{
    private static RunOutcome RunWith(string folder, int surrogates)
    {
        string plan = Path.Combine(folder, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: surrogates));
        return AnalysisRunner.Run(PlanReader.Read(plan));
    }

    [Fact]
    public void Too_few_surrogates_for_any_discovery_are_warned_about_in_the_outcome_and_the_report()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        var outcome = RunWith(folder.Path, surrogates: 10);
        string warning = Assert.Single(outcome.Warnings);
        Assert.Contains("smallest attainable p is 1/11", warning);
        Assert.Contains("no pair can pass the correction", warning);
        Assert.Contains("at least 119 surrogates", warning);
        Assert.Contains("smallest attainable p is 1/11", File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html")));
        Assert.All(outcome.Results, r => Assert.DoesNotContain(true, r.Significant));
    }

    [Fact]
    public void A_count_that_lets_several_pairs_through_says_how_many_must_reach_the_smallest_p()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        // M = 50: 6 / (0.05 x 51) = 2.35, so at least 3 pairs must reach p = 1/51.
        string warning = Assert.Single(RunWith(folder.Path, surrogates: 50).Warnings);
        Assert.Contains("only if at least 3 pairs reach that p", warning);
    }

    [Fact]
    public void Two_sided_tests_alone_halve_the_reach_of_the_surrogates()
    {
        // Two-sided p = min(1, 2·min(tail counts)) cannot go below 2/(M+1) (common practice for permutation tests), so
        // one pair among 6 at q = 0.05 needs 2/(M+1) ≤ 0.05/6, i.e. M ≥ 239; 119 draws, enough for one-sided tests, are not.
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        string plan = Path.Combine(folder.Path, "plan.yaml");
        string text = SmallStudy.PlanText(surrogates: 119);
        int at = text.IndexOf("measures:", StringComparison.Ordinal);
        int end = text.IndexOf('\n', at);
        File.WriteAllText(plan, text[..at] + "measures: [imag-coherency, aec]" + text[end..]);
        string warning = Assert.Single(AnalysisRunner.Run(PlanReader.Read(plan)).Warnings);
        Assert.Contains("smallest attainable p is 2/120 (two-sided tests)", warning);
        Assert.Contains("at least 239 surrogates", warning);
    }

    [Fact]
    public void Enough_surrogates_give_no_warning()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        Assert.Empty(RunWith(folder.Path, surrogates: 119).Warnings);
    }
}
