using System.Numerics;
using Coupling.Spectral;
using MathNet.Numerics.IntegralTransforms;

namespace Coupling.Tests.Spectral;

public class MorletTests
{
    [Theory]
    [InlineData(10.0, 7.0, 250.0)]
    [InlineData(40.0, 3.0, 1000.0)]
    [InlineData(6.0, 1.5, 128.0)]
    public void Morlet_wavelet_has_unit_energy(double hz, double cycles, double fs)
    {
        var w = MorletWavelet.Create(hz, cycles, fs);
        Assert.Equal(1.0, w.Samples.Sum(v => v.Magnitude * v.Magnitude), 1e-13);
    }

    // Tallon-Baudry et al. (1996): the Fourier transform of exp(-t^2 / (2 st^2)) exp(2 pi i f t) is a Gaussian in
    // frequency centred at f with sd sf = 1 / (2 pi st) = f / cycles. Fitted here as a parabola in log |FFT| of the
    // zero-padded wavelet over f +- 2 sf (least squares): log G = a - (f' - m)^2 / (2 s^2). The cut at +-5 st
    // perturbs the spectrum by about erfc(5 / sqrt 2) = 6e-7 of its peak, 4e-6 of the smallest fitted value
    // (exp(-2) of the peak), so centre and width hold to ~1e-5 of sf and the log residuals to ~1e-5.
    [Theory]
    [InlineData(10.0, 7.0, 250.0)]
    [InlineData(40.0, 5.0, 1000.0)]
    [InlineData(6.0, 3.0, 128.0)]
    public void Morlet_spectrum_is_a_gaussian_at_the_centre_with_sd_f_over_cycles(double hz, double cycles, double fs)
    {
        var w = MorletWavelet.Create(hz, cycles, fs);
        double sf = hz / cycles;
        Assert.Equal(sf, w.FrequencySd, 1e-12);
        Assert.Equal(1 / (2 * Math.PI * w.FrequencySd), w.TimeSd, 1e-15);
        int size = 1;
        while (fs / size > sf / 100) size <<= 1;
        var spectrum = new Complex[size];
        for (int k = 0; k < w.Length; k++) spectrum[k] = w.Samples[k];
        Fourier.Forward(spectrum, FourierOptions.Matlab);
        var points = new List<(double u, double y)>();
        for (int k = 0; k <= size / 2; k++)
        {
            double u = (k * fs / size - hz) / sf; // in units of sf
            if (Math.Abs(u) <= 2) points.Add((u, Math.Log(spectrum[k].Magnitude)));
        }
        // Normal equations of y = c0 + c1 u + c2 u^2.
        var m = new double[3, 3];
        var r = new double[3];
        foreach (var (u, y) in points)
            for (int i = 0; i < 3; i++)
            {
                r[i] += y * Math.Pow(u, i);
                for (int j = 0; j < 3; j++) m[i, j] += Math.Pow(u, i + j);
            }
        var c = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfArray(m)
            .Solve(MathNet.Numerics.LinearAlgebra.Vector<double>.Build.DenseOfArray(r));
        double width = Math.Sqrt(-1 / (2 * c[2])) * sf;
        double centre = hz - c[1] / (2 * c[2]) * sf;
        Assert.Equal(hz, centre, 1e-5 * sf);
        Assert.Equal(sf, width, 1e-5 * sf);
        foreach (var (u, y) in points) Assert.Equal(c[0] + c[1] * u + c[2] * u * u, y, 1e-5);
    }

    [Fact]
    public void Wavelet_from_a_time_sd_has_the_matching_cycles_and_support_of_five_sd()
    {
        var w = MorletWavelet.FromTimeSd(20, 0.05, 500);
        Assert.Equal(2 * Math.PI * 20 * 0.05, w.Cycles, 1e-12);
        Assert.Equal((int)Math.Ceiling(5 * 0.05 * 500), w.HalfLength);
        Assert.Equal(2 * w.HalfLength + 1, w.Samples.Length);
    }

    [Fact]
    public void Default_cycles_make_the_spectral_sd_the_band_half_width()
    {
        var band = new Band("alpha", 8, 12);
        var d = MorletDecomposition.Create(band, 250);
        Assert.Equal(2.0, d.Wavelet.FrequencySd, 1e-12);
        Assert.Equal(10.0, d.Wavelet.CentreHz);
        Assert.Equal(5.0, d.Info.Parameters["cycles"], 1e-12);
        Assert.Equal("morlet", d.Info.Method);
        Assert.Equal(d.Wavelet.Length, d.Info.Parameters["support_samples"]);
        Assert.Equal(d.Wavelet.HalfLength, d.PadSamples);
    }

    // Slow, obviously correct reference: w[i] = sum_k psi[k] x[i - k], k = -K..K, x zero outside.
    [Theory]
    [InlineData(300)]
    [InlineData(77)]
    public void Fft_convolution_equals_direct_centred_convolution(int n)
    {
        var d = MorletDecomposition.Create(new Band("theta", 4, 8), 250, 4);
        var random = new Random(11);
        var x = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
        var z = new Complex[n];
        d.Apply(x, z);
        int half = d.Wavelet.HalfLength;
        double scale = 0;
        var reference = new Complex[n];
        for (int i = 0; i < n; i++)
        {
            Complex sum = 0;
            for (int k = -half; k <= half; k++)
                if (i - k >= 0 && i - k < n) sum += d.Wavelet.Samples[k + half] * x[i - k];
            reference[i] = sum;
            scale = Math.Max(scale, sum.Magnitude);
        }
        for (int i = 0; i < n; i++) Assert.True((z[i] - reference[i]).Magnitude <= 1e-12 * scale, $"sample {i}");
    }

    // Bruns (2004): the wavelet route gives the phase of a sinusoid at the centre frequency unchanged, since the
    // envelope is symmetric (real spectrum at f); the mirror term at -f is exp(-2 cycles^2) = e^-50 for the untruncated wavelet.
    [Fact]
    public void Wavelet_output_of_a_centre_frequency_cosine_keeps_its_phase()
    {
        const double fs = 250, hz = 10, phase = -0.8;
        var d = MorletDecomposition.Create(new Band("alpha", 8, 12), fs);
        int n = 1000;
        var x = Enumerable.Range(0, n).Select(i => Math.Cos(2 * Math.PI * hz * i / fs + phase)).ToArray();
        var z = new Complex[n];
        d.Apply(x, z);
        // w[i] = (1/2) Psi(f) exp(i (w i + p)) + (1/2) Psi(-f) exp(-i (w i + p)) with Psi(f) = sum_k |psi[k]| real.
        // The mirror term Psi(-f) = sum_k psi[k] exp(i w k) is set by the cut at +-5 st (~1e-7 of Psi(f) here).
        double gain = 0.5 * d.Wavelet.Samples.Sum(v => v.Magnitude);
        double omega = 2 * Math.PI * hz / fs;
        int half = d.Wavelet.HalfLength;
        double mirror = 0.5 * Enumerable.Range(-half, 2 * half + 1)
            .Aggregate(Complex.Zero, (sum, k) => sum + d.Wavelet.Samples[k + half] * Complex.FromPolarCoordinates(1, omega * k)).Magnitude;
        Assert.True(mirror < 1e-6 * gain);
        for (int i = d.PadSamples; i < n - d.PadSamples; i++)
        {
            var expected = Complex.FromPolarCoordinates(gain, omega * i + phase);
            Assert.True((z[i] - expected).Magnitude <= mirror + 1e-12 * gain, $"sample {i}: {z[i]} vs {expected}");
        }
    }
}
