using Coupling.Graphs;
using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Tests.Graphs;

public class GraphMeasuresTests
{
    // Reference: networkx 2.8.8 (Debian python3-networkx 2.8.8-1) on Zachary's karate-club network (Zachary 1977),
    // Fixtures/Graphs/karate_networkx.json. networkx sums the same terms in another order: both sides round at about
    // 1e-16 per operation over at most a few thousand operations, so 1e-12 absolute leaves a wide margin.
    private const double Tolerance = 1e-12;

    public static TheoryData<string> Variants => new() { "binary", "weighted", "strong" };

    [Fact]
    public void The_karate_network_has_34_members_and_78_ties()
    {
        // Zachary (1977), Fig. 1 / Table 1: 34 members, 78 ties observed outside the club.
        var g = KarateFixture.Graph("binary");
        Assert.Equal(34, g.VertexCount);
        Assert.Equal(78, g.EdgeCount);
    }

    [Theory]
    [MemberData(nameof(Variants))]
    public void Clustering_matches_networkx(string variant)
    {
        // Watts & Strogatz (1998) binary and Onnela et al. (2005) weighted clustering; networkx clustering().
        var expected = KarateFixture.Variant(variant);
        var g = KarateFixture.Graph(variant);
        var binary = GraphMeasures.Clustering(g);
        var weighted = GraphMeasures.WeightedClustering(g);
        var nxBinary = expected.Doubles("clustering");
        var nxWeighted = expected.Doubles("clustering_weighted");
        for (int i = 0; i < 34; i++)
        {
            Assert.Equal(nxBinary[i], binary[i], Tolerance);
            Assert.Equal(nxWeighted[i], weighted[i], Tolerance);
        }
        var summary = g.Measures.Summary;
        Assert.Equal(expected.GetProperty("average_clustering").GetDouble(), summary.Clustering, Tolerance);
        Assert.Equal(expected.GetProperty("average_clustering_weighted").GetDouble(), summary.WeightedClustering, Tolerance);
    }

    [Theory]
    [MemberData(nameof(Variants))]
    public void Global_efficiency_matches_networkx(string variant)
    {
        // Latora & Marchiori (2001): networkx global_efficiency; weighted with length 1/w: networkx Dijkstra lengths.
        var expected = KarateFixture.Variant(variant);
        var g = KarateFixture.Graph(variant);
        Assert.Equal(expected.GetProperty("efficiency").GetDouble(), GraphMeasures.GlobalEfficiency(g), Tolerance);
        Assert.Equal(expected.GetProperty("efficiency_weighted").GetDouble(), GraphMeasures.WeightedGlobalEfficiency(g), Tolerance);
    }

    [Theory]
    [MemberData(nameof(Variants))]
    public void Components_match_networkx(string variant)
    {
        var expected = KarateFixture.Variant(variant);
        var g = KarateFixture.Graph(variant);
        Assert.Equal(expected.Ints("component_of"), GraphMeasures.Components(g));
        Assert.Equal(expected.GetProperty("components").GetInt32(), g.Measures.Summary.Components);
    }

    [Theory]
    [MemberData(nameof(Variants))]
    public void Modularity_of_a_given_partition_matches_networkx(string variant)
    {
        // Newman & Girvan (2004) / Newman (2004, weighted): networkx community.modularity of the club's split and of
        // every partition networkx's own Louvain run found.
        var expected = KarateFixture.Variant(variant);
        var g = KarateFixture.Graph(variant);
        Assert.Equal(expected.GetProperty("split_modularity").GetDouble(), GraphMeasures.Modularity(g, expected.Ints("split")), Tolerance);
        foreach (var run in expected.GetProperty("louvain").EnumerateArray())
            Assert.Equal(run.GetProperty("modularity").GetDouble(), GraphMeasures.Modularity(g, run.Ints("modules")), Tolerance);
    }

    [Theory]
    [MemberData(nameof(Variants))]
    public void The_louvain_partition_is_as_good_as_networkx_louvain(string variant)
    {
        // Blondel et al. (2008): a local optimum; networkx's louvain_communities over ten seeds gives the range that
        // the method reaches on this network. The deterministic order must land inside or above its lowest value.
        var expected = KarateFixture.Variant(variant);
        var g = KarateFixture.Graph(variant);
        var runs = expected.GetProperty("louvain").EnumerateArray().Select(r => r.GetProperty("modularity").GetDouble()).ToArray();
        double q = g.Measures.Summary.Modularity;
        Assert.True(q >= runs.Min() - Tolerance, $"Q = {q}, networkx Louvain from {runs.Min()} to {runs.Max()}");
        Assert.Equal(GraphMeasures.Modularity(g, LouvainPartition.Find(g)), q, Tolerance);
        Assert.Equal(g.Measures.Summary.Modules, g.Measures.Nodes.Max(n => n.Module));
        if (variant == "binary")
        {
            // The largest modularity of the unweighted network is 0.4198 (Brandes et al. 2008, On modularity clustering,
            // IEEE TKDE 20:172-188; from memory), matched by the best networkx run here: no partition may exceed it.
            Assert.True(q <= runs.Max() + Tolerance);
        }
    }

    [Fact]
    public void The_louvain_partition_is_the_same_on_every_call()
    {
        var g = KarateFixture.Graph("weighted");
        Assert.Equal(LouvainPartition.Find(g), LouvainPartition.Find(KarateFixture.Graph("weighted")));
    }

    // Small graphs worked out by hand from the definitions.

    [Fact]
    public void A_triangle_with_a_pendant_has_the_clustering_and_efficiency_worked_out_by_hand()
    {
        // Edges 0-1, 0-2, 1-2, 0-3. Node 0: k = 3, one triangle -> 2*1/(3*2) = 1/3; nodes 1 and 2: 1; node 3: k = 1 -> 0.
        // Distances: four pairs at 1, 1-3 and 2-3 at 2 -> sum 1/d over ordered pairs 2 * (4 + 1/2 + 1/2) = 10; E = 10/12.
        var g = Build(4, (0, 1, 1), (0, 2, 1), (1, 2, 1), (0, 3, 1));
        Assert.Equal([1.0 / 3, 1, 1, 0], GraphMeasures.Clustering(g));
        Assert.Equal(10.0 / 12, GraphMeasures.GlobalEfficiency(g), 1e-15);
        Assert.Equal([1, 1, 1, 1], GraphMeasures.Components(g));
    }

    [Fact]
    public void Weighted_clustering_is_the_geometric_mean_of_the_triangle_weights_over_the_largest()
    {
        // Onnela et al. (2005), Eq. 4: triangle weights 1, 1, 1/8 -> (1 * 1 * 1/8)^(1/3) = 1/2 at every corner (k = 2).
        var g = Build(3, (0, 1, 1), (0, 2, 1), (1, 2, 0.125));
        Assert.All(GraphMeasures.WeightedClustering(g), c => Assert.Equal(0.5, c, 1e-15)); // one cube root: rounding ~1e-16
    }

    [Fact]
    public void Weighted_efficiency_uses_inverse_weights_as_lengths()
    {
        // Path 0-1-2 with weights 1/2 and 1/4: lengths 2 and 4, d02 = 6. Ordered sum 2 (1/2 + 1/4 + 1/6) = 11/6; / (3 * 2).
        var g = Build(3, (0, 1, 0.5), (1, 2, 0.25));
        Assert.Equal(11.0 / 36, GraphMeasures.WeightedGlobalEfficiency(g), 1e-15);
        Assert.Equal((2 * (1 + 1 + 0.5)) / 6.0, GraphMeasures.GlobalEfficiency(g), 1e-15);
    }

    [Fact]
    public void Two_separate_edges_are_two_components_and_two_modules_with_modularity_one_half()
    {
        // m = 2; each module holds one edge (W_c = 1) and strength 2: Q = 2 (1/2 - (2/4)^2) = 1/2 (Newman & Girvan 2004, Eq. 5).
        var g = Build(5, (0, 1, 1), (2, 3, 1));
        Assert.Equal([1, 1, 2, 2, 3], GraphMeasures.Components(g));
        Assert.Equal([1, 1, 2, 2, 3], LouvainPartition.Find(g));
        Assert.Equal(0.5, g.Measures.Summary.Modularity, 1e-15);
        Assert.Equal(3, g.Measures.Summary.Components);
        Assert.Equal(2, g.Measures.Summary.LargestComponent);
        Assert.Equal(1.0 / 3 * 4 / 5 * 3 / 4, GraphMeasures.GlobalEfficiency(g), 1e-15); // 4 ordered pairs at d = 1 of 20
    }

    [Fact]
    public void Two_triangles_joined_by_one_edge_split_into_the_two_triangles()
    {
        // m = 7; modules {0,1,2} and {3,4,5}: W_c = 3, S_c = 7 each -> Q = 2 (3/7 - (7/14)^2) = 6/7 - 1/2 = 5/14.
        var g = Build(6, (0, 1, 1), (0, 2, 1), (1, 2, 1), (3, 4, 1), (3, 5, 1), (4, 5, 1), (2, 3, 1));
        Assert.Equal([1, 1, 1, 2, 2, 2], LouvainPartition.Find(g));
        Assert.Equal(5.0 / 14, g.Measures.Summary.Modularity, 1e-15);
    }

    [Fact]
    public void A_graph_without_edges_has_undefined_modularity_and_isolated_components()
    {
        var g = Build(3);
        var m = g.Measures;
        Assert.True(double.IsNaN(m.Summary.Modularity));
        Assert.Equal(0, m.Summary.Modules);
        Assert.All(m.Nodes, n => Assert.Null(n.Module));
        Assert.Equal(3, m.Summary.Components);
        Assert.Equal(0, m.Summary.Efficiency);
        Assert.Equal(0, m.Summary.Clustering);
    }

    [Fact]
    public void A_nan_weight_makes_the_weighted_measures_nan_and_keeps_the_binary_ones()
    {
        var g = Build(3, (0, 1, double.NaN), (1, 2, 1), (0, 2, 1));
        Assert.All(GraphMeasures.WeightedClustering(g), c => Assert.True(double.IsNaN(c)));
        Assert.True(double.IsNaN(GraphMeasures.WeightedGlobalEfficiency(g)));
        Assert.True(double.IsNaN(g.Measures.Summary.Modularity));
        Assert.Equal([1.0, 1, 1], GraphMeasures.Clustering(g));
        Assert.Equal(1, GraphMeasures.GlobalEfficiency(g));
    }

    private static ChannelGraph Build(int channels, params (int A, int B, double W)[] edges)
    {
        int n = PairIndex.Count(channels);
        var value = new double[n];
        var sig = new bool[n];
        foreach (var (a, b, w) in edges)
        {
            value[PairIndex.Of(a, b, channels)] = w;
            sig[PairIndex.Of(a, b, channels)] = true;
        }
        var labels = Enumerable.Range(0, channels).Select(i => $"c{i}").ToArray();
        return ChannelGraphs.Build(new PairResult("c", "b", "plv", labels, value, new double[n], new double[n], new double[n], sig));
    }
}
