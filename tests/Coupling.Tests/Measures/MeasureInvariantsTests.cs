using System.Numerics;
using Coupling.Measures;

namespace Coupling.Tests.Measures;

/// <summary>Known values and invariants of the measures, each with its published source.</summary>
public class MeasureInvariantsTests
{
    private static readonly Measure[] Every = MeasureCatalog.All.ToArray();

    private static double Of(double[][] values, Measure measure, int pair = 0) => values[(int)measure][pair];

    [Fact]
    public void Plv_of_independent_uniform_phases_matches_the_expected_mean_resultant_length()
    {
        // Mean resultant length R of N independent uniform unit vectors: 2N·R² is asymptotically chi-square with 2
        // degrees of freedom, so E[R] ≈ sqrt(pi/(4N)), and E[R²] = 1/N exactly (Fisher 1993, Statistical Analysis of
        // Circular Data, the Rayleigh test; Mardia & Jupp 2000, Directional Statistics; chapter and section from memory).
        // The window value is the mean of T independent time points, so its standard error is
        // sqrt(Var(R)/T) with Var(R) = 1/N - pi/(4N). The O(N^-3/2) term of E[R] is ~1e-5 here, far below 4 SE.
        const int trials = 200, times = 4000;
        var random = new Random(11);
        var set = TestSignals.Build(2, trials, times, (_, _, _) => TestSignals.UniformPhasor(random));
        var values = PairwiseKernels.ComputeObserved(set, [Measure.Plv, Measure.Ppc]);
        double expected = Math.Sqrt(Math.PI / (4.0 * trials));
        double standardError = Math.Sqrt((1 - Math.PI / 4) / trials / times);
        Assert.InRange(values[0][0], expected - 4 * standardError, expected + 4 * standardError);

        // PPC is unbiased for the squared population PLV, 0 here (Vinck et al. 2010, NeuroImage 51:112). Its
        // per-time-point variance is exactly 1/(N(N-1)) for uniform phases (the N(N-1)/2 pairwise cosines are
        // uncorrelated with variance 1/2), so the window mean has standard error 1/sqrt(N(N-1)T).
        double ppcError = 1 / Math.Sqrt(trials * (trials - 1.0) * times);
        Assert.InRange(values[1][0], -4 * ppcError, 4 * ppcError);
    }

    [Theory]
    [InlineData(7, 1)]
    [InlineData(13, 2)]
    [InlineData(200, 3)]
    public void Ppc_equals_n_plv_squared_minus_one_over_n_minus_one_at_each_time_point(int trials, int seed)
    {
        // Vinck et al. 2010 (NeuroImage 51:112), the relation of PPC to the PLV: PPC = (N·PLV² − 1)/(N − 1).
        // One time point, so the window value is the per-time-point value; tolerance: a few ulps of values <= 1
        // amplified by N/(N-1).
        var set = TestSignals.Random(4, trials, 1, seed);
        var values = PairwiseKernels.ComputeObserved(set, [Measure.Plv, Measure.Ppc]);
        for (int p = 0; p < values[0].Length; p++)
        {
            double plv = values[0][p];
            Assert.Equal((trials * plv * plv - 1) / (trials - 1), values[1][p], 1e-13);
        }
    }

    [Theory]
    [InlineData(0, 13)]
    [InlineData(5, 6)]
    [InlineData(9, 18)]
    public void Zero_lag_copies_anywhere_among_many_channels_give_exactly_zero_lag_measures(int original, int copy)
    {
        // As below (Stam et al. 2007; Vinck et al. 2011; Nolte et al. 2004): X_n = c|a_n|² is real for b = c·a, so the
        // lag measures are exactly 0. Here the copy sits in another tile of the all-pairs product (19 channels, tiles
        // of 4 x 8), with 37 trials, so the exactness must hold for the tiled, vectorised sums too.
        var set = TestSignals.Random(19, 37, 5, seed: 44);
        var data = (Complex[])set.Data.Clone();
        for (int t = 0; t < 5; t++)
            for (int n = 0; n < 37; n++)
                data[(t * 19 + copy) * 37 + n] = -4.0 * data[(t * 19 + original) * 37 + n];
        var values = PairwiseKernels.ComputeObserved(TestSignals.Wrap(19, 37, 5, data), Every);
        int pair = PairIndex.Of(Math.Min(original, copy), Math.Max(original, copy), 19);
        Assert.Equal(0.0, Of(values, Measure.Pli, pair));
        Assert.Equal(0.0, Of(values, Measure.Wpli, pair));
        Assert.Equal(0.0, Of(values, Measure.WpliDebiased, pair));
        Assert.Equal(0.0, Of(values, Measure.ImagCoherency, pair));
        Assert.Equal(0.0, Of(values, Measure.AecOrth, pair));
    }

    [Theory]
    [InlineData(-0.5)]
    [InlineData(2.0)]
    public void Zero_lag_mixing_gives_zero_lag_measures_and_full_plv_and_coherence(double gain)
    {
        // b = c·a with real c: the cross products X_n = c|a_n|² are real, so PLI (Stam et al. 2007), wPLI and
        // debiased wPLI² (Vinck et al. 2011) and imaginary coherency (Nolte et al. 2004) are exactly 0, while PLV and
        // coherence are 1. c is a power of two so the scaling is exact in floating point and Im X_n is exactly 0;
        // PLV and coherence are 1 to rounding of sums of 40 terms (tolerance 1e-14).
        var source = TestSignals.Random(1, 40, 8, seed: 21);
        var set = TestSignals.Build(3, 40, 8, (t, c, n) =>
        {
            var a = ReferenceMeasures.Z(source, t, 0, n);
            return c == 0 ? a : c == 1 ? gain * a : new Complex(0.3, -0.2) * a;
        });
        var values = PairwiseKernels.ComputeObserved(set, Every);
        int pair = PairIndex.Of(0, 1, 3);
        Assert.Equal(0.0, Of(values, Measure.Pli, pair));
        Assert.Equal(0.0, Of(values, Measure.Wpli, pair));
        Assert.Equal(0.0, Of(values, Measure.WpliDebiased, pair));
        Assert.Equal(0.0, Of(values, Measure.ImagCoherency, pair));
        Assert.Equal(1.0, Of(values, Measure.Plv, pair), 1e-14);
        Assert.Equal(1.0, Of(values, Measure.Coherence, pair), 1e-14);
        // Orthogonalizing an exact copy leaves nothing (Hipp et al. 2012, Nat Neurosci 15:884): AEC-orth is 0,
        // while plain AEC of proportional envelopes is 1 up to the documented clamp 1 - 1e-12.
        Assert.Equal(0.0, Of(values, Measure.AecOrth, pair));
        Assert.Equal(1.0, Of(values, Measure.Aec, pair), 1e-11);
        // The complex-scaled copy (channel 2) has a constant nonzero lag, so it is not a zero-lag control.
        Assert.Equal(1.0, Of(values, Measure.Pli, PairIndex.Of(0, 2, 3)));
    }

    [Fact]
    public void Plv_of_a_phase_shifted_copy_is_one_and_pli_of_a_constant_nonzero_lag_is_one()
    {
        // Lachaux et al. 1999 (PLV = 1 for a constant phase difference); Stam et al. 2007 (PLI = 1 when the phase
        // difference keeps one sign, here -0.8 rad in every trial). Tolerance: rounding of a sum of 30 unit terms.
        var source = TestSignals.Random(1, 30, 6, seed: 4);
        var shift = Complex.FromPolarCoordinates(1, 0.8);
        var set = TestSignals.Build(2, 30, 6, (t, c, n) => ReferenceMeasures.Z(source, t, 0, n) * (c == 0 ? 1 : shift));
        var values = PairwiseKernels.ComputeObserved(set, Every);
        Assert.Equal(1.0, Of(values, Measure.Plv), 1e-14);
        Assert.Equal(1.0, Of(values, Measure.Pli));
        Assert.Equal(1.0, Of(values, Measure.Wpli), 1e-14);
        Assert.Equal(1.0, Of(values, Measure.WpliDebiased), 1e-13);
        // Sign convention: X = a·conj(b) = |a|² e^{-0.8i}, so the imaginary coherency is negative (b leads a).
        Assert.True(Of(values, Measure.ImagCoherency) < 0);
    }

    [Fact]
    public void Coherence_of_a_linear_system_with_output_noise_is_snr_over_one_plus_snr()
    {
        // y = g·x + e with e independent of x: the population coherence is g²Sxx/(g²Sxx + See) = SNR/(1 + SNR)
        // (Bendat & Piersol, Random Data, 4th ed. 2010, coherence of a linear system with output noise). The estimate
        // from N trials has normalised random error sqrt(2)(1-γ²)/(|γ| sqrt(N)) (ibid., chapter on statistical errors
        // of coherence estimates; formula from memory) and a bias of order (1-γ²)²/N (from memory); averaging over
        // T independent time points divides the random error by sqrt(T). Tolerance: 4 standard errors plus the bias.
        const int trials = 2000, times = 40;
        const double gain = 1.0, noisePower = 0.5;
        var random = new Random(31);
        var set = TestSignals.Build(2, trials, times, (_, _, _) => Complex.Zero);
        for (int t = 0; t < times; t++)
            for (int n = 0; n < trials; n++)
            {
                var x = TestSignals.Gaussian(random);
                var e = Math.Sqrt(noisePower) * TestSignals.Gaussian(random);
                set.Data[(t * 2 + 0) * trials + n] = x;
                set.Data[(t * 2 + 1) * trials + n] = gain * x + e;
            }
        double snr = gain * gain * 1.0 / noisePower;
        double expected = snr / (1 + snr);
        double sd = Math.Sqrt(2) * (1 - expected) / Math.Sqrt(expected) / Math.Sqrt(trials) * expected;
        double tolerance = 4 * sd / Math.Sqrt(times) + Math.Pow(1 - expected, 2) / trials;
        var values = PairwiseKernels.ComputeObserved(set, [Measure.Coherence]);
        Assert.InRange(values[0][0], expected - tolerance, expected + tolerance);
    }

    [Fact]
    public void Aec_of_a_shared_envelope_with_independent_phases_is_high_while_plv_is_low()
    {
        // Amplitude coupling without phase coupling: both channels carry the same slowly varying envelope but
        // independent uniform phases (Hipp et al. 2012 distinguish the two). AEC is 1 up to the clamp; PLV is the
        // chance level sqrt(pi/(4N)) ≈ 0.089 for N = 100 (Fisher 1993), far below 0.2 (the window mean over 50 time
        // points has standard error ≈ 0.0065).
        const int trials = 100, times = 50;
        var random = new Random(41);
        var offsets = Enumerable.Range(0, trials).Select(_ => 2 * Math.PI * random.NextDouble()).ToArray();
        var set = TestSignals.Build(2, trials, times, (t, c, n) =>
            (1 + 0.7 * Math.Sin(2 * Math.PI * t / 25.0 + offsets[n])) * TestSignals.UniformPhasor(random));
        var values = PairwiseKernels.ComputeObserved(set, Every);
        Assert.True(Of(values, Measure.Aec) > 0.999, $"AEC {Of(values, Measure.Aec)}");
        Assert.True(Of(values, Measure.Plv) < 0.2, $"PLV {Of(values, Measure.Plv)}");
    }

    [Fact]
    public void Aec_orth_of_zero_lag_mixed_noisy_copies_is_near_zero_while_aec_is_high()
    {
        // x = s + n1, y = 0.6·s + n2 (one source seen at zero lag by two channels, plus independent noise): the shared
        // envelope makes AEC high; orthogonalising removes the zero-lag part, leaving noise whose envelope does not
        // follow the source (Hipp et al. 2012, Nat Neurosci 15:884, Fig. 1). Each trial's r over T time points has
        // standard deviation ≈ 1/sqrt(T); the Fisher mean over N trials ≈ 1/sqrt(NT) = 0.011 here; tolerance 0.06
        // (≈ 5 standard deviations).
        const int trials = 40, times = 200;
        var random = new Random(51);
        var source = new Complex[times, trials];
        for (int n = 0; n < trials; n++)
        {
            double offset = 2 * Math.PI * random.NextDouble(), phase = 0;
            for (int t = 0; t < times; t++)
            {
                phase += 0.5 + 0.2 * (random.NextDouble() - 0.5);
                source[t, n] = Complex.FromPolarCoordinates(1 + 0.7 * Math.Sin(2 * Math.PI * t / 50.0 + offset), phase);
            }
        }
        double noise = Math.Sqrt(0.05);
        var set = TestSignals.Build(2, trials, times, (t, c, n) =>
            (c == 0 ? source[t, n] : 0.6 * source[t, n]) + noise * TestSignals.Gaussian(random));
        var values = PairwiseKernels.ComputeObserved(set, [Measure.Aec, Measure.AecOrth]);
        Assert.True(values[0][0] > 0.8, $"AEC {values[0][0]}");
        Assert.InRange(values[1][0], -0.06, 0.06);
    }
}
