using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;

namespace Coupling.Statistics;

/// <summary>
/// Values recomputed on subsets of a condition's trials: leave-one-trial-out jackknife intervals, and values matched to a
/// smaller trial count by repeated random subsampling. Arrays are laid out [measure][pair in <see cref="PairIndex"/> order].
/// </summary>
/// <remarks>
/// <para>Jackknife (Efron and Tibshirani 1993, An Introduction to the Bootstrap, Chapman &amp; Hall, chapter 11, eq. 11.5):
/// with θ_(i) the value from all trials but trial i and θ_(·) their mean, se_jack = sqrt((N − 1)/N · Σ_i (θ_(i) − θ_(·))²);
/// the interval is θ̂ ± z·se_jack with z = Φ⁻¹(0.975) = 1.959963984540054 (a normal-approximation interval, section
/// 11.5 and chapter 12). For the sample mean se_jack equals the usual standard error s/√N exactly. The interval is about the
/// value's trial-to-trial variability; it is not a test, and for a measure biased in N it is centred on the biased value.</para>
/// <para>Matching (common practice for comparing conditions with different trial counts): PLV, PLI, wPLI, coherence, the
/// imaginary coherency and the AECs are biased upward (in magnitude) by an amount that shrinks with the trial count N
/// (e.g. E|mean of N independent unit phasors|² = 1/N), so values of conditions with different N are not comparable.
/// The matched value is the mean, over R subsets of n trials drawn without replacement, of the measure on the subset;
/// every condition is then as biased as one with n trials. PPC (Vinck et al. 2010, NeuroImage 51:112) and the debiased
/// squared wPLI (Vinck et al. 2011, NeuroImage 55:1548) are unbiased in N and need no matching.</para>
/// </remarks>
public static class TrialResampling
{
    /// <summary>Φ⁻¹(0.975), the two-sided 95 % normal quantile.</summary>
    public const double NormalQuantile975 = 1.959963984540054;

    /// <summary>Whether <paramref name="measure"/>'s expected value does not depend on the number of trials (PPC, debiased wPLI).</summary>
    public static bool IsUnbiasedInTrials(Measure measure) => measure is Measure.Ppc or Measure.WpliDebiased;

    /// <summary>The jackknife standard error of a statistic from its N leave-one-out values (Efron and Tibshirani 1993, eq. 11.5); NaN if any is NaN.</summary>
    /// <exception cref="ArgumentException">Fewer than 2 values.</exception>
    public static double JackknifeStandardError(ReadOnlySpan<double> leaveOneOut)
    {
        int n = leaveOneOut.Length;
        if (n < 2) throw new ArgumentException("At least 2 leave-one-out values are needed.", nameof(leaveOneOut));
        double mean = 0;
        foreach (double v in leaveOneOut) mean += v;
        mean /= n;
        double squares = 0;
        foreach (double v in leaveOneOut) squares += (v - mean) * (v - mean);
        return Math.Sqrt((n - 1.0) / n * squares);
    }

    /// <summary>
    /// 95 % jackknife intervals θ̂ ± 1.96·se_jack for every measure and pair of <paramref name="set"/> (θ̂ the value on all
    /// trials). Costs N computations of the measures on N − 1 trials.
    /// </summary>
    /// <exception cref="ArgumentException">Fewer than 3 trials (a measure needs at least 2 in each leave-one-out set).</exception>
    public static (double[] Low, double[] High) Jackknife(NarrowbandSet set, IReadOnlyList<Measure> measures)
    {
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(measures);
        int n = set.TrialCount;
        if (n < 3) throw new ArgumentException($"The jackknife needs at least 3 trials; the set has {n}.", nameof(set));
        var full = new PairwiseWorkspace(set, measures);
        var estimate = new double[full.OutputLength];
        PairwiseKernels.Compute(full, Identity(n), estimate);
        var subset = new Subset(set, n - 1, measures);
        var leaveOut = new double[n][];
        var keep = new int[n - 1];
        for (int i = 0; i < n; i++)
        {
            for (int j = 0, k = 0; j < n; j++) if (j != i) keep[k++] = j;
            leaveOut[i] = subset.Compute(keep).ToArray();
        }
        var low = new double[estimate.Length];
        var high = new double[estimate.Length];
        var column = new double[n];
        for (int c = 0; c < estimate.Length; c++)
        {
            for (int i = 0; i < n; i++) column[i] = leaveOut[i][c];
            double se = JackknifeStandardError(column);
            low[c] = estimate[c] - NormalQuantile975 * se;
            high[c] = estimate[c] + NormalQuantile975 * se;
        }
        return (low, high);
    }

    /// <summary>
    /// The mean of every measure over <paramref name="subsamples"/> random subsets of <paramref name="trials"/> trials of
    /// <paramref name="set"/>: subset r is the first <paramref name="trials"/> entries of the trial order
    /// <see cref="TrialShuffle.Generate"/>(seed, r), in ascending trial order. With as many trials as the set, the values
    /// on all trials.
    /// </summary>
    /// <exception cref="ArgumentException">Fewer than 2 or more than N trials asked, or fewer than 1 subsample.</exception>
    public static double[] Matched(NarrowbandSet set, IReadOnlyList<Measure> measures, int trials, int subsamples, ulong seed)
    {
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(measures);
        int n = set.TrialCount;
        if (trials < 2 || trials > n) throw new ArgumentException($"Cannot match {n} trials to {trials}.", nameof(trials));
        ArgumentOutOfRangeException.ThrowIfLessThan(subsamples, 1);
        if (trials == n)
        {
            var all = new PairwiseWorkspace(set, measures);
            var values = new double[all.OutputLength];
            PairwiseKernels.Compute(all, Identity(n), values);
            return values;
        }
        var subset = new Subset(set, trials, measures);
        var order = new int[n];
        var sum = new double[measures.Count * PairIndex.Count(set.ChannelCount)];
        for (int r = 0; r < subsamples; r++)
        {
            TrialShuffle.Generate(seed, r, order);
            var chosen = order.AsSpan(0, trials).ToArray();
            Array.Sort(chosen);
            var values = subset.Compute(chosen);
            for (int c = 0; c < sum.Length; c++) sum[c] += values[c];
        }
        for (int c = 0; c < sum.Length; c++) sum[c] /= subsamples;
        return sum;
    }

    private static int[] Identity(int n) => Enumerable.Range(0, n).ToArray();

    /// <summary>A set of the chosen trials, refilled in place, with its workspace.</summary>
    private sealed class Subset
    {
        private readonly NarrowbandSet _source, _set;
        private readonly Complex[] _data;
        private readonly PairwiseWorkspace _workspace;
        private readonly int[] _identity;
        private readonly double[] _values;

        public Subset(NarrowbandSet source, int trials, IReadOnlyList<Measure> measures)
        {
            _source = source;
            _data = new Complex[(long)source.TimeCount * source.ChannelCount * trials];
            _set = new NarrowbandSet(source.Band, source.Channels, trials, source.Times, _data);
            _workspace = new PairwiseWorkspace(_set, measures);
            _identity = Identity(trials);
            _values = new double[_workspace.OutputLength];
        }

        public double[] Compute(ReadOnlySpan<int> trials)
        {
            int rows = _source.TimeCount * _source.ChannelCount, n = _source.TrialCount, m = trials.Length;
            var data = _source.Data;
            for (int r = 0; r < rows; r++)
                for (int j = 0; j < m; j++) _data[r * m + j] = data[r * n + trials[j]];
            _workspace.Reload();
            PairwiseKernels.Compute(_workspace, _identity, _values);
            return _values;
        }
    }
}
