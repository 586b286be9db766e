namespace Coupling.Statistics;

/// <summary>How the p-values of one family of tests (all channel pairs of one table) are corrected for multiplicity.</summary>
public enum CorrectionMethod
{
    /// <summary>False discovery rate by the Benjamini-Hochberg step-up procedure (independent or positively dependent tests).</summary>
    BenjaminiHochberg,

    /// <summary>False discovery rate by the Benjamini-Yekutieli procedure, valid under any dependence between tests.</summary>
    BenjaminiYekutieli,

    /// <summary>Family-wise error by the maximum over pairs of a studentised statistic, from the same surrogate draws.</summary>
    MaxStatistic,

    /// <summary>Family-wise error on connected components of supra-threshold edges (network-based statistic).</summary>
    NetworkBased,

    /// <summary>No correction: each pair is judged by its own p-value.</summary>
    None,
}
