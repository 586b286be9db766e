namespace Coupling.Formats;

/// <summary>One channel as a summary shows it.</summary>
/// <param name="Label">Channel label.</param>
/// <param name="Type">Channel type ("unknown" when not stated).</param>
/// <param name="Unit">Physical unit.</param>
/// <param name="SampleRate">Sampling rate in Hz.</param>
/// <param name="SampleCount">Number of samples of this channel.</param>
public sealed record ChannelSummary(string Label, string Type, string Unit, double SampleRate, long SampleCount);
