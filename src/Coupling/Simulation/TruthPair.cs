using Coupling.Measures;

namespace Coupling.Simulation;

/// <summary>
/// One channel pair of the simulated scenario with a built-in relation, and what a connectivity pipeline is
/// expected to make of it. Pairs not listed in <see cref="GroundTruth.Pairs"/> are independent.
/// </summary>
/// <param name="ChannelA">Label of the first channel (the leading one for phase-coupled pairs).</param>
/// <param name="ChannelB">Label of the second channel.</param>
/// <param name="Kind">The relation built into the pair.</param>
/// <param name="Band">Name of the analysis band the relation lives in (one of <see cref="GroundTruth.Bands"/>).</param>
/// <param name="LagSeconds">
/// Delay of channel B behind channel A in seconds: the cross-spectrum X_A·conj(X_B) then has angle +2π·f·lag.
/// 0 for zero-lag mixing; null where no lag is defined (envelope-only, stimulus-locked).
/// </param>
/// <param name="Conditions">Conditions (event labels) in which the relation is present; in any other condition the pair is independent and no measure should find it.</param>
/// <param name="SnrA">Power of the pair's source on channel A over the expected background power of that channel in the band (for the stimulus-locked pair: at the peak of the response's envelope).</param>
/// <param name="SnrB">The same ratio on channel B.</param>
/// <param name="DetectedBy">
/// Measures expected to come out significant against trial-shuffle surrogates for this pair in the conditions
/// where it is present (at the default settings, in the analysis window and band).
/// </param>
/// <param name="NotDetectedBy">Measures expected not to come out significant for this pair in any condition.</param>
/// <param name="Note">Plain-language explanation of the pair and the expectation.</param>
public sealed record TruthPair(
    string ChannelA,
    string ChannelB,
    TruthKind Kind,
    string Band,
    double? LagSeconds,
    IReadOnlyList<string> Conditions,
    double SnrA,
    double SnrB,
    IReadOnlyList<Measure> DetectedBy,
    IReadOnlyList<Measure> NotDetectedBy,
    string Note);
