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
/// <param name="Exceedances">b: the smaller of the number of permutations with Δ at or above the observed Δ and the
/// number with Δ at or below it.</param>
/// <param name="P">min(1, 2(b + 1)/(M + 1)), two-sided against the permutation null itself
/// (<see cref="PermutationP.TwoSided"/>); NaN where the observed difference is NaN.</param>
/// <param name="Z">Rank-based z of the observed Δ among the permutations (<see cref="PermutationP.RankZ"/>), signed;
/// NaN where the observed difference is NaN.</param>
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
