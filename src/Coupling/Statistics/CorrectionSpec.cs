namespace Coupling.Statistics;

/// <summary>
/// The plan's multiplicity correction: the method, whether small p-values are refined by a generalised Pareto tail fitted
/// to the surrogates, and for the network-based statistic the threshold that makes an edge supra-threshold. The level
/// (q or alpha) is given beside it (the plan's Q).
/// </summary>
/// <param name="Method">The correction across the pairs of each table.</param>
/// <param name="ParetoTail">Whether per-pair p-values with fewer than 10 exceedances are replaced by a generalised Pareto
/// tail approximation (where the fit passes its goodness-of-fit check).</param>
/// <param name="Threshold">Network-based statistic only: an edge is supra-threshold when its studentised statistic
/// exceeds this value; null for the other methods.</param>
public sealed record CorrectionSpec(CorrectionMethod Method, bool ParetoTail = false, double? Threshold = null)
{
    /// <summary>Benjamini-Hochberg with counted p-values, the default.</summary>
    public static CorrectionSpec Default { get; } = new(CorrectionMethod.BenjaminiHochberg);

    /// <summary>The default supra-threshold value of the network-based statistic (studentised units).</summary>
    public const double DefaultThreshold = 3.0;

    /// <summary>The plan key of <paramref name="method"/> (e.g. "benjamini-hochberg").</summary>
    public static string Key(CorrectionMethod method) => method switch
    {
        CorrectionMethod.BenjaminiHochberg => "benjamini-hochberg",
        CorrectionMethod.BenjaminiYekutieli => "benjamini-yekutieli",
        CorrectionMethod.MaxStatistic => "max-statistic",
        CorrectionMethod.NetworkBased => "network-based",
        CorrectionMethod.None => "none",
        _ => throw new ArgumentOutOfRangeException(nameof(method), method, null),
    };

    /// <summary>Whether the method controls the false discovery rate (level q) rather than the family-wise error (level alpha).</summary>
    public static bool ControlsFalseDiscoveries(CorrectionMethod method) =>
        method is CorrectionMethod.BenjaminiHochberg or CorrectionMethod.BenjaminiYekutieli;
}
