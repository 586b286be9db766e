namespace Coupling.Plans;

/// <summary>
/// Two conditions of the plan whose connectivity is compared: the difference is value of <paramref name="ConditionA"/>
/// minus value of <paramref name="ConditionB"/>.
/// </summary>
/// <param name="ConditionA">Name of the first condition (the minuend).</param>
/// <param name="ConditionB">Name of the second condition (the subtrahend).</param>
public sealed record ContrastSpec(string ConditionA, string ConditionB)
{
    /// <summary>The contrast's name, "A-vs-B", as it appears in tables and file names.</summary>
    public string Name => $"{ConditionA}-vs-{ConditionB}";

    /// <summary>Whether <paramref name="other"/> compares the same two conditions, in either order.</summary>
    public bool Covers(ContrastSpec other) =>
        (ConditionA == other.ConditionA && ConditionB == other.ConditionB) ||
        (ConditionA == other.ConditionB && ConditionB == other.ConditionA);
}
