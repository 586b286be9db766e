using Coupling.Measures;

namespace Coupling.Plans;

/// <summary>The <c>spectrum.cluster_test</c> key: one pair's condition contrast tested over frequency x time.</summary>
/// <param name="Pair">The channel pair.</param>
/// <param name="Measure">The measure whose difference is tested.</param>
/// <param name="ConditionA">Condition A (minuend).</param>
/// <param name="ConditionB">Condition B (subtrahend).</param>
/// <param name="Threshold">Two-sided pointwise level of the cluster-forming threshold.</param>
/// <param name="Draws">Number of label permutations.</param>
public sealed record ClusterTestSpec(ChannelPairSpec Pair, Measure Measure, string ConditionA, string ConditionB, double Threshold, int Draws);
