using Coupling.Results;
using Coupling.Spectral;

namespace Coupling.Pipeline;

/// <summary>The computed, not yet written, results of a run.</summary>
/// <param name="Results">One tested table per condition x band x measure.</param>
/// <param name="Conditions">Trial counts and dropped trials per condition.</param>
/// <param name="Decompositions">What each band's decomposition actually used.</param>
/// <param name="TimeSteps">Time step (samples) used per band, in band order.</param>
/// <param name="PadSamples">Padding samples at each end of every trial.</param>
/// <param name="Warnings">Things the reader of the results must know (e.g. too few surrogates for any discovery).</param>
/// <param name="Contrasts">One tested difference table per contrast x band x measure, in the plan's order; empty without contrasts.</param>
/// <param name="Directions">Direction of the significant pairs per condition x band (plan key <c>direction</c>); null when not asked.</param>
/// <param name="Signals">Channel power, stimulus locking and pair coherency lags per condition x band; null when not computed.</param>
/// <param name="SurrogateExample">The surrogate draws of one edge for the report's figure; null when none was drawn.</param>
public sealed record Analysis(
    IReadOnlyList<PairResult> Results,
    IReadOnlyList<ConditionSummary> Conditions,
    IReadOnlyList<DecompositionInfo> Decompositions,
    IReadOnlyList<int> TimeSteps,
    int PadSamples,
    IReadOnlyList<string> Warnings,
    IReadOnlyList<ContrastPairResult> Contrasts,
    IReadOnlyList<PairDirection>? Directions = null,
    IReadOnlyList<BandSignalSummary>? Signals = null,
    SurrogateDistribution? SurrogateExample = null);
