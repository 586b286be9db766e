using System.Numerics;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.IntegralTransforms;

namespace Coupling.Simulation;

/// <summary>
/// Coloured Gaussian noise by shaping the spectrum of white noise: every bin of the discrete Fourier transform of
/// white Gaussian noise is multiplied by a real, even gain g(f), and the result is transformed back (MathNet FFT).
/// Gains are normalised so that the output has unit expected variance whatever their shape.
/// </summary>
/// <remarks>
/// <para>The DFT of m independent unit-variance Gaussian samples has, for 0 &lt; k &lt; m/2, independent circular complex
/// Gaussian bins with E|X_k|² = m, X_(m−k) = conj(X_k), and real Gaussian bins of variance m at k = 0 and k = m/2
/// (common practice). The bins are drawn directly in that distribution, which is the same as transforming drawn
/// white noise and saves the forward transform.</para>
/// <para>After the gain and the inverse transform (scaled by 1/m) the expected output variance is Σ g_k² / m
/// (Parseval), so the gain is multiplied by sqrt(m / Σ g_k²). A delay τ is applied exactly in the frequency domain as
/// the factor exp(−i·2π·f·τ) with signed frequency f, which keeps the spectrum Hermitian and the output real (shift
/// theorem). Two Hermitian spectra A and B are inverted in one complex transform of A + iB, whose real and imaginary
/// parts are the two real signals. The transform length is a power of two at least as long as the signal, so the
/// circular wrap of a delay falls outside the kept samples.</para>
/// </remarks>
internal static class SpectralShaping
{
    /// <summary>FFT length used for a signal of <paramref name="sampleCount"/> samples: the next power of two.</summary>
    public static int TransformLength(int sampleCount) => (int)BitOperations.RoundUpToPowerOf2((uint)Math.Max(sampleCount, 2));

    /// <summary>Signed frequency in Hz of FFT bin k of a length-m transform.</summary>
    public static double BinFrequency(int k, int m, double sampleRate) => (k <= m / 2 ? k : k - m) * sampleRate / m;

    /// <summary>
    /// Gain per bin of a length-m transform for the given shape |f| → g, scaled so that Σ g_k² = m
    /// (unit expected output variance). An all-zero shape gives all zeros.
    /// </summary>
    public static double[] Gain(int m, double sampleRate, Func<double, double> shape)
    {
        var g = new double[m];
        double sumSquares = 0.0;
        for (int k = 0; k <= m / 2; k++)
        {
            g[k] = shape(Math.Abs(BinFrequency(k, m, sampleRate)));
            if (k > 0 && k < m / 2) g[m - k] = g[k];
        }
        for (int k = 0; k < m; k++) sumSquares += g[k] * g[k];
        double scale = sumSquares > 0 ? Math.Sqrt(m / sumSquares) : 0.0;
        for (int k = 0; k < m; k++) g[k] *= scale;
        return g;
    }

    /// <summary>
    /// The spectrum of m white Gaussian samples of unit variance (drawn directly, see remarks) multiplied by
    /// <paramref name="gain"/>; m is the gain's length.
    /// </summary>
    public static Complex[] RandomSpectrum(Random rng, double[] gain)
    {
        int m = gain.Length;
        var normals = new double[m];
        Normal.Samples(rng, normals, 0.0, 1.0);
        var spectrum = new Complex[m];
        double full = Math.Sqrt(m), half = Math.Sqrt(0.5 * m);
        spectrum[0] = gain[0] * full * normals[0];
        spectrum[m / 2] = gain[m / 2] * full * normals[1];
        for (int k = 1; k < m / 2; k++)
        {
            var x = new Complex(half * normals[2 * k], half * normals[2 * k + 1]) * gain[k];
            spectrum[k] = x;
            spectrum[m - k] = Complex.Conjugate(x);
        }
        return spectrum;
    }

    /// <summary>A copy of <paramref name="spectrum"/> delayed by <paramref name="delaySeconds"/>; the Nyquist bin, which has no signed partner, is set to 0.</summary>
    public static Complex[] Delayed(Complex[] spectrum, double sampleRate, double delaySeconds)
    {
        int m = spectrum.Length;
        var result = new Complex[m];
        for (int k = 0; k < m; k++)
        {
            if (spectrum[k] == Complex.Zero) continue;
            result[k] = spectrum[k] * Complex.FromPolarCoordinates(1.0, -2.0 * Math.PI * BinFrequency(k, m, sampleRate) * delaySeconds);
        }
        result[m / 2] = Complex.Zero;
        return result;
    }

    /// <summary>
    /// Inverse-transforms Hermitian spectra (all of one length) two at a time and returns the first
    /// <paramref name="sampleCount"/> samples of each real signal, in input order.
    /// </summary>
    public static double[][] ToSignals(IReadOnlyList<Complex[]> spectra, int sampleCount)
    {
        var result = new double[spectra.Count][];
        for (int p = 0; p < spectra.Count; p += 2)
        {
            var a = spectra[p];
            var b = p + 1 < spectra.Count ? spectra[p + 1] : null;
            var work = new Complex[a.Length];
            for (int k = 0; k < a.Length; k++)
                work[k] = b is null ? a[k] : a[k] + Complex.ImaginaryOne * b[k];
            Fourier.Inverse(work, FourierOptions.Matlab);
            result[p] = new double[sampleCount];
            for (int i = 0; i < sampleCount; i++) result[p][i] = work[i].Real;
            if (b is null) continue;
            result[p + 1] = new double[sampleCount];
            for (int i = 0; i < sampleCount; i++) result[p + 1][i] = work[i].Imaginary;
        }
        return result;
    }

    /// <summary>
    /// Expected fraction of the output variance that falls in [low, high] Hz for the given gain
    /// (Σ of g² over the band's bins, both signs of frequency, over Σ g² over all bins).
    /// </summary>
    public static double BandFraction(double[] gain, double sampleRate, double low, double high)
    {
        int m = gain.Length;
        double total = 0.0, inBand = 0.0;
        for (int k = 0; k < m; k++)
        {
            double f = Math.Abs(BinFrequency(k, m, sampleRate));
            double g2 = gain[k] * gain[k];
            total += g2;
            if (f >= low && f <= high) inBand += g2;
        }
        return total > 0 ? inBand / total : 0.0;
    }

    /// <summary>
    /// Shape of a 1/f^alpha power spectrum: amplitude f^(−alpha/2), held at its value at <paramref name="floorHz"/>
    /// below that frequency, and zero at 0 Hz (no offset).
    /// </summary>
    public static Func<double, double> PowerLawShape(double exponent, double floorHz) =>
        f => f == 0.0 ? 0.0 : Math.Pow(Math.Max(f, floorHz), -0.5 * exponent);

    /// <summary>
    /// Shape of a band-limited source: 1 inside [low + taper, high − taper] Hz, raised-cosine flanks of width
    /// <paramref name="taper"/> down to 0 at <paramref name="low"/> and <paramref name="high"/>, 0 outside.
    /// </summary>
    public static Func<double, double> BandShape(double low, double high, double taper) => f =>
    {
        if (f <= low || f >= high) return 0.0;
        if (f < low + taper) return 0.5 - 0.5 * Math.Cos(Math.PI * (f - low) / taper);
        if (f > high - taper) return 0.5 - 0.5 * Math.Cos(Math.PI * (high - f) / taper);
        return 1.0;
    };
}
