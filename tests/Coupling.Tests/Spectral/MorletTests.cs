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

    // The complete (zero-mean) Morlet wavelet psi(t) = A (exp(2 pi i f t) - kappa) exp(-t^2 / (2 st^2)) has the
    // Fourier transform Psi(f') = A st sqrt(2 pi) [exp(-(f' - f)^2 / (2 sf^2)) - kappa exp(-f'^2 / (2 sf^2))] with
    // sf = 1 / (2 pi st) = f / cycles and kappa = exp(-cycles^2 / 2) (Addison 2002, The Illustrated Wavelet Transform
    // Handbook, section 2.3, from memory; Tallon-Baudry et al. 1996 for the Gaussian term). Unit energy sets
    // A^2 st sqrt(pi) (1 - 2 kappa exp(-cycles^2 / 4) + kappa^2) fs = 1 (the integral of |psi|^2, times fs for the sum of
    // samples). The DFT of the samples is fs Psi(f') up to the cut at +-5 st (about erfc(5 / sqrt 2) = 6e-7 of the peak)
    // and aliasing (a Gaussian tail at fs away, below 1e-30 here): checked on a fine grid from 0 Hz to f + 4 sf to
    // 1e-5 of the peak.
    [Theory]
    [InlineData(10.0, 7.0, 250.0)]
    [InlineData(40.0, 5.0, 1000.0)]
    [InlineData(6.0, 3.0, 128.0)]
    [InlineData(5.0, 2.0, 250.0)]
    public void Morlet_spectrum_matches_the_analytic_spectrum_of_the_complete_morlet_wavelet(double hz, double cycles, double fs)
    {
        var w = MorletWavelet.Create(hz, cycles, fs);
        double sf = hz / cycles, st = w.TimeSd;
        Assert.Equal(sf, w.FrequencySd, 1e-12);
        Assert.Equal(1 / (2 * Math.PI * w.FrequencySd), st, 1e-15);
        double kappa = Math.Exp(-cycles * cycles / 2);
        // The sampled kappa differs from the continuous one by the cut at +-5 st, where the envelope is exp(-12.5) =
        // 3.7e-6 of its peak and about erfc(5 / sqrt 2) = 6e-7 of its mass lies beyond: 1e-6 absolute.
        Assert.Equal(kappa, w.DcCorrection, 1e-6);
        double amplitude = 1 / Math.Sqrt(st * Math.Sqrt(Math.PI) * (1 - 2 * kappa * Math.Exp(-cycles * cycles / 4) + kappa * kappa) * fs);
        double peak = fs * amplitude * st * Math.Sqrt(2 * Math.PI);
        for (double f = 0; f <= hz + 4 * sf; f += sf / 16)
        {
            double expected = peak * (Math.Exp(-(f - hz) * (f - hz) / (2 * sf * sf)) - kappa * Math.Exp(-f * f / (2 * sf * sf)));
            var dft = Complex.Zero;
            for (int k = -w.HalfLength; k <= w.HalfLength; k++)
                dft += w.Samples[k + w.HalfLength] * Complex.FromPolarCoordinates(1, -2 * Math.PI * f * k / fs);
            Assert.True(Math.Abs(dft.Real - expected) <= 1e-5 * peak && Math.Abs(dft.Imaginary) <= 1e-9 * peak,
                $"{f} Hz: {dft} against {expected}");
        }
    }

    [Theory]
    [InlineData(10.0, 7.0, 250.0)]
    [InlineData(6.0, 3.0, 128.0)]
    [InlineData(5.0, 2.0, 250.0)]
    public void Morlet_wavelet_has_zero_mean(double hz, double cycles, double fs)
    {
        // Admissibility: the samples sum to zero up to rounding (a few ulps of the largest sample per term).
        var w = MorletWavelet.Create(hz, cycles, fs);
        var sum = w.Samples.Aggregate(Complex.Zero, (a, v) => a + v);
        Assert.True(sum.Magnitude <= 1e-14 * w.Samples.Sum(v => v.Magnitude), $"sum {sum}");
    }

    [Fact]
    public void A_constant_offset_of_1000_gives_no_more_response_than_nothing()
    {
        // Unit-variance noise with and without an offset of 1000, theta band at 3 cycles (where the Gaussian spectrum
        // alone would keep exp(-4.5) = 0.011 of its peak at 0 Hz): the outputs agree everywhere, edges included, to
        // rounding of the offset (1000 x 1e-15 x the wavelet's gain sum_k |psi[k]|, a few times over).
        var d = MorletDecomposition.Create(new Band("theta", 4, 8), 250, 3);
        var random = new Random(3);
        int n = 400;
        var noise = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
        var offset = noise.Select(v => v + 1000).ToArray();
        var constant = Enumerable.Repeat(1000.0, n).ToArray();
        var a = new Complex[n];
        var b = new Complex[n];
        var c = new Complex[n];
        d.Apply(noise, a);
        d.Apply(offset, b);
        d.Apply(constant, c);
        double gain = d.Wavelet.Samples.Sum(v => v.Magnitude), rounding = 1000 * 1e-14 * gain;
        for (int i = 0; i < n; i++)
        {
            Assert.True((a[i] - b[i]).Magnitude <= rounding, $"sample {i}: {a[i]} vs {b[i]}");
            Assert.True(c[i].Magnitude <= rounding, $"sample {i}: {c[i]}");
        }
        Assert.Equal(1.0, d.Info.Parameters["segment_mean_removed"]);
        Assert.Equal(d.Wavelet.DcCorrection, d.Info.Parameters["dc_correction"]);
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

    // Slow, obviously correct reference: w[i] = sum_k psi[k] y[i - k], k = -K..K, y = x - mean(x), zero outside.
    [Theory]
    [InlineData(300)]
    [InlineData(77)]
    public void Fft_convolution_equals_direct_centred_convolution(int n)
    {
        var d = MorletDecomposition.Create(new Band("theta", 4, 8), 250, 4);
        var random = new Random(11);
        var x = Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5 + 3).ToArray();
        var z = new Complex[n];
        d.Apply(x, z);
        double mean = x.Average();
        x = x.Select(v => v - mean).ToArray();
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
        // w[i] = (1/2) Psi(f) exp(i (w i + p)) + (1/2) Psi(-f) exp(-i (w i + p)) with Psi(f) = sum_k psi[k] exp(-i w k),
        // real because the envelope is even. The mirror term Psi(-f) = sum_k psi[k] exp(i w k) is set by the cut at
        // +-5 st and the zero-mean term (~1e-7 of Psi(f) here). The 1000 samples hold 25 whole periods, so the cosine's
        // mean, removed first, is 0 up to rounding.
        double omega = 2 * Math.PI * hz / fs;
        int half = d.Wavelet.HalfLength;
        double gain = 0.5 * Enumerable.Range(-half, 2 * half + 1)
            .Aggregate(Complex.Zero, (sum, k) => sum + d.Wavelet.Samples[k + half] * Complex.FromPolarCoordinates(1, -omega * k)).Real;
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
