namespace Coupling.Statistics;

/// <summary>Control of the false discovery rate across a family of p-values.</summary>
/// <remarks>
/// Benjamini and Hochberg (1995), "Controlling the false discovery rate: a practical and powerful approach to
/// multiple testing", J R Stat Soc B 57(1):289-300: with the m p-values sorted, p_(1) ≤ ... ≤ p_(m), reject
/// H_(1)..H_(k) for the largest k with p_(k) ≤ k·q/m (the step-up procedure). Valid for independent tests and under
/// positive regression dependence (Benjamini and Yekutieli 2001, Ann Stat 29:1165). Benjamini and Yekutieli (2001),
/// "The control of the false discovery rate in multiple testing under dependency", Ann Stat 29(4):1165-1188, theorem 1.3:
/// the same step-up rule at level q/c(m), c(m) = Σ_{i=1..m} 1/i, controls the false discovery rate at q under any
/// dependence.
/// </remarks>
public static class FalseDiscoveryRate
{
    /// <summary>
    /// Benjamini-Hochberg adjusted p-values, in the input order: adj_(i) = min over j ≥ i of min(1, m·p_(j)/j).
    /// They are monotone in p, at most 1, and adj_i ≤ q exactly when the step-up procedure at level q rejects H_i.
    /// </summary>
    /// <exception cref="ArgumentException">A p-value is NaN or outside [0, 1].</exception>
    public static double[] BenjaminiHochberg(ReadOnlySpan<double> p)
    {
        int m = p.Length;
        var keys = new double[m];
        var order = new int[m];
        for (int i = 0; i < m; i++)
        {
            if (double.IsNaN(p[i]) || p[i] < 0 || p[i] > 1)
                throw new ArgumentException($"p-value {i} is {p[i]}; p-values must be numbers in [0, 1].", nameof(p));
            keys[i] = p[i];
            order[i] = i;
        }
        // Ties in p get the same adjusted value whatever their order, so an unstable sort is fine.
        Array.Sort(keys, order);
        var adjusted = new double[m];
        double running = 1;
        for (int rank = m; rank >= 1; rank--)
        {
            int index = order[rank - 1];
            running = Math.Min(running, m * p[index] / rank);
            adjusted[index] = running;
        }
        return adjusted;
    }

    /// <summary>
    /// <see cref="BenjaminiHochberg"/> over the defined p-values only: a NaN p (a pair whose measure is undefined, e.g.
    /// a channel with no amplitude in the band) stays NaN and is not counted in m, so it neither passes nor makes the
    /// correction stricter for the others.
    /// </summary>
    /// <exception cref="ArgumentException">A p-value outside [0, 1].</exception>
    public static double[] BenjaminiHochbergOfDefined(ReadOnlySpan<double> p) => OfDefined(p, BenjaminiHochberg);

    private delegate double[] Adjustment(ReadOnlySpan<double> p);

    private static double[] OfDefined(ReadOnlySpan<double> p, Adjustment adjust)
    {
        var defined = new List<int>(p.Length);
        for (int i = 0; i < p.Length; i++) if (!double.IsNaN(p[i])) defined.Add(i);
        var result = new double[p.Length];
        Array.Fill(result, double.NaN);
        var values = new double[defined.Count];
        for (int k = 0; k < defined.Count; k++) values[k] = p[defined[k]];
        var adjusted = adjust(values);
        for (int k = 0; k < defined.Count; k++) result[defined[k]] = adjusted[k];
        return result;
    }

    /// <summary>
    /// Benjamini-Yekutieli adjusted p-values, in the input order: adj_(i) = min over j ≥ i of min(1, c(m)·m·p_(j)/j) with
    /// c(m) = Σ_{i=1..m} 1/i, i.e. min(1, c(m)·BH-adjusted p); adj_i ≤ q exactly when the step-up procedure at level
    /// q/c(m) rejects H_i (Benjamini and Yekutieli 2001, Ann Stat 29:1165, theorem 1.3).
    /// </summary>
    /// <exception cref="ArgumentException">A p-value is NaN or outside [0, 1].</exception>
    public static double[] BenjaminiYekutieli(ReadOnlySpan<double> p)
    {
        var adjusted = BenjaminiHochberg(p);
        double c = 0;
        for (int i = adjusted.Length; i >= 1; i--) c += 1.0 / i;
        for (int i = 0; i < adjusted.Length; i++) adjusted[i] = Math.Min(1, c * adjusted[i]);
        return adjusted;
    }

    /// <summary>
    /// <see cref="BenjaminiYekutieli"/> over the defined p-values only: a NaN p stays NaN and is not counted in m (as in
    /// <see cref="BenjaminiHochbergOfDefined"/>).
    /// </summary>
    /// <exception cref="ArgumentException">A p-value outside [0, 1].</exception>
    public static double[] BenjaminiYekutieliOfDefined(ReadOnlySpan<double> p) => OfDefined(p, BenjaminiYekutieli);

    /// <summary>
    /// Which hypotheses the Benjamini-Hochberg step-up procedure rejects at false discovery rate
    /// <paramref name="q"/>: those whose adjusted p-value is at or below q.
    /// </summary>
    /// <exception cref="ArgumentException">A p-value is NaN or outside [0, 1].</exception>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="q"/> is not in (0, 1].</exception>
    public static bool[] Reject(ReadOnlySpan<double> p, double q)
    {
        if (!(q > 0 && q <= 1)) throw new ArgumentOutOfRangeException(nameof(q), q, "The level q must be in (0, 1].");
        var adjusted = BenjaminiHochberg(p);
        var reject = new bool[adjusted.Length];
        for (int i = 0; i < adjusted.Length; i++) reject[i] = adjusted[i] <= q;
        return reject;
    }
}
