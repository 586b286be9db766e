using Coupling.Pipeline;
using Coupling.Plans;

namespace Coupling.Tests.Pipeline;

/// <summary>The same plan and data give the same bytes out, whatever the thread count (design.md: one seed in the plan).</summary>
public sealed class ReproducibilityTests
{
    private static byte[] Edges(string folder, int threads)
    {
        string plan = Path.Combine(folder, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: 50, threads: threads));
        var outcome = AnalysisRunner.Run(PlanReader.Read(plan));
        return File.ReadAllBytes(Path.Combine(outcome.OutputFolder, "edges.tsv"));
    }

    [Fact]
    public void The_same_plan_twice_gives_byte_identical_edges_with_one_or_two_threads()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        byte[] first = Edges(folder.Path, threads: 1);
        byte[] again = Edges(folder.Path, threads: 1);
        byte[] two = Edges(folder.Path, threads: 2);
        Assert.Equal(first, again);
        Assert.Equal(first, two);
        // The run is not trivially constant: 3 measures x 6 pairs, and the shared 10 Hz source of A and B is found.
        var rows = System.Text.Encoding.UTF8.GetString(first).Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(1 + 3 * 6, rows.Length);
        Assert.Contains(rows, r => r.StartsWith("go\talpha\tplv\tA\tB\t", StringComparison.Ordinal));
    }

    [Fact]
    public void Another_seed_gives_other_surrogate_p_values()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        byte[] first = Edges(folder.Path, threads: 1);
        File.WriteAllText(Path.Combine(folder.Path, "plan.yaml"), SmallStudy.PlanText(surrogates: 50).Replace("seed: 42", "seed: 43"));
        var outcome = AnalysisRunner.Run(PlanReader.Read(Path.Combine(folder.Path, "plan.yaml")));
        Assert.NotEqual(first, File.ReadAllBytes(Path.Combine(outcome.OutputFolder, "edges.tsv")));
    }
}
