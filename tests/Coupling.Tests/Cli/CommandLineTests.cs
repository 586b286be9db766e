using System.CommandLine;
using System.Text;
using Coupling.Cli;
using Coupling.Pipeline;
using Coupling.Simulation;
using Coupling.Tests.Pipeline;

namespace Coupling.Tests.Cli;

/// <summary>The command line: pinned help, exit codes, and what inspect and simulate print and write.</summary>
public sealed class CommandLineTests
{
    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CommandLine.Run(args, output, error);
        return (code, output.ToString(), error.ToString());
    }

    [Fact]
    public void Help_matches_the_approved_text()
    {
        var sb = new StringBuilder();
        foreach (var args in new[] { new[] { "--help" }, ["demo", "--help"], ["run", "--help"], ["check", "--help"], ["simulate", "--help"], ["inspect", "--help"] })
        {
            var (code, output, err) = Run(args);
            Assert.Equal(0, code);
            Assert.Equal("", err);
            // The usage line names the executable, which differs between the tool and the test host.
            sb.Append("$ coupling ").AppendLine(string.Join(' ', args))
              .Append(output.Replace(RootCommand.ExecutableName, "coupling", StringComparison.Ordinal).TrimEnd()).Append("\n\n");
        }
        Approval.Verify(sb.ToString(), "help.txt");
    }

    [Fact]
    public void The_approval_diff_marks_changed_lines()
    {
        string diff = Approval.Diff("a\nb\nc", "a\nB\nc\nd");
        Assert.Equal("-2: b\n+2: B\n+4: d\n", diff.ReplaceLineEndings("\n"));
    }

    [Theory]
    [InlineData("frobnicate")]
    [InlineData("run")]
    [InlineData("simulate", "--trials", "many")]
    [InlineData("run", "plan.yaml", "--threads", "2", "--extra")]
    public void A_usage_error_exits_with_2_and_says_so_on_stderr(params string[] args)
    {
        var (code, output, err) = Run(args);
        Assert.Equal(2, code);
        Assert.Equal("", output);
        Assert.StartsWith("coupling: ", err);
        Assert.Contains("--help", err);
    }

    [Fact]
    public void A_missing_plan_file_exits_with_2_and_one_line_naming_it()
    {
        string missing = Path.Combine(Path.GetTempPath(), "coupling-no-such-" + Guid.NewGuid().ToString("N"), "plan.yaml");
        var (code, _, err) = Run("run", missing);
        Assert.Equal(2, code);
        Assert.Equal($"coupling: {missing}: plan file not found.\n", err.ReplaceLineEndings("\n"));
    }

    [Fact]
    public void Simulate_writes_the_files_it_names_and_inspect_lists_channels_and_event_counts()
    {
        using var folder = new TempFolder();
        string target = folder["scenario"];
        var (code, output, err) = Run("simulate", "--trials", "5", "--seed", "3", "--output", target);
        Assert.Equal(0, code);
        Assert.Equal("", err);
        var named = output.Split('\n', StringSplitOptions.RemoveEmptyEntries)
            .Select(l => l.Split(':', 2)[1].Trim().Split(' ')[0]).ToArray();
        Assert.Equal([Path.Combine(target, "scenario.edf"), Path.Combine(target, "truth.json"), Path.Combine(target, "plan.yaml")], named);
        Assert.All(named, f => Assert.True(File.Exists(f), f));
        var truth = TruthFile.Read(named[1]);
        Assert.Equal(3, truth.Seed);

        (code, output, err) = Run("inspect", named[0]);
        Assert.Equal(0, code);
        Assert.Equal("", err);
        var lines = output.Split('\n').Select(l => l.TrimEnd()).ToArray();
        Assert.Contains("channels: 10", lines);
        foreach (var label in truth.Channels) Assert.Contains(lines, l => l.StartsWith($"  {label} ", StringComparison.Ordinal));
        Assert.Contains("events: 10 (2 labels)", lines);
        Assert.Contains(lines, l => System.Text.RegularExpressions.Regex.IsMatch(l, @"^  tone\s+5$"));
        Assert.Contains(lines, l => System.Text.RegularExpressions.Regex.IsMatch(l, @"^  light\s+5$"));
    }

    [Fact]
    public void Inspect_of_an_EDF_plus_D_file_names_its_gaps()
    {
        // Records stamped 0, 1 and 3.5 s (EdfSegmentReaderTests.Discontinuous: 1 s records of 8 samples).
        using var folder = new TempFolder();
        string path = folder["d.edf"];
        File.WriteAllBytes(path, Coupling.Tests.Formats.EdfSegmentReaderTests.Discontinuous(0, 1, 3.5).Build());
        var (code, output, err) = Run("inspect", path);
        Assert.True(code == 0, err);
        var lines = output.Split('\n').Select(l => l.TrimEnd()).ToArray();
        Assert.Contains("format: EDF+D", lines);
        Assert.Contains("  EDF+D: 1 gap(s) between data records, 1.5 s in all (first from 2 s, 1.5 s long); trials that reach into a gap cannot be analysed.", lines);
    }

    [Fact]
    public void Inspect_of_a_BDF_file_says_its_events_come_from_the_Status_trigger_codes()
    {
        // BDF: version field 0xFF "BIOSEMI", 24-bit samples; two records of 4 samples with codes 3 and 5 in the Status signal.
        var b = new Coupling.Tests.Formats.EdfBuilder { Bdf = true, Reserved = "24BIT" };
        b.Signals.Add(new("A1", "uV", "-262144", "262143", "-8388608", "8388607", 4));
        b.Signals.Add(new("Status", "Boolean", "-8388608", "8388607", "-8388608", "8388607", 4));
        b.Records.Add([new[] { 1, 2, 3, 4 }, new[] { 0, 3, 3, 0 }]);
        b.Records.Add([new[] { 1, 2, 3, 4 }, new[] { 5, 0, 0, 0 }]);
        using var folder = new TempFolder();
        File.WriteAllBytes(folder["t.bdf"], b.Build());
        var (code, output, err) = Run("inspect", folder["t.bdf"]);
        Assert.True(code == 0, err);
        var lines = output.Split('\n').Select(l => l.TrimEnd()).ToArray();
        Assert.Contains("format: BDF", lines);
        Assert.Contains("events: 2 (2 labels)", lines);
        Assert.Contains(lines, l => l.StartsWith("  Events from the trigger codes of the 'Status' signal (its lower 16 bits): 2 onsets", StringComparison.Ordinal));
    }

    [Fact]
    public void Inspect_of_a_csv_without_a_rate_exits_with_2()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path, trials: 2);
        var (code, _, err) = Run("inspect", folder["rec.csv"]);
        Assert.Equal(2, code);
        Assert.Contains("give --rate in Hz", err);
        (code, var output, _) = Run("inspect", folder["rec.csv"], "--rate", "200");
        Assert.Equal(0, code);
        Assert.Contains("channels: 4", output);
    }

    [Fact]
    public void Run_of_a_small_plan_exits_with_0_and_names_the_results()
    {
        using var folder = new TempFolder();
        string plan = SmallStudy.Write(folder.Path, surrogates: 20);
        var (code, output, _) = Run("run", plan, "--threads", "1");
        Assert.Equal(0, code);
        Assert.Contains($"Results: {folder["results"]}", output);
        Assert.Contains("go: 20 trials", output);
        Assert.True(File.Exists(folder["results/edges.tsv"]));
    }
}
