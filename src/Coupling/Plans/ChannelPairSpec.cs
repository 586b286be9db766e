namespace Coupling.Plans;

/// <summary>Two channels named in a plan, as the plan gives them.</summary>
/// <param name="A">First channel label.</param>
/// <param name="B">Second channel label.</param>
public sealed record ChannelPairSpec(string A, string B)
{
    /// <summary>"A-B", as in tables and file names.</summary>
    public string Name => $"{A}-{B}";

    /// <summary>Whether <paramref name="other"/> names the same two channels in either order.</summary>
    public bool SameAs(ChannelPairSpec other) => (A == other.A && B == other.B) || (A == other.B && B == other.A);
}
