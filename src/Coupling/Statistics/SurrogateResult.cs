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
/// <param name="Exceedances">b: the number of draws whose test statistic is at or above the observed one.</param>
/// <param name="P">(b + 1)/(M + 1); NaN where the observed value is NaN.</param>
/// <param name="Z">(Observed − NullMean)/NullSd, signed; NaN where the standard deviation is 0 or NaN.</param>
public sealed record SurrogateResult(
    Measure Measure,
    int Draws,
    double[] Observed,
    double[] NullMean,
    double[] NullSd,
    int[] Exceedances,
    double[] P,
    double[] Z);
