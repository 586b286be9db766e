using Coupling.Statistics;

namespace Coupling.Outputs;

/// <summary>
/// Writes a cluster-based permutation test as two tidy tab-separated tables: the clusters (<see cref="ClusterColumns"/>)
/// and the map's cells (<see cref="CellColumns"/>), conventions as <see cref="TimeFrequencyTableWriter"/>.
/// </summary>
public static class ClusterTableWriter
{
    /// <summary>Header of the cluster table: one row per observed cluster, by decreasing |mass|.</summary>
    public static IReadOnlyList<string> ClusterColumns { get; } =
    [
        "channel_a", "channel_b", "measure", "condition_a", "condition_b", "cluster", "sign", "mass", "cells", "p",
        "low_hz", "high_hz", "start_s", "end_s", "draws", "threshold",
    ];

    /// <summary>Header of the cell table: one row per frequency x time bin; cluster is 0 outside every cluster.</summary>
    public static IReadOnlyList<string> CellColumns { get; } =
        ["frequency_hz", "time_s", "difference", "z", "cluster", "cluster_p"];

    /// <summary>Writes the cluster table; returns the row count.</summary>
    public static int WriteClusters(ClusterTestResult r, string path) =>
        TidyTable.Write(path, ClusterColumns, r.Clusters.Select(c => (IReadOnlyList<string>)
        [
            r.ChannelA, r.ChannelB, r.Measure, r.ConditionA, r.ConditionB, c.Id.ToString(System.Globalization.CultureInfo.InvariantCulture),
            c.Sign > 0 ? "positive" : "negative", TableText.Number(c.Mass), c.Cells.ToString(System.Globalization.CultureInfo.InvariantCulture),
            TableText.Number(c.P), TableText.Number(c.LowHz), TableText.Number(c.HighHz), TableText.Number(c.Start), TableText.Number(c.End),
            r.Draws.ToString(System.Globalization.CultureInfo.InvariantCulture), TableText.Number(r.Threshold),
        ]));

    /// <summary>Writes the cell table; returns the row count.</summary>
    public static int WriteCells(ClusterTestResult r, string path) =>
        TidyTable.Write(path, CellColumns, Enumerable.Range(0, r.Difference.Length).Select(i => (IReadOnlyList<string>)
        [
            TableText.Number(r.Frequencies[i / r.Times.Count]), TableText.Number(r.Times[i % r.Times.Count]),
            TableText.Number(r.Difference[i]), TableText.Number(r.Z[i]), r.Labels[i].ToString(System.Globalization.CultureInfo.InvariantCulture),
            r.Labels[i] == 0 ? TableText.Missing : TableText.Number(r.Clusters[r.Labels[i] - 1].P),
        ]));
}
