using Coupling.Simulation;
using MathNet.Numerics;
using MathNet.Numerics.Random;

namespace Coupling.Tests.Simulation;

[Collection(ScenarioCollection.Name)]
public sealed class BackgroundSpectrumTests(ScenarioFixture fixture)
{
    private const double SampleRate = 250.0;

    [Theory]
    [InlineData(1.0)]
    [InlineData(1.5)]
    public void Shaped_noise_has_the_stated_power_law_slope(double exponent)
    {
        int m = 1 << 17;
        double[] gain = SpectralShaping.Gain(m, SampleRate, SpectralShaping.PowerLawShape(exponent, 1.0));
        var signal = SpectralShaping.ToSignals([SpectralShaping.RandomSpectrum(new Xoshiro256StarStar(3), gain)], m)[0];
        var (slope, tolerance) = FitSlope(signal, 512, 4.0, 100.0);
        Assert.True(Math.Abs(slope + exponent) < tolerance, $"slope {slope:0.000}, expected {-exponent} ± {tolerance:0.000}");
    }

    [Fact]
    public void Shaped_noise_has_unit_variance()
    {
        // Parseval: Σ g_k² = m makes the expected variance 1; for 2^17 samples of a process whose power sits mostly at low
        // frequencies the variance estimate has a few per cent spread, so 10 % is allowed.
        int m = 1 << 17;
        double[] gain = SpectralShaping.Gain(m, SampleRate, SpectralShaping.PowerLawShape(1.0, 1.0));
        var signal = SpectralShaping.ToSignals([SpectralShaping.RandomSpectrum(new Xoshiro256StarStar(4), gain)], m)[0];
        double variance = signal.Select(x => x * x).Average();
        Assert.InRange(variance, 0.9, 1.1);
    }

    [Fact]
    public void A_recording_channel_has_the_stated_background_slope_above_its_source_band()
    {
        // L1 carries only a 5-7 Hz source on top of its background, so 10-110 Hz is background alone.
        var (slope, tolerance) = FitSlope(fixture.Channel("L1"), 512, 10.0, 110.0);
        double exponent = fixture.Scenario.Truth.BackgroundExponent;
        Assert.True(Math.Abs(slope + exponent) < tolerance, $"slope {slope:0.000}, expected {-exponent} ± {tolerance:0.000}");
    }

    /// <summary>
    /// Least-squares line (MathNet Fit.Line) through log10 power against log10 frequency of a Welch spectrum, with the
    /// allowed deviation of its slope.
    /// </summary>
    /// <remarks>
    /// The mean of K periodograms is chi-square with 2K degrees of freedom per bin, so its natural log has standard
    /// deviation about 1/sqrt(K) (Welch 1967, IEEE Trans. Audio Electroacoust. 15:70-73). Hann-windowed neighbours are
    /// correlated; counting one independent estimate per 1.5 bins (the window's equivalent noise bandwidth, Harris 1978,
    /// Proc. IEEE 66:51-83) inflates the slope's standard error by sqrt(1.5). The tolerance is 5 standard errors plus
    /// 0.01 for the Hann window's smoothing bias on a power law, which at 8 or more bins from 0 Hz is below 1 % in power.
    /// </remarks>
    private static (double Slope, double Tolerance) FitSlope(double[] signal, int length, double lowHz, double highHz)
    {
        var starts = SegmentSpectra.Consecutive(signal.Length, length);
        var power = SegmentSpectra.Power(signal, starts, length);
        double df = SampleRate / length;
        int kLow = (int)Math.Ceiling(lowHz / df), kHigh = (int)Math.Floor(highHz / df);
        var x = Enumerable.Range(kLow, kHigh - kLow + 1).Select(k => Math.Log10(k * df)).ToArray();
        var y = Enumerable.Range(kLow, kHigh - kLow + 1).Select(k => Math.Log10(power[k])).ToArray();
        var (_, slope) = Fit.Line(x, y);
        double mean = x.Average();
        double sxx = x.Sum(v => (v - mean) * (v - mean));
        double sigmaY = Math.Log10(Math.E) / Math.Sqrt(starts.Length);
        double standardError = sigmaY * Math.Sqrt(1.5) / Math.Sqrt(sxx);
        return (slope, 5 * standardError + 0.01);
    }
}
