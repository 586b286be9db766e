using System.Numerics;
using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Trials;

namespace Coupling.Tests.Spectral;

/// <summary>
/// NarrowbandExtractor with a stand-in decomposition that writes each input sample back as (x, −s): the output then
/// shows which trial, channel and sample every value came from and where it was put.
/// Trials: 3 trials x 4 channels, 100 Hz, span -0.5..1.5 s (200 samples) padded by 20 samples at each end.
/// </summary>
public sealed class NarrowbandExtractorTests
{
    private const int Trials = 3, Channels = 4, Pad = 20, Span = 200, Total = Span + 2 * Pad;

    private sealed class MarkingDecomposition : IBandDecomposition
    {
        public Band Band { get; } = new("test", 4, 8);
        public int PadSamples => Pad;
        public DecompositionInfo Info { get; } = new("marking", "test", new Dictionary<string, double>());

        public void Apply(ReadOnlySpan<double> input, Span<Complex> output)
        {
            Assert.Equal(input.Length, output.Length);
            for (int i = 0; i < input.Length; i++) output[i] = new Complex(input[i], -i);
        }
    }

    private static double Code(int n, int c, int s) => 100000 * n + 1000 * c + s;

    private static TrialSet Trials3x4()
    {
        var data = new double[Trials * Channels * Total];
        for (int n = 0; n < Trials; n++)
            for (int c = 0; c < Channels; c++)
                for (int s = 0; s < Total; s++) data[(n * Channels + c) * Total + s] = Code(n, c, s);
        return new TrialSet("cue", ["A", "B", "C", "D"], 100, Trials, Total, Pad, -0.5, data, [1, 2, 3], []);
    }

    [Fact]
    public void Window_samples_start_at_the_window_and_step_through_it()
    {
        // Window 0..1 s: 100 samples from padded index 20 + 50 = 70; every 3rd gives ceil(100 / 3) = 34 points, last 169.
        int[] idx = NarrowbandExtractor.WindowSamples(Trials3x4(), new TimeRange(0.0, 1.0), 3);
        Assert.Equal(34, idx.Length);
        Assert.Equal(70, idx[0]);
        Assert.Equal(169, idx[^1]);
        Assert.All(idx.Zip(idx.Skip(1)), p => Assert.Equal(3, p.Second - p.First));
        Assert.Equal(Enumerable.Range(70, 100), NarrowbandExtractor.WindowSamples(Trials3x4(), new TimeRange(0.0, 1.0), 1));
    }

    [Fact]
    public void A_window_outside_the_span_is_refused()
    {
        Assert.Throws<ArgumentException>(() => NarrowbandExtractor.WindowSamples(Trials3x4(), new TimeRange(-0.6, 0.5), 1));
        Assert.Throws<ArgumentException>(() => NarrowbandExtractor.WindowSamples(Trials3x4(), new TimeRange(1.0, 1.6), 1));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    public void Values_are_laid_out_time_then_channel_then_trial(int threads)
    {
        var set = NarrowbandExtractor.Extract(Trials3x4(), new MarkingDecomposition(), new TimeRange(0.25, 0.75), 4, threads);
        // Window 0.25..0.75 s: 50 samples from index 20 + 75 = 95, every 4th: 13 points.
        Assert.Equal(13, set.TimeCount);
        Assert.Equal(Channels, set.ChannelCount);
        Assert.Equal(Trials, set.TrialCount);
        Assert.Equal("test", set.Band.Name);
        for (int t = 0; t < set.TimeCount; t++)
        {
            int s = 95 + 4 * t;
            Assert.Equal(0.25 + 0.04 * t, set.Times[t], 12);
            for (int c = 0; c < Channels; c++)
                for (int n = 0; n < Trials; n++)
                    Assert.Equal(new Complex(Code(n, c, s), -s), set.Data[(t * Channels + c) * Trials + n]);
            Assert.Equal(new Complex(Code(2, 1, s), -s), set.Row(t, 1)[2]);
        }
    }
}
