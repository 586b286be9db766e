namespace Coupling.Plans;

/// <summary>A condition of the experiment: its name in the outputs and the event labels whose onsets start its trials.</summary>
/// <param name="Name">Condition name used in file names and tables.</param>
/// <param name="EventLabels">Event labels (EDF+ annotation text or BIDS trial_type) that belong to the condition.</param>
public sealed record ConditionSpec(string Name, IReadOnlyList<string> EventLabels);
