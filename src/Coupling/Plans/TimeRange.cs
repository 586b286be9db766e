namespace Coupling.Plans;

/// <summary>A span of time in seconds relative to each event onset, start inclusive, end exclusive.</summary>
/// <param name="Start">Seconds relative to onset (negative before the event).</param>
/// <param name="End">Seconds relative to onset; greater than <paramref name="Start"/>.</param>
public sealed record TimeRange(double Start, double End)
{
    /// <summary>Length in seconds.</summary>
    public double Length => End - Start;
}
