using Coupling.Plans;
using Coupling.Statistics;
using Coupling.TimeFrequency;

namespace Coupling.Pipeline;

/// <summary>The computed, not yet written, frequency- and time-resolved results of a plan's <c>spectrum</c> key.</summary>
/// <param name="Spec">The settings they were computed with.</param>
/// <param name="Spectrum">Per condition x pair x measure, the values at every frequency over the analysis window (one bin).</param>
/// <param name="TimeCourse">Per condition x pair x measure, the values at every frequency x time bin; empty without <c>spectrum.time</c>.</param>
/// <param name="ClusterTest">The cluster-based permutation test; null without <c>spectrum.cluster_test</c>.</param>
/// <param name="FigurePair">The pair drawn in the figures, channels in analysis order.</param>
/// <param name="PadSamples">Padding samples at each end of every trial.</param>
/// <param name="TapersPerWindow">Multitaper: tapers per analysis window (spectrum) and per time bin (time course); null for Morlet.</param>
/// <param name="ClusterSeed">Seed of the cluster test's permutations (derived from the plan's seed).</param>
public sealed record SpectrumAnalysis(
    SpectrumSpec Spec,
    IReadOnlyList<TimeFrequencyValues> Spectrum,
    IReadOnlyList<TimeFrequencyValues> TimeCourse,
    ClusterTestResult? ClusterTest,
    ChannelPairSpec FigurePair,
    int PadSamples,
    IReadOnlyList<int>? TapersPerWindow,
    ulong ClusterSeed);
