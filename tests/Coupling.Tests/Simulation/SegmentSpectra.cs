using System.Numerics;
using MathNet.Numerics.IntegralTransforms;

namespace Coupling.Tests.Simulation;

/// <summary>
/// Direct segment-averaged spectra for checking the simulator: each segment has its mean removed, is multiplied by a
/// periodic Hann window and transformed with the MathNet FFT; auto- and cross-spectra are averaged over segments
/// (Welch 1967, IEEE Trans. Audio Electroacoust. 15:70-73, without overlap). Cross-spectrum convention
/// S_ab = X_a·conj(X_b), so a delay τ of b behind a gives angle +2π·f·τ.
/// </summary>
internal static class SegmentSpectra
{
    public static Complex[] Transform(double[] x, int start, int length)
    {
        double mean = 0;
        for (int i = 0; i < length; i++) mean += x[start + i];
        mean /= length;
        var z = new Complex[length];
        for (int i = 0; i < length; i++)
        {
            double w = 0.5 - 0.5 * Math.Cos(2 * Math.PI * i / length);
            z[i] = new Complex((x[start + i] - mean) * w, 0);
        }
        Fourier.Forward(z, FourierOptions.Matlab);
        return z;
    }

    /// <summary>Average of X_a[k]·conj(X_b[k]) over the segments, for bins 0..length/2.</summary>
    public static Complex[] Cross(double[] a, double[] b, IReadOnlyList<int> starts, int length)
    {
        var sum = new Complex[length / 2 + 1];
        foreach (int s in starts)
        {
            var xa = Transform(a, s, length);
            var xb = Transform(b, s, length);
            for (int k = 0; k < sum.Length; k++) sum[k] += xa[k] * Complex.Conjugate(xb[k]);
        }
        for (int k = 0; k < sum.Length; k++) sum[k] /= starts.Count;
        return sum;
    }

    /// <summary>Average |X[k]|² over the segments, for bins 0..length/2.</summary>
    public static double[] Power(double[] x, IReadOnlyList<int> starts, int length)
    {
        var cross = Cross(x, x, starts, length);
        return cross.Select(c => c.Real).ToArray();
    }

    /// <summary>Back-to-back segment starts covering the signal.</summary>
    public static int[] Consecutive(int signalLength, int length) =>
        Enumerable.Range(0, signalLength / length).Select(i => i * length).ToArray();

    /// <summary>Complex coherency summed over bins [kLow, kHigh]: ΣS_ab / sqrt(ΣS_aa·ΣS_bb).</summary>
    public static Complex BandCoherency(double[] a, double[] b, IReadOnlyList<int> starts, int length, int kLow, int kHigh)
    {
        var sab = Cross(a, b, starts, length);
        var saa = Power(a, starts, length);
        var sbb = Power(b, starts, length);
        Complex s = 0; double pa = 0, pb = 0;
        for (int k = kLow; k <= kHigh; k++) { s += sab[k]; pa += saa[k]; pb += sbb[k]; }
        return s / Math.Sqrt(pa * pb);
    }
}
