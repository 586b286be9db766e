using System.Xml;
using System.Xml.Linq;
using Coupling.Graphs;
using Coupling.Outputs;

namespace Coupling.Tests.Outputs;

public class GraphMlWriterTests
{
    // Structure per the GraphML primer (Brandes, Eiglsperger, Lerner; graphml.graphdrawing.org/primer):
    // <graphml xmlns="http://graphml.graphdrawing.org/xmlns"> with <key id for attr.name attr.type>, then
    // <graph edgedefault> holding <node id> and <edge source target>, each with <data key>.
    private static readonly XNamespace G = "http://graphml.graphdrawing.org/xmlns";

    private static XDocument WriteAndParse(TempFolder dir, Coupling.Results.PairResult r)
    {
        var graph = ChannelGraphs.Build(r);
        GraphMlWriter.Write(graph, r, dir["g.graphml"]);
        return XDocument.Load(dir["g.graphml"]);
    }

    private static Dictionary<string, string> DataOf(XElement element, Dictionary<string, string> keyNames) =>
        element.Elements(G + "data").ToDictionary(d => keyNames[(string)d.Attribute("key")!], d => d.Value);

    [Fact]
    public void The_file_parses_as_graphml_with_one_undirected_graph()
    {
        using var dir = new TempFolder();
        var doc = WriteAndParse(dir, SampleResults.FourChannels());
        Assert.Equal(G + "graphml", doc.Root!.Name);
        var graph = Assert.Single(doc.Root.Elements(G + "graph"));
        Assert.Equal("undirected", (string?)graph.Attribute("edgedefault"));
        Assert.Equal(4, graph.Elements(G + "node").Count());
        Assert.Equal(3, graph.Elements(G + "edge").Count());
        Assert.Equal(["g.graphml"], dir.Entries());
    }

    [Fact]
    public void Keys_are_declared_for_every_attribute_with_its_domain_and_type()
    {
        using var dir = new TempFolder();
        var doc = WriteAndParse(dir, SampleResults.FourChannels(withPositions: true));
        var keys = doc.Root!.Elements(G + "key")
            .Select(k => ((string)k.Attribute("for")!, (string)k.Attribute("attr.name")!, (string)k.Attribute("attr.type")!))
            .ToHashSet();
        (string, string, string)[] expected =
        [
            ("graph", "condition", "string"), ("graph", "band", "string"), ("graph", "measure", "string"),
            ("graph", "components", "int"), ("graph", "modules", "int"), ("graph", "modularity", "double"),
            ("graph", "efficiency", "double"), ("graph", "efficiency_weighted", "double"),
            ("graph", "clustering", "double"), ("graph", "clustering_weighted", "double"),
            ("node", "label", "string"), ("node", "x", "double"), ("node", "y", "double"),
            ("node", "degree", "int"), ("node", "strength", "double"),
            ("node", "clustering", "double"), ("node", "clustering_weighted", "double"),
            ("node", "component", "int"), ("node", "module", "int"),
            ("edge", "weight", "double"), ("edge", "value", "double"), ("edge", "z", "double"),
            ("edge", "p", "double"), ("edge", "p_corrected", "double"),
        ];
        Assert.Equal(expected.ToHashSet(), keys);
        // Every data element refers to a declared key of its own domain.
        var domainOf = doc.Root.Elements(G + "key").ToDictionary(k => (string)k.Attribute("id")!, k => (string)k.Attribute("for")!);
        foreach (var data in doc.Descendants(G + "data"))
            Assert.Equal(data.Parent!.Name.LocalName, domainOf[(string)data.Attribute("key")!]);
    }

    [Fact]
    public void Positions_are_left_out_when_the_result_has_none()
    {
        using var dir = new TempFolder();
        var doc = WriteAndParse(dir, SampleResults.FourChannels());
        var names = doc.Root!.Elements(G + "key").Select(k => (string)k.Attribute("attr.name")!).ToArray();
        Assert.DoesNotContain("x", names);
        Assert.DoesNotContain("y", names);
    }

    [Fact]
    public void Nodes_and_edges_carry_the_right_values()
    {
        using var dir = new TempFolder();
        var r = SampleResults.FourChannels(withPositions: true);
        var doc = WriteAndParse(dir, r);
        var keyNames = doc.Root!.Elements(G + "key").ToDictionary(k => (string)k.Attribute("id")!, k => (string)k.Attribute("attr.name")!);
        var graph = doc.Root.Element(G + "graph")!;

        var graphData = DataOf(graph, keyNames);
        Assert.Equal(("rest", "alpha", "plv"), (graphData["condition"], graphData["band"], graphData["measure"]));

        var nodes = graph.Elements(G + "node").ToDictionary(n => (string)n.Attribute("id")!, n => DataOf(n, keyNames));
        Assert.Equal(["Pz", "Cz", "Fz", "Oz"], nodes.Values.Select(n => n["label"]));
        // Degrees and strengths by hand (see ChannelGraphsTests): Pz 2 / 0.8, Cz 1 / 0.5, Fz 2 / 0.5, Oz 1 / 0.2.
        Assert.Equal(["2", "1", "2", "1"], nodes.Values.Select(n => n["degree"]));
        Assert.Equal(0.8, XmlConvert.ToDouble(nodes["n0"]["strength"]), 1e-15);
        Assert.Equal(0.2, XmlConvert.ToDouble(nodes["n3"]["strength"]));
        Assert.Equal(0.6, XmlConvert.ToDouble(nodes["n2"]["y"]));
        Assert.Equal(-0.9, XmlConvert.ToDouble(nodes["n3"]["y"]));

        var edges = graph.Elements(G + "edge").ToDictionary(
            e => ((string)e.Attribute("source")!, (string)e.Attribute("target")!), e => DataOf(e, keyNames));
        Assert.Equal([("n0", "n1"), ("n0", "n2"), ("n2", "n3")], edges.Keys);
        var pzFz = edges[("n0", "n2")];
        Assert.Equal(0.3, XmlConvert.ToDouble(pzFz["weight"]));
        Assert.Equal(-0.3, XmlConvert.ToDouble(pzFz["value"]));
        Assert.Equal(-3.5, XmlConvert.ToDouble(pzFz["z"]));
        Assert.Equal(0.002, XmlConvert.ToDouble(pzFz["p"]));
        Assert.Equal(0.004, XmlConvert.ToDouble(pzFz["p_corrected"]));
    }

    [Fact]
    public void Special_characters_in_labels_survive_the_round_trip()
    {
        using var dir = new TempFolder();
        var r = SampleResults.FourChannels() with { Channels = ["A<1>", "B&2", "C\"3'", "Ω4"] };
        var doc = WriteAndParse(dir, r);
        var labels = doc.Descendants(G + "node").Select(n => n.Element(G + "data")!.Value);
        Assert.Equal(["A<1>", "B&2", "C\"3'", "Ω4"], labels);
    }

    [Fact]
    public void A_graph_from_another_result_is_refused()
    {
        using var dir = new TempFolder();
        var r = SampleResults.FourChannels();
        var other = ChannelGraphs.Build(r with { Band = "beta" });
        Assert.Throws<ArgumentException>(() => GraphMlWriter.Write(other, r, dir["x.graphml"]));
        Assert.Empty(dir.Entries());
    }
}
