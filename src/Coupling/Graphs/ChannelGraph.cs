using QuikGraph;

namespace Coupling.Graphs;

/// <summary>
/// The significant pairs of one result as an undirected weighted graph: every channel is a vertex, every
/// significant pair an edge tagged with its weight |value|; built by <see cref="ChannelGraphs.Build"/>.
/// </summary>
public sealed class ChannelGraph
{
    private readonly Dictionary<(string, string), GraphEdge> _byVertices;
    private readonly Lazy<GraphMeasureSet> _measures;

    internal ChannelGraph(
        string condition, string band, string measure,
        UndirectedGraph<string, TaggedUndirectedEdge<string, double>> graph,
        IReadOnlyList<GraphEdge> edges, IReadOnlyList<NodeSummary> nodes,
        Dictionary<(string, string), GraphEdge> byVertices)
    {
        Condition = condition;
        Band = band;
        Measure = measure;
        Graph = graph;
        Edges = edges;
        Nodes = nodes;
        _byVertices = byVertices;
        _measures = new Lazy<GraphMeasureSet>(() => GraphMeasures.Compute(this));
    }

    /// <summary>Condition name of the source result.</summary>
    public string Condition { get; }

    /// <summary>Band name of the source result.</summary>
    public string Band { get; }

    /// <summary>Measure key of the source result.</summary>
    public string Measure { get; }

    /// <summary>
    /// The QuikGraph graph: vertices are channel labels, edge tags are weights |value|. For each edge
    /// <c>Source</c> is the lower label by <see cref="Comparer{T}.Default"/>, as QuikGraph requires.
    /// </summary>
    public UndirectedGraph<string, TaggedUndirectedEdge<string, double>> Graph { get; }

    /// <summary>The significant pairs in <see cref="Measures.PairIndex"/> order, with signed values and statistics.</summary>
    public IReadOnlyList<GraphEdge> Edges { get; }

    /// <summary>Degree and strength of every channel, in channel order.</summary>
    public IReadOnlyList<NodeSummary> Nodes { get; }

    /// <summary>Clustering, efficiency, components and modules (<see cref="GraphMeasures.Compute"/>), computed on first use.</summary>
    public GraphMeasureSet Measures => _measures.Value;

    /// <summary>Number of vertices (channels).</summary>
    public int VertexCount => Nodes.Count;

    /// <summary>Number of edges (significant pairs).</summary>
    public int EdgeCount => Edges.Count;

    /// <summary>
    /// Edge density 2E / (N (N - 1)): the share of all channel pairs that are edges; NaN for fewer than two channels.
    /// </summary>
    /// <remarks>Rubinov M, Sporns O (2010). NeuroImage 52:1059-1069 (connection density).</remarks>
    public double Density => VertexCount < 2 ? double.NaN : 2.0 * EdgeCount / ((double)VertexCount * (VertexCount - 1));

    /// <summary>Total weight: sum of |value| over the edges.</summary>
    public double TotalWeight => Edges.Sum(e => e.Weight);

    /// <summary>The signed value and statistics of a graph edge.</summary>
    /// <exception cref="KeyNotFoundException">The edge is not one of this graph's.</exception>
    public GraphEdge Details(TaggedUndirectedEdge<string, double> edge)
    {
        ArgumentNullException.ThrowIfNull(edge);
        return _byVertices[(edge.Source, edge.Target)];
    }

    /// <summary>The edge between two channels (in either order), or null when that pair is not significant.</summary>
    public GraphEdge? Between(string channelA, string channelB)
    {
        var key = Comparer<string>.Default.Compare(channelA, channelB) <= 0 ? (channelA, channelB) : (channelB, channelA);
        return _byVertices.TryGetValue(key, out var e) ? e : null;
    }
}
