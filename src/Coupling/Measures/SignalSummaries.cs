using System.Numerics;
using System.Runtime.CompilerServices;
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
                double p = 0;
                Complex unit = Complex.Zero;
                for (int n = 0; n < trials; n++)
                {
                    double m = row[n].Magnitude;
                    p += row[n].Real * row[n].Real + row[n].Imaginary * row[n].Imaginary;
                    if (m > 0) unit += row[n] / m;
                }
                rowPower[(long)t * channels + c] = p;
                power[c] += p;
                locking[c] += trials > 0 ? unit.Magnitude / trials : 0;
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
                var rb = set.Row(t, b);
                double re = 0, im = 0;
                for (int n = 0; n < trials; n++)
                {
                    re += ra[n].Real * rb[n].Real + ra[n].Imaginary * rb[n].Imaginary;
                    im += ra[n].Imaginary * rb[n].Real - ra[n].Real * rb[n].Imaginary;
                }
                sumRe[k] += re / denominator;
                sumIm[k] += im / denominator;
            }
        }
    }
}
