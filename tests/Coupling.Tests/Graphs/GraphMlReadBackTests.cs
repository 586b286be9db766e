using System.Text.Json;
using Coupling.Outputs;

namespace Coupling.Tests.Graphs;

public class GraphMlReadBackTests
{
    [Fact]
    public void Networkx_reads_the_graphml_of_the_karate_network_as_written()
    {
        // Independent reader: networkx 2.8.8 (Debian python3-networkx) read_graphml of coupling_karate.graphml,
        // written by this test with COUPLING_FIXTURE_OUT set (Fixtures/Graphs/regenerate.sh); its reading and its own
        // measures on what it read are in coupling_karate_networkx.json. First: the writer still makes that file.
        var result = KarateFixture.Result(KarateFixture.Variant("weighted"));
        var graph = Coupling.Graphs.ChannelGraphs.Build(result);
        string? regenerate = Environment.GetEnvironmentVariable("COUPLING_FIXTURE_OUT");
        if (regenerate is not null)
        {
            GraphMlWriter.Write(graph, result, Path.Combine(regenerate, "coupling_karate.graphml"));
            return;
        }
        using var tmp = new Coupling.Tests.Outputs.TempFolder();
        GraphMlWriter.Write(graph, result, tmp["k.graphml"]);
        Assert.Equal(File.ReadAllText(KarateFixture.PathOf("coupling_karate.graphml")), File.ReadAllText(tmp["k.graphml"]));

        using var doc = JsonDocument.Parse(File.ReadAllText(KarateFixture.PathOf("coupling_karate_networkx.json")));
        var root = doc.RootElement;
        Assert.False(root.GetProperty("directed").GetBoolean());
        var measures = graph.Measures;
        var g = root.GetProperty("graph");
        Assert.Equal("ties", g.GetProperty("measure").GetString());
        Assert.Equal(measures.Summary.Modularity, g.GetProperty("modularity").GetDouble());
        Assert.Equal(measures.Summary.Components, g.GetProperty("components").GetInt32());
        Assert.Equal(measures.Summary.Efficiency, g.GetProperty("efficiency").GetDouble());

        var nodes = root.GetProperty("nodes").EnumerateArray().ToArray();
        Assert.Equal(34, nodes.Length);
        for (int i = 0; i < 34; i++)
        {
            var n = nodes[i];
            var m = measures.Nodes[i];
            Assert.Equal($"n{i}", n.GetProperty("id").GetString());
            Assert.Equal(m.Channel, n.GetProperty("label").GetString());
            Assert.Equal(m.Degree, n.GetProperty("degree").GetInt32());
            // Doubles are written in the shortest round-trip form: networkx's float() gets back the same bits.
            Assert.Equal(m.Strength, n.GetProperty("strength").GetDouble());
            Assert.Equal(m.Clustering, n.GetProperty("clustering").GetDouble());
            Assert.Equal(m.WeightedClustering, n.GetProperty("clustering_weighted").GetDouble());
            Assert.Equal(m.Component, n.GetProperty("component").GetInt32());
            Assert.Equal(m.Module, n.GetProperty("module").GetInt32());
        }
        var edges = root.GetProperty("edges").EnumerateArray().ToArray();
        Assert.Equal(graph.EdgeCount, edges.Length);
        for (int k = 0; k < edges.Length; k++)
        {
            var e = graph.Edges[k];
            Assert.Equal($"n{e.A}", edges[k].GetProperty("source").GetString());
            Assert.Equal($"n{e.B}", edges[k].GetProperty("target").GetString());
            Assert.Equal(e.Weight, edges[k].GetProperty("weight").GetDouble());
            Assert.Equal(e.Z, edges[k].GetProperty("z").GetDouble());
        }

        // networkx's own measures on the graph it read: the same numbers the library computed (1e-12: sums in another order).
        var own = root.GetProperty("networkx_on_readback");
        var weighted = own.GetProperty("clustering_weighted").EnumerateArray().Select(v => v.GetDouble()).ToArray();
        for (int i = 0; i < 34; i++) Assert.Equal(weighted[i], measures.Nodes[i].WeightedClustering, 1e-12);
        Assert.Equal(own.GetProperty("efficiency").GetDouble(), measures.Summary.Efficiency, 1e-12);
        Assert.Equal(own.GetProperty("modularity_of_module_attribute").GetDouble(), measures.Summary.Modularity, 1e-12);
    }
}
