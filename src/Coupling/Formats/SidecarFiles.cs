namespace Coupling.Formats;

/// <summary>BIDS sidecar files found next to a recording; null where none was found.</summary>
/// <param name="Events">The events.tsv to use, or null.</param>
/// <param name="Channels">The channels.tsv to use, or null.</param>
/// <param name="Electrodes">The electrodes.tsv to use, or null.</param>
public sealed record SidecarFiles(string? Events, string? Channels, string? Electrodes);
