namespace Coupling.Formats;

/// <summary>An event marker: onset and duration in seconds from the start of the recording, and its label.</summary>
/// <param name="Onset">Seconds from the recording start.</param>
/// <param name="Duration">Seconds; 0 when the input gives none.</param>
/// <param name="Label">The event text (EDF+ annotation text or BIDS trial_type).</param>
public sealed record RecordingEvent(double Onset, double Duration, string Label);
