using System.Numerics;
using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Trials;

namespace Coupling.Tests.Trials;

/// <summary>
/// Padding past the recorded data must not create lagged coupling. A reflected copy reverses time, so where a filter
/// reaches into it a lag between two channels changes sign; zeros carry no phase, so the lag stays as recorded.
/// Imaginary coherency across trials, Im Σ z_a conj(z_b) / sqrt(Σ |z_a|² Σ |z_b|²) (Nolte et al. 2004, Clin
/// Neurophysiol 115:2292-2307), is computed here per time point straight from its definition.
/// </summary>
public sealed class ZeroPaddingTests
{
    private const double Rate = 250;
    private const int Trials = 300, Samples = 250, Delay = 3;

    /// <summary>
    /// Epochs of 1 s (−0.5..0.5 s around onset): channel A white noise, channel B the same noise 3 samples (12 ms)
    /// later plus a little independent noise, so B lags A by 2π·10 Hz·12 ms = 0.75 rad at 10 Hz: z_b(t) = z_a(t) e^{−iωd},
    /// so z_a conj(z_b) = |z_a|² e^{iωd} and the imaginary coherency is positive, about sin(0.75) = 0.68.
    /// </summary>
    private static double[] LaggedEpochs()
    {
        var random = new Random(4);
        var data = new double[Trials * 2 * Samples];
        for (int n = 0; n < Trials; n++)
        {
            var x = Enumerable.Range(0, Samples + Delay).Select(_ => random.NextDouble() - 0.5).ToArray();
            for (int s = 0; s < Samples; s++)
            {
                data[(n * 2) * Samples + s] = x[s + Delay];
                data[(n * 2 + 1) * Samples + s] = x[s] + 0.05 * (random.NextDouble() - 0.5);
            }
        }
        return data;
    }

    private static double ImaginaryCoherency(NarrowbandSet set, int t)
    {
        var a = set.Row(t, 0);
        var b = set.Row(t, 1);
        Complex cross = Complex.Zero;
        double pa = 0, pb = 0;
        for (int n = 0; n < set.TrialCount; n++)
        {
            cross += a[n] * Complex.Conjugate(b[n]);
            pa += a[n].Magnitude * a[n].Magnitude;
            pb += b[n].Magnitude * b[n].Magnitude;
        }
        return cross.Imaginary / Math.Sqrt(pa * pb);
    }

    [Fact]
    public void Padding_past_the_epochs_keeps_the_sign_and_size_of_a_lag_up_to_the_epoch_edges()
    {
        // The span is the whole epoch, so all padding lies past the data. Every time point of the span keeps the
        // imaginary coherency of the middle: same sign, at least half its size (with 300 trials the estimate's
        // standard deviation is about 1/sqrt(300) = 0.06 of unit coherency; half the size leaves over 5 of them).
        var decomposition = MorletDecomposition.Create(new Band("alpha", 8, 12), Rate);
        var span = new TimeRange(-0.5, 0.5);
        var trials = EpochTrials.Select("lagged.npy", LaggedEpochs(), Trials, ["A", "B"], Samples, Rate, -0.5,
            Enumerable.Repeat("cue", Trials).ToArray(), new ConditionSpec("cue", ["cue"]), span, decomposition.PadSamples);
        for (int i = 0; i < decomposition.PadSamples; i++)
        {
            Assert.Equal(0.0, trials.Trial(0, 0)[i]);
            Assert.Equal(0.0, trials.Trial(0, 1)[trials.SampleCount - 1 - i]);
        }
        var set = NarrowbandExtractor.Extract(trials, decomposition, span, 1, 1);
        double middle = ImaginaryCoherency(set, set.TimeCount / 2);
        Assert.True(middle > 0.4, $"middle {middle}");
        for (int t = 0; t < set.TimeCount; t++)
        {
            double value = ImaginaryCoherency(set, t);
            Assert.True(value > 0.5 * middle, $"time point {t} ({set.Times[t]:0.###} s): {value:0.###} against {middle:0.###} in the middle");
        }
    }

    [Fact]
    public void A_window_within_reach_of_the_zeros_is_refused_and_one_beyond_it_is_not()
    {
        // Morlet at 10 Hz with 5 cycles: st = 5 / (2π·10) = 0.0796 s, reach K = ceil(5·st·250) = 100 samples = 0.4 s.
        // The epochs give 0.5 s before 0 s and 0.5 s after: a window from 0 to 0.1 s has 0.5 s of data on its left and
        // 0.4 s on its right, enough; from -0.2 s its first 0.1 s (25 samples) lie within reach of the zeros.
        var decomposition = MorletDecomposition.Create(new Band("alpha", 8, 12), Rate);
        Assert.Equal(100, decomposition.PadSamples);
        Assert.Equal(0.4, decomposition.Info.Parameters["edge_reach_s"], 12);
        var trials = EpochTrials.Select("lagged.npy", LaggedEpochs(), Trials, ["A", "B"], Samples, Rate, -0.5,
            Enumerable.Repeat("cue", Trials).ToArray(), new ConditionSpec("cue", ["cue"]), new TimeRange(-0.5, 0.5), 120);
        Assert.Equal(120, trials.ZerosBefore);
        Assert.Equal(120, trials.ZerosAfter);
        Assert.Equal((0, 0), EdgeReach.IntoWindow(trials, decomposition, new TimeRange(0, 0.1)));
        EdgeReach.Check(trials, decomposition, new TimeRange(0, 0.1));
        Assert.Equal((25, 0), EdgeReach.IntoWindow(trials, decomposition, new TimeRange(-0.2, 0.1)));
        var error = Assert.Throws<InputException>(() => EdgeReach.Check(trials, decomposition, new TimeRange(-0.2, 0.1)));
        Assert.Contains("condition 'cue', band 'alpha'", error.Message);
        Assert.Contains("reaches 0.4 s", error.Message);
        Assert.Contains("only 0.3 s of data before the analysis window", error.Message);
        Assert.Contains("its first 0.1 s", error.Message);
        Assert.Equal((0, 5), EdgeReach.IntoWindow(trials, decomposition, new TimeRange(0, 0.12)));
    }
}
