using Coupling.Pipeline;
using Coupling.Plans;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// With M surrogates no one-sided p is below 1/(M+1) and no two-sided p below 2/(M+1) (twice the smaller one-sided
/// p; the plan tests aec, a signed measure), and the Benjamini-Hochberg step (Benjamini &amp; Hochberg 1995) rejects
/// k of m pairs only if the k-th smallest p is at most k·q/m: with 6 pairs at q = 0.05, one pair alone needs
/// 2/(M+1) ≤ 0.05/6, i.e. M ≥ 239; all six together need 2/(M+1) ≤ 0.05, i.e. M ≥ 39.
/// </summary>
public sealed class SurrogateCountWarningTests
{
    // The study's shared 10 Hz source keeps nearly the same phase at every onset (onsets 15 cycles apart, slow phase
    // drift), so its evoked share is high and the run warns about that too; only the surrogate-count warning is checked.
    private static IEnumerable<string> CountWarnings(RunOutcome outcome) => outcome.Warnings.Where(w => w.Contains("surrogates"));

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
        string warning = Assert.Single(CountWarnings(outcome));
        Assert.Contains("smallest attainable p is 1/11 one-sided and 2/11 two-sided", warning);
        Assert.Contains("no pair can pass the correction", warning);
        Assert.Contains("at least 239 surrogates", warning);
        Assert.Contains("smallest attainable p is 1/11", File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.md")));
        Assert.All(outcome.Results, r => Assert.DoesNotContain(true, r.Significant));
    }

    [Fact]
    public void A_count_that_lets_several_pairs_through_says_how_many_must_reach_the_smallest_p()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        // M = 50: 2 x 6 / (0.05 x 51) = 4.7, so at least 5 pairs must reach p = 2/51.
        string warning = Assert.Single(CountWarnings(RunWith(folder.Path, surrogates: 50)));
        Assert.Contains("only if at least 5 pairs reach that p", warning);
    }

    [Fact]
    public void Enough_surrogates_give_no_warning()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        Assert.Empty(CountWarnings(RunWith(folder.Path, surrogates: 239)));
    }
}
