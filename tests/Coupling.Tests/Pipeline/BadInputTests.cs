using System.Text;
using Coupling.Cli;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Simulation;

namespace Coupling.Tests.Pipeline;

/// <summary>A small simulated scenario (8 trials per condition) written once, for the tests that spoil its EDF.</summary>
public sealed class SmallScenario : IDisposable
{
    private readonly TempFolder _folder = new();

    public SmallScenario() => Paths = ScenarioFiles.Write(_folder.Path, new ScenarioOptions { TrialsPerCondition = 8 }, surrogates: 1000);

    public ScenarioPaths Paths { get; }

    public void Dispose() => _folder.Dispose();
}

/// <summary>
/// Input the pipeline cannot use is refused through the command line with exit code 2 and one line on stderr naming
/// what is wrong, before any long computation, and without leaving a results folder or a temporary one beside it.
/// </summary>
public sealed class BadInputTests(SmallScenario scenario) : IClassFixture<SmallScenario>, IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>Runs the plan through the CLI; asserts the refusal and that the folder holds only what it held before.</summary>
    private string Refused(string plan, params string[] fragments)
    {
        var before = _folder.Entries();
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CommandLine.Run(["run", plan], output, error);
        string err = error.ToString();
        Assert.True(code == 2, $"exit code {code}; stderr: {err}");
        string line = Assert.Single(err.Split('\n', StringSplitOptions.RemoveEmptyEntries), l => l.StartsWith("coupling: ", StringComparison.Ordinal));
        foreach (var f in fragments) Assert.Contains(f, line);
        Assert.False(Directory.Exists(_folder["results"]), "a results folder was left");
        Assert.Equal(before, _folder.Entries());
        // and the library itself raises the InputException the CLI reported.
        var e = Assert.Throws<InputException>(() => AnalysisRunner.Run(PlanReader.Read(plan)));
        Assert.Equal(line, "coupling: " + e.Message.ReplaceLineEndings(" "));
        Assert.Equal(before, _folder.Entries());
        return line;
    }

    private string ScenarioCopy(Func<byte[], byte[]> spoil)
    {
        File.WriteAllBytes(_folder["scenario.edf"], spoil(File.ReadAllBytes(scenario.Paths.Recording)));
        File.Copy(scenario.Paths.Plan, _folder["plan.yaml"]);
        return _folder["plan.yaml"];
    }

    private string Small(Func<int, int, double, double>? edit = null, string? plan = null)
    {
        SmallStudy.WriteRecording(_folder.Path, edit: edit);
        File.WriteAllText(_folder["plan.yaml"], plan ?? SmallStudy.PlanText());
        return _folder["plan.yaml"];
    }

    [Fact]
    public void A_truncated_edf_is_refused() =>
        Refused(ScenarioCopy(b => b[..^1000]), "scenario.edf", "truncated EDF file");

    [Fact]
    public void A_malformed_edf_header_is_refused() =>
        // Bytes 236-243 hold the number of data records (EDF specification, Kemp et al. 1992, Electroenceph. Clin. Neurophysiol. 82:391).
        Refused(ScenarioCopy(b => { Encoding.ASCII.GetBytes("12x4    ").CopyTo(b, 236); return b; }),
            "scenario.edf", "number of data records", "byte 236", "'12x4'");

    [Fact]
    public void An_unknown_channel_in_an_edf_selection_is_refused()
    {
        string plan = ScenarioCopy(b => b);
        File.WriteAllText(plan, File.ReadAllText(plan).Replace("conditions:", "channels: [L1, L9]\nconditions:"));
        Refused(plan, "scenario.edf", "'L9'");
    }

    [Fact]
    public void An_unknown_channel_in_a_csv_selection_is_refused() =>
        Refused(Small(plan: SmallStudy.PlanText(channels: "[A, B, Z]")), "rec.csv", "channel 'Z' not found", "A, B, C, D");

    [Fact]
    public void An_unknown_event_label_is_refused() =>
        Refused(Small(plan: SmallStudy.PlanText(conditions: "{ go: [go], stop: [stop] }")), "conditions.stop", "event label 'stop' does not occur", "labels there: go");

    [Fact]
    public void A_band_above_the_nyquist_frequency_is_refused() =>
        // The plan text puts 'bands' on line 8 (SmallStudy.PlanText); the message names the band's line.
        Refused(Small(plan: SmallStudy.PlanText(bands: "{ alpha: [8, 12], high: [90, 110] }")), "plan.yaml, line 8: bands.high:", "Nyquist frequency 100 Hz");

    [Fact]
    public void A_trial_span_longer_than_the_recording_is_refused() =>
        Refused(Small(plan: SmallStudy.PlanText(trial: "{ start: -0.25, end: 60 }")), "rec.csv", "longer than the recording");

    [Fact]
    public void Too_few_trials_for_the_surrogates_asked_are_refused()
    {
        var output = new StringWriter();
        Assert.Equal(0, CommandLine.Run(["simulate", "--trials", "4", "--output", _folder["sim"]], output, new StringWriter()));
        // 4 trials allow 4! = 24 orders, fewer than the plan's 2000 surrogates; the plan's 'surrogates' is on line 19.
        Refused(Path.Combine(_folder["sim"], "plan.yaml"), "plan.yaml, line 19: surrogates:", "condition 'tone' has 4 trials", "at most 24 distinct trial orders", "2000 surrogates");
        Assert.False(Directory.Exists(Path.Combine(_folder["sim"], "results")));
        Assert.DoesNotContain(Directory.EnumerateFileSystemEntries(_folder["sim"]), e => Path.GetFileName(e).StartsWith('.'));
    }

    [Fact]
    public void Too_few_trials_for_the_label_permutations_of_a_contrast_are_refused_before_any_long_step()
    {
        Assert.Equal(0, CommandLine.Run(["simulate", "--trials", "7", "--output", _folder["sim"]], new StringWriter(), new StringWriter()));
        // 7 trials per condition allow 7! = 5040 trial orders, enough for 4000 surrogates, but the 14 pooled trials
        // split into two groups of 7 only C(14, 7) = 3432 ways, fewer than the 4000 label permutations asked.
        string plan = Path.Combine(_folder["sim"], "plan.yaml");
        File.WriteAllText(plan, File.ReadAllText(plan).Replace("surrogates: 2000", "surrogates: 4000"));
        Refused(plan, "plan.yaml, line 6: contrasts:", "tone-vs-light", "at most 3432 distinct splits", "4000 surrogates");
        Assert.False(Directory.Exists(Path.Combine(_folder["sim"], "results")));
    }

    [Fact]
    public void A_nan_sample_is_refused() =>
        Refused(Small(edit: (c, s, v) => c == 1 && s == 300 ? double.NaN : v), "rec.csv", "line 302", "channel 'B', sample 300", "not finite");

    [Fact]
    public void A_flat_channel_is_refused() =>
        Refused(Small(edit: (c, s, v) => c == 2 ? 5.0 : v), "rec.csv", "channel(s) C are flat");
}
