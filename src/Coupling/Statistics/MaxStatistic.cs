namespace Coupling.Statistics;

/// <summary>
/// Family-wise error control by the distribution of the maximum statistic over a family of tests, taken from the same
/// permutation draws as the tests themselves.
/// </summary>
/// <remarks>
/// Nichols and Holmes (2002), "Nonparametric permutation tests for functional neuroimaging: a primer with examples", Hum
/// Brain Mapp 15:1-25, section "Multiple testing" (single-step maximum statistic; Westfall and Young 1993, Resampling-based
/// multiple testing, Wiley, ch. 2): per draw d the maximum T_max,d of the statistic over every test of the family; the
/// family-wise adjusted p of test i is p_i = (1 + #{d : T_max,d ≥ T_i})/(M + 1), counting the observed arrangement as one
/// of the M + 1 (Phipson and Smyth 2010, Stat Appl Genet Mol Biol 9(1):39). Rejecting p_i ≤ α controls the probability of
/// any false rejection in the family at α (strong control under subset pivotality).
/// </remarks>
public static class MaxStatistic
{
    /// <summary>Family-wise adjusted p-values from the observed statistics and the per-draw maxima.</summary>
    /// <param name="observed">T_i per test; NaN for a test that is undefined (its p is NaN).</param>
    /// <param name="nullMaxima">T_max,d per draw; NaN for a draw where every test was undefined (counts as below every T).</param>
    /// <returns>p_i per test, in (0, 1].</returns>
    /// <exception cref="ArgumentException">No draws.</exception>
    public static double[] Adjust(ReadOnlySpan<double> observed, ReadOnlySpan<double> nullMaxima)
    {
        if (nullMaxima.Length == 0) throw new ArgumentException("At least one draw is needed.", nameof(nullMaxima));
        var sorted = nullMaxima.ToArray();
        for (int d = 0; d < sorted.Length; d++) if (double.IsNaN(sorted[d])) sorted[d] = double.NegativeInfinity;
        Array.Sort(sorted);
        var p = new double[observed.Length];
        for (int i = 0; i < observed.Length; i++)
        {
            if (double.IsNaN(observed[i])) { p[i] = double.NaN; continue; }
            int atOrAbove = sorted.Length - LowerBound(sorted, observed[i]);
            p[i] = (atOrAbove + 1.0) / (sorted.Length + 1.0);
        }
        return p;
    }

    /// <summary>First index whose value is at or above <paramref name="x"/> in ascending <paramref name="sorted"/>.</summary>
    internal static int LowerBound(double[] sorted, double x)
    {
        int lo = 0, hi = sorted.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] < x) lo = mid + 1; else hi = mid;
        }
        return lo;
    }
}
