namespace Coupling.Outputs;

/// <summary>How many trials of a condition went into the analysis, and which were left out.</summary>
/// <param name="Condition">Condition name.</param>
/// <param name="Trials">Number of kept trials.</param>
/// <param name="Dropped">One line per dropped trial saying which and why (as <see cref="Trials.TrialSet.DroppedTrials"/>).</param>
public sealed record ConditionTrials(string Condition, int Trials, IReadOnlyList<string> Dropped);
