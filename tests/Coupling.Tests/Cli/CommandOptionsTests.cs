using System.Text.Json.Nodes;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Tests.Pipeline;

namespace Coupling.Tests.Cli;

/// <summary>check, the overrides of plan keys on run, and how much run prints with --quiet and --verbose.</summary>
public sealed class CommandOptionsTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static (int Code, string Out, string Err) Cli(params string[] args) => CliCapture.Run(args);

    [Fact]
    public void Check_prints_trials_kernel_lengths_units_and_surrogates_needed_and_writes_nothing()
    {
        string plan = ResumeStudy.Write(_folder.Path, surrogates: 40);
        var snapshot = FolderSnapshot.Take(_folder.Path);
        var entries = _folder.Entries();

        var (code, output, err) = Cli("check", plan);

        Assert.True(code == 0, err);
        Assert.Equal("", err);
        snapshot.AssertAllStillThere();
        Assert.Equal(entries, _folder.Entries());
        var lines = output.Split('\n').Select(l => l.TrimEnd()).ToArray();
        // The events alternate go and stop over 20 onsets (ResumeStudy).
        Assert.Contains("  go: 10", lines);
        Assert.Contains("  stop: 10", lines);
        foreach (var (band, lo, hi) in new[] { ("alpha", 8.0, 12.0), ("beta", 15.0, 25.0) })
        {
            int taps = BandDecompositions.Create("fir-hilbert", new Band(band, lo, hi), SmallStudy.Rate).PadSamples;
            Assert.Contains(lines, l => l.StartsWith($"  {band}: fir-hilbert, filter {taps} samples", StringComparison.Ordinal));
        }
        Assert.Contains("Work units: 6 (2 condition(s) x 2 band(s), 1 contrast(s) x 2 band(s)), 40 surrogates each", lines);
        Assert.Contains("  contrast go-vs-stop / band beta", lines);
        // 4 channels give 6 pairs; a lone pair passes Benjamini-Hochberg at q = 0.05 only if 1/(M+1) <= 0.05/6, so M >= 119.
        Assert.Contains(lines, l => l.StartsWith("Surrogates needed for a single discovery among 6 pairs at q = 0.05 (benjamini-hochberg): at least 119; the plan has 40", StringComparison.Ordinal));
        // The contrast is two-sided, so its smallest counted p is 2/(M+1) and the Benjamini-Hochberg step for a lone pair,
        // q/6 (Benjamini & Hochberg 1995), needs M >= 2·6/0.05 − 1 = 239.
        Assert.Contains("Surrogates needed for a single difference between conditions (two-sided): at least 239; the plan has 40 " +
            "(too few for a lone pair that differs to pass the correction).", lines);

        // Values without a test: no surrogate count to check, and check says so.
        (code, output, err) = Cli("check", plan, "--surrogates", "0");
        Assert.True(code == 0, err);
        Assert.Contains("the plan has 0 (values only, no test).", output);
        snapshot.AssertAllStillThere();
        Assert.Equal(entries, _folder.Entries());
    }

    [Fact]
    public void Check_lists_the_units_an_interrupted_run_kept_and_refuses_a_bad_plan_with_2()
    {
        string plan = ResumeStudy.Write(_folder.Path, surrogates: 40);
        using (var stop = new CancellationTokenSource())
        {
            var progress = new StopOnSecondUnit(stop);
            Assert.ThrowsAny<OperationCanceledException>(() => AnalysisRunner.Run(PlanReader.Read(plan), progress, threads: 1, cancellationToken: stop.Token));
        }
        var kept = FolderSnapshot.Take(_folder.Path);
        var (code, output, _) = Cli("check", plan);
        Assert.Equal(0, code);
        Assert.Contains("  condition go / band alpha   (kept by an interrupted run: loaded, not computed)", output);
        Assert.Contains("  condition go / band beta\n", output.ReplaceLineEndings("\n"));
        kept.AssertAllStillThere();

        File.WriteAllText(plan, File.ReadAllText(plan).Replace("go: [go]", "go: [went]"));
        string err;
        (code, _, err) = Cli("check", plan, "--output", _folder["other"]);
        Assert.Equal(2, code);
        Assert.Contains("'went' does not occur", err);
    }

    [Fact]
    public void Output_surrogates_and_seed_on_the_command_line_replace_the_plan_keys()
    {
        SmallStudy.WriteRecording(_folder.Path);
        string plan = _folder["plan.yaml"];
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: 50));
        string other = _folder["elsewhere"];
        var (code, output, err) = Cli("run", plan, "--output", other, "--surrogates", "30", "--seed", "9", "--quiet");
        Assert.True(code == 0, err);
        Assert.StartsWith($"Results: {other}\n", output.ReplaceLineEndings("\n"));
        Assert.False(Directory.Exists(_folder["results"]));
        var manifest = JsonNode.Parse(File.ReadAllText(Path.Combine(other, "manifest.json")))!;
        Assert.Equal(30, (int)manifest["plan"]!["surrogates"]!);
        Assert.Equal(9UL, (ulong)manifest["seed"]!);
        Assert.Equal(other, (string)manifest["plan"]!["output"]!);

        (code, _, err) = Cli("run", plan, "--surrogates", "-1");
        Assert.Equal(2, code);
        Assert.Contains("--surrogates: -1 is not a whole number from 0", err);
        (code, _, err) = Cli("run", plan, "--seed", "-1");
        Assert.Equal(2, code);
    }

    [Fact]
    public void Quiet_prints_only_the_results_and_verbose_adds_the_preview_and_timed_progress()
    {
        SmallStudy.WriteRecording(_folder.Path);
        string plan = _folder["plan.yaml"];
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: 200) + "\noverwrite: true\n");

        var (code, output, err) = Cli("run", plan, "--quiet");
        Assert.Equal(0, code);
        Assert.Equal("", err);
        Assert.Equal($"Results: {_folder["results"]}", output.Split('\n')[0].TrimEnd());
        Assert.All(output.Split('\n', StringSplitOptions.RemoveEmptyEntries).Skip(1), l => Assert.StartsWith("  warning: ", l));

        (code, output, err) = Cli("run", plan);
        Assert.Equal(0, code);
        var progress = err.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal("reading input", progress[0]);
        Assert.Contains(progress, l => l.StartsWith("go / alpha: surrogates: 200/200 (", StringComparison.Ordinal) && l.EndsWith(" s)", StringComparison.Ordinal));
        Assert.DoesNotContain("Work units:", output);

        (code, output, err) = Cli("run", plan, "--verbose");
        Assert.Equal(0, code);
        Assert.Contains("Work units: 1 (1 condition(s) x 1 band(s)), 200 surrogates each", output);
        Assert.Contains("go / alpha: band isolation", err);

        (code, _, err) = Cli("run", plan, "--quiet", "--verbose");
        Assert.Equal(2, code);
        Assert.Contains("--quiet and --verbose", err);
    }

    /// <summary>Cancels the run when the second unit's band isolation starts.</summary>
    private sealed class StopOnSecondUnit(CancellationTokenSource stop) : IProgress<RunProgress>
    {
        private int _units;

        public void Report(RunProgress value)
        {
            if (value.Stage.EndsWith(": band isolation", StringComparison.Ordinal) && ++_units == 2) stop.Cancel();
        }
    }
}
