using Coupling.Results;

namespace Coupling.Pipeline;

/// <summary>What a finished run produced.</summary>
/// <param name="OutputFolder">The results folder.</param>
/// <param name="Results">The tested tables.</param>
/// <param name="Conditions">Trial counts per condition.</param>
/// <param name="Warnings">Warnings about the analysis, also in the report.</param>
/// <param name="Elapsed">Wall-clock time of the run.</param>
/// <param name="Contrasts">The tested condition differences (empty when the plan has no contrasts).</param>
/// <param name="ResumedUnits">Work units loaded from an interrupted earlier run rather than computed; null or empty for none.</param>
/// <param name="Signals">Channel power, stimulus locking and pair lags per condition x band.</param>
/// <param name="SurrogateExample">The surrogate draws of the edge drawn in the report, or null.</param>
public sealed record RunOutcome(string OutputFolder, IReadOnlyList<PairResult> Results, IReadOnlyList<ConditionSummary> Conditions, IReadOnlyList<string> Warnings, TimeSpan Elapsed,
    IReadOnlyList<ContrastPairResult> Contrasts, IReadOnlyList<string>? ResumedUnits = null, IReadOnlyList<BandSignalSummary>? Signals = null,
    SurrogateDistribution? SurrogateExample = null);
