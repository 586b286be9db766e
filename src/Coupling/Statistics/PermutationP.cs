using Coupling.Measures;
using MathNet.Numerics.Distributions;

namespace Coupling.Statistics;

/// <summary>
/// p-values and z of a resampling test from the counts of null draws below and above the observed value: the one
/// place where the tails of every surrogate and permutation test are decided.
/// </summary>
/// <remarks>
/// <para>With M draws, L of them strictly below the observed value and U strictly above (draws equal to it, and draws
/// that are NaN, count in neither), the one-sided counts are b_upper = M − L (draws at or above the observed value) and
/// b_lower = M − U (at or below). Each one-sided p-value is (b + 1)/(M + 1), exact for randomly drawn permutations
/// (Phipson and Smyth 2010, "Permutation p-values should never be zero", Stat Appl Genet Mol Biol 9(1):39).</para>
/// <para>Two-sided: p = min(1, 2 · min(p_upper, p_lower)), twice the smaller one-sided p-value, tested against the null
/// distribution itself, wherever it is centred; a null shifted away from 0 (a lagged stimulus-locked response, a shared
/// envelope, a difference in trial counts) is handled like one centred at 0. Valid because each one-sided p-value is,
/// and the doubling is the union bound over the two tails (Kulinskaya 2008, "On two-sided p-values for non-symmetric
/// distributions", arXiv:0810.2124).</para>
/// <para>z is rank-based, so it needs no normal null: the observed value's mid-rank among the M + 1 values (the M draws
/// and itself), F = (L + E/2 + 1/2)/(M + 1) with E = M − L − U ties, turned into a normal deviate, z = Φ⁻¹(F) (the
/// plotting position (r − ½)/n of Hazen 1914, Trans Am Soc Civ Eng 77:1539-1640, as normal scores are formed from
/// ranks; from memory). Its sign says on which side of the null the observed value lies; its size is bounded by
/// |Φ⁻¹(1/(2(M+1)))| (2.58 for M = 99, 3.29 for M = 999), the resolution of M draws.</para>
/// </remarks>
public static class PermutationP
{
    /// <summary>One-sided upper p-value (b_upper + 1)/(M + 1).</summary>
    /// <param name="below">L: draws strictly below the observed value.</param>
    /// <param name="draws">M, the number of draws.</param>
    public static double Upper(int below, int draws) => (draws - below + 1.0) / (draws + 1.0);

    /// <summary>One-sided lower p-value (b_lower + 1)/(M + 1).</summary>
    /// <param name="above">U: draws strictly above the observed value.</param>
    /// <param name="draws">M, the number of draws.</param>
    public static double Lower(int above, int draws) => (draws - above + 1.0) / (draws + 1.0);

    /// <summary>Two-sided p-value against the null itself: min(1, 2 · min(upper, lower)).</summary>
    /// <param name="below">L: draws strictly below the observed value.</param>
    /// <param name="above">U: draws strictly above the observed value.</param>
    /// <param name="draws">M, the number of draws.</param>
    public static double TwoSided(int below, int above, int draws) =>
        Math.Min(1.0, 2 * Math.Min(Upper(below, draws), Lower(above, draws)));

    /// <summary>The p-value of <paramref name="tail"/>: <see cref="Upper"/> or <see cref="TwoSided"/>.</summary>
    public static double Of(TestTail tail, int below, int above, int draws) =>
        tail == TestTail.TwoSided ? TwoSided(below, above, draws) : Upper(below, draws);

    /// <summary>
    /// The exceedance count b reported beside the p-value of <paramref name="tail"/>: b_upper for the upper tail, the
    /// smaller of b_upper and b_lower for two sides (so that p = min(1, 2(b + 1)/(M + 1))).
    /// </summary>
    public static int Exceedances(TestTail tail, int below, int above, int draws) =>
        tail == TestTail.TwoSided ? Math.Min(draws - below, draws - above) : draws - below;

    /// <summary>Rank-based z = Φ⁻¹((L + E/2 + 1/2)/(M + 1)), E = M − L − U (see the type's remarks).</summary>
    /// <param name="below">L: draws strictly below the observed value.</param>
    /// <param name="above">U: draws strictly above the observed value.</param>
    /// <param name="draws">M, the number of draws.</param>
    public static double RankZ(int below, int above, int draws)
    {
        double ties = draws - below - above;
        return Normal.InvCDF(0, 1, (below + 0.5 * ties + 0.5) / (draws + 1.0));
    }
}
