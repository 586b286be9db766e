namespace Coupling.Graphs;

/// <summary>Per-channel measures of a <see cref="ChannelGraph"/>.</summary>
/// <param name="Channel">Channel label (the vertex).</param>
/// <param name="Index">Position of the channel in <see cref="Results.PairResult.Channels"/>.</param>
/// <param name="Degree">Number of significant edges at the channel.</param>
/// <param name="Strength">Sum of the weights (|value|) of the significant edges at the channel; 0 when it has none.</param>
/// <remarks>
/// Degree k_i = sum_j a_ij and strength s_i = sum_j w_ij as defined by Rubinov M, Sporns O (2010). Complex network
/// measures of brain connectivity: uses and interpretations. NeuroImage 52:1059-1069 (Table A1).
/// </remarks>
public sealed record NodeSummary(string Channel, int Index, int Degree, double Strength);
