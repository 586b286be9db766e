using Coupling.Graphs;

namespace Coupling.Outputs;

/// <summary>Writes the node measures of channel graphs as one tidy TSV table.</summary>
/// <remarks>
/// Columns: condition, band, measure, channel, degree, strength, clustering, clustering_weighted, component, module
/// (see docs/outputs.md and <see cref="NodeMeasures"/>); module is NA where modularity is undefined. Same conventions as the edge
/// table: tab-separated, a header row, invariant culture, round-trip numbers.
/// </remarks>
public static class NodeTableWriter
{
    /// <summary>The column names, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } = 
        ["condition", "band", "measure", "channel", "degree", "strength", "clustering", "clustering_weighted", "component", "module"];

    /// <summary>Writes one row per channel of every graph; returns the number of data rows.</summary>
    /// <param name="graphs">Each graph with the condition, band and measure it belongs to.</param>
    /// <param name="path">The file to write (atomically).</param>
    public static int Write(IEnumerable<(string Condition, string Band, string Measure, ChannelGraph Graph)> graphs, string path) =>
        TidyTable.Write(path, Columns,
            from g in graphs
            from node in g.Graph.Measures.Nodes
            select (IReadOnlyList<string>)[
                g.Condition, g.Band, g.Measure, node.Channel, Integer(node.Degree), TableText.Number(node.Strength),
                TableText.Number(node.Clustering), TableText.Number(node.WeightedClustering), Integer(node.Component),
                node.Module is int module ? Integer(module) : TableText.Missing]);

    private static string Integer(int value) => value.ToString(System.Globalization.CultureInfo.InvariantCulture);
}
