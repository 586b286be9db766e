namespace Coupling.Simulation;

/// <summary>One condition of the simulated task.</summary>
/// <param name="Name">Condition name, as a plan would refer to it.</param>
/// <param name="EventLabel">Label of the events that mark its trial onsets in the recording.</param>
/// <param name="TrialCount">Number of trials (events) of the condition.</param>
/// <param name="Description">What the condition is in the invented task.</param>
public sealed record ConditionTruth(string Name, string EventLabel, int TrialCount, string Description);
