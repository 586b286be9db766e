using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Tests.Pipeline;

namespace Coupling.Tests.Reports;

/// <summary>
/// The report, the flag table and the report's figures hold nothing about the run itself: the same plan and data give
/// the same bytes, whatever the thread count (design.md: one seed in the plan; only the manifest records the run).
/// </summary>
public sealed class ReportReproducibilityTests
{
    private static Dictionary<string, byte[]> Run(string folder, int threads)
    {
        string plan = Path.Combine(folder, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: 50, threads: threads).Replace("figures: false", "figures: true") + "\noverwrite: true\nsurrogate_figure: { condition: go, band: alpha, measure: plv, channels: [A, B] }\n");
        var outcome = AnalysisRunner.Run(PlanReader.Read(plan));
        return new[] { "report.html", "flags.tsv", "figures/overview.png", "figures/surrogate-distribution.png" }
            .ToDictionary(f => f, f => File.ReadAllBytes(Path.Combine(outcome.OutputFolder, f)));
    }

    [Fact]
    public void The_same_plan_gives_the_same_report_with_one_or_two_threads()
    {
        using var folder = new Pipeline.TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        var first = Run(folder.Path, threads: 1);
        var two = Run(folder.Path, threads: 2);
        foreach (var (name, bytes) in first) Assert.True(bytes.SequenceEqual(two[name]), $"{name} differs between runs");
    }
}
