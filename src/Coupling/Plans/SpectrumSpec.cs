using Coupling.Measures;

namespace Coupling.Plans;

/// <summary>
/// Frequency-resolved (and optionally time-resolved) connectivity of chosen channel pairs per condition: the plan's
/// <c>spectrum</c> key.
/// </summary>
/// <param name="Method">"morlet" (a complex Morlet wavelet per frequency) or "multitaper" (DPSS tapers).</param>
/// <param name="Frequencies">Frequencies in Hz, increasing.</param>
/// <param name="Cycles">Morlet cycles at every frequency (method morlet).</param>
/// <param name="HalfBandwidthHz">Half-bandwidth W of the tapers in Hz (method multitaper).</param>
/// <param name="Pairs">The channel pairs; null for every pair of the analysed channels.</param>
/// <param name="Measures">The measures computed per frequency (and time bin).</param>
/// <param name="Time">Time-resolved settings; null for the spectrum over the analysis window only.</param>
/// <param name="ClusterTest">Cluster-based permutation test of one pair's condition contrast; null for none.</param>
/// <param name="FigurePair">The pair drawn in the figures; null for the first pair.</param>
public sealed record SpectrumSpec(
    string Method,
    IReadOnlyList<double> Frequencies,
    double Cycles,
    double HalfBandwidthHz,
    IReadOnlyList<ChannelPairSpec>? Pairs,
    IReadOnlyList<Measure> Measures,
    TimeCourseSpec? Time,
    ClusterTestSpec? ClusterTest,
    ChannelPairSpec? FigurePair);
