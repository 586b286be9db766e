namespace Coupling.Measures;

/// <summary>Which values of a measure count as evidence of coupling in a surrogate test.</summary>
public enum TestTail
{
    /// <summary>One-sided: the test statistic is the value itself; larger means more coupling.</summary>
    Upper,
    /// <summary>
    /// Two-sided against the null distribution itself: a value far below the null counts as much as one far above it,
    /// wherever the null is centred (see Statistics.PermutationP).
    /// </summary>
    TwoSided,
}
