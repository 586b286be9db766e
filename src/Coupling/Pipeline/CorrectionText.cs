using System.Globalization;
using System.Text.Json.Nodes;
using Coupling.Statistics;

namespace Coupling.Pipeline;

/// <summary>Words and manifest entries that name a run's correction and the family it covers.</summary>
internal static class CorrectionText
{
    /// <summary>The family of one table of the per-condition tests.</summary>
    public const string ConditionFamily = "all channel pairs of one condition x band x measure";

    /// <summary>The family of one table of the contrasts.</summary>
    public const string ContrastFamily = "all channel pairs of one contrast x band x measure";

    /// <summary>"Benjamini-Hochberg false discovery rate at q = 0.05", and so on.</summary>
    public static string Describe(CorrectionSpec c, double level)
    {
        string l = level.ToString("G4", CultureInfo.InvariantCulture);
        string text = c.Method switch
        {
            CorrectionMethod.BenjaminiHochberg => $"Benjamini-Hochberg false discovery rate at q = {l}",
            CorrectionMethod.BenjaminiYekutieli => $"Benjamini-Yekutieli false discovery rate (any dependence) at q = {l}",
            CorrectionMethod.MaxStatistic => $"family-wise error at alpha = {l} by the maximum over pairs of the studentised statistic (same draws)",
            CorrectionMethod.NetworkBased => string.Create(CultureInfo.InvariantCulture,
                $"network-based statistic: components of edges with studentised statistic above {c.Threshold ?? CorrectionSpec.DefaultThreshold:G4}, family-wise error at alpha = {l} on component extent (same draws)"),
            CorrectionMethod.None => $"no correction: each pair at alpha = {l}",
            _ => throw new ArgumentOutOfRangeException(nameof(c)),
        };
        return c.ParetoTail ? text + "; p-values with fewer than 10 exceedances refined by a generalised Pareto tail fit (p_source pareto-tail)" : text;
    }

    /// <summary>The manifest's record of the correction.</summary>
    public static JsonObject Manifest(CorrectionSpec c, double level) => new()
    {
        ["method"] = CorrectionSpec.Key(c.Method),
        [CorrectionSpec.ControlsFalseDiscoveries(c.Method) ? "q" : "alpha"] = level,
        ["p_values"] = c.ParetoTail ? "counted, refined by a generalised Pareto tail below 10 exceedances" : "counted (b+1)/(M+1)",
        ["threshold"] = c.Threshold,
        ["family"] = ConditionFamily,
        ["contrast_family"] = ContrastFamily,
        ["description"] = Describe(c, level),
    };
}
