using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

/// <summary>
/// Signed measures (imaginary coherency, AEC, AEC-orth) tested two-sided against the trial-shuffle null itself, not
/// against 0: a stimulus-locked response with a lag between channels, or a shared envelope, shifts that null away from
/// 0, and a value far below it is as much evidence of trial-by-trial coupling as one far above it. Two-sided p-value as
/// twice the smaller one-sided p-value (Kulinskaya 2008, "On two-sided p-values for non-symmetric distributions",
/// arXiv:0810.2124), each one-sided p being (b + 1)/(M + 1) (Phipson and Smyth 2010, Stat Appl Genet Mol Biol 9:39).
/// </summary>
public class ShiftedNullTests
{
    /// <summary>
    /// Two channels: a stimulus-locked response e(t), the same in every trial, channel 1 lagging by φ = 0.8 rad, so
    /// that shuffled trials keep an imaginary coherency of about sin φ / 2 = 0.36 (the issue's +0.37); and, trial by
    /// trial, shared activity s with channel 1 leading by φ and the same power, whose imaginary part cancels that of the
    /// response: E[z_0 conj z_1] = |e|² e^{iφ} + |s|² e^{−iφ} has imaginary part 0. The observed value lies near 0,
    /// far below the null.
    /// </summary>
    private static NarrowbandSet LaggedResponseAgainstOppositeCoupling(int trials, int times, Random random)
    {
        var evoked = Enumerable.Range(0, times).Select(t => Complex.FromPolarCoordinates(1, 1.1 * t)).ToArray();
        var shared = new Complex[times, trials];
        for (int t = 0; t < times; t++)
            for (int n = 0; n < trials; n++) shared[t, n] = TestSignals.Gaussian(random);
        var lag = Complex.FromPolarCoordinates(1, -0.8);
        var lead = Complex.FromPolarCoordinates(1, 0.8);
        return TestSignals.Build(2, trials, times, (t, c, n) => c == 0
            ? evoked[t] + shared[t, n] + 0.2 * TestSignals.Gaussian(random)
            : evoked[t] * lag + lead * shared[t, n] + 0.2 * TestSignals.Gaussian(random));
    }

    [Fact]
    public void An_imaginary_coherency_far_below_a_shifted_null_is_significant()
    {
        const int trials = 30, times = 20, draws = 199;
        var set = LaggedResponseAgainstOppositeCoupling(trials, times, new Random(5));
        var result = SurrogateTest.Run(set, [Measure.ImagCoherency], draws, seed: 9, "x")[0];
        // The null is shifted and narrow (the case: mean +0.37, sd 0.02), the observed value far below it.
        Assert.InRange(result.NullMean[0], 0.25, 0.45);
        Assert.True(result.Observed[0] < result.NullMean[0] - 5 * result.NullSd[0],
            $"observed {result.Observed[0]}, null {result.NullMean[0]} ± {result.NullSd[0]}");
        // No draw is at or below the observed value: the lower one-sided p is 1/(M+1), the two-sided p twice that.
        Assert.Equal(2.0 / (draws + 1), result.P[0]);
        Assert.True(result.Z[0] < -2, $"z = {result.Z[0]}");
    }

    [Fact]
    public void An_envelope_correlation_far_below_a_shared_envelope_null_is_significant()
    {
        // Both channels' envelopes follow one stimulus-locked modulation m(t), the same in every trial, so shuffled
        // trials keep a strong positive envelope correlation; trial by trial the channels' own envelope fluctuations
        // are opposite (1 + g and 1 − g), which pulls the observed AEC far below that null.
        const int trials = 30, times = 40, draws = 99;
        var random = new Random(11);
        var modulation = Enumerable.Range(0, times).Select(t => 1 + 0.6 * Math.Sin(2 * Math.PI * t / times)).ToArray();
        var wobble = new double[times, trials];
        for (int t = 0; t < times; t++)
            for (int n = 0; n < trials; n++) wobble[t, n] = 0.5 * (2 * random.NextDouble() - 1);
        var set = TestSignals.Build(2, trials, times, (t, c, n) =>
            Complex.FromPolarCoordinates(modulation[t] * (c == 0 ? 1 + wobble[t, n] : 1 - wobble[t, n]), 2 * Math.PI * random.NextDouble()));
        var result = SurrogateTest.Run(set, [Measure.Aec], draws, seed: 4, "x")[0];
        Assert.True(result.NullMean[0] > 0.2, $"null mean {result.NullMean[0]}");
        Assert.True(result.Observed[0] < result.NullMean[0] - 5 * result.NullSd[0],
            $"observed {result.Observed[0]}, null {result.NullMean[0]} ± {result.NullSd[0]}");
        Assert.Equal(2.0 / (draws + 1), result.P[0]);
    }

    [Fact]
    public void Signed_measures_reject_at_the_nominal_rate_when_the_shifted_null_is_true()
    {
        // Only the lagged stimulus-locked response and independent noise: nothing couples the channels trial by trial,
        // so shuffling is exchangeable and the null hypothesis holds, while the null of imaginary coherency sits far
        // from 0. 250 data sets of 2 channels, 12 trials, 10 time points, M = 39: the two-sided test at 0.05 rejects
        // the most extreme of 40 values on either side, level exactly 2/40 for a continuous statistic. The count must
        // lie in the central 99.9 % range of Binomial(250, 0.05) (exact binomial law).
        const int sets = 250, trials = 12, times = 10, draws = 39;
        const double alpha = 0.05;
        // Imaginary coherency only: its null is the one the lagged response shifts (AEC's is not), and the envelope
        // measures cost far more per draw at this size.
        Measure[] signed = [Measure.ImagCoherency];
        var rejectedBySet = new bool[sets, signed.Length];
        var nullMean = new double[sets];
        Parallel.For(0, sets, s =>
        {
            var random = new Random(9100 + s);
            var evoked = Enumerable.Range(0, times).Select(t => Complex.FromPolarCoordinates(1 + 0.5 * Math.Sin(t), 1.1 * t)).ToArray();
            var lag = Complex.FromPolarCoordinates(1, -0.8);
            var set = TestSignals.Build(2, trials, times, (t, c, n) =>
                (c == 0 ? evoked[t] : evoked[t] * lag) + 0.7 * TestSignals.Gaussian(random));
            var results = SurrogateTest.Run(set, signed, draws, seed: (ulong)s, "x", maxThreads: 1);
            for (int k = 0; k < signed.Length; k++) rejectedBySet[s, k] = results[k].P[0] <= alpha;
            nullMean[s] = results[0].NullMean[0];
        });
        Assert.True(nullMean.Average() > 0.3, $"imaginary coherency null mean {nullMean.Average()}");
        var (low, high) = BinomialRange.Central(sets, alpha, 0.999);
        for (int k = 0; k < signed.Length; k++)
        {
            int count = Enumerable.Range(0, sets).Count(s => rejectedBySet[s, k]);
            Assert.True(count >= low && count <= high, $"{MeasureCatalog.Key(signed[k])}: {count} of {sets} outside {low}..{high}");
        }
    }
}
