namespace Coupling.Results;

/// <summary>
/// The tested difference in connectivity between two conditions for one band x measure: per channel pair (in
/// <see cref="Measures.PairIndex"/> order) the value in each condition, the difference A − B, its z-score, uncorrected
/// p, corrected p and decision from the condition-label permutation test. A plain record for tables and figures.
/// </summary>
/// <param name="Contrast">The contrast's name, "A-vs-B".</param>
/// <param name="ConditionA">Name of condition A.</param>
/// <param name="ConditionB">Name of condition B.</param>
/// <param name="Band">Band name.</param>
/// <param name="Measure">Measure key (e.g. "wpli").</param>
/// <param name="Channels">Channel labels.</param>
/// <param name="ValueA">Value per pair in condition A.</param>
/// <param name="ValueB">Value per pair in condition B.</param>
/// <param name="Difference">ValueA − ValueB per pair.</param>
/// <param name="Z">(difference − permutation mean) / permutation standard deviation, per pair.</param>
/// <param name="P">Uncorrected two-sided permutation p-value (b+1)/(M+1), per pair.</param>
/// <param name="PCorrected">Adjusted p-value across the pairs of this table (the plan's correction, Benjamini-Hochberg by default).</param>
/// <param name="Significant">Whether the corrected p is at or below the plan's level.</param>
/// <param name="Positions">Channel positions where known (same order as <paramref name="Channels"/>), else null.</param>
/// <param name="Correction">The correction's details (method, level, p source per pair, network components), when known.</param>
public sealed record ContrastPairResult(
    string Contrast,
    string ConditionA,
    string ConditionB,
    string Band,
    string Measure,
    IReadOnlyList<string> Channels,
    double[] ValueA,
    double[] ValueB,
    double[] Difference,
    double[] Z,
    double[] P,
    double[] PCorrected,
    bool[] Significant,
    IReadOnlyList<Formats.ChannelPosition?>? Positions = null,
    Statistics.FamilyOutcome? Correction = null)
{
    /// <summary>
    /// The difference as a <see cref="PairResult"/> (Value = difference, condition "A vs B"), for the writers and
    /// figures that take one.
    /// </summary>
    public PairResult AsDifference() =>
        new($"{ConditionA} vs {ConditionB}", Band, Measure, Channels, Difference, Z, P, PCorrected, Significant, Positions, Correction);
}
