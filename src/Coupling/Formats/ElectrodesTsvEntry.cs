namespace Coupling.Formats;

/// <summary>One row of a BIDS electrodes.tsv file.</summary>
/// <param name="Name">Electrode name, matched to channel names.</param>
/// <param name="Position">x, y, z in the file's coordinate system, or null when any coordinate is "n/a".</param>
public sealed record ElectrodesTsvEntry(string Name, ChannelPosition? Position);
