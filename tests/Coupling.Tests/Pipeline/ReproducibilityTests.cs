using Coupling.Pipeline;
using Coupling.Plans;

namespace Coupling.Tests.Pipeline;

/// <summary>The same plan and data give the same bytes out, whatever the thread count (design.md: one seed in the plan).</summary>
public sealed class ReproducibilityTests
{
    private static byte[] Edges(string folder, int threads)
    {
        string plan = Path.Combine(folder, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: 50, threads: threads) + "\noverwrite: true\n");
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
        File.WriteAllText(Path.Combine(folder.Path, "plan.yaml"), SmallStudy.PlanText(surrogates: 50).Replace("seed: 42", "seed: 43") + "\noverwrite: true\n");
        var outcome = AnalysisRunner.Run(PlanReader.Read(Path.Combine(folder.Path, "plan.yaml")));
        Assert.NotEqual(first, File.ReadAllBytes(Path.Combine(outcome.OutputFolder, "edges.tsv")));
    }

    private static byte[] Contrasts(string folder, int threads)
    {
        string plan = Path.Combine(folder, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: 50, threads: threads, conditions: "{ go: [go], stop: [stop] }")
            + "\ncontrasts: [[go, stop]]\noverwrite: true\n");
        var outcome = AnalysisRunner.Run(PlanReader.Read(plan));
        return File.ReadAllBytes(Path.Combine(outcome.OutputFolder, "contrasts.tsv"));
    }

    [Fact]
    public void The_same_contrast_twice_gives_byte_identical_tables_with_one_or_two_threads()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        // Alternate the 20 onsets between two conditions of 10 trials: C(20, 10) = 184756 splits, far more than 50.
        string events = Path.Combine(folder.Path, "rec_events.tsv");
        var rows = File.ReadAllLines(events);
        for (int i = 1; i < rows.Length; i++) if (i % 2 == 0) rows[i] = rows[i].Replace("\tgo", "\tstop", StringComparison.Ordinal);
        File.WriteAllText(events, string.Join("\n", rows) + "\n");
        byte[] first = Contrasts(folder.Path, threads: 1);
        byte[] again = Contrasts(folder.Path, threads: 1);
        byte[] two = Contrasts(folder.Path, threads: 2);
        Assert.Equal(first, again);
        Assert.Equal(first, two);
        var lines = System.Text.Encoding.UTF8.GetString(first).Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(1 + 3 * 6, lines.Length);
    }
}
