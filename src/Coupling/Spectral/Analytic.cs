using System.Numerics;
using MathNet.Numerics.IntegralTransforms;

namespace Coupling.Spectral;

/// <summary>The discrete-time analytic signal by FFT.</summary>
/// <remarks>
/// Marple, S. L. (1999), "Computing the discrete-time analytic signal via FFT", IEEE Transactions on Signal
/// Processing 47(9), 2600-2603. The same definition as scipy.signal.hilbert.
/// </remarks>
public static class Analytic
{
    /// <summary>
    /// Writes the analytic signal z of <paramref name="x"/> (length n): X = DFT(x); Z[0] = X[0]; for even n
    /// Z[n/2] = X[n/2]; Z[k] = 2 X[k] for 0 &lt; k &lt; n/2; Z[k] = 0 for the negative frequencies; z = IDFT(Z).
    /// Re z equals x, Im z is the discrete Hilbert transform, and the DFT is circular (the segment is treated as one
    /// period).
    /// </summary>
    /// <param name="x">Real samples.</param>
    /// <param name="z">Receives the analytic signal, same length.</param>
    /// <remarks>Marple (1999), IEEE Trans. Signal Processing 47(9), eq. 5-6.</remarks>
    /// <exception cref="ArgumentException">Lengths differ.</exception>
    public static void Hilbert(ReadOnlySpan<double> x, Span<Complex> z)
    {
        if (x.Length != z.Length)
            throw new ArgumentException($"Output length {z.Length} differs from input length {x.Length}.", nameof(z));
        int n = x.Length;
        if (n == 0) return;
        var buffer = new Complex[n];
        for (int i = 0; i < n; i++) buffer[i] = x[i];
        Fourier.Forward(buffer, FourierOptions.Matlab);
        ApplyMask(buffer);
        Fourier.Inverse(buffer, FourierOptions.Matlab);
        buffer.CopyTo(z);
    }

    /// <summary>Array convenience for <see cref="Hilbert(ReadOnlySpan{double}, Span{Complex})"/>.</summary>
    /// <param name="x">Real samples.</param>
    public static Complex[] Hilbert(ReadOnlySpan<double> x)
    {
        var z = new Complex[x.Length];
        Hilbert(x, z);
        return z;
    }

    /// <summary>Multiplies a DFT by Marple's one-sided weights (1 at DC and even-length Nyquist, 2 above, 0 below).</summary>
    internal static void ApplyMask(Span<Complex> spectrum)
    {
        int n = spectrum.Length;
        int half = n / 2;
        int lastDoubled = n % 2 == 0 ? half - 1 : half; // (n + 1)/2 - 1 for odd n
        for (int k = 1; k <= lastDoubled; k++) spectrum[k] *= 2;
        for (int k = lastDoubled + 1 + (n % 2 == 0 ? 1 : 0); k < n; k++) spectrum[k] = Complex.Zero;
    }
}
