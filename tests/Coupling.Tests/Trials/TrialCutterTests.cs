using Coupling.Formats;
using Coupling.Plans;
using Coupling.Trials;

namespace Coupling.Tests.Trials;

/// <summary>
/// TrialCutter on a recording whose every sample holds its own index (plus 1000 x the channel), so each cut
/// sample says where it came from. Rate 100 Hz, 1000 samples (10 s); span -0.5..1.0 s = 150 samples, 50 before onset.
/// </summary>
public sealed class TrialCutterTests
{
    private const double Rate = 100;
    private const int Samples = 1000, Pad = 10, Length = 150, Offset = -50;
    private static readonly TimeRange Span = new(-0.5, 1.0);
    private static readonly ConditionSpec Cue = new("cue", ["cue"]);

    private static Recording IndexRecording(params (double Onset, string Label)[] events)
    {
        var samples = new double[2][];
        for (int c = 0; c < 2; c++) samples[c] = Enumerable.Range(0, Samples).Select(s => 1000.0 * c + s).ToArray();
        return new Recording("index.edf", Rate, [new ChannelInfo("A", "EEG", "uV"), new ChannelInfo("B", "EEG", "uV")], samples,
            events.OrderBy(e => e.Onset).Select(e => new RecordingEvent(e.Onset, 0, e.Label)).ToArray());
    }

    /// <summary>The sample the cutter should hold at index i of a padded trial whose padded start is <paramref name="start"/>:
    /// the recording's sample, or 0 past either end (zeros carry no time-reversed data).</summary>
    private static double Expected(int channel, int start, int i)
    {
        int s = start + i;
        return s < 0 || s > Samples - 1 ? 0.0 : 1000.0 * channel + s;
    }

    [Fact]
    public void Each_trial_holds_the_samples_of_its_span_and_padding()
    {
        var set = TrialCutter.Cut(IndexRecording((2.0, "cue"), (3.0, "other"), (5.255, "cue")), Cue, Span, Pad);
        Assert.Equal(2, set.TrialCount);
        Assert.Equal(Length + 2 * Pad, set.SampleCount);
        Assert.Equal(Pad, set.PadSamples);
        Assert.Equal(-0.5, set.SpanStart, 12);
        Assert.Equal([2.0, 5.255], set.Onsets);
        Assert.Empty(set.DroppedTrials);
        Assert.Equal(["A", "B"], set.Channels);
        // Onset sample round(5.255 * 100) = 526 (the documented rounding), so its span starts at 476.
        int[] spanStarts = [200 + Offset, 526 + Offset];
        for (int n = 0; n < 2; n++)
            for (int c = 0; c < 2; c++)
            {
                var x = set.Trial(n, c);
                for (int i = 0; i < x.Length; i++) Assert.Equal(1000.0 * c + spanStarts[n] - Pad + i, x[i]);
            }
        Assert.Equal(0.0, set.TimeOf(Pad + 50), 12);
    }

    [Fact]
    public void Padding_past_either_end_of_the_recording_is_filled_with_zeros_and_counted()
    {
        // Onset 0.5 s: span starts at sample 0 exactly; onset 9.0 s: span ends at the last sample exactly.
        var set = TrialCutter.Cut(IndexRecording((0.5, "cue"), (9.0, "cue")), Cue, Span, Pad);
        Assert.Equal(2, set.TrialCount);
        int[] paddedStarts = [0 - Pad, 850 - Pad];
        for (int n = 0; n < 2; n++)
            for (int c = 0; c < 2; c++)
            {
                var x = set.Trial(n, c);
                for (int i = 0; i < x.Length; i++) Assert.Equal(Expected(c, paddedStarts[n], i), x[i]);
            }
        // Spelled out at the start: Pad zeros, then 0, 1, 2 ...; and at the end: ..., 998, 999, then zeros.
        Assert.Equal([.. Enumerable.Repeat(0.0, Pad), 0, 1, 2], set.Trial(0, 0)[..(Pad + 3)].ToArray());
        Assert.Equal([998.0, 999, 0, 0], set.Trial(1, 0).Slice(Pad + Length - 2, 4).ToArray());
        Assert.Equal(Pad, set.ZerosBefore);
        Assert.Equal(Pad, set.ZerosAfter);
        // Trials padded with recorded data count no zeros.
        var inside = TrialCutter.Cut(IndexRecording((2.0, "cue"), (5.0, "cue")), Cue, Span, Pad);
        Assert.Equal(0, inside.ZerosBefore);
        Assert.Equal(0, inside.ZerosAfter);
    }

    [Fact]
    public void Trials_whose_span_runs_past_the_recording_are_dropped_and_listed()
    {
        var set = TrialCutter.Cut(IndexRecording((0.2, "cue"), (4.0, "cue"), (9.5, "cue")), Cue, Span, Pad);
        Assert.Equal(1, set.TrialCount);
        Assert.Equal([4.0], set.Onsets);
        Assert.Equal(1000.0 * 1 + 400 + Offset - Pad, set.Trial(0, 1)[0]);
        Assert.Equal(2, set.DroppedTrials.Count);
        Assert.Contains("0.2 s", set.DroppedTrials[0]);
        Assert.Contains("9.5 s", set.DroppedTrials[1]);
        Assert.All(set.DroppedTrials, d => Assert.Contains("runs past the recording (0..10 s)", d));
        Assert.All(set.DroppedTrials, d => Assert.StartsWith("cue: event 'cue'", d));
    }

    [Fact]
    public void A_trial_span_longer_than_the_recording_is_refused()
    {
        var e = Assert.Throws<InputException>(() => TrialCutter.Cut(IndexRecording((1.0, "cue")), Cue, new TimeRange(-1, 11), Pad));
        Assert.Contains("index.edf", e.Message);
        Assert.Contains("longer than the recording", e.Message);
    }

    [Fact]
    public void Counting_the_trials_agrees_with_cutting_them_whatever_the_padding()
    {
        var recording = IndexRecording((0.2, "cue"), (0.5, "cue"), (4.0, "cue"), (9.0, "cue"), (9.5, "cue"), (5.0, "other"));
        int counted = TrialCutter.Count(recording, recording.Events, Cue, Span);
        Assert.Equal(3, counted);
        foreach (int pad in new[] { 0, Pad, 5000 })
            Assert.Equal(counted, TrialCutter.Cut(recording, Cue, Span, pad).TrialCount);
    }
}
