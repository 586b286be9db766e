using Coupling.Measures;

namespace Coupling.Statistics;

/// <summary>
/// The condition-label permutation test of one measure over all channel pairs; every array is indexed by pair in
/// <see cref="PairIndex"/> order. The difference is Δ = value in A − value in B.
/// </summary>
/// <param name="Measure">The measure tested.</param>
/// <param name="Draws">Number of label permutations M.</param>
/// <param name="ValueA">Value per pair in condition A (its own trials), summarised over the window.</param>
/// <param name="ValueB">Value per pair in condition B.</param>
/// <param name="Difference">ValueA − ValueB per pair.</param>
/// <param name="NullMean">Mean of Δ over the permutations.</param>
/// <param name="NullSd">Sample standard deviation (divisor M − 1) of Δ over the permutations; NaN when M = 1.</param>
/// <param name="Exceedances">b: the number of permutations whose |Δ| is at or above the observed |Δ|.</param>
/// <param name="P">(b + 1)/(M + 1), two-sided; NaN where the observed difference is NaN.</param>
/// <param name="Z">(Difference − NullMean)/NullSd, signed; NaN where the standard deviation is 0 or NaN.</param>
public sealed record ContrastResult(
    Measure Measure,
    int Draws,
    double[] ValueA,
    double[] ValueB,
    double[] Difference,
    double[] NullMean,
    double[] NullSd,
    int[] Exceedances,
    double[] P,
    double[] Z);
