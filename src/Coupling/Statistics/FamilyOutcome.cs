namespace Coupling.Statistics;

/// <summary>
/// The corrected decisions for one family of tests: all channel pairs of one table (condition or contrast x band x
/// measure). Arrays are indexed by pair in <see cref="Measures.PairIndex"/> order.
/// </summary>
/// <param name="Method">The correction applied.</param>
/// <param name="Level">Its level: q for the false discovery rate methods, alpha otherwise.</param>
/// <param name="P">Per-pair p-value used as input to the correction (the counted permutation p, or its generalised
/// Pareto refinement where <paramref name="PSource"/> says so).</param>
/// <param name="PSource">Per pair "counted" (p = (b+1)/(M+1)) or "pareto-tail" (generalised Pareto tail approximation).</param>
/// <param name="PCorrected">Adjusted p: Benjamini-Hochberg or -Yekutieli adjusted p, the maximum-statistic family-wise p,
/// the family-wise p of the pair's supra-threshold component (1 for a pair in none), or the p itself for no correction.</param>
/// <param name="Significant">PCorrected at or below the level (and, for the network-based statistic, in a component).</param>
/// <param name="Component">Network-based statistic: the pair's component number (0-based), −1 for none; empty otherwise.</param>
/// <param name="ComponentExtent">Network-based statistic: edges per component; empty otherwise.</param>
/// <param name="ComponentP">Network-based statistic: family-wise p per component; empty otherwise.</param>
public sealed record FamilyOutcome(
    CorrectionMethod Method,
    double Level,
    double[] P,
    string[] PSource,
    double[] PCorrected,
    bool[] Significant,
    int[] Component,
    int[] ComponentExtent,
    double[] ComponentP);
