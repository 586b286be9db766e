using Coupling.Graphs;
using Coupling.Results;
using Coupling.Tests.Outputs;

namespace Coupling.Tests.Graphs;

public class ChannelGraphsTests
{
    // Degree k_i = number of edges at i; strength s_i = sum of |w_ij|; density 2E/(N(N-1)):
    // Rubinov & Sporns (2010), Complex network measures of brain connectivity, NeuroImage 52:1059, Table A1.
    // The expected numbers below are worked out by hand from SampleResults.FourChannels:
    // edges Pz-Cz |0.5|, Pz-Fz |-0.3|, Fz-Oz |0.2|.

    [Fact]
    public void Every_channel_is_a_vertex_and_only_significant_pairs_are_edges()
    {
        var g = ChannelGraphs.Build(SampleResults.FourChannels());
        Assert.Equal(4, g.Graph.VertexCount);
        Assert.Equal(["Pz", "Cz", "Fz", "Oz"], g.Graph.Vertices.OrderBy(v => Array.IndexOf(new[] { "Pz", "Cz", "Fz", "Oz" }, v)));
        Assert.Equal(3, g.Graph.EdgeCount);
        Assert.Equal(3, g.EdgeCount);
        Assert.NotNull(g.Between("Cz", "Pz"));
        Assert.NotNull(g.Between("Pz", "Fz"));
        Assert.NotNull(g.Between("Oz", "Fz"));
        Assert.Null(g.Between("Cz", "Fz")); // 0.9 but not significant
        Assert.Null(g.Between("Cz", "Oz"));
    }

    [Fact]
    public void Degree_and_strength_match_the_hand_computed_values()
    {
        var g = ChannelGraphs.Build(SampleResults.FourChannels());
        // Pz: Pz-Cz, Pz-Fz -> k=2, s=0.5+0.3; Cz: Pz-Cz -> k=1, s=0.5; Fz: Pz-Fz, Fz-Oz -> k=2, s=0.3+0.2; Oz: k=1, s=0.2.
        Assert.Equal([2, 1, 2, 1], g.Nodes.Select(n => n.Degree));
        var expected = new[] { 0.8, 0.5, 0.5, 0.2 };
        for (int i = 0; i < 4; i++)
            Assert.Equal(expected[i], g.Nodes[i].Strength, 1e-15); // sums of two doubles: rounding at 1 ulp (~1e-16)
        Assert.Equal(["Pz", "Cz", "Fz", "Oz"], g.Nodes.Select(n => n.Channel));
    }

    [Fact]
    public void Node_degree_agrees_with_quikgraph_adjacent_degree()
    {
        var g = ChannelGraphs.Build(SampleResults.Grid(9, (a, b) => (a * b) % 3 == 1));
        foreach (var node in g.Nodes)
            Assert.Equal(g.Graph.AdjacentDegree(node.Channel), node.Degree);
        foreach (var node in g.Nodes)
            Assert.Equal(g.Graph.AdjacentEdges(node.Channel).Sum(e => e.Tag), node.Strength, 1e-12);
    }

    [Fact]
    public void Density_is_the_share_of_possible_pairs_that_are_edges()
    {
        // 3 edges of 4*3/2 = 6 possible pairs.
        Assert.Equal(0.5, ChannelGraphs.Build(SampleResults.FourChannels()).Density);
        Assert.Equal(1.0, ChannelGraphs.Build(SampleResults.Grid(5, (_, _) => true)).Density);
        var empty = ChannelGraphs.Build(SampleResults.Grid(5, (_, _) => false));
        Assert.Equal(0.0, empty.Density);
        Assert.All(empty.Nodes, n => { Assert.Equal(0, n.Degree); Assert.Equal(0.0, n.Strength); });
    }

    [Fact]
    public void Edge_tag_is_the_absolute_value_and_the_signed_value_stays_available()
    {
        var g = ChannelGraphs.Build(SampleResults.FourChannels());
        var pzFz = g.Graph.Edges.Single(e => (e.Source, e.Target) is ("Fz", "Pz") or ("Pz", "Fz"));
        Assert.Equal(0.3, pzFz.Tag);
        Assert.Equal(-0.3, g.Details(pzFz).Value);
        Assert.Equal(1, g.Details(pzFz).Pair);
        Assert.Equal(0.004, g.Details(pzFz).PCorrected);
        Assert.Equal(1.0, g.TotalWeight, 1e-15); // 0.5 + 0.3 + 0.2
    }

    [Fact]
    public void Mismatched_array_lengths_are_refused()
    {
        var r = SampleResults.FourChannels() with { Z = [1.0, 2.0] };
        Assert.Throws<ArgumentException>(() => ChannelGraphs.Build(r));
    }

    [Fact]
    public void Repeated_channel_labels_are_refused()
    {
        var r = SampleResults.FourChannels() with { Channels = ["Pz", "Cz", "Pz", "Oz"] };
        Assert.Throws<ArgumentException>(() => ChannelGraphs.Build(r));
    }
}
