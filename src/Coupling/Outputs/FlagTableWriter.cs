using Coupling.Artefacts;

namespace Coupling.Outputs;

/// <summary>Writes the artefact flags of a run as one tidy TSV table (flags.tsv).</summary>
/// <remarks>
/// Columns: flag, condition, band, channel_a, channel_b, measures, value, detail (docs/outputs.md). Same conventions as
/// the edge table: tab-separated, a header row, invariant culture, round-trip numbers, NA for missing values; a channel
/// flag has channel_b NA.
/// </remarks>
public static class FlagTableWriter
{
    /// <summary>The column names, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
        ["flag", "condition", "band", "channel_a", "channel_b", "measures", "value", "detail"];

    /// <summary>Writes one row per flag (a header alone when there are none); returns the number of data rows.</summary>
    public static int Write(IEnumerable<ArtefactFlag> flags, string path) =>
        TidyTable.Write(path, Columns,
            from f in flags
            select (IReadOnlyList<string>)[f.Key, f.Condition, f.Band, f.ChannelA, f.ChannelB ?? "NA", f.Measures,
                TableText.Number(f.Value), f.Detail]);
}
