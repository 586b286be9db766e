using Coupling.Statistics;

namespace Coupling.Outputs;

/// <summary>
/// The columns that say how each row's corrected p was obtained, shared by the edge and contrast tables: the correction
/// method, the size of its family (the pairs with a defined p in the row's table), where the p came from, and the
/// network-based statistic's component.
/// </summary>
internal static class CorrectionColumns
{
    /// <summary>Column names, in order.</summary>
    public static IReadOnlyList<string> Names { get; } = ["correction", "family_size", "p_source", "component"];

    /// <summary>The family size of a table: its pairs with a defined p.</summary>
    public static int FamilySize(double[] p) => p.Count(v => !double.IsNaN(v));

    /// <summary>The cells of pair <paramref name="pair"/>; NA where the result carries no correction details.</summary>
    public static IEnumerable<string> Cells(FamilyOutcome? outcome, int family, int pair)
    {
        if (outcome is null) return ["NA", "NA", "NA", "NA"];
        string component = outcome.Component.Length > 0 && outcome.Component[pair] >= 0
            ? (outcome.Component[pair] + 1).ToString(System.Globalization.CultureInfo.InvariantCulture) : "NA";
        return [CorrectionSpec.Key(outcome.Method), family.ToString(System.Globalization.CultureInfo.InvariantCulture),
            outcome.PSource[pair], component];
    }
}
