using Coupling.Measures;
using Coupling.Plans;

namespace Coupling.Tests.Plans;

/// <summary>
/// PlanReader: a full plan is read field by field, omitted keys get their documented defaults (docs/user-guide.md),
/// and every rejected plan is rejected with a message naming the file, the line, the key and what is allowed.
/// YAML line numbers are 1-based (YAML 1.2 spec, section 5.4: marks count lines from the start of the stream).
/// </summary>
public sealed class PlanReaderTests
{
    private static readonly string Folder = Path.Combine(Path.GetTempPath(), "coupling-plan-tests");
    private static readonly string Source = Path.Combine(Folder, "study.yaml");

    // The smallest valid plan; line numbers below refer to it.
    private static readonly string[] Minimal =
    [
        "recording: rec.edf",                 // 1
        "conditions:",                        // 2
        "  cue: [cue-a, cue-b]",              // 3
        "  rest: [rest]",                     // 4
        "trial: { start: -0.5, end: 1.5 }",   // 5
        "window: { start: 0.0, end: 1.0 }",   // 6
        "bands:",                             // 7
        "  theta: [4, 8]",                    // 8
        "measures: [plv]",                    // 9
        "seed: 7",                            // 10
        "output: results",                    // 11
    ];

    private static Plan Parse(IEnumerable<string> lines) =>
        PlanReader.Parse(new StringReader(string.Join("\n", lines) + "\n"), Source);

    private static string[] With(int line, string text)
    {
        var copy = Minimal.ToArray();
        copy[line - 1] = text;
        return copy;
    }

    private static string[] Without(string key) => Minimal.Where(l => !l.StartsWith(key + ":", StringComparison.Ordinal)).ToArray();

    private static string[] Plus(params string[] lines) => [.. Minimal, .. lines];

    /// <summary>Asserts the plan is refused with a message naming the file, the line and every fragment.</summary>
    private static void AssertRefused(IEnumerable<string> lines, int line, params string[] fragments)
    {
        var e = Assert.Throws<InputException>(() => Parse(lines));
        Assert.Contains(Source, e.Message);
        Assert.Contains($"line {line}:", e.Message);
        foreach (var f in fragments) Assert.Contains(f, e.Message);
    }

    [Fact]
    public void A_full_plan_is_read_with_every_field()
    {
        var plan = Parse(
        [
            "# analysis of one session",
            "recording: data/rec.edf",
            "events: data/rec_events.tsv",
            "channels: [L1, L2, R1]",
            "conditions:",
            "  cue: [cue-left, cue-right]",
            "  rest: rest",
            "trial: { start: -0.5, end: 1.5 }",
            "window:",
            "  start: 0.1",
            "  end: 1.1",
            "evoked: subtract",
            "bands:",
            "  theta: [4, 8]",
            "  beta: [13.5, 30]",
            "decomposition:",
            "  method: morlet",
            "  cycles: 7",
            "  time_step: 3",
            "measures: [plv, wpli, aec-orth]",
            "surrogates: 250",
            "seed: 18446744073709551615",
            "correction: { method: benjamini-hochberg, q: 0.01 }",
            "output: ../out/run1",
            "figures: false",
            "threads: 2",
        ]);

        Assert.Equal(Source, plan.Source);
        Assert.Equal(Path.Combine(Folder, "data", "rec.edf"), plan.Recording);
        Assert.Equal(Path.Combine(Folder, "data", "rec_events.tsv"), plan.Events);
        Assert.Equal(["L1", "L2", "R1"], plan.Channels!);
        Assert.Null(plan.SampleRate);
        Assert.Null(plan.Epochs);
        Assert.Equal(2, plan.Conditions.Count);
        Assert.Equal("cue", plan.Conditions[0].Name);
        Assert.Equal(["cue-left", "cue-right"], plan.Conditions[0].EventLabels);
        Assert.Equal("rest", plan.Conditions[1].Name);
        Assert.Equal(["rest"], plan.Conditions[1].EventLabels);
        Assert.Equal(new TimeRange(-0.5, 1.5), plan.Trial);
        Assert.Equal(new TimeRange(0.1, 1.1), plan.Window);
        Assert.True(plan.SubtractEvoked);
        Assert.Equal(2, plan.Bands.Count);
        Assert.Equal(("theta", 4.0, 8.0), (plan.Bands[0].Name, plan.Bands[0].Low, plan.Bands[0].High));
        Assert.Equal(("beta", 13.5, 30.0), (plan.Bands[1].Name, plan.Bands[1].Low, plan.Bands[1].High));
        Assert.Equal(new DecompositionSpec("morlet", null, null, 7.0, 3), plan.Decomposition);
        Assert.Equal([Measure.Plv, Measure.Wpli, Measure.AecOrth], plan.Measures);
        Assert.Equal(250, plan.Surrogates);
        Assert.Equal(ulong.MaxValue, plan.Seed);
        Assert.Equal(0.01, plan.Q);
        Assert.Equal(Path.GetFullPath(Path.Combine(Folder, "..", "out", "run1")), plan.Output);
        Assert.False(plan.Figures);
        Assert.Equal(2, plan.Threads);
    }

    [Fact]
    public void Fir_hilbert_settings_and_an_epochs_recording_are_read()
    {
        var plan = Parse(
        [
            "recording: epochs.npy",
            "sample_rate: 512",
            "epochs: { first_sample_time: -0.25, labels: epochs.txt, channel_labels: [A, B] }",
            "conditions: { go: [go] }",
            "trial: { start: -0.2, end: 0.8 }",
            "window: { start: 0.0, end: 0.5 }",
            "bands: { alpha: [8, 12] }",
            "decomposition: { method: fir-hilbert, transition: 2, attenuation: 60, time_step: auto }",
            "measures: all",
            "seed: 0",
            "output: out",
        ]);
        Assert.Equal(512.0, plan.SampleRate);
        Assert.Equal(-0.25, plan.Epochs!.FirstSampleTime);
        Assert.Equal(Path.Combine(Folder, "epochs.txt"), plan.Epochs.LabelsFile);
        Assert.Equal(["A", "B"], plan.Epochs.ChannelLabels);
        Assert.Equal(new DecompositionSpec("fir-hilbert", 2.0, 60.0, null, null), plan.Decomposition);
        Assert.Equal(MeasureCatalog.All, plan.Measures);
    }

    [Fact]
    public void Omitted_keys_take_their_defaults()
    {
        var plan = Parse(Minimal);
        Assert.Equal(1000, plan.Surrogates);
        Assert.Equal(0.05, plan.Q);
        Assert.Equal(new DecompositionSpec("fir-hilbert", null, null, null, null), plan.Decomposition);
        Assert.True(plan.Figures);
        Assert.Equal(0, plan.Threads);
        Assert.False(plan.SubtractEvoked);
        Assert.Null(plan.Events);
        Assert.Null(plan.Channels);
        Assert.Equal(7UL, plan.Seed);
    }

    [Fact]
    public void An_unknown_top_level_key_is_refused_with_the_allowed_keys() =>
        AssertRefused(Plus("surogates: 10"), 12, "surogates", "unknown key", "allowed here:", "surrogates", "recording");

    [Fact]
    public void An_unknown_nested_key_is_refused_with_the_allowed_keys() =>
        AssertRefused(Plus("decomposition:", "  metod: morlet"), 13, "decomposition.metod", "unknown key", "method, transition, attenuation, cycles, time_step");

    [Theory]
    [InlineData("recording")]
    [InlineData("conditions")]
    [InlineData("trial")]
    [InlineData("window")]
    [InlineData("bands")]
    [InlineData("measures")]
    [InlineData("seed")]
    [InlineData("output")]
    public void A_missing_required_key_is_named(string key)
    {
        var lines = Without(key);
        if (key == "conditions") lines = lines.Where(l => !l.StartsWith("  cue", StringComparison.Ordinal) && !l.StartsWith("  rest", StringComparison.Ordinal)).ToArray();
        if (key == "bands") lines = lines.Where(l => !l.StartsWith("  theta", StringComparison.Ordinal)).ToArray();
        // The error points at the plan's first line (the mapping that lacks the key).
        AssertRefused(lines, 1, $"{key}:", key == "seed" ? "give a 'seed'" : "required key is missing");
    }

    [Fact]
    public void A_recording_with_an_unknown_extension_is_refused() =>
        AssertRefused(With(1, "recording: rec.mat"), 1, "recording:", "'.mat'", ".edf", ".csv", ".npy");

    [Fact]
    public void A_window_outside_the_trial_is_refused() =>
        AssertRefused(With(6, "window: { start: 0.0, end: 2.0 }"), 6, "window:", "must lie inside the trial span -0.5..1.5 s");

    [Fact]
    public void A_trial_ending_before_it_starts_is_refused() =>
        AssertRefused(With(5, "trial: { start: 1.0, end: -0.5 }"), 5, "trial:", "end (-0.5 s) must be after start (1 s)");

    [Fact]
    public void A_band_with_its_edges_reversed_is_refused() =>
        AssertRefused(With(8, "  theta: [8, 4]"), 8, "bands.theta:", "expected 0 < low < high, got [8, 4]");

    [Fact]
    public void An_unknown_measure_is_refused_with_the_known_ones() =>
        AssertRefused(With(9, "measures: [plv, phase-sync]"), 9, "measures:", "'phase-sync' is not a known measure", "allowed: all, plv", "wpli-debiased", "aec-orth");

    [Fact]
    public void An_event_label_in_two_conditions_is_refused() =>
        AssertRefused(With(4, "  rest: [rest, cue-b]"), 4, "conditions.rest:", "'cue-b' already belongs to condition 'cue'");

    [Fact]
    public void A_csv_recording_without_a_sample_rate_is_refused() =>
        AssertRefused(With(1, "recording: rec.csv"), 1, "sample_rate:", "a .csv recording carries no sampling rate");

    [Fact]
    public void An_npy_recording_without_epochs_is_refused() =>
        AssertRefused([.. With(1, "recording: rec.npy"), "sample_rate: 250"], 1, "epochs:", "give 'epochs' with first_sample_time, labels and channel_labels");

    [Fact]
    public void Bad_yaml_syntax_is_refused_with_its_line()
    {
        // An unclosed flow sequence on line 9: the parser finds the error on a later line, but never before line 9.
        var e = Assert.Throws<InputException>(() => Parse(With(9, "measures: [plv, wpli")));
        Assert.Contains(Source, e.Message);
        Assert.Contains("not valid YAML", e.Message);
        var line = System.Text.RegularExpressions.Regex.Match(e.Message, @"line (\d+):");
        Assert.True(line.Success, e.Message);
        Assert.InRange(int.Parse(line.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture), 9, 12);
    }

    [Fact]
    public void Bad_indentation_is_refused_at_its_own_line() =>
        AssertRefused(With(4, "   rest: [rest]"), 4, "not valid YAML");

    [Fact]
    public void An_evoked_value_other_than_keep_or_subtract_is_refused() =>
        AssertRefused(Plus("evoked: remove"), 12, "evoked:", "'remove' is not allowed; use 'keep' or 'subtract'");

    [Theory]
    [InlineData("0")]
    [InlineData("1")]
    [InlineData("1.5")]
    [InlineData("-0.05")]
    public void A_false_discovery_rate_level_outside_zero_to_one_is_refused(string q) =>
        AssertRefused(Plus($"correction: {{ method: benjamini-hochberg, q: {q} }}"), 12, "correction.q:", "expected a level between 0 and 1");

    [Fact]
    public void Contrasts_are_read_as_pairs_of_conditions_in_the_order_given()
    {
        var plan = Parse(Plus("contrasts: [[cue, rest]]"));
        var contrast = Assert.Single(plan.Contrasts);
        Assert.Equal(("cue", "rest"), (contrast.ConditionA, contrast.ConditionB));
        Assert.Equal("cue-vs-rest", contrast.Name);
        Assert.Empty(Parse(Minimal).Contrasts);
        Assert.Contains("contrasts", PlanReader.TopLevelKeys);
    }

    [Fact]
    public void A_contrast_with_an_unknown_condition_is_refused_with_the_known_ones() =>
        AssertRefused(Plus("contrasts: [[cue, task]]"), 12, "contrasts:", "'task' is not a condition of the plan", "conditions: cue, rest");

    [Fact]
    public void A_condition_contrasted_with_itself_is_refused() =>
        AssertRefused(Plus("contrasts: [[cue, cue]]"), 12, "contrasts:", "'cue' is contrasted with itself");

    [Theory]
    [InlineData("contrasts: [[cue, rest], [cue, rest]]")]
    [InlineData("contrasts: [[cue, rest], [rest, cue]]")]
    public void A_contrast_listed_twice_is_refused_in_either_order(string line) =>
        AssertRefused(Plus(line), 12, "contrasts:", "is listed twice");

    [Theory]
    [InlineData("contrasts: [cue, rest]")]
    [InlineData("contrasts: [[cue, rest, cue]]")]
    [InlineData("contrasts: cue")]
    public void A_contrast_that_is_not_a_list_of_two_names_is_refused(string line) =>
        AssertRefused(Plus(line), 12, "contrasts:");
}
