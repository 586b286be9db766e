using Coupling.Plans;
using Coupling.Trials;

namespace Coupling.Tests.Trials;

/// <summary>
/// EpochTrials.Select on 4 epochs x 2 channels x 50 samples whose values encode (epoch, channel, sample) as
/// 10000 e + 1000 c + s. Rate 100 Hz; each epoch's first sample is at -0.2 s.
/// </summary>
public sealed class EpochTrialsTests
{
    private const int Epochs = 4, Channels = 2, Samples = 50;
    private static readonly string[] Labels = ["go", "stop", "go", "stop"];

    private static double[] Data()
    {
        var d = new double[Epochs * Channels * Samples];
        for (int e = 0; e < Epochs; e++)
            for (int c = 0; c < Channels; c++)
                for (int s = 0; s < Samples; s++) d[(e * Channels + c) * Samples + s] = 10000 * e + 1000 * c + s;
        return d;
    }

    private static TrialSet Select(TimeRange span, int pad, string condition = "go") =>
        EpochTrials.Select("epochs.npy", Data(), Epochs, ["A", "B"], Samples, 100, -0.2, Labels,
            new ConditionSpec(condition, [condition]), span, pad);

    [Fact]
    public void The_condition_epochs_and_span_samples_are_selected()
    {
        // Span -0.1..0.2 s starts round((−0.1 − (−0.2)) · 100) = 10 samples into each epoch and holds 30 samples.
        var set = Select(new TimeRange(-0.1, 0.2), pad: 5);
        Assert.Equal(2, set.TrialCount);
        Assert.Equal(40, set.SampleCount);
        Assert.Equal(-0.1, set.SpanStart, 12);
        Assert.Empty(set.DroppedTrials);
        int[] chosen = [0, 2];
        for (int n = 0; n < 2; n++)
            for (int c = 0; c < Channels; c++)
            {
                var x = set.Trial(n, c);
                for (int i = 0; i < x.Length; i++) Assert.Equal(10000 * chosen[n] + 1000 * c + 5 + i, x[i]);
            }
        Assert.All(set.Onsets, o => Assert.True(double.IsNaN(o)));
    }

    [Fact]
    public void Padding_past_the_epoch_ends_is_filled_with_zeros_and_counted()
    {
        // Span -0.2..0.3 s is the whole epoch; 3 samples of padding past each end hold zeros.
        var set = Select(new TimeRange(-0.2, 0.3), pad: 3, condition: "stop");
        Assert.Equal(56, set.SampleCount);
        double[] expected = [0, 0, 0, .. Enumerable.Range(0, 50).Select(s => 10000.0 * 3 + 1000 + s), 0, 0, 0];
        Assert.Equal(expected, set.Trial(1, 1).ToArray());
        Assert.Equal(3, set.ZerosBefore);
        Assert.Equal(3, set.ZerosAfter);
    }

    [Fact]
    public void A_span_outside_the_epochs_is_refused()
    {
        var e = Assert.Throws<InputException>(() => Select(new TimeRange(-0.3, 0.2), pad: 0));
        Assert.Contains("epochs.npy", e.Message);
        Assert.Contains("runs past the epochs", e.Message);
    }
}
