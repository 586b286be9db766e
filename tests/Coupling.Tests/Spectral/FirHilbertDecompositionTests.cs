using System.Numerics;
using Coupling.Spectral;

namespace Coupling.Tests.Spectral;

public class FirHilbertDecompositionTests
{
    private static double[] Noise(int n, int seed)
    {
        var random = new Random(seed);
        return Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
    }

    private static readonly FirFilter Theta = FirDesign.BandPass(new Band("theta", 4, 8), 250);

    // The one-FFT route is, by linearity of the DFT, the two-step route on the zero-extended segment:
    // zero-phase filter [c zeros, x, zeros up to L], analytic signal of all L samples, keep c .. c + n - 1.
    [Theory]
    [InlineData(700)]
    [InlineData(2001)]
    public void One_transform_equals_filter_then_analytic_signal_of_the_zero_extended_segment(int n)
    {
        var d = new FirHilbertDecomposition(Theta);
        var x = Noise(n, 5);
        var z = new Complex[n];
        d.Apply(x, z);
        int c = Theta.DelaySamples;
        int size = 1;
        while (size < n + Theta.Length - 1) size <<= 1;
        var extended = new double[size];
        x.CopyTo(extended, c);
        var filtered = ZeroPhase.Apply(Theta, extended);
        var reference = Analytic.Hilbert(filtered);
        // Two FFT round trips of length L against one: rounding ~ eps log2(L) of the norm.
        double scale = reference.Max(v => v.Magnitude);
        for (int i = 0; i < n; i++)
            Assert.True((z[i] - reference[i + c]).Magnitude <= 1e-12 * scale, $"sample {i}");
    }

    // Against the plain two-step route on the segment alone (filter n samples, analytic signal of those n): they
    // differ through the filtered signal's spill past the ends. Beyond the padding (d >= N samples from the spill)
    // that difference is the spill seen through the Hilbert kernel's 2 / (pi d) tail; the spill is band-limited
    // above the lower stop-band edge f_low, so its running sum stays below about a half cycle of it,
    // rms * fs / (pi f_low), giving at most (2 / pi) * rms * fs / (pi f_low) / N (1.5e-2 of the rms here; about 2e-3 seen).
    [Fact]
    public void One_transform_agrees_with_the_plain_two_step_route_beyond_the_padding()
    {
        var d = new FirHilbertDecomposition(Theta);
        int n = 6 * Theta.Length;
        var x = Noise(n, 9);
        var z = new Complex[n];
        d.Apply(x, z);
        var twoStep = Analytic.Hilbert(ZeroPhase.Apply(Theta, x));
        double rms = Math.Sqrt(z.Average(v => v.Magnitude * v.Magnitude));
        double worst = 0;
        for (int i = d.PadSamples; i < n - d.PadSamples; i++) worst = Math.Max(worst, (z[i] - twoStep[i]).Magnitude);
        double bound = 2 / Math.PI * (250 / (Math.PI * Theta.StopLowHz)) / Theta.Length;
        Assert.True(worst <= bound * rms, $"largest difference {worst / rms:E3} of the rms, bound {bound:E3}");
        // Real parts are the same filter output either way, to rounding.
        for (int i = 0; i < n; i++) Assert.Equal(twoStep[i].Real, z[i].Real, 1e-12 * Math.Sqrt(n) * rms);
    }

    // Bruns (2004), J. Neurosci. Methods 137: band-pass plus Hilbert of cos(w t + p) in the pass band gives
    // A(f) exp(i (w t + p)): envelope A(f), phase the input's. Beyond the padding the analytic kernel acts on real
    // data except for its tails, which come from the sign jump of -i sgn(f) A(f) at 0 Hz and Nyquist where
    // |A| <= delta = 1e-3 (60 dB); so the deviation stays below delta (about 6e-7 seen).
    [Fact]
    public void Pass_band_cosine_becomes_a_complex_exponential_of_the_filter_gain()
    {
        const double fs = 250, hz = 6.3, phase = 1.1;
        var d = new FirHilbertDecomposition(Theta);
        int n = 5 * Theta.Length;
        var x = Enumerable.Range(0, n).Select(i => Math.Cos(2 * Math.PI * hz * i / fs + phase)).ToArray();
        var z = new Complex[n];
        d.Apply(x, z);
        double gain = Theta.Response(hz);
        double worst = 0;
        for (int i = d.PadSamples; i < n - d.PadSamples; i++)
            worst = Math.Max(worst, (z[i] - Complex.FromPolarCoordinates(gain, 2 * Math.PI * hz * i / fs + phase)).Magnitude);
        Assert.True(worst <= 1e-3, $"largest deviation {worst:E3}");
    }

    [Fact]
    public void Info_records_the_realised_filter()
    {
        var d = new FirHilbertDecomposition(Theta);
        var p = d.Info.Parameters;
        Assert.Equal("fir-hilbert", d.Info.Method);
        Assert.Equal("theta", d.Info.Band);
        Assert.Equal(Theta.Length, p["filter_taps"]);
        Assert.Equal(Theta.Length / 250.0, p["filter_length_s"], 1e-15);
        Assert.Equal(4 + Theta.TransitionHz / 2, p["pass_low_hz"], 1e-12);
        Assert.Equal(8 - Theta.TransitionHz / 2, p["pass_high_hz"], 1e-12);
        Assert.Equal(4 - Theta.TransitionHz / 2, p["stop_low_hz"], 1e-12);
        Assert.Equal(8 + Theta.TransitionHz / 2, p["stop_high_hz"], 1e-12);
        Assert.Equal(60, p["attenuation_db"]);
        Assert.True(p["measured_stopband_db"] >= 60);
        // 60 dB means deviation <= 1e-3, i.e. peak-to-peak ripple <= 20 log10(1.001 / 0.999) = 0.0174 dB.
        Assert.True(p["measured_ripple_db"] <= 20 * Math.Log10(1.001 / 0.999));
        Assert.Equal(KaiserDesign.Beta(p["design_attenuation_db"]), p["kaiser_beta"], 1e-15);
        foreach (var key in new[] { "transition_hz", "kaiser_beta" }) Assert.True(p.ContainsKey(key));
        Assert.Equal(Theta.Length, d.PadSamples);
    }
}
