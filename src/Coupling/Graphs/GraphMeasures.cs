using QuikGraph;
using QuikGraph.Algorithms.ConnectedComponents;
using QuikGraph.Algorithms.ShortestPath;

namespace Coupling.Graphs;

/// <summary>
/// Graph measures of a <see cref="ChannelGraph"/>: clustering, global efficiency, connected components and modularity.
/// Edge weights are the graph's |value| weights; structure (components, shortest paths) comes from QuikGraph.
/// </summary>
/// <remarks>
/// Definitions as collected by Rubinov M, Sporns O (2010), Complex network measures of brain connectivity: uses and
/// interpretations, NeuroImage 52:1059-1069 (Table A1), each with its original source on the method below.
/// A weight that is not finite (a significant pair whose value is NaN) leaves the binary measures and components
/// defined and makes the weighted ones NaN.
/// </remarks>
public static class GraphMeasures
{
    /// <summary>All measures of <paramref name="graph"/>, per channel and for the whole graph.</summary>
    public static GraphMeasureSet Compute(ChannelGraph graph)
    {
        ArgumentNullException.ThrowIfNull(graph);
        int n = graph.VertexCount;
        var clustering = Clustering(graph);
        var weighted = WeightedClustering(graph);
        var components = Components(graph);
        int[]? modules = ModularityDefined(graph) ? LouvainPartition.Find(graph) : null;

        var nodes = new NodeMeasures[n];
        for (int i = 0; i < n; i++)
        {
            var s = graph.Nodes[i];
            nodes[i] = new NodeMeasures(s.Channel, i, s.Degree, s.Strength, clustering[i], weighted[i], components[i], modules?[i]);
        }

        int componentCount = n == 0 ? 0 : components.Max();
        int largest = n == 0 ? 0 : components.GroupBy(c => c).Max(g => g.Count());
        var summary = new GraphSummary(
            n, graph.EdgeCount, graph.Density, componentCount, largest,
            n == 0 ? double.NaN : clustering.Average(),
            n == 0 ? double.NaN : weighted.Average(),
            GlobalEfficiency(graph),
            WeightedGlobalEfficiency(graph),
            modules is null ? 0 : modules.Max(),
            modules is null ? double.NaN : Modularity(graph, modules));
        return new GraphMeasureSet(nodes, summary);
    }

    /// <summary>
    /// Binary clustering coefficient of every channel: C_i = 2 t_i / (k_i (k_i - 1)), t_i the number of triangles
    /// through i and k_i its degree; 0 for k_i &lt; 2. In channel order.
    /// </summary>
    /// <remarks>Watts DJ, Strogatz SH (1998). Collective dynamics of 'small-world' networks. Nature 393:440-442.
    /// The value 0 below two neighbours follows networkx's <c>clustering</c>.</remarks>
    public static double[] Clustering(ChannelGraph graph)
    {
        ArgumentNullException.ThrowIfNull(graph);
        var adjacent = Adjacency(graph, out _);
        int n = graph.VertexCount;
        var c = new double[n];
        for (int i = 0; i < n; i++)
        {
            var nb = Neighbours(adjacent, i);
            int k = nb.Count;
            if (k < 2) continue;
            long triangles = 0;
            for (int x = 0; x < k; x++)
                for (int y = x + 1; y < k; y++)
                    if (adjacent[nb[x], nb[y]]) triangles++;
            c[i] = 2.0 * triangles / ((double)k * (k - 1));
        }
        return c;
    }

    /// <summary>
    /// Weighted clustering coefficient of every channel: C_i = 1 / (k_i (k_i - 1)) sum over ordered neighbour pairs
    /// (j, h) of (w_ij w_ih w_jh / max(w)^3)^(1/3), the geometric mean of the triangle's weights scaled by the largest
    /// weight of the graph; 0 for k_i &lt; 2; NaN for every channel when a weight is not finite. In channel order.
    /// </summary>
    /// <remarks>Onnela J-P, Saramäki J, Kertész J, Kaski K (2005). Intensity and coherence of motifs in weighted complex
    /// networks. Physical Review E 71:065103 (Eq. 4). The same definition as networkx's <c>clustering(G, weight=...)</c>.</remarks>
    public static double[] WeightedClustering(ChannelGraph graph)
    {
        ArgumentNullException.ThrowIfNull(graph);
        int n = graph.VertexCount;
        var c = new double[n];
        if (!WeightsFinite(graph)) { Array.Fill(c, double.NaN); return c; }
        var adjacent = Adjacency(graph, out var weight);
        double max = graph.Edges.Count == 0 ? 0 : graph.Edges.Max(e => e.Weight);
        if (max == 0) return c;
        for (int i = 0; i < n; i++)
        {
            var nb = Neighbours(adjacent, i);
            int k = nb.Count;
            if (k < 2) continue;
            double sum = 0;
            for (int x = 0; x < k; x++)
                for (int y = x + 1; y < k; y++)
                {
                    int j = nb[x], h = nb[y];
                    if (!adjacent[j, h]) continue;
                    sum += Math.Cbrt(weight[i, j] / max * (weight[i, h] / max) * (weight[j, h] / max));
                }
            c[i] = 2.0 * sum / ((double)k * (k - 1));
        }
        return c;
    }

    /// <summary>
    /// Binary global efficiency: E = 1 / (N (N - 1)) sum over ordered pairs i != j of 1 / d_ij, d_ij the number of
    /// edges on a shortest path (1 / d = 0 between components); 0 below two channels.
    /// </summary>
    /// <remarks>Latora V, Marchiori M (2001). Efficient behavior of small-world networks. Physical Review Letters
    /// 87:198701 (Eq. 2). Shortest paths by QuikGraph's Dijkstra search with unit lengths.</remarks>
    public static double GlobalEfficiency(ChannelGraph graph)
    {
        ArgumentNullException.ThrowIfNull(graph);
        return Efficiency(graph, _ => 1.0);
    }

    /// <summary>
    /// Weighted global efficiency: as <see cref="GlobalEfficiency"/> with d_ij the shortest weighted path length,
    /// each edge's length being 1 / weight (stronger coupling, shorter path); NaN when a weight is not finite.
    /// </summary>
    /// <remarks>Latora V, Marchiori M (2001), Phys Rev Lett 87:198701, with the weighted path length of Rubinov M,
    /// Sporns O (2010), NeuroImage 52:1059-1069 (Table A1, "weighted global efficiency"; their cube-root variant is
    /// not used). The weights are not rescaled, so the value carries the measure's units inverted.</remarks>
    public static double WeightedGlobalEfficiency(ChannelGraph graph)
    {
        ArgumentNullException.ThrowIfNull(graph);
        if (!WeightsFinite(graph)) return double.NaN;
        return Efficiency(graph, e => 1.0 / e.Tag);
    }

    /// <summary>
    /// Connected component of every channel (channel order), numbered from 1 in the order of each component's first
    /// channel; an isolated channel is a component of its own. Found by QuikGraph's connected-components search.
    /// </summary>
    public static int[] Components(ChannelGraph graph)
    {
        ArgumentNullException.ThrowIfNull(graph);
        var search = new ConnectedComponentsAlgorithm<string, TaggedUndirectedEdge<string, double>>(graph.Graph);
        search.Compute();
        return Renumber(graph.Nodes.Select(n => search.Components[n.Channel]).ToArray());
    }

    /// <summary>
    /// Weighted modularity of a partition: Q = sum over modules c of [ W_c / m - (S_c / 2m)^2 ], W_c the total weight
    /// of the edges inside c, S_c the total strength of its channels and m the total weight of the graph (with unit
    /// weights, the count of edges). NaN when the graph has no edge or a weight is not finite.
    /// </summary>
    /// <param name="graph">The graph.</param>
    /// <param name="modules">A module label per channel, in channel order (any integers).</param>
    /// <remarks>Newman MEJ, Girvan M (2004). Finding and evaluating community structure in networks. Physical Review E
    /// 69:026113 (Eq. 5); weighted form: Newman MEJ (2004), Analysis of weighted networks, Physical Review E 70:056131
    /// (Eq. 7). The same quantity as networkx's <c>community.modularity</c> with resolution 1.</remarks>
    /// <exception cref="ArgumentException">There is not one label per channel.</exception>
    public static double Modularity(ChannelGraph graph, IReadOnlyList<int> modules)
    {
        ArgumentNullException.ThrowIfNull(graph);
        ArgumentNullException.ThrowIfNull(modules);
        if (modules.Count != graph.VertexCount)
            throw new ArgumentException($"{modules.Count} module labels for {graph.VertexCount} channels.", nameof(modules));
        if (!ModularityDefined(graph)) return double.NaN;
        double m = graph.TotalWeight;
        var inside = new Dictionary<int, double>();
        var strength = new Dictionary<int, double>();
        foreach (var e in graph.Edges)
            if (modules[e.A] == modules[e.B])
                inside[modules[e.A]] = inside.GetValueOrDefault(modules[e.A]) + e.Weight;
        foreach (var node in graph.Nodes)
            strength[modules[node.Index]] = strength.GetValueOrDefault(modules[node.Index]) + node.Strength;
        double q = 0;
        foreach (var (module, s) in strength)
        {
            double share = s / (2 * m);
            q += inside.GetValueOrDefault(module) / m - share * share;
        }
        return q;
    }

    /// <summary>Whether modularity is defined: at least one edge, every weight finite, total weight above 0.</summary>
    internal static bool ModularityDefined(ChannelGraph graph) =>
        graph.EdgeCount > 0 && WeightsFinite(graph) && graph.TotalWeight > 0;

    /// <summary>Labels renumbered 1, 2, ... in order of first appearance.</summary>
    internal static int[] Renumber(IReadOnlyList<int> labels)
    {
        var map = new Dictionary<int, int>();
        var result = new int[labels.Count];
        for (int i = 0; i < labels.Count; i++)
        {
            if (!map.TryGetValue(labels[i], out int id)) map[labels[i]] = id = map.Count + 1;
            result[i] = id;
        }
        return result;
    }

    private static bool WeightsFinite(ChannelGraph graph) => graph.Edges.All(e => double.IsFinite(e.Weight));

    private static double Efficiency(ChannelGraph graph, Func<TaggedUndirectedEdge<string, double>, double> length)
    {
        int n = graph.VertexCount;
        if (n < 2) return 0;
        double sum = 0;
        foreach (var source in graph.Nodes)
        {
            if (source.Degree == 0) continue;
            var search = new UndirectedDijkstraShortestPathAlgorithm<string, TaggedUndirectedEdge<string, double>>(graph.Graph, length);
            search.Compute(source.Channel);
            foreach (var target in graph.Nodes)
            {
                if (target.Index == source.Index) continue;
                if (search.TryGetDistance(target.Channel, out double d) && d > 0 && d < double.MaxValue)
                    sum += 1.0 / d;
            }
        }
        return sum / ((double)n * (n - 1));
    }

    private static bool[,] Adjacency(ChannelGraph graph, out double[,] weight)
    {
        int n = graph.VertexCount;
        var adjacent = new bool[n, n];
        weight = new double[n, n];
        foreach (var e in graph.Edges)
        {
            adjacent[e.A, e.B] = adjacent[e.B, e.A] = true;
            weight[e.A, e.B] = weight[e.B, e.A] = e.Weight;
        }
        return adjacent;
    }

    private static List<int> Neighbours(bool[,] adjacent, int i)
    {
        var list = new List<int>();
        for (int j = 0; j < adjacent.GetLength(1); j++)
            if (j != i && adjacent[i, j]) list.Add(j);
        return list;
    }
}
