namespace Coupling.Results;

/// <summary>
/// Direction of one channel pair that is significant in at least one measure of a condition x band: the phase of the
/// coherency with the lag it means at the band centre and which channel leads, and the phase-slope index with its
/// trial-shuffle p.
/// </summary>
/// <param name="Condition">Condition name.</param>
/// <param name="Band">Band name.</param>
/// <param name="ChannelA">First channel of the pair.</param>
/// <param name="ChannelB">Second channel of the pair.</param>
/// <param name="SignificantIn">Measure keys in which the pair is significant after correction.</param>
/// <param name="Phase">Phase of the coherency, arg Σ z_a z_b*, radians in (−π, π].</param>
/// <param name="LagMs">Phase / (2π · band centre), in milliseconds; positive when A leads.</param>
/// <param name="Leader">The channel ahead in phase (A for a positive phase), or "none" for a phase of exactly 0 or π or NaN.</param>
/// <param name="Psi">Phase-slope index Ψ_AB (positive: A leads).</param>
/// <param name="PsiP">Two-sided trial-shuffle p of Ψ.</param>
public sealed record PairDirection(
    string Condition,
    string Band,
    string ChannelA,
    string ChannelB,
    IReadOnlyList<string> SignificantIn,
    double Phase,
    double LagMs,
    string Leader,
    double Psi,
    double PsiP);
