using System.Globalization;
using System.Text;
using Coupling.Formats;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Tests.Formats;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// The plan key unusable_data: NaN or infinite samples, flat channels and clipped EDF samples leave out trials or
/// channels (named in the manifest and report) instead of refusing the file.
/// </summary>
public sealed class UnusableDataTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private RunOutcome Run(string policy, Func<int, int, double, double>? edit, string? events = null, string output = "results")
    {
        SmallStudy.WriteRecording(_folder.Path, edit: edit);
        if (events is not null) File.WriteAllText(_folder["rec_events.tsv"], events);
        File.WriteAllText(_folder["plan.yaml"], SmallStudy.PlanText(surrogates: 0).Replace("output: results", $"output: {output}") + $"\nunusable_data: {policy}\n");
        return AnalysisRunner.Run(PlanReader.Read(_folder["plan.yaml"]));
    }

    [Fact]
    public void Drop_trials_leaves_out_the_trials_whose_padded_span_holds_a_nan_and_the_rest_are_as_without_it()
    {
        var outcome = Run(UnusableData.DropTrials, (c, s, v) => c == 1 && s == 300 ? double.NaN : v);
        var go = Assert.Single(outcome.Conditions);
        Assert.NotEmpty(go.Dropped);
        Assert.All(go.Dropped, d => Assert.Contains("holds NaN or infinite samples (channel 'B' from 1.5 s)", d));
        Assert.Equal(20 - go.Dropped.Count, go.Trials);
        string report = System.Net.WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html")));
        string manifest = File.ReadAllText(Path.Combine(outcome.OutputFolder, "manifest.json"));
        Assert.Contains("go: event 'go' at 3 s: the trial (with its padding) holds NaN or infinite samples", report);
        Assert.Contains("holds NaN or infinite samples", manifest);

        // The same trials from a recording without the NaN, the dropped events removed by hand: the same values.
        var kept = new StringBuilder("onset\tduration\ttrial_type\n");
        for (int n = go.Dropped.Count; n < 20; n++) kept.Append(string.Create(CultureInfo.InvariantCulture, $"{3 + 1.5 * n:R}\t0\tgo\n"));
        var clean = Run(UnusableData.Refuse, (c, s, v) => c == 1 && s == 300 ? 0.0 : v, kept.ToString(), output: "clean");
        Assert.Equal(clean.Results.Select(r => r.Value), outcome.Results.Select(r => r.Value));
    }

    [Fact]
    public void Drop_channels_leaves_out_a_channel_with_an_infinite_sample_and_names_it()
    {
        var outcome = Run(UnusableData.DropChannels, (c, s, v) => c == 1 && s == 300 ? double.NegativeInfinity : v);
        Assert.All(outcome.Results, r => Assert.Equal(["A", "C", "D"], r.Channels));
        Assert.Equal(20, Assert.Single(outcome.Conditions).Trials);
        string note = "Channel 'B' left out (unusable_data: drop-channels): 1 NaN or infinite sample(s), the first at 1.5 s.";
        Assert.Contains(note, System.Net.WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html"))));
        Assert.Contains(note, File.ReadAllText(Path.Combine(outcome.OutputFolder, "manifest.json")));
    }

    [Fact]
    public void A_flat_channel_is_left_out_under_either_policy()
    {
        var outcome = Run(UnusableData.DropTrials, (c, s, v) => c == 2 ? 5.0 : v);
        Assert.All(outcome.Results, r => Assert.Equal(["A", "B", "D"], r.Channels));
        Assert.Contains("Channel 'C' left out (unusable_data: drop-trials): flat (every sample equal).", System.Net.WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html"))));
    }

    [Fact]
    public void Too_few_channels_left_is_refused_naming_the_key()
    {
        var e = Assert.Throws<InputException>(() => Run(UnusableData.DropChannels, (c, s, v) => c >= 1 && s == 10 ? double.NaN : v));
        Assert.Contains("plan.yaml, line 15: unusable_data: connectivity needs at least 2 channels, but 1 remains", e.Message);
    }

    [Fact]
    public void Epochs_with_a_nan_are_dropped_and_listed_with_their_condition()
    {
        var rng = new Random(9);
        var data = new double[12 * 2 * 100];
        for (int i = 0; i < data.Length; i++) data[i] = rng.NextDouble() - 0.5;
        data[(3 * 2 + 1) * 100 + 40] = double.NaN; // epoch 4 (1-based), channel Y
        NpyArray.Write(_folder["epochs.npy"], [12, 2, 100], data);
        File.WriteAllText(_folder["labels.txt"], string.Concat(Enumerable.Range(0, 12).Select(e => e % 2 == 0 ? "a\n" : "b\n")));
        File.WriteAllText(_folder["plan.yaml"],
            "recording: epochs.npy\nsample_rate: 100\nepochs: { first_sample_time: -0.5, labels: labels.txt, channel_labels: [X, Y] }\n" +
            "conditions: { a: [a], b: [b] }\ntrial: { start: -0.5, end: 0.5 }\nwindow: { start: -0.2, end: 0.2 }\nbands: { alpha: [8, 12] }\n" +
            // A short wavelet (reach 0.24 s) keeps band isolation's edge effects from the ends of the 1 s epochs out of the window.
            "decomposition: { method: morlet, cycles: 3 }\n" +
            "measures: [plv]\nsurrogates: 0\nseed: 1\noutput: results\nfigures: false\nunusable_data: drop-trials\n");
        var outcome = AnalysisRunner.Run(PlanReader.Read(_folder["plan.yaml"]));
        Assert.Equal([6, 5], outcome.Conditions.Select(c => c.Trials));
        Assert.Equal("b: epoch 4 ('b'): holds NaN or infinite samples (channel 'Y')", Assert.Single(outcome.Conditions[1].Dropped));
        Assert.All(outcome.Results.SelectMany(r => r.Value), v => Assert.True(double.IsFinite(v)));
    }

    [Fact]
    public void Clipped_edf_samples_are_runs_at_a_digital_limit_and_drop_their_channel()
    {
        // Kemp et al. (1992): samples are 16-bit integers within the signal's digital minimum and maximum.
        var b = new EdfBuilder();
        foreach (var label in new[] { "EEG A1", "EEG A2", "EEG A3" }) b.Signals.Add(new(label, "uV", "-500", "500", "-2048", "2047", 16));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 30));
        var rng = new Random(2);
        for (int r = 0; r < 4; r++)
        {
            short[] Noise() => Enumerable.Range(0, 16).Select(_ => (short)rng.Next(-2000, 2000)).ToArray();
            var a1 = Noise();
            var a2 = Noise();
            var a3 = Noise();
            if (r == 0) a1[5] = 2047; // one sample at the limit: an extreme, not clipping
            if (r == 1) { a2[14] = -2048; a2[15] = -2048; } // a run across the record boundary
            if (r == 2) a2[0] = -2048;
            var annotation = new byte[60];
            EdfBuilder.Tal($"+{r}||").CopyTo(annotation, 0);
            b.Records.Add([a1, a2, a3, annotation]);
        }
        File.WriteAllBytes(_folder["rec.edf"], b.Build());
        var reader = EdfSegmentReader.Open(_folder["rec.edf"]);
        Assert.Empty(reader.ClippedRuns(0));
        Assert.Equal([(30, 3)], reader.ClippedRuns(1));
        Assert.Empty(reader.ClippedRuns(2));

        File.WriteAllText(_folder["plan.yaml"], "recording: rec.edf\nconditions: { x: [x] }\ntrial: { start: 0, end: 0.5 }\nwindow: { start: 0, end: 0.5 }\n" +
            "bands: { slow: [1, 2] }\nmeasures: [plv]\nsurrogates: 0\nseed: 1\noutput: results\nunusable_data: drop-channels\n");
        var input = InputLoader.Load(PlanReader.Read(_folder["plan.yaml"]));
        Assert.Equal(["EEG A1", "EEG A3"], input.Channels.Select(c => c.Label));
        Assert.Contains("Channel 'EEG A2' left out (unusable_data: drop-channels): 3 clipped sample(s), the first at 1.875 s.", input.Notes);
    }
}
