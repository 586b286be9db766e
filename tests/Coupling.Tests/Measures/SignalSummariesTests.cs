using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;

namespace Coupling.Tests.Measures;

/// <summary>
/// Channel power, stimulus locking (inter-trial phase consistency; Tallon-Baudry et al. 1996, J Neurosci 16:4240) and the
/// coherency phase of each pair turned into a lag at the band centre.
/// </summary>
public class SignalSummariesTests
{
    [Theory]
    [InlineData(Math.PI / 2, 10, 25)]      // a quarter period of 10 Hz is 25 ms
    [InlineData(-Math.PI, 4, -125)]        // half a period of 4 Hz is 125 ms
    [InlineData(Math.PI / 4, 40, 3.125)]   // an eighth of 25 ms
    [InlineData(0, 6, 0)]
    public void A_phase_becomes_its_fraction_of_the_period(double phase, double hz, double ms)
    {
        // τ = φ/(2πf): a pure delay τ shifts the phase at f by 2πfτ (Fourier shift theorem). 1e-12: a few roundings of doubles.
        Assert.Equal(ms, PhaseLag.Milliseconds(phase, hz), 12);
    }

    [Fact]
    public void A_lag_needs_a_positive_frequency_and_keeps_NaN()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => PhaseLag.Milliseconds(1, 0));
        Assert.True(double.IsNaN(PhaseLag.Milliseconds(double.NaN, 10)));
    }

    [Theory]
    [InlineData(0.025)]
    [InlineData(-0.010)]
    [InlineData(0.040)]
    public void A_delayed_copy_has_the_delay_as_its_lag(double delay)
    {
        // Channel b is channel a delayed by τ at the band centre f = 10 Hz: z_b(t) = z_a(t − τ) = z_a(t)·e^(−i2πfτ) for a
        // narrowband signal at f, so arg(z_a·conj(z_b)) = 2πfτ and a leads by τ (Nolte et al. 2004, Clin Neurophysiol
        // 115:2292, sign convention of coherency). Random phases and amplitudes per trial; a third channel is noise.
        double f = TestSignals.TestBand.Centre;
        var random = new Random(5);
        const int trials = 30, times = 12;
        var a = new Complex[times, trials];
        for (int t = 0; t < times; t++)
            for (int n = 0; n < trials; n++)
                a[t, n] = (0.5 + random.NextDouble()) * TestSignals.UniformPhasor(random);
        var shift = Complex.FromPolarCoordinates(1, -2 * Math.PI * f * delay);
        var set = TestSignals.Build(3, trials, times, (t, c, n) => c switch
        {
            0 => a[t, n],
            1 => 0.7 * a[t, n] * shift,
            _ => TestSignals.Gaussian(random),
        });
        var s = SignalSummaries.Summarise(set, "go");
        // 1e-9: the phase comes from sums of 360 products and one atan2; the lag scales it by 1000/(2πf) ≈ 16.
        Assert.Equal(2 * Math.PI * f * delay, s.CoherencyPhase[PairIndex.Of(0, 1, 3)], 9);
        Assert.Equal(1000 * delay, s.LagMs[PairIndex.Of(0, 1, 3)], 9);
        Assert.Equal(f, s.CentreHz);
        Assert.Equal(trials, s.Trials);
    }

    [Fact]
    public void Equal_phases_in_every_trial_give_stimulus_locking_one_and_independent_phases_give_the_chance_level()
    {
        // Channel 0: the same phase in every trial (a response locked to the stimulus): R = 1 exactly at each time point.
        // Channel 1: independent uniform phases: E[R] ≈ sqrt(π/(4N)) (Fisher 1993, Statistical Analysis of Circular Data,
        // the mean resultant length of a uniform sample). Averaged over 200 time points the mean lies within about
        // 3·sqrt((1 − π/4)/N)/sqrt(200) of it (Rayleigh distribution's sd, independent time points); 0.02 covers that at N = 40.
        var random = new Random(17);
        const int trials = 40, times = 200;
        var set = TestSignals.Build(2, trials, times, (t, c, n) => c == 0
            ? Complex.FromPolarCoordinates(1 + n % 3, 0.3 * t)
            : TestSignals.UniformPhasor(random));
        var s = SignalSummaries.Summarise(set, "go");
        Assert.Equal(1, s.StimulusLocking[0], 12);
        Assert.Equal(Math.Sqrt(Math.PI / (4.0 * trials)), s.StimulusLocking[1], 0.02);
    }

    [Fact]
    public void Power_is_the_mean_squared_amplitude_over_time_points_and_trials()
    {
        // Amplitudes 1, 2, 3 cycling over trials: mean of squares (1 + 4 + 9)/3 = 14/3 (definition).
        var random = new Random(2);
        var set = TestSignals.Build(2, 6, 5, (t, c, n) => (c + 1) * (1 + n % 3) * TestSignals.UniformPhasor(random));
        var s = SignalSummaries.Summarise(set, "go");
        Assert.Equal(14.0 / 3, s.Power[0], 12);
        Assert.Equal(4 * 14.0 / 3, s.Power[1], 12);
    }

    [Fact]
    public void A_silent_channel_has_no_phase_and_no_lag()
    {
        var random = new Random(3);
        var set = TestSignals.Build(2, 5, 4, (t, c, n) => c == 0 ? TestSignals.UniformPhasor(random) : Complex.Zero);
        var s = SignalSummaries.Summarise(set, "go");
        Assert.True(double.IsNaN(s.CoherencyPhase[0]));
        Assert.True(double.IsNaN(s.LagMs[0]));
        Assert.Equal(0, s.StimulusLocking[1]);
        Assert.Equal(0, s.Power[1]);
    }
    [Fact]
    public void The_vector_cross_sum_equals_the_sum_of_complex_products_at_every_length()
    {
        // Σ_n x_n·conj(y_n) through System.Numerics.Complex (the runtime's own complex arithmetic) as the reference, for
        // lengths that leave every possible remainder after the four-complex steps. 1e-12 relative: a few dozen roundings.
        var random = new Random(11);
        for (int length = 0; length <= 13; length++)
        {
            var x = new Complex[length];
            var y = new Complex[length + 2];
            for (int n = 0; n < length; n++) x[n] = TestSignals.Gaussian(random);
            for (int n = 0; n < y.Length; n++) y[n] = TestSignals.Gaussian(random);
            var expected = Complex.Zero;
            for (int n = 0; n < length; n++) expected += x[n] * Complex.Conjugate(y[n]);
            var (re, im) = SignalSummaries.CrossSum(x, y);
            Assert.Equal(expected.Real, re, 1e-12 * (1 + Math.Abs(expected.Real)));
            Assert.Equal(expected.Imaginary, im, 1e-12 * (1 + Math.Abs(expected.Imaginary)));
        }
    }
}
