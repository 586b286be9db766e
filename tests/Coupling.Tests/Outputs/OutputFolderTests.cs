using Coupling.Outputs;

namespace Coupling.Tests.Outputs;

public class OutputFolderTests
{
    [Fact]
    public void A_successful_run_puts_the_whole_folder_in_place_and_leaves_no_siblings()
    {
        using var dir = new TempFolder();
        using (var output = OutputFolder.Begin(dir["results"]))
        {
            AtomicFile.WriteAllText(output.PathOf("a.csv"), "1");
            AtomicFile.WriteAllText(output.PathOf("figures/b.txt"), "2");
            Assert.False(Directory.Exists(dir["results"]));
            output.Commit();
        }
        Assert.Equal(["results"], dir.Entries());
        Assert.Equal("1", File.ReadAllText(dir["results/a.csv"]));
        Assert.Equal("2", File.ReadAllText(dir["results/figures/b.txt"]));
    }

    [Fact]
    public void A_failed_run_leaves_no_partial_folder()
    {
        using var dir = new TempFolder();
        Assert.Throws<InvalidDataException>((Action)(() =>
        {
            using var output = OutputFolder.Begin(dir["results"]);
            AtomicFile.WriteAllText(output.PathOf("a.csv"), "1");
            using var half = AtomicFile.Create(output.PathOf("b.csv"));
            half.WriteByte(1);
            throw new InvalidDataException("simulated failure before the run finished");
        }));
        Assert.Empty(dir.Entries());
    }

    [Fact]
    public void A_failed_run_leaves_the_old_results_intact()
    {
        using var dir = new TempFolder();
        Directory.CreateDirectory(dir["results"]);
        File.WriteAllText(dir["results/old.csv"], "old");
        Assert.Throws<InvalidDataException>((Action)(() =>
        {
            using var output = OutputFolder.Begin(dir["results"]);
            AtomicFile.WriteAllText(output.PathOf("new.csv"), "new");
            throw new InvalidDataException("simulated failure");
        }));
        Assert.Equal(["results"], dir.Entries());
        Assert.Equal(["old.csv"], Directory.GetFiles(dir["results"]).Select(Path.GetFileName));
    }

    [Fact]
    public void A_successful_run_replaces_the_old_results_and_removes_them()
    {
        using var dir = new TempFolder();
        Directory.CreateDirectory(dir["results"]);
        File.WriteAllText(dir["results/old.csv"], "old");
        using (var output = OutputFolder.Begin(dir["results"]))
        {
            AtomicFile.WriteAllText(output.PathOf("new.csv"), "new");
            output.Commit();
        }
        Assert.Equal(["results"], dir.Entries());
        Assert.Equal(["new.csv"], Directory.GetFiles(dir["results"]).Select(Path.GetFileName));
    }

    [Fact]
    public void The_working_folder_is_a_hidden_sibling_of_the_target()
    {
        using var dir = new TempFolder();
        using var output = OutputFolder.Begin(dir["out"]);
        Assert.Equal(dir.Path, Path.GetDirectoryName(output.WorkingPath));
        Assert.Matches(@"^\.out\.tmp-[0-9a-f]{12}$", Path.GetFileName(output.WorkingPath));
        Assert.True(Directory.Exists(output.WorkingPath));
    }

    [Fact]
    public void Paths_outside_the_folder_are_refused()
    {
        using var dir = new TempFolder();
        using var output = OutputFolder.Begin(dir["out"]);
        Assert.Throws<ArgumentException>(() => output.PathOf("../escape.csv"));
        Assert.Throws<ArgumentException>(() => output.PathOf("/etc/escape.csv"));
    }

    [Fact]
    public void A_second_commit_is_refused()
    {
        using var dir = new TempFolder();
        using var output = OutputFolder.Begin(dir["out"]);
        output.Commit();
        Assert.Throws<InvalidOperationException>(output.Commit);
    }

    [Fact]
    public void A_target_that_is_a_file_is_reported_as_input_error()
    {
        using var dir = new TempFolder();
        File.WriteAllText(dir["out"], "a file");
        var e = Assert.Throws<InputException>(() => OutputFolder.Begin(dir["out"]));
        Assert.Contains("out", e.Message);
    }

    [Fact]
    public void Leftovers_of_killed_runs_are_removed_and_the_results_kept()
    {
        using var dir = new TempFolder();
        Directory.CreateDirectory(dir["results"]);
        Directory.CreateDirectory(dir[".results.tmp-0123456789ab"]);
        Directory.CreateDirectory(dir[".results.old-0123456789ab"]);
        Directory.CreateDirectory(dir[".other.tmp-0123456789ab"]);
        Assert.Equal(2, OutputFolder.RemoveLeftovers(dir["results"]));
        Assert.Equal([".other.tmp-0123456789ab", "results"], dir.Entries());
    }

    [Fact]
    public void Old_results_set_aside_by_a_run_killed_before_its_rename_are_put_back()
    {
        using var dir = new TempFolder();
        Directory.CreateDirectory(dir[".results.tmp-0123456789ab"]);
        Directory.CreateDirectory(dir[".results.old-0123456789ab"]);
        File.WriteAllText(Path.Combine(dir[".results.old-0123456789ab"], "edges.tsv"), "earlier");
        OutputFolder.RemoveLeftovers(dir["results"]);
        Assert.Equal(["results"], dir.Entries());
        Assert.Equal("earlier", File.ReadAllText(Path.Combine(dir["results"], "edges.tsv")));
    }
}
