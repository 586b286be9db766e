using Coupling.Measures;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Statistics;
using Coupling.Tests.Cli;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// A stopped run keeps its finished work units beside the results folder and the next run of the same plan and inputs
/// loads them instead of computing them again, giving the same bytes as a run computed whole; a changed plan or input
/// is refused unless the user asks to start over.
/// </summary>
public sealed class ResumeTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>Runs the plan and stops it (by cancellation) when the stage of unit number <paramref name="stopAt"/> (from 0) begins.</summary>
    private static void RunAndStop(string plan, int stopAt)
    {
        using var stop = new CancellationTokenSource();
        var progress = new StopAtUnit(stopAt, stop);
        Assert.ThrowsAny<OperationCanceledException>(() => AnalysisRunner.Run(PlanReader.Read(plan), progress, threads: 1, cancellationToken: stop.Token));
    }

    [Fact]
    public void A_stopped_run_resumes_from_its_finished_units_and_gives_the_same_bytes()
    {
        string plan = ResumeStudy.Write(_folder.Path, surrogates: 40);
        var whole = AnalysisRunner.Run(PlanReader.Read(plan), threads: 1);
        Assert.Empty(whole.ResumedUnits!);
        var expected = ResumeStudy.Contents(whole.OutputFolder);
        Directory.Move(_folder["results"], _folder["whole"]);

        RunAndStop(plan, stopAt: 3);
        Assert.False(Directory.Exists(_folder["results"]));
        string unfinished = _folder[".results.unfinished"];
        Assert.Equal(3, Directory.GetFiles(Path.Combine(unfinished, "units"), "*.unit").Length);

        var resumed = AnalysisRunner.Run(PlanReader.Read(plan), threads: 1);
        Assert.Equal(["condition go / band alpha", "condition go / band beta", "condition stop / band alpha"], resumed.ResumedUnits);
        Assert.Equal(resumed.ResumedUnits, ResumeStudy.ResumedUnits(_folder["results"]));
        Assert.Equal(expected, ResumeStudy.Contents(_folder["results"]));
        Assert.False(Directory.Exists(unfinished), "the unfinished units were not removed after the commit");
        Assert.Equal(["plan.yaml", "rec.csv", "rec_events.tsv", "results", "whole"], _folder.Entries());
    }

    [Theory]
    [InlineData("{ method: max-statistic, alpha: 0.05 }")]
    [InlineData("{ method: network-based, alpha: 0.05, threshold: 2 }")]
    [InlineData("{ method: benjamini-hochberg, q: 0.05, tail: pareto }")]
    public void Corrections_decided_by_the_draws_resume_from_their_units_and_give_the_same_bytes(string correction)
    {
        // These corrections need every draw of a table (its maxima, components or tails), so a unit keeps each measure's
        // corrected outcome beside its test; a resumed run must still write exactly what a run never stopped writes.
        string plan = ResumeStudy.Write(_folder.Path, surrogates: 40, correction);
        var whole = AnalysisRunner.Run(PlanReader.Read(plan), threads: 1);
        var expected = ResumeStudy.Contents(whole.OutputFolder);
        Directory.Move(_folder["results"], _folder["whole"]);

        RunAndStop(plan, stopAt: 5);
        Assert.Equal(5, Directory.GetFiles(Path.Combine(_folder[".results.unfinished"], "units"), "*.unit").Length);

        var resumed = AnalysisRunner.Run(PlanReader.Read(plan), threads: 1);
        Assert.Equal(["condition go / band alpha", "condition go / band beta", "condition stop / band alpha",
            "condition stop / band beta", "contrast go-vs-stop / band alpha"], resumed.ResumedUnits);
        Assert.Equal(expected, ResumeStudy.Contents(_folder["results"]));
    }

    [Fact]
    public void A_changed_plan_or_input_is_refused_unless_asked_to_start_over()
    {
        string plan = ResumeStudy.Write(_folder.Path, surrogates: 40);
        RunAndStop(plan, stopAt: 2);
        string unfinished = _folder[".results.unfinished"];
        var kept = FolderSnapshot.Take(unfinished);

        File.WriteAllText(plan, File.ReadAllText(plan).Replace("seed: 42", "seed: 43"));
        var (code, _, err) = Cli("run", plan);
        Assert.Equal(2, code);
        Assert.Contains("the plan has changed", err);
        Assert.Contains("--restart", err);
        kept.AssertAllStillThere();
        File.WriteAllText(plan, File.ReadAllText(plan).Replace("seed: 43", "seed: 42"));

        // threads do not change results: not a change of plan
        File.WriteAllText(plan, File.ReadAllText(plan).Replace("threads: 1", "threads: 2"));
        Assert.Null(Record.Exception(() => UnfinishedRun.Open(PlanReader.Read(plan))));

        File.AppendAllText(_folder["rec_events.tsv"], "60\t0\tgo\n");
        (code, _, err) = Cli("run", plan);
        Assert.Equal(2, code);
        Assert.Contains("rec_events.tsv' has changed", err);
        kept.AssertAllStillThere();

        string output;
        (code, output, err) = Cli("run", plan, "--restart");
        Assert.True(code == 0, err);
        Assert.DoesNotContain("resumed", output);
        Assert.Empty(ResumeStudy.ResumedUnits(_folder["results"]));
        Assert.False(Directory.Exists(unfinished));
    }

    [Fact]
    public void A_folder_at_the_units_place_that_the_tool_did_not_make_is_refused_and_kept()
    {
        string plan = ResumeStudy.Write(_folder.Path, surrogates: 40);
        Directory.CreateDirectory(_folder[".results.unfinished"]);
        File.WriteAllText(_folder[".results.unfinished/mine.txt"], "mine");
        var (code, _, err) = Cli("run", plan, "--restart");
        Assert.Equal(2, code);
        Assert.Contains("mine.txt", err);
        Assert.Equal("mine", File.ReadAllText(_folder[".results.unfinished/mine.txt"]));
        Assert.False(Directory.Exists(_folder["results"]));
    }

    [Fact]
    public void Unit_files_give_back_every_double_bit_for_bit()
    {
        string plan = ResumeStudy.Write(_folder.Path, surrogates: 40);
        var units = UnfinishedRun.Open(PlanReader.Read(plan));
        double[] awkward = [0.1, -0.0, double.NaN, BitConverter.Int64BitsToDouble(0x7FF8_0000_0000_0123), double.Epsilon,
            double.MaxValue, double.NegativeInfinity, 1.0 / 3];
        var saved = new SurrogateResult(Measure.Wpli, 7, awkward, awkward.Reverse().ToArray(), awkward, [0, 1, int.MaxValue, 3, 4, 5, 6, 7], awkward, awkward);
        var first = units.Condition(0, 1, "u", () => [saved]);
        var again = UnfinishedRun.Open(PlanReader.Read(plan)).Condition(0, 1, "u", () => throw new InvalidOperationException("computed again"));
        var back = Assert.Single(again);
        Assert.Equal(saved.Measure, back.Measure);
        Assert.Equal(saved.Draws, back.Draws);
        foreach (var (a, b) in new[] { (saved.Observed, back.Observed), (saved.NullMean, back.NullMean), (saved.NullSd, back.NullSd), (saved.P, back.P), (saved.Z, back.Z) })
            Assert.Equal(a.Select(BitConverter.DoubleToInt64Bits), b.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(saved.Exceedances, back.Exceedances);
    }

    private static (int Code, string Out, string Err) Cli(params string[] args) => CliCapture.Run(args);

    /// <summary>Cancels the run when the band isolation of the unit numbered <c>stopAt</c> (counting from 0) starts.</summary>
    private sealed class StopAtUnit(int stopAt, CancellationTokenSource stop) : IProgress<RunProgress>
    {
        private int _units;

        public void Report(RunProgress value)
        {
            if (value.Stage.EndsWith(": band isolation", StringComparison.Ordinal) && _units++ == stopAt) stop.Cancel();
        }
    }
}
