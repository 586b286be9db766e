namespace Coupling.Results;

/// <summary>
/// The tested connectivity of one condition x band x measure: one value per channel pair (in
/// <see cref="Measures.PairIndex"/> order) with its surrogate z-score, uncorrected p, corrected p and decision.
/// A plain record for graphs, figures and exports; it holds no analysis state.
/// </summary>
/// <param name="Condition">Condition name.</param>
/// <param name="Band">Band name.</param>
/// <param name="Measure">Measure key (e.g. "wpli").</param>
/// <param name="Channels">Channel labels.</param>
/// <param name="Value">Observed value per pair, summarised over the analysis window.</param>
/// <param name="Z">(observed - surrogate mean) / surrogate standard deviation, per pair.</param>
/// <param name="P">Uncorrected surrogate p-value (b+1)/(M+1), per pair.</param>
/// <param name="PCorrected">Adjusted p-value across the pairs of this table (the plan's correction, Benjamini-Hochberg by default).</param>
/// <param name="Significant">Whether the corrected p is at or below the plan's level.</param>
/// <param name="Positions">Channel positions where known (same order as <paramref name="Channels"/>), else null.</param>
/// <param name="Correction">The correction's details (method, level, p source per pair, network components), when known.</param>
/// <param name="IntervalLow">Lower end of the jackknife 95 % interval of the value per pair, when computed.</param>
/// <param name="IntervalHigh">Upper end of the jackknife 95 % interval of the value per pair, when computed.</param>
/// <param name="ValueMatched">The value matched to the smallest condition's trial count (mean over random subsets), when computed.</param>
public sealed record PairResult(
    string Condition,
    string Band,
    string Measure,
    IReadOnlyList<string> Channels,
    double[] Value,
    double[] Z,
    double[] P,
    double[] PCorrected,
    bool[] Significant,
    IReadOnlyList<Formats.ChannelPosition?>? Positions = null,
    Statistics.FamilyOutcome? Correction = null,
    double[]? IntervalLow = null,
    double[]? IntervalHigh = null,
    double[]? ValueMatched = null);
