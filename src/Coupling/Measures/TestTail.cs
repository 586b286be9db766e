namespace Coupling.Measures;

/// <summary>Which values of a measure count as evidence of coupling in a surrogate test.</summary>
public enum TestTail
{
    /// <summary>One-sided: the test statistic is the value itself; larger means more coupling.</summary>
    Upper,
    /// <summary>Two-sided: the test statistic is the absolute value; either sign counts as coupling.</summary>
    TwoSided,
}
