namespace Coupling.Plans;

/// <summary>For recordings that are already cut into trials (NPY arrays trials x channels x samples).</summary>
/// <param name="FirstSampleTime">Time of each epoch's first sample, in seconds relative to the event onset.</param>
/// <param name="LabelsFile">Text file with one event label per line, one line per epoch, in epoch order.</param>
/// <param name="ChannelLabels">Channel labels in array order.</param>
public sealed record EpochsSpec(double FirstSampleTime, string LabelsFile, IReadOnlyList<string> ChannelLabels);
