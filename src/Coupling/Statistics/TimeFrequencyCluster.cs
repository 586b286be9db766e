namespace Coupling.Statistics;

/// <summary>One cluster of adjacent supra-threshold cells of a time-frequency contrast map.</summary>
/// <param name="Id">1-based number, in order of decreasing |mass|; cells of the map carry it in the result's labels.</param>
/// <param name="Sign">+1 when condition A exceeds condition B in the cluster, -1 otherwise.</param>
/// <param name="Mass">Sum of the cells' standardised differences (signed).</param>
/// <param name="Cells">Number of cells.</param>
/// <param name="P">Permutation p-value: (1 + number of draws whose largest |mass| is at least this |mass|) / (draws + 1).</param>
/// <param name="LowHz">Lowest frequency in the cluster, Hz.</param>
/// <param name="HighHz">Highest frequency in the cluster, Hz.</param>
/// <param name="Start">Earliest bin centre in the cluster, s.</param>
/// <param name="End">Latest bin centre in the cluster, s.</param>
public sealed record TimeFrequencyCluster(int Id, int Sign, double Mass, int Cells, double P, double LowHz, double HighHz,
    double Start, double End);
