using Coupling.Results;

namespace Coupling.Outputs;

/// <summary>
/// Writes directions.tsv: one row per condition x band x channel pair significant in at least one measure, with the
/// coherency phase, the lag at the band centre, the leading channel and the phase-slope index with its p. Same
/// conventions as the edge table (NA, number format, quoting, LF, atomic).
/// </summary>
public static class DirectionTableWriter
{
    /// <summary>The header row, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
        ["condition", "band", "channel_a", "channel_b", "significant_in", "phase_rad", "lag_ms", "leader", "psi", "psi_p"];

    /// <summary>Writes <paramref name="directions"/> to <paramref name="path"/>; returns the number of data rows.</summary>
    public static int Write(IEnumerable<PairDirection> directions, string path)
    {
        ArgumentNullException.ThrowIfNull(directions);
        return TidyTable.Write(path, Columns, directions.Select(d => (IReadOnlyList<string>)
        [
            d.Condition, d.Band, d.ChannelA, d.ChannelB, string.Join(",", d.SignificantIn), TableText.Number(d.Phase),
            TableText.Number(d.LagMs), d.Leader, TableText.Number(d.Psi), TableText.Number(d.PsiP),
        ]));
    }
}
