using Coupling.Statistics;

namespace Coupling.Pipeline;

/// <summary>
/// How many surrogates a single coupled pair needs to pass a false discovery rate correction, given that counted p-values
/// cannot go below 1/(M + 1): Benjamini-Hochberg passes one pair alone when 1/(M + 1) ≤ q/m, Benjamini-Yekutieli when
/// 1/(M + 1) ≤ q/(m·c(m)), c(m) = Σ 1/i. The family-wise corrections and no correction need only 1/(M + 1) ≤ alpha; with
/// the Pareto tail, p can go below the floor, so no count is required.
/// </summary>
/// <param name="Applies">Whether the false-discovery-rate floor check applies (an FDR method with counted p-values).</param>
/// <param name="Multiplier">1 for Benjamini-Hochberg, c(m) for Benjamini-Yekutieli.</param>
/// <param name="Needed">The smallest M for which one pair can pass on its own.</param>
internal sealed record SurrogateFloor(bool Applies, double Multiplier, int Needed)
{
    public static SurrogateFloor Of(CorrectionSpec correction, double level, int pairs)
    {
        if (correction.ParetoTail) return new SurrogateFloor(false, 1, 1);
        if (!CorrectionSpec.ControlsFalseDiscoveries(correction.Method))
            return new SurrogateFloor(false, 1, (int)Math.Ceiling(1 / level) - 1);
        double c = 1;
        if (correction.Method == CorrectionMethod.BenjaminiYekutieli)
        {
            c = 0;
            for (int i = pairs; i >= 1; i--) c += 1.0 / i;
        }
        return new SurrogateFloor(true, c, (int)Math.Min(int.MaxValue, Math.Ceiling(c * pairs / level) - 1));
    }
}
