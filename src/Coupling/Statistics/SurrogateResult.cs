using Coupling.Measures;

namespace Coupling.Statistics;

/// <summary>
/// The trial-shuffle surrogate test of one measure over all channel pairs; every array is indexed by pair in
/// <see cref="PairIndex"/> order.
/// </summary>
/// <param name="Measure">The measure tested.</param>
/// <param name="Draws">Number of surrogate draws M.</param>
/// <param name="Observed">Observed value per pair (trials in their own order), summarised over the window.</param>
/// <param name="NullMean">Mean of the surrogate values (the values, not the test statistics).</param>
/// <param name="NullSd">Sample standard deviation (divisor M − 1) of the surrogate values; NaN when M = 1.</param>
/// <param name="Exceedances">b: for a one-sided measure the number of draws at or above the observed value; for a
/// two-sided (signed) measure the smaller of that and the number of draws at or below it.</param>
/// <param name="P">(b + 1)/(M + 1) one-sided, min(1, 2(b + 1)/(M + 1)) two-sided (<see cref="PermutationP"/>); NaN
/// where the observed value is NaN.</param>
/// <param name="Z">Rank-based z of the observed value among the draws (<see cref="PermutationP.RankZ"/>), signed; NaN
/// where the observed value is NaN.</param>
public sealed record SurrogateResult(
    Measure Measure,
    int Draws,
    double[] Observed,
    double[] NullMean,
    double[] NullSd,
    int[] Exceedances,
    double[] P,
    double[] Z);
