using Coupling.Formats;
using Coupling.Plans;
using Coupling.Tests.Formats;
using Coupling.Trials;

namespace Coupling.Tests.Trials;

/// <summary>
/// Trials cut from a file read a segment at a time against trials cut from the same file read whole, and the
/// multi-channel padded read against the per-channel padded copy (zeros past either end).
/// </summary>
public sealed class SegmentCutTests
{
    private static Recording Simulated(double rate, int n, IReadOnlyList<RecordingEvent> events)
    {
        var random = new Random(11);
        var channels = new[] { "EEG F3", "EEG F4", "EEG C3", "EEG C4" }.Select(l => new ChannelInfo(l, "EEG", "uV")).ToArray();
        var samples = channels.Select((_, c) => Enumerable.Range(0, n)
            .Select(i => 30.0 * Math.Sin(2 * Math.PI * (6 + c) * i / rate) + random.NextDouble()).ToArray()).ToArray();
        return new Recording("simulated", rate, channels, samples, events);
    }

    [Fact]
    public void Trials_cut_from_the_segment_reader_equal_those_cut_from_the_whole_recording_bit_for_bit()
    {
        using var tmp = new TempFolder();
        // 250 Hz, 2600 samples: 10.4 s, written in records the writer chooses (a divisor closest to 1 s).
        // Events near both ends make padding run past them (zeros there); two spans run past the ends and are dropped.
        RecordingEvent[] events =
        [
            new(0.05, 0, "cue"), new(0.3, 0, "cue"), new(2.0, 0, "probe"), new(3.77, 0, "cue"), new(5.5, 0, "probe"),
            new(9.6, 0, "cue"), new(10.1, 0, "cue"), new(10.35, 0, "probe"),
        ];
        string path = tmp.File("trials.edf");
        EdfWriter.Write(Simulated(250, 2600, events), path);
        var whole = EdfReader.Read(path);
        var reader = EdfSegmentReader.Open(path);
        var span = new TimeRange(-0.2, 0.6);
        foreach (var condition in new[] { new ConditionSpec("cue", ["cue"]), new ConditionSpec("both", ["cue", "probe"]) })
            foreach (int pad in new[] { 0, 40, 400, 3000 })
            {
                var expected = TrialCutter.Cut(whole, condition, span, pad);
                var actual = TrialCutter.Cut(reader, reader.Events, condition, span, pad);
                Assert.True(expected.TrialCount > 0);
                Assert.Equal(expected.TrialCount, actual.TrialCount);
                Assert.Equal(expected.SampleCount, actual.SampleCount);
                Assert.Equal(expected.Channels, actual.Channels);
                Assert.Equal(expected.Onsets, actual.Onsets);
                Assert.Equal(expected.DroppedTrials, actual.DroppedTrials);
                Assert.Equal(expected.SpanStart, actual.SpanStart);
                Assert.Equal(expected.Data.Select(BitConverter.DoubleToInt64Bits), actual.Data.Select(BitConverter.DoubleToInt64Bits));
            }
    }

    [Fact]
    public void The_padded_read_of_all_channels_equals_the_padded_copy_of_each_and_counts_the_zeros()
    {
        var rec = Simulated(100, 37, []);
        double[]? scratch = null;
        // Starts before, inside and after the samples; lengths up to several times the recording.
        foreach (int start in new[] { -80, -36, -5, 0, 3, 30, 36, 40 })
            foreach (int length in new[] { 1, 7, 37, 50, 150 })
            {
                var target = new double[rec.Channels.Count * length];
                var zeros = TrialCutter.ReadPadded(rec, start, length, target, ref scratch);
                int before = Enumerable.Range(start, length).Count(i => i < 0);
                int after = Enumerable.Range(start, length).Count(i => i >= 37);
                Assert.Equal((before, after), zeros);
                for (int c = 0; c < rec.Channels.Count; c++)
                {
                    var expected = Enumerable.Range(start, length).Select(i => i < 0 || i >= 37 ? 0.0 : rec.Samples[c][i]).ToArray();
                    var copied = new double[length];
                    Assert.Equal((before, after), TrialCutter.CopyPadded(rec.Samples[c], start, copied));
                    Assert.Equal(expected, copied);
                    Assert.Equal(expected, target.AsSpan(c * length, length).ToArray());
                }
            }
    }
}
