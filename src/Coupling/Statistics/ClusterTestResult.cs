namespace Coupling.Statistics;

/// <summary>
/// The cluster-based permutation test of one channel pair's condition contrast over frequency x time. Per-cell arrays are
/// frequency-major (cell f, b at <c>f * Times.Count + b</c>).
/// </summary>
/// <param name="ChannelA">First channel of the pair.</param>
/// <param name="ChannelB">Second channel of the pair.</param>
/// <param name="Measure">Measure key.</param>
/// <param name="ConditionA">Condition A (minuend).</param>
/// <param name="ConditionB">Condition B (subtrahend).</param>
/// <param name="TrialsA">Trials of condition A.</param>
/// <param name="TrialsB">Trials of condition B.</param>
/// <param name="Frequencies">Frequencies, Hz.</param>
/// <param name="Times">Bin centres, s.</param>
/// <param name="Difference">Value in A minus value in B per cell.</param>
/// <param name="Z">Standardised difference per cell: (difference - mean) / sd over the observed and every permuted map.</param>
/// <param name="Labels">Cluster id per cell (0 for cells in no cluster).</param>
/// <param name="Clusters">The observed clusters, by decreasing |mass|.</param>
/// <param name="Draws">Number of label permutations.</param>
/// <param name="Threshold">Cluster-forming threshold as a two-sided pointwise level.</param>
/// <param name="ZThreshold">The same as a bound on |z|.</param>
/// <param name="EvokedRemoved">Whether each group of every labelling had its own trial mean (the evoked response) removed
/// inside the test; false when the trials were tested as given.</param>
public sealed record ClusterTestResult(
    string ChannelA,
    string ChannelB,
    string Measure,
    string ConditionA,
    string ConditionB,
    int TrialsA,
    int TrialsB,
    IReadOnlyList<double> Frequencies,
    IReadOnlyList<double> Times,
    double[] Difference,
    double[] Z,
    int[] Labels,
    IReadOnlyList<TimeFrequencyCluster> Clusters,
    int Draws,
    double Threshold,
    double ZThreshold,
    bool EvokedRemoved = false);
