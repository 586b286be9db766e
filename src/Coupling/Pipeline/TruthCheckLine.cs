namespace Coupling.Pipeline;

/// <summary>One expectation of the ground truth held against a run's result.</summary>
/// <param name="ChannelA">First channel of the pair.</param>
/// <param name="ChannelB">Second channel of the pair.</param>
/// <param name="Kind">What the pair is built as (e.g. "phase-coupled").</param>
/// <param name="Condition">Condition.</param>
/// <param name="Band">Band.</param>
/// <param name="Measure">Measure key.</param>
/// <param name="ExpectSignificant">What the truth expects.</param>
/// <param name="Significant">What the run found.</param>
/// <param name="PCorrected">The run's corrected p-value for the pair.</param>
public sealed record TruthCheckLine(string ChannelA, string ChannelB, string Kind, string Condition, string Band,
    string Measure, bool ExpectSignificant, bool Significant, double PCorrected)
{
    /// <summary>Whether the run agrees with the truth.</summary>
    public bool Agrees => ExpectSignificant == Significant;
}
