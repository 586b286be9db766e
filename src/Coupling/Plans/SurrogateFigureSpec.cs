namespace Coupling.Plans;

/// <summary>The edge whose surrogate distribution is drawn (plan key <c>surrogate_figure</c>).</summary>
/// <param name="Condition">Condition name from the plan.</param>
/// <param name="Band">Band name from the plan.</param>
/// <param name="Measure">Measure key, one of the plan's measures.</param>
/// <param name="ChannelA">One channel of the pair.</param>
/// <param name="ChannelB">The other channel of the pair.</param>
public sealed record SurrogateFigureSpec(string Condition, string Band, string Measure, string ChannelA, string ChannelB);
