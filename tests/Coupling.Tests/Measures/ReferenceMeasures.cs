using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;

namespace Coupling.Tests.Measures;

/// <summary>
/// Slow, direct implementations of every measure, one pair and one time point at a time, written straight from the
/// published formulas (see PairwiseKernels' remarks for the sources), to check the all-pairs kernels against.
/// </summary>
internal static class ReferenceMeasures
{
    public static double Value(Measure measure, NarrowbandSet set, int a, int b, int[] perm)
    {
        switch (measure)
        {
            case Measure.Aec:
                return FisherMean(Enumerable.Range(0, set.TrialCount).Select(n =>
                    Pearson(Envelope(set, a, n), Envelope(set, b, perm[n]))));
            case Measure.AecOrth:
                return FisherMean(Enumerable.Range(0, set.TrialCount).Select(n => OrthogonalizedR(set, a, b, n, perm[n])));
            default:
                double sum = 0;
                for (int t = 0; t < set.TimeCount; t++) sum += PerTimePoint(measure, set, t, a, b, perm);
                return sum / set.TimeCount;
        }
    }

    public static Complex Z(NarrowbandSet set, int t, int c, int n) => set.Data[(t * set.ChannelCount + c) * set.TrialCount + n];

    public static double PerTimePoint(Measure measure, NarrowbandSet set, int t, int a, int b, int[] perm)
    {
        int count = set.TrialCount;
        var x = Enumerable.Range(0, count).Select(n => Z(set, t, a, n) * Complex.Conjugate(Z(set, t, b, perm[n]))).ToArray();
        // Unit phasors; a trial with zero amplitude has no phase and contributes 0.
        var u = x.Select(v => v.Magnitude == 0 ? Complex.Zero : v / v.Magnitude).ToArray();
        Complex sumU = u.Aggregate(Complex.Zero, (s, v) => s + v);
        Complex sumX = x.Aggregate(Complex.Zero, (s, v) => s + v);
        double powerA = Enumerable.Range(0, count).Sum(n => Math.Pow(Z(set, t, a, n).Magnitude, 2));
        double powerB = Enumerable.Range(0, count).Sum(n => Math.Pow(Z(set, t, b, perm[n]).Magnitude, 2));
        double sumIm = x.Sum(v => v.Imaginary);
        double sumAbsIm = x.Sum(v => Math.Abs(v.Imaginary));
        double sumSqIm = x.Sum(v => v.Imaginary * v.Imaginary);
        switch (measure)
        {
            case Measure.Plv: // Lachaux et al. 1999
                return (sumU / count).Magnitude;
            case Measure.Ppc: // Vinck et al. 2010
                return (Math.Pow(sumU.Magnitude, 2) - count) / (count * (count - 1.0));
            case Measure.Pli: // Stam et al. 2007
                return Math.Abs(x.Sum(v => (double)Math.Sign(v.Imaginary)) / count);
            case Measure.Wpli: // Vinck et al. 2011
                return sumAbsIm == 0 ? 0 : Math.Abs(sumIm) / sumAbsIm;
            case Measure.WpliDebiased: // Vinck et al. 2011, debiased estimator
                double denominator = sumAbsIm * sumAbsIm - sumSqIm;
                return denominator == 0 ? 0 : (sumIm * sumIm - sumSqIm) / denominator;
            case Measure.Coherence:
                return powerA * powerB == 0 ? 0 : Math.Pow(sumX.Magnitude, 2) / (powerA * powerB);
            case Measure.ImagCoherency: // Nolte et al. 2004
                return powerA * powerB == 0 ? 0 : sumX.Imaginary / Math.Sqrt(powerA * powerB);
            default:
                throw new ArgumentOutOfRangeException(nameof(measure));
        }
    }

    public static double[] Envelope(NarrowbandSet set, int c, int n) =>
        Enumerable.Range(0, set.TimeCount).Select(t => Z(set, t, c, n).Magnitude).ToArray();

    /// <summary>Hipp et al. 2012: r(|b orthogonalised to a|, |a|) and r(|a orthogonalised to b|, |b|), averaged.</summary>
    public static double OrthogonalizedR(NarrowbandSet set, int a, int b, int trialA, int trialB)
    {
        var za = Enumerable.Range(0, set.TimeCount).Select(t => Z(set, t, a, trialA)).ToArray();
        var zb = Enumerable.Range(0, set.TimeCount).Select(t => Z(set, t, b, trialB)).ToArray();
        double[] Orthogonal(Complex[] target, Complex[] reference) => target.Zip(reference, (y, x) =>
            x.Magnitude == 0 ? 0 : Math.Abs((y * Complex.Conjugate(x) / x.Magnitude).Imaginary)).ToArray();
        double rab = Pearson(Orthogonal(zb, za), za.Select(v => v.Magnitude).ToArray());
        double rba = Pearson(Orthogonal(za, zb), zb.Select(v => v.Magnitude).ToArray());
        return (rab + rba) / 2;
    }

    /// <summary>Two-pass Pearson correlation; 0 when either series is constant.</summary>
    public static double Pearson(double[] x, double[] y)
    {
        double mx = x.Average(), my = y.Average();
        double sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < x.Length; i++)
        {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
            syy += (y[i] - my) * (y[i] - my);
        }
        return sxx == 0 || syy == 0 ? 0 : sxy / Math.Sqrt(sxx * syy);
    }

    /// <summary>Fisher combination tanh(mean atanh(r)), r clamped to ±(1 − 1e-12).</summary>
    public static double FisherMean(IEnumerable<double> r) =>
        Math.Tanh(r.Select(v => Math.Atanh(Math.Clamp(v, -(1 - 1e-12), 1 - 1e-12))).Average());
}
