namespace Coupling.Pipeline;

/// <summary>How many trials a condition kept and which were dropped (and why).</summary>
/// <param name="Condition">Condition name.</param>
/// <param name="Trials">Kept trials.</param>
/// <param name="Dropped">One line per dropped trial.</param>
public sealed record ConditionSummary(string Condition, int Trials, IReadOnlyList<string> Dropped);
