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

    /// <summary>The small study with 24 trials alternately go and stay and the contrast go vs stay.</summary>
    private static string ContrastPlan(TempFolder folder, int surrogates, string extra = "")
    {
        string path = SpectrumRunTests.Write(folder, "contrasts: [[go, stay]]" + extra);
        File.WriteAllText(path, File.ReadAllText(path).Replace("surrogates: 20", $"surrogates: {surrogates}", StringComparison.Ordinal));
        return path;
    }

    [Fact]
    public void A_contrast_with_too_few_label_permutations_is_warned_about_at_the_two_sided_floor()
    {
        // A contrast's p = min(1, 2·min(b_upper + 1, b_lower + 1)/(M + 1)) (Kulinskaya 2008, docs/methods.md section 7)
        // cannot go below 2/(M+1): one pair among 6 at q = 0.05 needs 2/(M+1) ≤ 0.05/6 (Benjamini & Hochberg 1995), i.e.
        // M ≥ 239. With M = 119 the per-condition tests (plv and wpli one-sided) are fine at 1/120 ≤ 0.05/6, the contrast
        // is not: ceil(2·6 / (0.05·120)) = 2 pairs must reach p = 2/120 together.
        using var folder = new TempFolder();
        var outcome = AnalysisRunner.Run(PlanReader.Read(ContrastPlan(folder, 119)));
        string warning = Assert.Single(outcome.Warnings);
        Assert.StartsWith("Condition contrasts (go-vs-stay) are tested two-sided: with 119 surrogates the smallest attainable p of a difference is 2/120;", warning);
        Assert.Contains("only if at least 2 pairs reach that p", warning);
        Assert.Contains("at least 239 surrogates", warning);
        Assert.Contains("smallest attainable p of a difference is 2/120", File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html")));
    }

    [Fact]
    public void The_plan_check_gives_the_contrast_warning_before_any_run()
    {
        // The same plan as above (M = 119): `check` says what the run would warn about the contrasts.
        using var folder = new TempFolder();
        var preview = PlanCheck.Preview(PlanReader.Read(ContrastPlan(folder, 119)));
        Assert.Contains(preview.Warnings, w => w.StartsWith("Condition contrasts (go-vs-stay) are tested two-sided", StringComparison.Ordinal)
            && w.Contains("at least 239 surrogates", StringComparison.Ordinal));
        var enough = PlanCheck.Preview(PlanReader.Read(ContrastPlan(folder, 239)));
        Assert.DoesNotContain(enough.Warnings, w => w.StartsWith("Condition contrasts", StringComparison.Ordinal));
    }

    [Fact]
    public void The_contrast_floor_is_met_at_twice_the_one_sided_count_and_absent_without_contrasts()
    {
        // 2/(M+1) ≤ 0.05/6 from M = 239 on (Benjamini & Hochberg 1995 with the two-sided floor, as above).
        var plan = PlanReader.Parse(new StringReader(SmallStudy.PlanText(surrogates: 239, conditions: "{ go: [go], stay: [stay] }") +
            "\ncontrasts: [[go, stay]]"), "/data/plan.yaml");
        Assert.Null(SurrogateCountWarning.ForContrasts(plan, 6));
        Assert.Contains("at least 239 surrogates", SurrogateCountWarning.ForContrasts(plan with { Surrogates = 238 }, 6));
        Assert.Contains("smallest attainable p of a difference is 2/239", SurrogateCountWarning.ForContrasts(plan with { Surrogates = 238 }, 6));
        Assert.Null(SurrogateCountWarning.ForContrasts(plan with { Contrasts = [], Surrogates = 10 }, 6));
    }

    [Fact]
    public void Family_wise_maxima_keep_the_floor_at_one_over_m_plus_one_for_contrasts_and_two_sided_measures()
    {
        // The maximum statistic's p = (1 + #{d : max T_d ≥ T})/(M + 1) on the absolute studentised statistic (Nichols &
        // Holmes 2002) reaches 1/(M+1) for two-sided tests too: alpha = 0.05 needs M ≥ 19, not 39.
        var plan = PlanReader.Parse(new StringReader(SmallStudy.PlanText(surrogates: 19, conditions: "{ go: [go], stay: [stay] }")
            .Replace("measures: [plv, wpli, aec]", "measures: [imag-coherency, aec]", StringComparison.Ordinal) +
            "\ncontrasts: [[go, stay]]\ncorrection: { method: max-statistic, alpha: 0.05 }"), "/data/plan.yaml");
        Assert.Null(SurrogateCountWarning.ForContrasts(plan, 6));
        Assert.Null(SurrogateCountWarning.ForConditions(plan, 6));
        string? warning = SurrogateCountWarning.ForContrasts(plan with { Surrogates = 18 }, 6);
        Assert.Equal("Condition contrasts (go-vs-stay): with 18 surrogates the smallest attainable p of a difference is 1/19, above alpha = 0.05: " +
                     "no pair can be significant. Use at least 19 surrogates.", warning);
    }

    [Fact]
    public void Enough_surrogates_give_no_warning()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        Assert.Empty(RunWith(folder.Path, surrogates: 119).Warnings);
    }
}
