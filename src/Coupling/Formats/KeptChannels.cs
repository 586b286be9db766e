namespace Coupling.Formats;

/// <summary>The channels of a recording that remain after its sidecar files are applied.</summary>
/// <param name="Indices">For each kept channel, its index among the recording's channels, in the recording's order.</param>
/// <param name="Channels">The kept channels' descriptions, with types, units and positions from the sidecars.</param>
/// <param name="Notes">The recording's notes followed by the notes on applying the sidecars.</param>
public sealed record KeptChannels(IReadOnlyList<int> Indices, IReadOnlyList<ChannelInfo> Channels, IReadOnlyList<string> Notes);
