namespace Coupling.Artefacts;

/// <summary>One warning raised from the results: what it is, where, and the numbers behind it.</summary>
/// <param name="Kind">What kind of warning.</param>
/// <param name="Condition">Condition name.</param>
/// <param name="Band">Band name.</param>
/// <param name="ChannelA">The channel (power outliers) or the first channel of the pair.</param>
/// <param name="ChannelB">The second channel of the pair; null for a channel flag.</param>
/// <param name="Measures">Measure keys the flag concerns, comma-separated; empty when it concerns the signals, not a measure.</param>
/// <param name="Value">The number the flag rests on: the coherency phase in degrees (zero lag), the smaller of the two
/// stimulus lockings (shared evoked response), the AEC (amplitude-driven), the modified z-score of log power (power outlier).</param>
/// <param name="Detail">A sentence for the reader.</param>
public sealed record ArtefactFlag(
    ArtefactKind Kind,
    string Condition,
    string Band,
    string ChannelA,
    string? ChannelB,
    string Measures,
    double Value,
    string Detail)
{
    /// <summary>The kind's key in tables: zero-lag, shared-evoked, amplitude-driven, power-outlier.</summary>
    public string Key => ArtefactFlags.Key(Kind);
}
