namespace Coupling.Formats;

/// <summary>One recorded channel: its label, type (e.g. EEG, SEEG, LFP), physical unit and optional position.</summary>
/// <param name="Label">The channel label as the recording spells it (trimmed).</param>
/// <param name="Type">Channel type, as in BIDS channels.tsv (EEG, SEEG, ECOG, LFP, MISC, ...); "unknown" when not stated.</param>
/// <param name="Unit">Physical unit of the samples (e.g. "uV").</param>
/// <param name="Position">Sensor position where the input gives one (electrodes.tsv or the simulator), else null.</param>
public sealed record ChannelInfo(string Label, string Type, string Unit, ChannelPosition? Position = null);
