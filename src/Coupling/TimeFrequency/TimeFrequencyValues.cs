namespace Coupling.TimeFrequency;

/// <summary>
/// One measure of one channel pair in one condition at every frequency x time bin. Values are frequency-major: the
/// value at frequency f and bin b is <c>Values[f * Times.Count + b]</c>.
/// </summary>
/// <param name="Condition">Condition name.</param>
/// <param name="ChannelA">First channel of the pair.</param>
/// <param name="ChannelB">Second channel of the pair (for signed measures the sign says how A relates to B).</param>
/// <param name="Measure">Measure key.</param>
/// <param name="Frequencies">Frequencies, Hz.</param>
/// <param name="Times">Centre of each time bin, s relative to onset.</param>
/// <param name="Values">The values, frequency-major.</param>
/// <param name="Change">Value minus the mean of the baseline bins at the same frequency, in the same layout; null
/// without a baseline.</param>
public sealed record TimeFrequencyValues(
    string Condition,
    string ChannelA,
    string ChannelB,
    string Measure,
    IReadOnlyList<double> Frequencies,
    IReadOnlyList<double> Times,
    double[] Values,
    double[]? Change)
{
    /// <summary>The value at frequency index <paramref name="f"/> and bin index <paramref name="b"/>.</summary>
    public double At(int f, int b) => Values[f * Times.Count + b];
}
