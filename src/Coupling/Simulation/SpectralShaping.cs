using System.Numerics;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.IntegralTransforms;

namespace Coupling.Simulation;

/// <summary>
/// Coloured Gaussian noise by shaping the spectrum of white noise: white samples are transformed with the FFT,
/// every bin is multiplied by a real, even gain g(f), and the result is transformed back. The gain is scaled so
/// that the output has unit expected variance whatever its shape.
/// </summary>
/// <remarks>
/// For white noise of unit variance and length M, E|X_k|² = M; after the gain and the inverse transform
/// (scaled by 1/M) the expected output variance is Σ g_k² / M, so the gain is multiplied by sqrt(M / Σ g_k²)
/// (Parseval). A delay τ is applied exactly in the frequency domain as the factor exp(-i·2π·f·τ) with signed
/// frequency f, which keeps the spectrum Hermitian and the output real (common practice). The transform length is
/// a power of two at least as long as the signal, so the circular wrap of the delay falls outside the kept samples.
/// </remarks>
internal static class SpectralShaping
{
    /// <summary>FFT length used for a signal of <paramref name="sampleCount"/> samples: the next power of two.</summary>
    public static int TransformLength(int sampleCount) => (int)BitOperations.RoundUpToPowerOf2((uint)Math.Max(sampleCount, 2));

    /// <summary>Signed frequency in Hz of FFT bin k of a length-m transform.</summary>
    public static double BinFrequency(int k, int m, double sampleRate) => (k <= m / 2 ? k : k - m) * sampleRate / m;

    /// <summary>
    /// Draws m white Gaussian samples from <paramref name="rng"/>, transforms them and applies the normalised gain.
    /// The returned spectrum has unit expected variance once inverted.
    /// </summary>
    public static Complex[] ShapedSpectrum(Random rng, int m, double sampleRate, Func<double, double> gain)
    {
        var white = new double[m];
        Normal.Samples(rng, white, 0.0, 1.0);
        var spectrum = new Complex[m];
        for (int i = 0; i < m; i++) spectrum[i] = new Complex(white[i], 0.0);
        Fourier.Forward(spectrum, FourierOptions.Matlab);
        double sumSquares = 0.0;
        var g = new double[m];
        for (int k = 0; k < m; k++)
        {
            g[k] = gain(Math.Abs(BinFrequency(k, m, sampleRate)));
            sumSquares += g[k] * g[k];
        }
        double scale = sumSquares > 0 ? Math.Sqrt(m / sumSquares) : 0.0;
        for (int k = 0; k < m; k++) spectrum[k] *= g[k] * scale;
        return spectrum;
    }

    /// <summary>
    /// Inverse-transforms a copy of <paramref name="spectrum"/> delayed by <paramref name="delaySeconds"/> and
    /// returns the first <paramref name="sampleCount"/> samples of its real part, multiplied by <paramref name="amplitude"/>.
    /// </summary>
    public static double[] ToSignal(Complex[] spectrum, double sampleRate, int sampleCount, double amplitude, double delaySeconds = 0.0)
    {
        int m = spectrum.Length;
        var work = (Complex[])spectrum.Clone();
        if (delaySeconds != 0.0)
        {
            for (int k = 0; k < m; k++)
                work[k] *= Complex.FromPolarCoordinates(1.0, -2.0 * Math.PI * BinFrequency(k, m, sampleRate) * delaySeconds);
            work[m / 2] = Complex.Zero; // the Nyquist bin has no signed partner; drop it so the output stays real
        }
        Fourier.Inverse(work, FourierOptions.Matlab);
        var result = new double[sampleCount];
        for (int i = 0; i < sampleCount; i++) result[i] = amplitude * work[i].Real;
        return result;
    }

    /// <summary>
    /// Expected fraction of the output variance that falls in [low, high] Hz for the given gain on a length-m grid
    /// (Σ of g² over the band's bins, both signs of frequency, over Σ g² over all bins).
    /// </summary>
    public static double BandFraction(int m, double sampleRate, Func<double, double> gain, double low, double high)
    {
        double total = 0.0, inBand = 0.0;
        for (int k = 0; k < m; k++)
        {
            double f = Math.Abs(BinFrequency(k, m, sampleRate));
            double g2 = gain(f) * gain(f);
            total += g2;
            if (f >= low && f <= high) inBand += g2;
        }
        return total > 0 ? inBand / total : 0.0;
    }

    /// <summary>
    /// Gain of a 1/f^alpha power spectrum: amplitude f^(-alpha/2), held at its value at <paramref name="floorHz"/>
    /// below that frequency, and zero at 0 Hz (no offset).
    /// </summary>
    public static Func<double, double> PowerLawGain(double exponent, double floorHz) =>
        f => f == 0.0 ? 0.0 : Math.Pow(Math.Max(f, floorHz), -0.5 * exponent);

    /// <summary>
    /// Gain of a band-limited source: 1 inside [low + taper, high - taper] Hz, raised-cosine flanks of width
    /// <paramref name="taper"/> down to 0 at <paramref name="low"/> and <paramref name="high"/>, 0 outside.
    /// </summary>
    public static Func<double, double> BandGain(double low, double high, double taper) => f =>
    {
        if (f <= low || f >= high) return 0.0;
        if (f < low + taper) return 0.5 - 0.5 * Math.Cos(Math.PI * (f - low) / taper);
        if (f > high - taper) return 0.5 - 0.5 * Math.Cos(Math.PI * (high - f) / taper);
        return 1.0;
    };
}
