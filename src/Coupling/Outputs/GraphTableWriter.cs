using System.Globalization;
using Coupling.Graphs;

namespace Coupling.Outputs;

/// <summary>Writes the whole-graph measures of channel graphs as one tidy TSV table, one row per condition x band x measure.</summary>
/// <remarks>
/// Columns (docs/outputs.md; definitions in <see cref="GraphSummary"/> and docs/methods.md): condition, band, measure,
/// nodes, edges, density, components, largest_component, clustering, clustering_weighted, efficiency,
/// efficiency_weighted, modules, modularity. Same conventions as the edge table: tab-separated, a header row,
/// invariant culture, round-trip numbers, NA for undefined values.
/// </remarks>
public static class GraphTableWriter
{
    /// <summary>The column names, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
    [
        "condition", "band", "measure", "nodes", "edges", "density", "components", "largest_component",
        "clustering", "clustering_weighted", "efficiency", "efficiency_weighted", "modules", "modularity",
    ];

    /// <summary>Writes one row per graph; returns the number of data rows.</summary>
    /// <param name="graphs">Each graph with the condition, band and measure it belongs to.</param>
    /// <param name="path">The file to write (atomically).</param>
    public static int Write(IEnumerable<(string Condition, string Band, string Measure, ChannelGraph Graph)> graphs, string path) =>
        TidyTable.Write(path, Columns,
            from g in graphs
            let s = g.Graph.Measures.Summary
            select (IReadOnlyList<string>)[
                g.Condition, g.Band, g.Measure, Integer(s.Nodes), Integer(s.Edges), TableText.Number(s.Density),
                Integer(s.Components), Integer(s.LargestComponent), TableText.Number(s.Clustering),
                TableText.Number(s.WeightedClustering), TableText.Number(s.Efficiency), TableText.Number(s.WeightedEfficiency),
                Integer(s.Modules), TableText.Number(s.Modularity)]);

    private static string Integer(int value) => value.ToString(CultureInfo.InvariantCulture);
}
