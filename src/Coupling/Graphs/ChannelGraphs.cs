using Coupling.Measures;
using Coupling.Outputs;
using Coupling.Results;
using QuikGraph;

namespace Coupling.Graphs;

/// <summary>Builds channel graphs from tested pair results.</summary>
public static class ChannelGraphs
{
    /// <summary>
    /// The graph of the significant pairs of <paramref name="result"/>: all channels as vertices, one undirected
    /// edge per pair whose <see cref="PairResult.Significant"/> is set, weighted by |value|; with degree and
    /// strength per channel.
    /// </summary>
    /// <remarks>
    /// Binary degree k_i = number of edges at i, strength s_i = sum of the weights at i, density 2E / (N(N-1)),
    /// after Rubinov M, Sporns O (2010). Complex network measures of brain connectivity: uses and interpretations.
    /// NeuroImage 52:1059-1069. A significant pair whose value is NaN gets weight NaN, which then shows in the
    /// strength of both channels rather than being silently dropped.
    /// </remarks>
    /// <exception cref="ArgumentException">The per-pair arrays do not match the channels, or labels repeat.</exception>
    public static ChannelGraph Build(PairResult result)
    {
        PairResultShape.Check(result);
        int c = result.Channels.Count;
        var graph = new UndirectedGraph<string, TaggedUndirectedEdge<string, double>>(allowParallelEdges: false);
        graph.AddVertexRange(result.Channels);

        var edges = new List<GraphEdge>();
        var byVertices = new Dictionary<(string, string), GraphEdge>();
        var degree = new int[c];
        var strength = new double[c];
        var comparer = Comparer<string>.Default;
        for (int k = 0; k < result.Significant.Length; k++)
        {
            if (!result.Significant[k]) continue;
            var (a, b) = PairIndex.Channels(k, c);
            double value = result.Value[k];
            var e = new GraphEdge(a, b, k, value, Math.Abs(value), result.Z[k], result.P[k], result.PCorrected[k]);
            edges.Add(e);
            string la = result.Channels[a], lb = result.Channels[b];
            var (source, target) = comparer.Compare(la, lb) <= 0 ? (la, lb) : (lb, la);
            graph.AddEdge(new TaggedUndirectedEdge<string, double>(source, target, e.Weight));
            byVertices[(source, target)] = e;
            degree[a]++; degree[b]++;
            strength[a] += e.Weight; strength[b] += e.Weight;
        }

        var nodes = new NodeSummary[c];
        for (int i = 0; i < c; i++) nodes[i] = new NodeSummary(result.Channels[i], i, degree[i], strength[i]);
        return new ChannelGraph(result.Condition, result.Band, result.Measure, graph, edges, nodes, byVertices);
    }
}
