using Coupling.Outputs;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Tests.Cli;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// A run never deletes, moves or overwrites a file it did not write: an output folder that is the current folder, holds
/// an input or is one, or exists without being an earlier results folder of this tool, is refused before anything is
/// computed, and every file already there stays, byte for byte.
/// </summary>
public sealed class OutputPlaceTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static (int Code, string Out, string Err) Cli(params string[] args) => CliCapture.Run(args);

    /// <summary>Writes the small study into <paramref name="folder"/> with <paramref name="output"/> as its output; returns the plan.</summary>
    private static string Study(string folder, string output, int surrogates = 20, string extra = "")
    {
        Directory.CreateDirectory(folder);
        SmallStudy.WriteRecording(folder);
        string plan = Path.Combine(folder, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates).Replace("output: results", $"output: {output}") + "\n" + extra);
        return plan;
    }

    /// <summary>Runs the plan through the command line; asserts exit code 2, one line naming the folder, and every file kept.</summary>
    private void Refused(string plan, string folderNamed, string[] options, params string[] fragments)
    {
        var snapshot = FolderSnapshot.Take(_folder.Path);
        var entries = _folder.Entries();
        var (code, output, err) = Cli(["run", plan, .. options]);
        Assert.True(code == 2, $"exit code {code}; stderr: {err}");
        Assert.Equal("", output);
        string line = Assert.Single(err.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.StartsWith("coupling: ", line);
        Assert.Contains($"'{folderNamed}'", line);
        foreach (var f in fragments) Assert.Contains(f, line);
        snapshot.AssertAllStillThere();
        Assert.Equal(entries, _folder.Entries());
    }

    [Fact]
    public void Output_dot_beside_the_recording_events_plan_and_notes_is_refused_and_every_file_kept()
    {
        string plan = Study(_folder.Path, ".");
        File.WriteAllText(_folder["notes.txt"], "my notes about the session, not to be lost\n");
        Assert.Equal(4, FolderSnapshot.Take(_folder.Path).Count);
        Refused(plan, _folder.Path, [], "holds the input");
        Refused(plan, _folder.Path, ["--force"], "holds the input");
        File.AppendAllText(plan, "overwrite: true\n");
        Refused(plan, _folder.Path, [], "holds the input");
    }

    [Fact]
    public void Output_naming_an_existing_folder_with_a_planted_document_is_refused_even_with_force()
    {
        string plan = Study(_folder["study"], "../existing");
        Directory.CreateDirectory(_folder["existing"]);
        File.WriteAllText(_folder["existing/thesis draft.docx"], "a planted document");
        string existing = _folder["existing"];
        Refused(plan, existing, [], "not a results folder of this tool");
        Refused(plan, existing, ["--force"], "not a results folder of this tool");
        Assert.Equal("a planted document", File.ReadAllText(_folder["existing/thesis draft.docx"]));
    }

    [Fact]
    public void A_folder_holding_the_recording_deeper_down_is_refused()
    {
        string plan = Study(_folder["project/data"], "rec.csv");
        Refused(plan, _folder["project/data/rec.csv"], ["--force"], "is an input");
        File.WriteAllText(plan, File.ReadAllText(plan).Replace("output: rec.csv", "output: ../.."));
        Refused(plan, _folder.Path, ["--force"], "holds the input");
        File.WriteAllText(plan, File.ReadAllText(plan).Replace("output: ../..", "output: rec_events.tsv"));
        Refused(plan, _folder["project/data/rec_events.tsv"], ["--force"], "is an input");
    }

    [Fact]
    public void A_folder_holding_only_the_plan_or_only_the_events_file_is_refused()
    {
        Directory.CreateDirectory(_folder["data"]);
        Directory.CreateDirectory(_folder["plans"]);
        Directory.CreateDirectory(_folder["events"]);
        SmallStudy.WriteRecording(_folder["data"]);
        File.Move(_folder["data/rec_events.tsv"], _folder["events/go.tsv"]);
        string plan = _folder["plans/plan.yaml"];
        string text = SmallStudy.PlanText(20).Replace("recording: rec.csv", "recording: ../data/rec.csv").Replace("events: rec_events.tsv", "events: ../events/go.tsv");
        File.WriteAllText(plan, text.Replace("output: results", "output: ."));
        Refused(plan, _folder["plans"], ["--force"], "holds the input", "plan.yaml");
        File.WriteAllText(plan, text.Replace("output: results", "output: ../events"));
        Refused(plan, _folder["events"], ["--force"], "holds the input", "go.tsv");
    }

    [Fact]
    public void A_link_to_the_recording_folder_is_recognised_as_that_folder()
    {
        string plan = Study(_folder["data"], "../link");
        File.CreateSymbolicLink(_folder["link"], _folder["data"]);
        Refused(plan, _folder["data"], ["--force"], "holds the input");
    }

    [Fact]
    public void The_current_folder_and_its_ancestors_are_refused_as_output()
    {
        string current = Directory.GetCurrentDirectory();
        var e = Assert.Throws<InputException>(() => OutputSafety.Check(current, [], replace: true, "output"));
        Assert.Contains("is the current folder", e.Message);
        e = Assert.Throws<InputException>(() => OutputSafety.Check(Path.GetDirectoryName(current)!, [], replace: true, "output"));
        Assert.Contains("holds the current folder", e.Message);
    }

    [Fact]
    public void The_refusal_comes_before_the_input_is_read()
    {
        string plan = Study(_folder.Path, ".", surrogates: 100_000);
        var stages = new List<string>();
        var progress = new SynchronousProgress(stages);
        Assert.Throws<InputException>(() => AnalysisRunner.Run(PlanReader.Read(plan), progress));
        Assert.Empty(stages);
    }

    [Fact]
    public void Earlier_results_are_replaced_only_when_asked_and_only_when_they_hold_nothing_else()
    {
        string plan = Study(_folder.Path, "results");
        var (code, _, err) = Cli("run", plan);
        Assert.True(code == 0, err);
        var manifest = ManifestReader.Read(_folder["results/manifest.json"]);
        Assert.Equal(Manifest.ResultsFormat, manifest.Format);
        var written = Directory.EnumerateFiles(_folder["results"], "*", SearchOption.AllDirectories)
            .Select(f => Path.GetRelativePath(_folder["results"], f).Replace('\\', '/')).Order(StringComparer.Ordinal);
        Assert.Equal(written, manifest.Outputs.Order(StringComparer.Ordinal));

        Refused(plan, _folder["results"], [], "give --force");

        File.WriteAllText(_folder["results/edges.tsv"], "my edited table");
        (code, _, err) = Cli("run", plan, "--force");
        Assert.True(code == 0, err);
        Assert.NotEqual("my edited table", File.ReadAllText(_folder["results/edges.tsv"]));

        File.WriteAllText(_folder["results/my notes.txt"], "added by the user");
        Refused(plan, _folder["results"], ["--force"], "did not write", "my notes.txt");
        File.AppendAllText(plan, "overwrite: true\n");
        Refused(plan, _folder["results"], [], "did not write", "my notes.txt");

        File.Delete(_folder["results/my notes.txt"]);
        (code, _, err) = Cli("run", plan);
        Assert.True(code == 0, err);
        Assert.Equal(["plan.yaml", "rec.csv", "rec_events.tsv", "results"], _folder.Entries());
    }

    [Fact]
    public void Earlier_results_left_aside_by_a_killed_run_are_put_back_before_anything_is_computed()
    {
        string plan = Study(_folder.Path, "results");
        Assert.Equal(0, Cli("run", plan).Code);
        // A run killed between setting the earlier results aside and renaming its own into place.
        Directory.Move(_folder["results"], _folder[".results.old-0123456789ab"]);
        var stages = new List<string>();
        var e = Assert.Throws<InputException>(() => AnalysisRunner.Run(PlanReader.Read(plan), new SynchronousProgress(stages)));
        Assert.Contains("give --force", e.Message);
        Assert.Empty(stages);
        Assert.Equal(["plan.yaml", "rec.csv", "rec_events.tsv", "results"], _folder.Entries());
        Assert.True(File.Exists(_folder["results/manifest.json"]));
    }

    [Fact]
    public void A_results_folder_whose_manifest_lacks_the_marker_is_never_replaced()
    {
        string plan = Study(_folder.Path, "results");
        Assert.Equal(0, Cli("run", plan).Code);
        string path = _folder["results/manifest.json"];
        File.WriteAllText(path, File.ReadAllText(path).Replace($"\"format\": \"{Manifest.ResultsFormat}\",", ""));
        Assert.Null(ManifestReader.Read(path).Format);
        Refused(plan, _folder["results"], ["--force"], "not a results folder of this tool");
    }

    [Fact]
    public void A_manifest_listing_a_file_outside_its_folder_is_not_trusted()
    {
        Directory.CreateDirectory(_folder["results"]);
        File.WriteAllText(_folder["outside.txt"], "keep me");
        ManifestWriter.Write(SyntheticManifest(["../outside.txt", "manifest.json"]), _folder["results/manifest.json"]);
        Assert.Null(OutputSafety.OwnFiles(_folder["results"]));
        Assert.Throws<InputException>(() => OutputSafety.CheckReplaceable(_folder["results"], replace: true, "output"));
        Assert.Equal("keep me", File.ReadAllText(_folder["outside.txt"]));
    }

    [Fact]
    public void An_empty_existing_folder_may_be_used()
    {
        string plan = Study(_folder.Path, "results");
        Directory.CreateDirectory(_folder["results"]);
        var (code, _, err) = Cli("run", plan);
        Assert.True(code == 0, err);
        Assert.True(File.Exists(_folder["results/edges.tsv"]));
    }

    [Fact]
    public void Simulate_and_demo_refuse_a_folder_holding_other_files_and_replace_an_earlier_scenario_only_with_force()
    {
        string target = _folder["scenario"];
        Directory.CreateDirectory(target);
        File.WriteAllText(Path.Combine(target, "plan.yaml"), "my own plan");
        File.WriteAllText(Path.Combine(target, "notes.txt"), "my notes");
        var snapshot = FolderSnapshot.Take(_folder.Path);
        foreach (var args in new[] { new[] { "simulate", "--trials", "5", "--output", target, "--force" }, ["demo", "--surrogates", "10", "--output", target, "--force"] })
        {
            var (code, _, err) = Cli(args);
            Assert.Equal(2, code);
            Assert.Contains("notes.txt", err);
            snapshot.AssertAllStillThere();
            Assert.Equal(["notes.txt", "plan.yaml"], Directory.GetFileSystemEntries(target).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        }

        string fresh = _folder["fresh"];
        Assert.Equal(0, Cli("simulate", "--trials", "5", "--output", fresh).Code);
        var (again, _, message) = Cli("simulate", "--trials", "5", "--output", fresh);
        Assert.Equal(2, again);
        Assert.Contains("give --force", message);
        Assert.Equal(0, Cli("simulate", "--trials", "5", "--output", fresh, "--force").Code);
    }

    private static Manifest SyntheticManifest(string[] outputs) => new()
    {
        Format = Manifest.ResultsFormat,
        Tool = ToolInfo.Current(),
        Started = DateTimeOffset.UnixEpoch,
        Finished = DateTimeOffset.UnixEpoch,
        Outputs = outputs,
    };

    /// <summary>Records stage names as they are reported, on the reporting thread.</summary>
    private sealed class SynchronousProgress(List<string> stages) : IProgress<RunProgress>
    {
        public void Report(RunProgress value)
        {
            lock (stages) stages.Add(value.Stage);
        }
    }
}
