using System.Numerics;
using MathNet.Numerics.IntegralTransforms;

namespace Coupling.Spectral;

/// <summary>
/// Applies a symmetric odd-length FIR centred: y[i] = sum_k h[k] x[i + c - k] with c = (N - 1) / 2 and x taken as 0
/// outside the segment. The delay c of the causal filter is removed, so the result has exactly zero phase
/// (the response is the real amplitude <see cref="FirFilter.Response"/>). This is linear convolution, not
/// forward-backward filtering: the magnitude response is applied once, not squared. The ends see the zero
/// extension for c samples; the caller pads the segment (see <see cref="FirHilbertDecomposition.PadSamples"/>).
/// </summary>
/// <remarks>
/// Type I linear-phase FIR and its zero-phase form: Oppenheim, A. V. and Schafer, R. W., Discrete-Time Signal
/// Processing, section 5.7. Long filters go through the FFT (MathNet.Numerics Fourier, power-of-two length at
/// least n + N - 1, so no circular wrap), short ones are summed directly; both compute the same sum, equal to
/// rounding (about 1e-15 of the largest output times log2 of the transform length).
/// </remarks>
public static class ZeroPhase
{
    /// <summary>Filters up to this many taps are applied by direct summation; longer ones by FFT.</summary>
    public const int DirectMaximumTaps = 64;

    /// <summary>Writes the centred (zero-phase) filtering of <paramref name="x"/> to <paramref name="y"/> (same length).</summary>
    /// <param name="filter">The filter.</param>
    /// <param name="x">Input samples.</param>
    /// <param name="y">Receives the output, same length as <paramref name="x"/>.</param>
    /// <exception cref="ArgumentException">Lengths differ.</exception>
    public static void Apply(FirFilter filter, ReadOnlySpan<double> x, Span<double> y)
    {
        if (filter.Length <= DirectMaximumTaps) ApplyDirect(filter, x, y);
        else ApplyByFft(filter, x, y);
    }

    /// <summary>Array convenience for <see cref="Apply(FirFilter, ReadOnlySpan{double}, Span{double})"/>.</summary>
    /// <param name="filter">The filter.</param>
    /// <param name="x">Input samples.</param>
    public static double[] Apply(FirFilter filter, ReadOnlySpan<double> x)
    {
        var y = new double[x.Length];
        Apply(filter, x, y);
        return y;
    }

    internal static void ApplyDirect(FirFilter filter, ReadOnlySpan<double> x, Span<double> y)
    {
        CheckLengths(x, y);
        ReadOnlySpan<double> h = filter.Taps.AsSpan();
        int c = filter.DelaySamples, n = x.Length;
        for (int i = 0; i < n; i++)
        {
            // x index j = i + c - k must lie in [0, n): k in [i + c - n + 1, i + c].
            int kLow = Math.Max(0, i + c - n + 1), kHigh = Math.Min(h.Length - 1, i + c);
            double sum = 0;
            for (int k = kLow; k <= kHigh; k++) sum += h[k] * x[i + c - k];
            y[i] = sum;
        }
    }

    internal static void ApplyByFft(FirFilter filter, ReadOnlySpan<double> x, Span<double> y)
    {
        CheckLengths(x, y);
        int n = x.Length;
        if (n == 0) return;
        ReadOnlySpan<double> h = filter.Taps.AsSpan();
        int size = SpectralChecks.PowerOfTwoAtLeast(n + h.Length - 1);
        var signal = new Complex[size];
        var kernel = new Complex[size];
        for (int i = 0; i < n; i++) signal[i] = x[i];
        for (int k = 0; k < h.Length; k++) kernel[k] = h[k];
        Fourier.Forward(signal, FourierOptions.Matlab);
        Fourier.Forward(kernel, FourierOptions.Matlab);
        for (int k = 0; k < size; k++) signal[k] *= kernel[k];
        Fourier.Inverse(signal, FourierOptions.Matlab);
        int c = filter.DelaySamples;
        for (int i = 0; i < n; i++) y[i] = signal[i + c].Real;
    }

    private static void CheckLengths(ReadOnlySpan<double> x, Span<double> y)
    {
        if (x.Length != y.Length)
            throw new ArgumentException($"Output length {y.Length} differs from input length {x.Length}.", nameof(y));
    }
}
