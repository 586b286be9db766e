namespace Coupling.Formats;

/// <summary>One row of a BIDS channels.tsv file.</summary>
/// <param name="Name">Channel name as in the recording.</param>
/// <param name="Type">Channel type in upper case as BIDS lists them (EEG, SEEG, ECOG, EOG, MISC, ...).</param>
/// <param name="Units">Physical unit of the channel's samples (e.g. "uV", "µV").</param>
/// <param name="IsBad">True when the optional status column says "bad".</param>
public sealed record ChannelsTsvEntry(string Name, string Type, string Units, bool IsBad);
