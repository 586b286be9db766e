using System.Text;
using System.Xml;
using Coupling.Graphs;
using Coupling.Results;

namespace Coupling.Outputs;

/// <summary>Writes a <see cref="ChannelGraph"/> as a GraphML file.</summary>
/// <remarks>
/// Follows the GraphML format: Brandes U, Eiglsperger M, Lerner J, Pich C, "Graph Markup Language (GraphML)",
/// in Tamassia R (ed.), Handbook of Graph Drawing and Visualization (2013), and the GraphML primer at
/// graphml.graphdrawing.org. One undirected <c>graph</c> (edgedefault="undirected"); a node per channel with id
/// <c>n&lt;index&gt;</c> in channel order; an edge per significant pair with id <c>e&lt;pair index&gt;</c>,
/// source the lower channel index. Declared keys (GraphML-Attributes): graph condition, band, measure
/// (string); node label (string), x and y (double, declared only when the result has positions, written for
/// the channels that have one), degree (int), strength (double), clustering, clustering_weighted (double),
/// component (int), module (int, only where modularity is defined); graph measures of <see cref="GraphSummary"/>
/// (components, modules: int; efficiency, efficiency_weighted, modularity, clustering, clustering_weighted: double);
/// edge weight = |value|, value, z, p, p_corrected (double). Doubles use the XML Schema lexical form (shortest round-trip, NaN, INF, -INF).
/// </remarks>
public static class GraphMlWriter
{
    /// <summary>The GraphML namespace.</summary>
    public const string Namespace = "http://graphml.graphdrawing.org/xmlns";

    private const string SchemaInstance = "http://www.w3.org/2001/XMLSchema-instance";
    private const string SchemaLocation = Namespace + " http://graphml.graphdrawing.org/xmlns/1.0/graphml.xsd";

    /// <summary>Writes <paramref name="graph"/>, built from <paramref name="result"/>, to <paramref name="path"/> atomically.</summary>
    /// <exception cref="ArgumentException">The graph was not built from this result.</exception>
    public static void Write(ChannelGraph graph, PairResult result, string path)
    {
        ArgumentNullException.ThrowIfNull(graph);
        PairResultShape.Check(result);
        if (graph.VertexCount != result.Channels.Count || graph.Condition != result.Condition
            || graph.Band != result.Band || graph.Measure != result.Measure)
            throw new ArgumentException(
                $"Graph {graph.Condition}/{graph.Band}/{graph.Measure} was not built from result {result.Condition}/{result.Band}/{result.Measure}.");

        bool positions = result.Positions is not null && result.Positions.Any(p => p.HasValue);
        var settings = new XmlWriterSettings
        {
            Encoding = new UTF8Encoding(false),
            Indent = true,
            IndentChars = "  ",
            NewLineChars = "\n",
            CloseOutput = false,
        };
        using var stream = AtomicFile.Create(path);
        using (var w = XmlWriter.Create(stream, settings))
        {
            w.WriteStartDocument();
            w.WriteStartElement("graphml", Namespace);
            w.WriteAttributeString("xmlns", "xsi", null, SchemaInstance);
            w.WriteAttributeString("schemaLocation", SchemaInstance, SchemaLocation);

            Key(w, "g_condition", "graph", "condition", "string");
            Key(w, "g_band", "graph", "band", "string");
            Key(w, "g_measure", "graph", "measure", "string");
            Key(w, "g_components", "graph", "components", "int");
            Key(w, "g_modules", "graph", "modules", "int");
            Key(w, "g_modularity", "graph", "modularity", "double");
            Key(w, "g_efficiency", "graph", "efficiency", "double");
            Key(w, "g_efficiency_weighted", "graph", "efficiency_weighted", "double");
            Key(w, "g_clustering", "graph", "clustering", "double");
            Key(w, "g_clustering_weighted", "graph", "clustering_weighted", "double");
            Key(w, "n_label", "node", "label", "string");
            if (positions)
            {
                Key(w, "n_x", "node", "x", "double");
                Key(w, "n_y", "node", "y", "double");
            }
            Key(w, "n_degree", "node", "degree", "int");
            Key(w, "n_strength", "node", "strength", "double");
            Key(w, "n_clustering", "node", "clustering", "double");
            Key(w, "n_clustering_weighted", "node", "clustering_weighted", "double");
            Key(w, "n_component", "node", "component", "int");
            Key(w, "n_module", "node", "module", "int");
            Key(w, "e_weight", "edge", "weight", "double");
            Key(w, "e_value", "edge", "value", "double");
            Key(w, "e_z", "edge", "z", "double");
            Key(w, "e_p", "edge", "p", "double");
            Key(w, "e_p_corrected", "edge", "p_corrected", "double");

            w.WriteStartElement("graph", Namespace);
            w.WriteAttributeString("id", "G");
            w.WriteAttributeString("edgedefault", "undirected");
            Data(w, "g_condition", result.Condition);
            Data(w, "g_band", result.Band);
            Data(w, "g_measure", result.Measure);
            var summary = graph.Measures.Summary;
            Data(w, "g_components", XmlConvert.ToString(summary.Components));
            Data(w, "g_modules", XmlConvert.ToString(summary.Modules));
            Data(w, "g_modularity", XmlConvert.ToString(summary.Modularity));
            Data(w, "g_efficiency", XmlConvert.ToString(summary.Efficiency));
            Data(w, "g_efficiency_weighted", XmlConvert.ToString(summary.WeightedEfficiency));
            Data(w, "g_clustering", XmlConvert.ToString(summary.Clustering));
            Data(w, "g_clustering_weighted", XmlConvert.ToString(summary.WeightedClustering));

            foreach (var node in graph.Nodes)
            {
                w.WriteStartElement("node", Namespace);
                w.WriteAttributeString("id", $"n{node.Index}");
                Data(w, "n_label", node.Channel);
                if (positions && result.Positions![node.Index] is { } pos)
                {
                    Data(w, "n_x", XmlConvert.ToString(pos.X));
                    Data(w, "n_y", XmlConvert.ToString(pos.Y));
                }
                Data(w, "n_degree", XmlConvert.ToString(node.Degree));
                Data(w, "n_strength", XmlConvert.ToString(node.Strength));
                var measures = graph.Measures.Nodes[node.Index];
                Data(w, "n_clustering", XmlConvert.ToString(measures.Clustering));
                Data(w, "n_clustering_weighted", XmlConvert.ToString(measures.WeightedClustering));
                Data(w, "n_component", XmlConvert.ToString(measures.Component));
                if (measures.Module is int module) Data(w, "n_module", XmlConvert.ToString(module));
                w.WriteEndElement();
            }

            foreach (var e in graph.Edges)
            {
                w.WriteStartElement("edge", Namespace);
                w.WriteAttributeString("id", $"e{e.Pair}");
                w.WriteAttributeString("source", $"n{e.A}");
                w.WriteAttributeString("target", $"n{e.B}");
                Data(w, "e_weight", XmlConvert.ToString(e.Weight));
                Data(w, "e_value", XmlConvert.ToString(e.Value));
                Data(w, "e_z", XmlConvert.ToString(e.Z));
                Data(w, "e_p", XmlConvert.ToString(e.P));
                Data(w, "e_p_corrected", XmlConvert.ToString(e.PCorrected));
                w.WriteEndElement();
            }

            w.WriteEndElement(); // graph
            w.WriteEndElement(); // graphml
            w.WriteEndDocument();
        }
        stream.Commit();
    }

    private static void Key(XmlWriter w, string id, string domain, string name, string type)
    {
        w.WriteStartElement("key", Namespace);
        w.WriteAttributeString("id", id);
        w.WriteAttributeString("for", domain);
        w.WriteAttributeString("attr.name", name);
        w.WriteAttributeString("attr.type", type);
        w.WriteEndElement();
    }

    private static void Data(XmlWriter w, string key, string value)
    {
        w.WriteStartElement("data", Namespace);
        w.WriteAttributeString("key", key);
        w.WriteString(value);
        w.WriteEndElement();
    }
}
