using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using Coupling.Results;
using Coupling.Spectral;

namespace Coupling.Measures;

/// <summary>
/// Per-channel power and stimulus locking, and per-pair coherency phase and lag, of one narrowband set: the numbers the
/// report shows beside the pair measures and the artefact flags read.
/// </summary>
/// <remarks>
/// <para>Power: mean of |z_c,n(t)|² over the T time points and N trials.</para>
/// <para>Stimulus locking: the inter-trial phase consistency R_c(t) = |(1/N) Σ_n z_c,n(t)/|z_c,n(t)||, averaged over
/// the window; 1 when every trial has the same phase at each time point, about sqrt(π/(4N)) for independent uniform
/// phases (Fisher 1993, <i>Statistical Analysis of Circular Data</i>). This is the "phase-locking factor" of
/// Tallon-Baudry, Bertrand, Delpuech, Pernier (1996), J Neurosci 16:4240-4249. A zero amplitude contributes 0 and N is
/// not reduced (as for the PLV, docs/methods.md).</para>
/// <para>Coherency phase: the argument of the window mean of coherency
/// C_ab(t) = Σ_n z_a,n(t)·conj(z_b,n(t)) / sqrt(Σ_n |z_a,n(t)|² · Σ_n |z_b,n(t)|²) (Nolte et al. 2004, Clin
/// Neurophysiol 115:2292-2307, eq. 1), so a time point with stronger coherency weighs more; positive when a leads b.
/// Time points where either power is 0 contribute nothing.</para>
/// </remarks>
public static class SignalSummaries
{
    /// <summary>Summarises <paramref name="set"/>, the narrowband signals of <paramref name="condition"/>.</summary>
    /// <param name="set">The narrowband signals.</param>
    /// <param name="condition">The condition's name, carried into the summary.</param>
    /// <param name="maxThreads">Threads for the pair sums (null: all cores); each pair's sum runs over the time points
    /// in order on one thread, so the result does not depend on it.</param>
    public static BandSignalSummary Summarise(NarrowbandSet set, string condition, int? maxThreads = null)
    {
        ArgumentNullException.ThrowIfNull(set);
        int channels = set.ChannelCount, trials = set.TrialCount, times = set.TimeCount;
        var power = new double[channels];
        var locking = new double[channels];
        var rowPower = new double[(long)times * channels];
        int pairs = PairIndex.Count(channels);
        var sumRe = new double[pairs];
        var sumIm = new double[pairs];
        for (int t = 0; t < times; t++)
        {
            for (int c = 0; c < channels; c++)
            {
                var row = set.Row(t, c);
                double p = 0, unitRe = 0, unitIm = 0;
                for (int n = 0; n < trials; n++)
                {
                    double re = row[n].Real, im = row[n].Imaginary, squared = re * re + im * im;
                    p += squared;
                    if (squared > 0)
                    {
                        double inverse = 1 / Math.Sqrt(squared);
                        unitRe += re * inverse;
                        unitIm += im * inverse;
                    }
                }
                rowPower[(long)t * channels + c] = p;
                power[c] += p;
                locking[c] += trials > 0 ? Math.Sqrt(unitRe * unitRe + unitIm * unitIm) / trials : 0;
            }
        }
        // Coherency sums: one channel a (its pairs with every b > a) per work item.
        Parallel.For(0, channels - 1, new ParallelOptions { MaxDegreeOfParallelism = maxThreads ?? -1 },
            a => AddCoherency(set, a, rowPower, sumRe, sumIm));
        double cells = (double)times * trials;
        for (int c = 0; c < channels; c++)
        {
            power[c] = cells > 0 ? power[c] / cells : double.NaN;
            locking[c] = times > 0 ? locking[c] / times : double.NaN;
        }
        var phase = new double[pairs];
        var lag = new double[pairs];
        for (int k = 0; k < pairs; k++)
        {
            phase[k] = sumRe[k] == 0 && sumIm[k] == 0 ? double.NaN : Math.Atan2(sumIm[k], sumRe[k]);
            lag[k] = PhaseLag.Milliseconds(phase[k], set.Band.Centre);
        }
        return new BandSignalSummary(condition, set.Band.Name, set.Band.Centre, trials, set.Channels, power, locking, phase, lag);
    }

    /// <summary>Adds, for channel a and every b &gt; a, Σ_t coherency(t) into the pair sums (time points in order).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void AddCoherency(NarrowbandSet set, int a, double[] rowPower, double[] sumRe, double[] sumIm)
    {
        int channels = set.ChannelCount, trials = set.TrialCount, times = set.TimeCount;
        int first = PairIndex.Of(a, a + 1, channels);
        for (int t = 0; t < times; t++)
        {
            var ra = set.Row(t, a);
            double powerA = rowPower[(long)t * channels + a];
            for (int b = a + 1, k = first; b < channels; b++, k++)
            {
                double denominator = Math.Sqrt(powerA * rowPower[(long)t * channels + b]);
                if (!(denominator > 0)) continue;
                var (re, im) = CrossSum(ra, set.Row(t, b));
                sumRe[k] += re / denominator;
                sumIm[k] += im / denominator;
            }
        }
    }

    /// <summary>
    /// Σ_n x_n·conj(y_n) as (real, imaginary). The complex numbers are read as interleaved (re, im) doubles: the real
    /// part is their dot product, the imaginary part the alternating sum of x times y with each pair's halves swapped.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static (double Re, double Im) CrossSum(ReadOnlySpan<Complex> x, ReadOnlySpan<Complex> y)
    {
        var xs = MemoryMarshal.Cast<Complex, double>(x);
        var ys = MemoryMarshal.Cast<Complex, double>(y[..x.Length]);
        const int width = 4;
        Vector256<double> re0 = default, re1 = default, swapped0 = default, swapped1 = default;
        int i = 0;
        for (; i <= xs.Length - 2 * width; i += 2 * width)
        {
            var x0 = Vector256.Create(xs.Slice(i, width));
            var x1 = Vector256.Create(xs.Slice(i + width, width));
            var y0 = Vector256.Create(ys.Slice(i, width));
            var y1 = Vector256.Create(ys.Slice(i + width, width));
            re0 = Vector256.FusedMultiplyAdd(x0, y0, re0);
            re1 = Vector256.FusedMultiplyAdd(x1, y1, re1);
            swapped0 = Vector256.FusedMultiplyAdd(x0, Vector256.Shuffle(y0, Vector256.Create(1L, 0, 3, 2)), swapped0);
            swapped1 = Vector256.FusedMultiplyAdd(x1, Vector256.Shuffle(y1, Vector256.Create(1L, 0, 3, 2)), swapped1);
        }
        var reSum = re0 + re1;
        // Lanes of the swapped product: x_re·y_im, x_im·y_re, ...: the imaginary part is odd lanes minus even lanes.
        var imSum = (swapped0 + swapped1) * Vector256.Create(-1.0, 1.0, -1.0, 1.0);
        double re = Vector256.Sum(reSum), im = Vector256.Sum(imSum);
        for (; i < xs.Length; i += 2)
        {
            re += xs[i] * ys[i] + xs[i + 1] * ys[i + 1];
            im += xs[i + 1] * ys[i] - xs[i] * ys[i + 1];
        }
        return (re, im);
    }
}
