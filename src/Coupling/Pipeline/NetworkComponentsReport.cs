using System.Globalization;
using Coupling.Measures;

namespace Coupling.Pipeline;

/// <summary>The rows of the report section naming the network-based statistic's components.</summary>
internal static class NetworkComponentsReport
{
    /// <summary>Whether any table of <paramref name="analysis"/> was corrected with the network-based statistic.</summary>
    public static bool Applies(Analysis analysis) =>
        analysis.Results.Concat(analysis.Contrasts.Select(c => c.AsDifference()))
            .Any(r => r.Correction?.Method == Statistics.CorrectionMethod.NetworkBased);

    /// <summary>One row per component: table, component number, edges, family-wise p, channels (plain text).</summary>
    public static IReadOnlyList<string[]> Rows(Analysis analysis)
    {
        var tables = analysis.Results.Select(r => (Name: $"{r.Condition} / {r.Band} / {r.Measure}", r.Channels, r.Correction))
            .Concat(analysis.Contrasts.Select(c => (Name: $"{c.ConditionA} vs {c.ConditionB} / {c.Band} / {c.Measure}", c.Channels, c.Correction)))
            .Where(t => t.Correction is { ComponentExtent.Length: > 0 });
        var rows = new List<string[]>();
        foreach (var (name, channels, outcome) in tables)
            for (int c = 0; c < outcome!.ComponentExtent.Length; c++)
            {
                var members = Enumerable.Range(0, outcome.Component.Length).Where(k => outcome.Component[k] == c)
                    .SelectMany(k => { var (a, b) = PairIndex.Channels(k, channels.Count); return new[] { a, b }; })
                    .Distinct().Order().Select(i => channels[i]);
                rows.Add([name, (c + 1).ToString(CultureInfo.InvariantCulture), outcome.ComponentExtent[c].ToString(CultureInfo.InvariantCulture),
                    outcome.ComponentP[c].ToString("G4", CultureInfo.InvariantCulture), string.Join(", ", members)]);
            }
        return rows;
    }
}
