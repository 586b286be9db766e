using Coupling.Outputs;
using Coupling.Tests.Pipeline;

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
        WriteEarlierResults(dir["results"], "old.csv");
        Assert.Throws<InvalidDataException>((Action)(() =>
        {
            using var output = OutputFolder.Begin(dir["results"], replace: true);
            AtomicFile.WriteAllText(output.PathOf("new.csv"), "new");
            throw new InvalidDataException("simulated failure");
        }));
        Assert.Equal(["results"], dir.Entries());
        Assert.Equal(["manifest.json", "old.csv"], Directory.GetFiles(dir["results"]).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }

    /// <summary>An earlier results folder of this tool: a marked manifest listing every file.</summary>
    private static void WriteEarlierResults(string folder, params string[] files)
    {
        Directory.CreateDirectory(folder);
        foreach (var f in files)
        {
            Directory.CreateDirectory(Path.GetDirectoryName(Path.Combine(folder, f))!);
            File.WriteAllText(Path.Combine(folder, f), "old " + f);
        }
        ManifestWriter.Write(new Manifest
        {
            Format = Manifest.ResultsFormat,
            Tool = ToolInfo.Current(),
            Started = DateTimeOffset.UnixEpoch,
            Finished = DateTimeOffset.UnixEpoch,
            Outputs = [.. files, "manifest.json"],
        }, Path.Combine(folder, "manifest.json"));
    }

    [Fact]
    public void A_successful_run_replaces_earlier_results_when_asked_and_removes_them()
    {
        using var dir = new TempFolder();
        WriteEarlierResults(dir["results"], "old.csv", "figures/old.png");
        using (var output = OutputFolder.Begin(dir["results"], replace: true))
        {
            AtomicFile.WriteAllText(output.PathOf("new.csv"), "new");
            output.Commit();
        }
        Assert.Equal(["results"], dir.Entries());
        Assert.Equal(["new.csv"], Directory.GetFileSystemEntries(dir["results"]).Select(Path.GetFileName));
    }

    [Fact]
    public void Earlier_results_are_not_replaced_unless_asked()
    {
        using var dir = new TempFolder();
        WriteEarlierResults(dir["results"], "old.csv");
        var e = Assert.Throws<InputException>(() => OutputFolder.Begin(dir["results"]));
        Assert.Contains("--force", e.Message);
        Assert.Equal("old old.csv", File.ReadAllText(dir["results/old.csv"]));
        Assert.Equal(["results"], dir.Entries());
    }

    [Fact]
    public void A_file_added_to_earlier_results_during_the_run_stops_the_commit_and_is_kept()
    {
        using var dir = new TempFolder();
        WriteEarlierResults(dir["results"], "old.csv");
        using (var output = OutputFolder.Begin(dir["results"], replace: true))
        {
            AtomicFile.WriteAllText(output.PathOf("new.csv"), "new");
            File.WriteAllText(dir["results/added.txt"], "added while the run computed");
            var e = Assert.Throws<InputException>(output.Commit);
            Assert.Contains("added.txt", e.Message);
        }
        Assert.Equal(["results"], dir.Entries());
        Assert.Equal("added while the run computed", File.ReadAllText(dir["results/added.txt"]));
        Assert.Equal("old old.csv", File.ReadAllText(dir["results/old.csv"]));
    }

    [Fact]
    public void A_folder_of_other_files_is_never_replaced_even_when_asked()
    {
        using var dir = new TempFolder();
        Directory.CreateDirectory(dir["results"]);
        File.WriteAllText(dir["results/mine.txt"], "mine");
        var e = Assert.Throws<InputException>(() => OutputFolder.Begin(dir["results"], replace: true));
        Assert.Contains("not a results folder of this tool", e.Message);
        Assert.Equal(["results"], dir.Entries());
        Assert.Equal("mine", File.ReadAllText(dir["results/mine.txt"]));
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
        File.WriteAllText(dir[".results.tmp-0123456789ab/" + OutputFolder.WorkingMarker], "");
        File.WriteAllText(dir[".results.tmp-0123456789ab/edges.tsv"], "partial");
        WriteEarlierResults(dir[".results.old-0123456789ab"], "edges.tsv");
        Directory.CreateDirectory(dir[".other.tmp-0123456789ab"]);
        Assert.Equal(2, OutputFolder.RemoveLeftovers(dir["results"]));
        Assert.Equal([".other.tmp-0123456789ab", "results"], dir.Entries());
    }

    [Fact]
    public void Folders_that_only_look_like_leftovers_are_never_touched()
    {
        using var dir = new TempFolder();
        // no marker: not made by this class
        Directory.CreateDirectory(dir[".results.tmp-0123456789ab"]);
        File.WriteAllText(dir[".results.tmp-0123456789ab/mine.txt"], "mine");
        // not 12 hex digits
        Directory.CreateDirectory(dir[".results.tmp-mine"]);
        File.WriteAllText(dir[".results.tmp-mine/" + OutputFolder.WorkingMarker], "");
        // set aside earlier results that hold a file the manifest does not list
        WriteEarlierResults(dir[".results.old-0123456789ab"], "edges.tsv");
        File.WriteAllText(dir[".results.old-0123456789ab/mine.txt"], "mine");
        // no manifest at all
        Directory.CreateDirectory(dir[".results.old-ba9876543210"]);
        File.WriteAllText(dir[".results.old-ba9876543210/mine.txt"], "mine");
        // a link that looks like a working folder, pointing at user files
        Directory.CreateDirectory(dir["data"]);
        File.WriteAllText(dir["data/" + OutputFolder.WorkingMarker], "");
        File.WriteAllText(dir["data/rec.edf"], "recording");
        Directory.CreateSymbolicLink(dir[".results.tmp-aaaaaaaaaaaa"], dir["data"]);
        Directory.CreateDirectory(dir["results"]);
        var snapshot = FolderSnapshot.Take(dir.Path);
        var entries = dir.Entries();

        Assert.Equal(0, OutputFolder.RemoveLeftovers(dir["results"]));
        Assert.Equal(entries, dir.Entries());
        snapshot.AssertAllStillThere();
    }

    [Fact]
    public void Old_results_set_aside_by_a_run_killed_before_its_rename_are_put_back()
    {
        using var dir = new TempFolder();
        Directory.CreateDirectory(dir[".results.tmp-0123456789ab"]);
        File.WriteAllText(dir[".results.tmp-0123456789ab/" + OutputFolder.WorkingMarker], "");
        WriteEarlierResults(dir[".results.old-0123456789ab"], "edges.tsv");
        OutputFolder.RemoveLeftovers(dir["results"]);
        Assert.Equal(["results"], dir.Entries());
        Assert.Equal("old edges.tsv", File.ReadAllText(Path.Combine(dir["results"], "edges.tsv")));
    }
}
