namespace Coupling.Graphs;

/// <summary>The graph measures of one <see cref="ChannelGraph"/>: per channel and for the whole graph.</summary>
/// <param name="Nodes">Per-channel measures, in channel order.</param>
/// <param name="Summary">Whole-graph measures.</param>
public sealed record GraphMeasureSet(IReadOnlyList<NodeMeasures> Nodes, GraphSummary Summary);
