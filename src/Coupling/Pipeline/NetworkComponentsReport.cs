using System.Globalization;
using System.Text;
using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Pipeline;

/// <summary>The report section naming the network-based statistic's components (only when that correction was used).</summary>
internal static class NetworkComponentsReport
{
    public static void Append(StringBuilder sb, Analysis analysis)
    {
        var tables = analysis.Results.Select(r => (Name: $"{r.Condition} / {r.Band} / {r.Measure}", r.Channels, r.Correction))
            .Concat(analysis.Contrasts.Select(c => (Name: $"{c.ConditionA} vs {c.ConditionB} / {c.Band} / {c.Measure}", c.Channels, c.Correction)))
            .Where(t => t.Correction is { ComponentExtent.Length: > 0 })
            .ToArray();
        if (!analysis.Results.Concat(analysis.Contrasts.Select(c => c.AsDifference()))
                .Any(r => r.Correction?.Method == Statistics.CorrectionMethod.NetworkBased)) return;
        sb.AppendLine("## Network components");
        sb.AppendLine();
        sb.AppendLine("Connected components of supra-threshold edges (network-based statistic); the component number is the `component` column of the tables. " +
                      "A significant component says that coupling differs from the null somewhere in it, not at each of its edges.");
        sb.AppendLine();
        sb.AppendLine("| table | component | edges | family-wise p | channels |");
        sb.AppendLine("|---|---|---|---|---|");
        foreach (var (name, channels, outcome) in tables)
            for (int c = 0; c < outcome!.ComponentExtent.Length; c++)
            {
                var members = Enumerable.Range(0, outcome.Component.Length).Where(k => outcome.Component[k] == c)
                    .SelectMany(k => { var (a, b) = PairIndex.Channels(k, channels.Count); return new[] { a, b }; })
                    .Distinct().Order().Select(i => channels[i]);
                sb.AppendLine(string.Create(CultureInfo.InvariantCulture,
                    $"| {name} | {c + 1} | {outcome.ComponentExtent[c]} | {outcome.ComponentP[c]:G4} | {string.Join(", ", members)} |"));
            }
        if (tables.Length == 0) sb.AppendLine("| (none: no edge above the threshold) | | | | |");
        sb.AppendLine();
    }
}
