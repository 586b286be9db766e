using Coupling.Statistics;

namespace Coupling.Pipeline;

/// <summary>
/// How many surrogates a single coupled pair needs to pass a false discovery rate correction, given that counted p-values
/// cannot go below 1/(M + 1): Benjamini-Hochberg passes one pair alone when 1/(M + 1) ≤ q/m, Benjamini-Yekutieli when
/// 1/(M + 1) ≤ q/(m·c(m)), c(m) = Σ 1/i. The family-wise corrections and no correction need only 1/(M + 1) ≤ alpha; with
/// the Pareto tail, p can go below the floor, so no count is required. When every test of the table is two-sided against
/// its null (<see cref="Measures.TestTail.TwoSided"/>), a counted p is min(1, 2 min(b_upper + 1, b_lower + 1)/(M + 1)), so
/// the floor is 2/(M + 1) and every count doubles; the family-wise maxima (maximum statistic, network-based statistic)
/// give p = (1 + b)/(M + 1) on the absolute statistic even then, so their floor stays 1/(M + 1).
/// </summary>
/// <param name="Applies">Whether the false-discovery-rate floor check applies (an FDR method with counted p-values).</param>
/// <param name="Multiplier">1 for Benjamini-Hochberg, c(m) for Benjamini-Yekutieli; times 2 for two-sided tests.</param>
/// <param name="Needed">The smallest M for which one pair can pass on its own.</param>
/// <param name="Sides">1 when the smallest attainable p is 1/(M + 1), 2 when every test is two-sided with counted p (2/(M + 1)).</param>
internal sealed record SurrogateFloor(bool Applies, double Multiplier, int Needed, int Sides = 1)
{
    public static SurrogateFloor Of(CorrectionSpec correction, double level, int pairs, bool twoSidedOnly = false)
    {
        int sides = twoSidedOnly && correction.Method is not (CorrectionMethod.MaxStatistic or CorrectionMethod.NetworkBased) ? 2 : 1;
        if (correction.ParetoTail) return new SurrogateFloor(false, 1, 1, sides);
        if (!CorrectionSpec.ControlsFalseDiscoveries(correction.Method))
            return new SurrogateFloor(false, sides, (int)Math.Ceiling(sides / level) - 1, sides);
        double c = 1;
        if (correction.Method == CorrectionMethod.BenjaminiYekutieli)
        {
            c = 0;
            for (int i = pairs; i >= 1; i--) c += 1.0 / i;
        }
        return new SurrogateFloor(true, sides * c, (int)Math.Min(int.MaxValue, Math.Ceiling(sides * c * pairs / level) - 1), sides);
    }
}
