namespace Coupling.Results;

/// <summary>
/// The surrogate values of one edge (condition x band x measure x channel pair) with its observed value: what the
/// trial-shuffle test compared the observation with. A plain record for the surrogate figure and the report.
/// </summary>
/// <param name="Condition">Condition name.</param>
/// <param name="Band">Band name.</param>
/// <param name="Measure">Measure key.</param>
/// <param name="ChannelA">First channel of the pair (earlier in the channel order).</param>
/// <param name="ChannelB">Second channel of the pair.</param>
/// <param name="Observed">The observed value.</param>
/// <param name="Draws">The value of every surrogate draw, in draw order.</param>
/// <param name="TwoSided">Whether the test statistic is |value| (imaginary coherency, AEC, AEC-orth) rather than the value.</param>
/// <param name="P">(b + 1)/(M + 1) recomputed from <paramref name="Draws"/>.</param>
/// <param name="Z">(observed − mean of draws)/sd of draws (divisor M − 1); NaN when the sd is 0 or M = 1.</param>
/// <param name="Chosen">How the edge was chosen ("plan" or "strongest significant edge").</param>
public sealed record SurrogateDistribution(
    string Condition,
    string Band,
    string Measure,
    string ChannelA,
    string ChannelB,
    double Observed,
    double[] Draws,
    bool TwoSided,
    double P,
    double Z,
    string Chosen);
