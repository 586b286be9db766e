using System.Diagnostics;
using Coupling.Tests.Pipeline;

namespace Coupling.Tests.Cli;

/// <summary>
/// Runs of the real program killed outright (SIGKILL) at random points and run again until they finish give the same
/// results folder, byte for byte, as a run never stopped (only the manifest's fields about the run itself differ), and
/// no partial results folder is ever visible under the target name.
/// </summary>
public sealed class KilledRunTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Killed_and_resumed_runs_give_the_bytes_of_an_uninterrupted_run()
    {
        string study = _folder["study"];
        Directory.CreateDirectory(study);
        string plan = ResumeStudy.Write(study, surrogates: 40);
        string target = Path.Combine(study, "results");

        // The uninterrupted run, and how many progress lines it writes (the kill points are drawn among them).
        int lines;
        using (var whole = new CliProcess(study, "run", "plan.yaml"))
        {
            whole.WaitForExit();
            Assert.True(whole.ExitCode == 0, whole.ErrorText);
            lines = whole.ErrorLineCount;
        }
        Assert.True(lines > 10, $"only {lines} progress lines");
        var expected = ResumeStudy.Contents(target);
        var expectedNames = expected.Keys.ToArray();
        Directory.Move(target, _folder["reference"]);

        int resumedUnits = 0;
        foreach (int seed in new[] { 1, 2, 3 })
        {
            var rng = new Random(seed);
            for (int attempt = 0; ; attempt++)
            {
                // Up to three kills per seed; then the run is left to finish.
                int? killAfterLine = attempt < 3 ? rng.Next(0, lines) : null;
                int extraMs = rng.Next(0, 100);
                using var run = new CliProcess(study, "run", "plan.yaml");
                var clock = Stopwatch.StartNew();
                long seenAt = -1;
                while (!run.HasExited)
                {
                    AssertWholeOrAbsent(target, expectedNames);
                    if (killAfterLine is { } k && run.ErrorLineCount >= k)
                    {
                        if (seenAt < 0) seenAt = clock.ElapsedMilliseconds;
                        if (clock.ElapsedMilliseconds - seenAt >= extraMs)
                        {
                            run.Kill();
                            break;
                        }
                    }
                    Thread.Sleep(2);
                }
                run.WaitForExit();
                AssertWholeOrAbsent(target, expectedNames);
                if (Directory.Exists(target))
                {
                    // Finished (possibly just before the kill landed).
                    Assert.Equal(expected, ResumeStudy.Contents(target));
                    resumedUnits += ResumeStudy.ResumedUnits(target).Length;
                    Assert.False(Directory.Exists(Path.Combine(study, ".results.unfinished")), "units left after the commit");
                    break;
                }
                Assert.True(killAfterLine is not null, $"the last run did not finish: exit {run.ExitCode}, {run.ErrorText}");
            }
            Directory.Delete(target, recursive: true);
            Assert.Equal(["plan.yaml", "rec.csv", "rec_events.tsv"], Directory.GetFileSystemEntries(study).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        }
        Assert.True(resumedUnits > 0, "no kill landed after a finished unit, so nothing was resumed");
    }

    /// <summary>The target is either missing or holds exactly the files of a whole results folder.</summary>
    private static void AssertWholeOrAbsent(string target, string[] expectedNames)
    {
        if (!Directory.Exists(target)) return;
        var names = Directory.EnumerateFiles(target, "*", new EnumerationOptions { RecurseSubdirectories = true, AttributesToSkip = 0 })
            .Select(f => Path.GetRelativePath(target, f).Replace('\\', '/')).Order(StringComparer.Ordinal).ToArray();
        if (!Directory.Exists(target)) return;
        Assert.Equal(expectedNames, names);
    }
}
