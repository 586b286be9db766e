namespace Coupling.Graphs;

/// <summary>Whole-graph measures of a <see cref="ChannelGraph"/> (see <see cref="GraphMeasures"/>).</summary>
/// <param name="Nodes">Number of vertices (channels).</param>
/// <param name="Edges">Number of edges (significant pairs).</param>
/// <param name="Density">2E / (N (N - 1)); NaN below two channels.</param>
/// <param name="Components">Number of connected components (an isolated channel is one).</param>
/// <param name="LargestComponent">Number of channels in the largest component.</param>
/// <param name="Clustering">Mean binary clustering coefficient over all channels (Watts and Strogatz 1998).</param>
/// <param name="WeightedClustering">Mean weighted clustering coefficient over all channels (Onnela et al. 2005).</param>
/// <param name="Efficiency">Binary global efficiency (Latora and Marchiori 2001).</param>
/// <param name="WeightedEfficiency">Weighted global efficiency, edge length 1 / weight (Rubinov and Sporns 2010).</param>
/// <param name="Modules">Number of modules of the Louvain partition; 0 when modularity is undefined.</param>
/// <param name="Modularity">Weighted modularity Q of that partition (Newman 2004); NaN when undefined.</param>
public sealed record GraphSummary(
    int Nodes, int Edges, double Density, int Components, int LargestComponent,
    double Clustering, double WeightedClustering, double Efficiency, double WeightedEfficiency,
    int Modules, double Modularity);
