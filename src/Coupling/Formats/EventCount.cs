namespace Coupling.Formats;

/// <summary>How many events carry one label.</summary>
/// <param name="Label">The event label.</param>
/// <param name="Count">Number of events with that label.</param>
public sealed record EventCount(string Label, int Count);
