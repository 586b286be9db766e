using Coupling.Graphs;
using Coupling.Outputs;

namespace Coupling.Tests.Outputs;

public class GraphTableWriterTests
{
    // SampleResults.FourChannels: edges Pz-Cz 0.5, Pz-Fz 0.3, Fz-Oz 0.2: a path Cz-Pz-Fz-Oz, no triangle, one component.

    [Fact]
    public void The_graph_table_has_one_row_per_graph_with_the_measures_worked_out_by_hand()
    {
        using var dir = new TempFolder();
        var r = SampleResults.FourChannels();
        var g = ChannelGraphs.Build(r);
        Assert.Equal(1, GraphTableWriter.Write([(r.Condition, r.Band, r.Measure, g)], dir["graphs.tsv"]));
        var lines = File.ReadAllLines(dir["graphs.tsv"]);
        Assert.Equal(string.Join('\t', GraphTableWriter.Columns), lines[0]);
        var cells = lines[1].Split('\t');
        string Cell(string column) => cells[GraphTableWriter.Columns.ToList().IndexOf(column)];
        Assert.Equal("4", Cell("nodes"));
        Assert.Equal("3", Cell("edges"));
        Assert.Equal("0.5", Cell("density"));      // 2*3 / (4*3)
        Assert.Equal("1", Cell("components"));
        Assert.Equal("4", Cell("largest_component"));
        Assert.Equal("0", Cell("clustering"));     // a path has no triangle
        // Path distances 1,1,1,2,2,3 -> sum 1/d = 3 + 1 + 1/3; ordered twice over 12 pairs (Latora & Marchiori 2001).
        Assert.Equal(2 * (3 + 1 + 1.0 / 3) / 12, double.Parse(Cell("efficiency"), System.Globalization.CultureInfo.InvariantCulture), 1e-15);
        Assert.Equal(g.Measures.Summary.Modularity.ToString("R", System.Globalization.CultureInfo.InvariantCulture), Cell("modularity"));
    }

    [Fact]
    public void The_node_table_carries_clustering_component_and_module_and_NA_where_modularity_is_undefined()
    {
        using var dir = new TempFolder();
        var r = SampleResults.FourChannels();
        var none = r with { Significant = new bool[r.Significant.Length] };
        NodeTableWriter.Write([(r.Condition, r.Band, r.Measure, ChannelGraphs.Build(r)), ("none", r.Band, r.Measure, ChannelGraphs.Build(none))], dir["nodes.tsv"]);
        var lines = File.ReadAllLines(dir["nodes.tsv"]);
        Assert.Equal("condition\tband\tmeasure\tchannel\tdegree\tstrength\tclustering\tclustering_weighted\tcomponent\tmodule", lines[0]);
        Assert.Equal(9, lines.Length);
        Assert.StartsWith("rest\talpha\tplv\tPz\t2\t0.8\t0\t0\t1\t", lines[1]);
        Assert.Equal("none\talpha\tplv\tOz\t0\t0\t0\t0\t4\tNA", lines[8]); // four isolated channels: Oz is the fourth component
    }
}
