namespace Coupling.Graphs;

/// <summary>Per-channel graph measures of a <see cref="ChannelGraph"/> (see <see cref="GraphMeasures"/>).</summary>
/// <param name="Channel">Channel label (the vertex).</param>
/// <param name="Index">Position of the channel in the result's channel order.</param>
/// <param name="Degree">Number of edges at the channel.</param>
/// <param name="Strength">Sum of the weights of the edges at the channel.</param>
/// <param name="Clustering">Binary clustering coefficient (Watts and Strogatz 1998); 0 below two neighbours.</param>
/// <param name="WeightedClustering">Weighted clustering coefficient (Onnela et al. 2005); 0 below two neighbours,
/// NaN when an edge weight is not finite.</param>
/// <param name="Component">Connected component, numbered from 1 in the order of each component's first channel.</param>
/// <param name="Module">Module of the partition that maximises modularity (Louvain method), numbered from 1 in the order
/// of each module's first channel; null when modularity is undefined (no edge, or a weight that is not finite).</param>
public sealed record NodeMeasures(
    string Channel, int Index, int Degree, double Strength,
    double Clustering, double WeightedClustering, int Component, int? Module);
