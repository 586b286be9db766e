using System.Globalization;
using System.Text;
using Coupling.Cli;
using Coupling.Formats;
using Coupling.Pipeline;
using Coupling.Plans;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// What a run answers to input that is usable but unusual: values without a test (surrogates: 0), warnings that come
/// before the long computation, bands too slow for the window, truncated EDF files kept by choice, and the command
/// line's handling of figures, NPY and CSV in inspect.
/// </summary>
public sealed class InputAnswersTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private static (int Code, string Out, string Err) Cli(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CommandLine.Run(args, output, error);
        return (code, output.ToString(), error.ToString().ReplaceLineEndings("\n"));
    }

    /// <summary>The small study with two conditions (alternate trials go/stop) and their contrast.</summary>
    private string TwoConditions(int surrogates)
    {
        SmallStudy.WriteRecording(_folder.Path);
        var events = new StringBuilder("onset\tduration\ttrial_type\n");
        for (int n = 0; n < 20; n++) events.Append(string.Create(CultureInfo.InvariantCulture, $"{3 + 1.5 * n:R}\t0\t{(n % 2 == 0 ? "go" : "stop")}\n"));
        File.WriteAllText(_folder["rec_events.tsv"], events.ToString());
        string plan = _folder["plan.yaml"];
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: surrogates, conditions: "{ go: [go], stop: [stop] }")
            .Replace("figures: false", "figures: true") + "\ncontrasts: [[go, stop]]\n");
        return plan;
    }

    [Fact]
    public void Surrogates_0_gives_the_tested_values_with_empty_p_z_and_no_significance()
    {
        string plan = TwoConditions(surrogates: 0);
        var valuesOnly = AnalysisRunner.Run(PlanReader.Read(plan));
        File.WriteAllText(plan, File.ReadAllText(plan).Replace("surrogates: 0", "surrogates: 20").Replace("output: results", "output: tested")
            .Replace("figures: true", "figures: false"));
        var tested = AnalysisRunner.Run(PlanReader.Read(plan));

        Assert.Equal(tested.Results.Count, valuesOnly.Results.Count);
        foreach (var (v, t) in valuesOnly.Results.Zip(tested.Results))
        {
            Assert.Equal(t.Value, v.Value); // the same computation, bit for bit
            Assert.All(v.P, p => Assert.True(double.IsNaN(p)));
            Assert.All(v.Z, z => Assert.True(double.IsNaN(z)));
            Assert.All(v.PCorrected, p => Assert.True(double.IsNaN(p)));
            Assert.DoesNotContain(true, v.Significant);
        }
        foreach (var (v, t) in valuesOnly.Contrasts.Zip(tested.Contrasts))
        {
            Assert.Equal(t.Difference, v.Difference);
            Assert.All(v.P, p => Assert.True(double.IsNaN(p)));
            Assert.DoesNotContain(true, v.Significant);
        }
        Assert.Empty(valuesOnly.Warnings); // no surrogate-count warning when no test is asked

        string folder = valuesOnly.OutputFolder;
        var edges = File.ReadAllLines(Path.Combine(folder, "edges.tsv"));
        var header = edges[0].Split('\t');
        int p = Array.IndexOf(header, "p"), pc = Array.IndexOf(header, "p_corrected"), z = Array.IndexOf(header, "z");
        Assert.All(edges.Skip(1), line =>
        {
            var cells = line.Split('\t');
            Assert.Equal(("NA", "NA", "NA"), (cells[p], cells[pc], cells[z]));
        });
        // Matrix figures show the values; there is no network of significant pairs to draw.
        Assert.NotEmpty(Directory.GetFiles(Path.Combine(folder, "figures"), "*_matrix.png"));
        Assert.Empty(Directory.GetFiles(Path.Combine(folder, "figures"), "*_network.png", SearchOption.AllDirectories));
        Assert.Contains("not tested (surrogates: 0, values only)", System.Net.WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(folder, "report.html"))));
    }

    [Fact]
    public void The_surrogate_count_warning_arrives_before_any_surrogate_is_drawn()
    {
        SmallStudy.WriteRecording(_folder.Path);
        File.WriteAllText(_folder["plan.yaml"], SmallStudy.PlanText(surrogates: 10));
        var events = new List<string>();
        var progress = new Recorder(events);
        var outcome = AnalysisRunner.Run(PlanReader.Read(_folder["plan.yaml"]), progress, onWarning: w => events.Add("warning: " + w));
        int warning = events.FindIndex(e => e.StartsWith("warning: ", StringComparison.Ordinal));
        int firstDraws = events.FindIndex(e => e.Contains("band isolation", StringComparison.Ordinal));
        Assert.True(warning >= 0 && firstDraws > warning, string.Join("\n", events));
        Assert.Equal("warning: " + Assert.Single(outcome.Warnings), events[warning]);

        // and the command line prints it on stderr before the first stage of the computation.
        var (code, output, err) = Cli("run", _folder["plan.yaml"], "--force");
        Assert.Equal(0, code);
        int printed = err.IndexOf("coupling: warning: With 10 surrogates", StringComparison.Ordinal);
        int computing = err.IndexOf("band isolation", StringComparison.Ordinal);
        Assert.True(printed >= 0 && computing > printed, err);
        Assert.Contains("1 warning(s), shown before the computation and in the report", output);
    }

    private sealed class Recorder(List<string> events) : IProgress<RunProgress>
    {
        public void Report(RunProgress value)
        {
            lock (events) events.Add(value.Stage);
        }
    }

    [Fact]
    public void A_band_with_fewer_than_3_cycles_in_the_window_is_warned_about()
    {
        SmallStudy.WriteRecording(_folder.Path);
        // The window is 0.5 s: 4 Hz completes 2 cycles in it, 8 Hz completes 4.
        // 239 surrogates: enough for the two-sided aec test of 6 pairs (2/(M+1) <= 0.05/6), so no surrogate-count warning.
        File.WriteAllText(_folder["plan.yaml"], SmallStudy.PlanText(surrogates: 239, bands: "{ slow: [4, 7], alpha: [8, 12] }"));
        var outcome = AnalysisRunner.Run(PlanReader.Read(_folder["plan.yaml"]));
        string w = Assert.Single(outcome.Warnings);
        Assert.Contains("Band 'slow' (4-7 Hz): the 0.5 s analysis window holds only 2 cycles of 4 Hz, fewer than 3", w);
    }

    /// <summary>20 epochs of 1 s at 100 Hz (from -0.5 s), two channels of uniform noise, all labelled 'a'.</summary>
    private void WriteShortNoiseEpochs()
    {
        var rng = new Random(5);
        var data = new double[20 * 2 * 100];
        for (int i = 0; i < data.Length; i++) data[i] = rng.NextDouble() - 0.5;
        NpyArray.Write(_folder["epochs.npy"], [20, 2, 100], data);
        File.WriteAllText(_folder["labels.txt"], string.Concat(Enumerable.Repeat("a\n", 20)));
    }

    /// <summary>A plan for <see cref="WriteShortNoiseEpochs"/>: theta by a FIR with a 1 Hz transition, and
    /// <paramref name="decompositionExtra"/> appended to the decomposition's keys.</summary>
    private static string ShortEpochPlan(string decompositionExtra) =>
        "recording: epochs.npy\nsample_rate: 100\nepochs: { first_sample_time: -0.5, labels: labels.txt, channel_labels: [X, Y] }\n" +
        "conditions: { a: [a] }\ntrial: { start: -0.5, end: 0.5 }\nwindow: { start: -0.2, end: 0.4 }\nbands: { theta: [5, 8] }\n" +
        $"decomposition: {{ method: fir-hilbert, transition: 1{decompositionExtra} }}\nmeasures: [plv]\nsurrogates: 0\nseed: 1\noutput: results\nfigures: false\n";

    [Fact]
    public void A_filter_longer_than_the_epochs_is_warned_about()
    {
        // 20 epochs of 1 s at 100 Hz, two channels of noise; a 4-8 Hz FIR band-pass with a 1 Hz transition is several
        // seconds long (Kaiser window length ~ (A - 8) / (2.285 * 2 pi * tw / fs), Kaiser 1974).
        WriteShortNoiseEpochs();
        File.WriteAllText(_folder["plan.yaml"], ShortEpochPlan(""));
        // The warning comes first; then the run is refused, because the filter's edge effects from the zeros past the
        // epochs would reach into the analysis window.
        var warnings = new List<string>();
        var error = Assert.Throws<InputException>(() => AnalysisRunner.Run(PlanReader.Read(_folder["plan.yaml"]), onWarning: warnings.Add));
        Assert.Contains(warnings, w => w.StartsWith("Band 'theta' (5-8 Hz): the filter is", StringComparison.Ordinal)
            && w.Contains("longer than the 100-sample epochs", StringComparison.Ordinal));
        Assert.Contains("band isolation reaches", error.Message);
    }

    [Fact]
    public void Edge_effects_reaching_the_window_are_analysed_with_a_warning_when_the_plan_accepts_them()
    {
        // 20 epochs of 1 s at 100 Hz; the 4-8 Hz Kaiser FIR with a 1 Hz transition reaches further than the epochs hold
        // around the window (as in the test above). With edge_effects: accept the run goes on and says how far.
        WriteShortNoiseEpochs();
        static string Plan(string edges) => ShortEpochPlan(edges);
        File.WriteAllText(_folder["plan.yaml"], Plan(", edge_effects: refuse"));
        var error = Assert.Throws<InputException>(() => AnalysisRunner.Run(PlanReader.Read(_folder["plan.yaml"])));
        Assert.Contains("'edge_effects: accept'", error.Message);

        File.WriteAllText(_folder["plan.yaml"], Plan(", edge_effects: accept"));
        var warnings = new List<string>();
        var outcome = AnalysisRunner.Run(PlanReader.Read(_folder["plan.yaml"]), onWarning: warnings.Add);
        string edge = Assert.Single(warnings, w => w.StartsWith("Condition 'a', band 'theta': band isolation reaches", StringComparison.Ordinal));
        Assert.Contains("of the window are computed partly from zero padding", edge);
        Assert.Contains(edge, outcome.Warnings);
        Assert.All(outcome.Results, r => Assert.All(r.Value, v => Assert.True(double.IsFinite(v))));

        File.WriteAllText(_folder["plan.yaml"], Plan(", edge_effects: acept"));
        var misspelt = Assert.Throws<InputException>(() => PlanReader.Read(_folder["plan.yaml"]));
        Assert.Contains("decomposition.edge_effects: 'acept' is not allowed (did you mean 'accept'?)", misspelt.Message);
    }

    [Fact]
    public void A_truncated_edf_is_analysed_on_its_complete_records_when_the_plan_says_so()
    {
        Assert.Equal(0, Cli("simulate", "--trials", "6", "--output", _folder["sim"]).Code);
        string edf = Path.Combine(_folder["sim"], "scenario.edf");
        var header = EdfReader.ReadHeader(edf);
        long keep = header.HeaderBytes + (header.RecordCount - 3) * header.RecordBytes + header.RecordBytes / 3;
        var bytes = File.ReadAllBytes(edf)[..(int)keep];
        File.WriteAllBytes(edf, bytes);
        string plan = Path.Combine(_folder["sim"], "plan.yaml");
        File.WriteAllText(plan, File.ReadAllText(plan).Replace("surrogates: 2000", "surrogates: 0").Replace("figures: true", "figures: false")
            .Replace("measures: [plv, ppc, pli, wpli, wpli-debiased, coherence, imag-coherency, aec, aec-orth]", "measures: [plv]"));
        var (code, _, err) = Cli("run", plan);
        Assert.Equal(2, code);
        Assert.Contains("truncated_recording: keep-complete-records", err);

        File.AppendAllText(plan, "truncated_recording: keep-complete-records\n");
        var outcome = AnalysisRunner.Run(PlanReader.Read(plan));
        string expected = $"Truncated file: {header.RecordCount - 3} of the {header.RecordCount} data records the header promises are complete and were kept";
        Assert.Contains(expected, System.Net.WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html"))));
        Assert.Contains(expected, File.ReadAllText(Path.Combine(outcome.OutputFolder, "manifest.json")));
    }

    [Fact]
    public void Figures_false_prints_no_figures_path()
    {
        string plan = SmallStudy.Write(_folder.Path, surrogates: 0);
        var (code, output, _) = Cli("run", plan);
        Assert.Equal(0, code);
        Assert.DoesNotContain("figures", output);
        Assert.False(Directory.Exists(_folder["results/figures"]));
        File.WriteAllText(plan, File.ReadAllText(plan).Replace("figures: false", "figures: true"));
        (code, output, _) = Cli("run", plan, "--force");
        Assert.Equal(0, code);
        Assert.Contains($"figures:  {_folder["results/figures"]}", output);
    }

    [Fact]
    public void Inspect_reads_an_npy_header_and_finds_the_events_beside_a_csv()
    {
        NpyArray.Write(_folder["epochs.npy"], [3, 2, 50], new double[300]);
        var (code, output, err) = Cli("inspect", _folder["epochs.npy"]);
        Assert.True(code == 0, err);
        Assert.Contains("format: NPY array, dtype <f8, C order", output);
        Assert.Contains("shape: (3, 2, 50)", output);
        Assert.Contains("as epochs: 3 trials x 2 channels x 50 samples", output);

        SmallStudy.WriteRecording(_folder.Path, trials: 4); // rec.csv with rec_events.tsv beside it, as 'run' finds it
        (code, output, err) = Cli("inspect", _folder["rec.csv"], "--rate", "200");
        Assert.True(code == 0, err);
        Assert.Contains("Events from rec_events.tsv.", output);
        Assert.Matches(@"(?m)^  go\s+4\s*$", output);
    }

    [Fact]
    public void A_write_failure_names_the_results_folder_not_the_temporary_one()
    {
        string target = _folder["results"];
        var e = FileErrors.Writing(target, "results folder",
            new IOException($"Access to the path '{_folder[".results.tmp-1a2b3c"]}/edges.tsv' is denied."));
        Assert.Equal($"{target}: cannot write the results folder: input/output error.", e.Message);
        Assert.Equal($"{target}: cannot write the results folder: permission denied.",
            FileErrors.Writing(target, "results folder", new UnauthorizedAccessException("Access to the path '/x/.results.tmp-1' is denied.")).Message);
    }
}
