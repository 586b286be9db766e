using System.Numerics;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

public class DirectionTests
{
    [Fact]
    public void The_coherency_phase_of_a_delayed_copy_gives_the_delay_and_the_leader()
    {
        // z_b(t) = z_a(t - tau) at 10 Hz: z_a z_b* = |z_a|^2 exp(2 pi i f tau), so phase = 2 pi f tau (Nolte et al. 2004
        // definition of coherency; analytic invariant) and the lag at 10 Hz is tau = 12 ms, a leading.
        const double f = 10, tau = 0.012;
        var random = new Random(1);
        var set = TestSignals.Build(2, 15, 20, (t, c, n) => Complex.Zero);
        for (int t = 0; t < 20; t++)
            for (int n = 0; n < 15; n++)
            {
                var za = TestSignals.Gaussian(random);
                set.Data[(t * 2 + 0) * 15 + n] = za;
                set.Data[(t * 2 + 1) * 15 + n] = za * Complex.FromPolarCoordinates(1, -2 * Math.PI * f * tau);
            }
        double phase = CoherencyPhase.Of(set, 0, 1);
        // Tolerance: a sum of 300 products, a few ulps of pi.
        Assert.Equal(2 * Math.PI * f * tau, phase, 1e-12);
        Assert.Equal(12, CoherencyPhase.LagMilliseconds(phase, f), 1e-9);
        Assert.Equal(-phase, CoherencyPhase.Of(set, 1, 0), 1e-12);
    }

    /// <summary>Trials x channels x samples (trial-major) of white noise with channel 1 = channel 0 delayed by <paramref name="delay"/> samples plus noise.</summary>
    private static double[] Delayed(int trials, int samples, int delay, double mix, Random random, bool instantaneous = false)
    {
        var x = new double[trials * 2 * samples];
        for (int n = 0; n < trials; n++)
        {
            var source = Enumerable.Range(0, samples + delay).Select(_ => Gauss(random)).ToArray();
            for (int s = 0; s < samples; s++)
            {
                x[(n * 2 + 0) * samples + s] = source[s + delay];
                x[(n * 2 + 1) * samples + s] = instantaneous ? mix * source[s + delay] : mix * source[s] + Gauss(random);
            }
        }
        return x;
    }

    private static double Gauss(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());

    [Fact]
    public void The_phase_slope_index_points_from_the_leading_channel_and_is_significant()
    {
        // Nolte et al. (2008), Phys Rev Lett 100:234101: for b a delayed copy of a, the coherency phase rises with
        // frequency and Psi_ab > 0 (a leads); Psi_ba = -Psi_ab (antisymmetry of the definition). 40 trials of 200 samples
        // at 200 Hz, delay 3 samples (15 ms), band 8-30 Hz (1 Hz resolution: 23 frequencies).
        var random = new Random(2);
        var x = Delayed(40, 200, 3, 1.0, random);
        var (spectra, frequencies) = PhaseSlopeIndex.Spectra(x, 2, 40, 200, 8, 30);
        Assert.Equal(23, frequencies.Length);
        Assert.Equal(8, frequencies[0], 1e-12);
        var (psi, p) = PhaseSlopeIndex.Test(spectra, 40, frequencies.Length, [(0, 1), (1, 0)], 99, 5);
        Assert.True(psi[0] > 0, $"psi = {psi[0]}");
        Assert.Equal(-psi[0], psi[1], 1e-12);
        Assert.Equal(1 / 100.0, p[0]);
    }

    [Fact]
    public void The_phase_slope_index_of_instantaneous_mixing_is_zero()
    {
        // b = 0.7·a with no delay: the coherency is real at every frequency, so Psi = 0 exactly up to rounding (Nolte et al.
        // 2008: insensitive to instantaneous mixtures). Tolerance: rounding of spectra of 200-sample windows, 1e-12.
        var random = new Random(3);
        var x = Delayed(20, 200, 0, 0.7, random, instantaneous: true);
        var (spectra, frequencies) = PhaseSlopeIndex.Spectra(x, 2, 20, 200, 8, 30);
        Assert.Equal(0, PhaseSlopeIndex.Compute(spectra, 20, frequencies.Length, 0, 1, TestSignals.Identity(20)), 1e-12);
    }

    [Fact]
    public void The_spectrum_is_the_tapered_discrete_fourier_transform()
    {
        // X(f) = sum_s w_s x_s exp(-2 pi i f s / fs) with the periodic Hann taper; a cosine at a bin frequency k/T with
        // amplitude A gives |X| = A·S/4 (Hann coherent gain 1/2, one of the two exponentials; textbook DFT, e.g. Harris
        // 1978, Proc IEEE 66:51, table 1). Tolerance 1e-9 relative.
        const int s = 100;
        double fs = 100, f = 12;
        var x = Enumerable.Range(0, s).Select(i => 3.0 * Math.Cos(2 * Math.PI * f * i / fs)).ToArray();
        var (spectra, frequencies) = PhaseSlopeIndex.Spectra(x, 1, 1, fs, 11, 13);
        Assert.Equal([11.0, 12.0, 13.0], frequencies);
        Assert.Equal(3.0 * s / 4, spectra[1].Magnitude, 3.0 * s / 4 * 1e-9);
    }

    [Fact]
    public void The_surrogate_test_of_the_phase_slope_index_is_calibrated()
    {
        // Independent channels: P(p <= alpha) = alpha for the permutation test up to the discreteness of p (Phipson &
        // Smyth 2010); the count of p <= 0.1 over 120 experiments within the 99 % binomial acceptance region (exact).
        const int experiments = 120, draws = 19;
        var random = new Random(4);
        int small = 0;
        for (int e = 0; e < experiments; e++)
        {
            var x = Delayed(12, 64, 2, 0.0, random);
            var (spectra, frequencies) = PhaseSlopeIndex.Spectra(x, 2, 12, 64, 5, 20);
            var (_, p) = PhaseSlopeIndex.Test(spectra, 12, frequencies.Length, [(0, 1)], draws, (ulong)e);
            if (p[0] <= 0.1) small++;
        }
        var (lo, hi) = BinomialInterval.Of(experiments, 0.1);
        Assert.InRange(small, lo, hi);
    }
}
