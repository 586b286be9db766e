using System.Text;
using Coupling.Graphs;

namespace Coupling.Outputs;

/// <summary>Writes the node measures of channel graphs as one tidy TSV table.</summary>
/// <remarks>
/// Columns: condition, band, measure, channel, degree, strength (see docs/outputs.md). Same conventions as the edge
/// table: tab-separated, a header row, invariant culture, round-trip numbers.
/// </remarks>
public static class NodeTableWriter
{
    /// <summary>The column names, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } = ["condition", "band", "measure", "channel", "degree", "strength"];

    /// <summary>Writes one row per channel of every graph; returns the number of data rows.</summary>
    /// <param name="graphs">Each graph with the condition, band and measure it belongs to.</param>
    /// <param name="path">The file to write (atomically).</param>
    public static int Write(IEnumerable<(string Condition, string Band, string Measure, ChannelGraph Graph)> graphs, string path)
    {
        using var stream = AtomicFile.Create(path);
        int rows = 0;
        using (var w = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true) { NewLine = "\n" })
        {
            w.Write(string.Join('\t', Columns));
            w.Write('\n');
            foreach (var (condition, band, measure, graph) in graphs)
                foreach (var node in graph.Nodes)
                {
                    w.Write($"{TableText.Field(condition, '\t')}\t{TableText.Field(band, '\t')}\t{TableText.Field(measure, '\t')}\t" +
                        $"{TableText.Field(node.Channel, '\t')}\t{node.Degree}\t{TableText.Number(node.Strength)}\n");
                    rows++;
                }
        }
        stream.Commit();
        return rows;
    }
}
