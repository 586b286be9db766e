namespace Coupling.Pipeline;

/// <summary>What a run of a plan would do, found without computing anything (see <see cref="PlanCheck"/>).</summary>
/// <param name="Plan">The plan file.</param>
/// <param name="Recording">The recording.</param>
/// <param name="SampleRate">Sampling rate in Hz.</param>
/// <param name="Channels">Channels analysed, in result order.</param>
/// <param name="Conditions">Trials each condition would keep (dropped trials are counted at the run).</param>
/// <param name="Bands">Per band: decomposition, kernel length, padding and time step.</param>
/// <param name="WorkUnits">The work units of the run (condition x band, then contrast x band), as the manifest names them.</param>
/// <param name="KeptUnits">Work units an interrupted earlier run kept that the run would load rather than compute.</param>
/// <param name="Surrogates">Surrogate draws per unit (0: values without a test).</param>
/// <param name="Pairs">Channel pairs per table.</param>
/// <param name="SurrogatesForOneDiscovery">Fewest surrogates with which a single coupled pair can pass the correction,
/// ⌈pairs / q⌉ − 1 for Benjamini-Hochberg (its smallest p, 1/(M + 1), must reach q / pairs), ⌈c(m)·pairs / q⌉ − 1 for
/// Benjamini-Yekutieli, ⌈1/alpha⌉ − 1 for the family-wise corrections and none, 1 with the Pareto tail.</param>
/// <param name="SurrogatesForOneDifference">The same for the condition contrasts, which are tested two-sided (so their
/// floor is 2/(M + 1) under the false discovery rate corrections and none); null when the plan has no contrasts.</param>
/// <param name="Output">The results folder.</param>
/// <param name="Warnings">Warnings the run would give too: about the bands (e.g. too few cycles in the window) and about too few surrogates for the condition contrasts.</param>
public sealed record PlanPreview(
    string Plan,
    string Recording,
    double SampleRate,
    IReadOnlyList<string> Channels,
    IReadOnlyList<ConditionSummary> Conditions,
    IReadOnlyList<BandPreview> Bands,
    IReadOnlyList<string> WorkUnits,
    IReadOnlyList<string> KeptUnits,
    int Surrogates,
    int Pairs,
    int SurrogatesForOneDiscovery,
    int? SurrogatesForOneDifference,
    string Output,
    IReadOnlyList<string> Warnings);
