using System.Globalization;
using System.Text;

namespace Coupling.Pipeline;

/// <summary>The report's section on the plan's <c>spectrum</c> key: what was computed and the cluster test's outcome.</summary>
internal static class SpectrumReport
{
    /// <summary>Appends the section to <paramref name="sb"/>.</summary>
    public static void Append(StringBuilder sb, SpectrumAnalysis spectrum)
    {
        var inv = CultureInfo.InvariantCulture;
        var spec = spectrum.Spec;
        var pairs = spectrum.Spectrum.Select(v => $"{v.ChannelA}-{v.ChannelB}").Distinct().ToArray();
        sb.AppendLine("## Spectra and time-frequency maps");
        sb.AppendLine();
        string how = spec.Method == "morlet"
            ? string.Create(inv, $"a complex Morlet wavelet of {spec.Cycles:G4} cycles per frequency")
            : string.Create(inv, $"multitaper, half-bandwidth {spec.HalfBandwidthHz:G4} Hz ({string.Join(" and ", spectrum.TapersPerWindow!)} DPSS tapers per window)");
        sb.AppendLine(string.Create(inv,
            $"- {spec.Frequencies.Count} frequencies from {spec.Frequencies[0]:G6} to {spec.Frequencies[^1]:G6} Hz by {how}; {pairs.Length} pair(s): {string.Join(", ", pairs.Take(12))}{(pairs.Length > 12 ? ", ..." : "")}"));
        sb.AppendLine($"- Measures: {string.Join(", ", spec.Measures.Select(Measures.MeasureCatalog.Key))}; values without a significance test per cell (spectrum/spectrum.tsv)");
        if (spectrum.TimeCourse.Count > 0)
        {
            var times = spectrum.TimeCourse[0].Times;
            sb.AppendLine(string.Create(inv,
                $"- Time course: {times.Count} bins ({(spec.Time!.Width == 0 ? "single time points" : $"{spec.Time.Width:G4} s wide")}, centres {times[0]:G4} to {times[^1]:G4} s){(spec.Time.Baseline is { } b ? $", change from the baseline {b.Start:G4} to {b.End:G4} s" : "")} (spectrum/time_frequency.tsv)"));
        }
        if (spectrum.ClusterTest is { } test)
        {
            var significant = test.Clusters.Where(c => c.P <= 0.05).ToArray();
            sb.AppendLine(string.Create(inv,
                $"- Cluster test, {test.ChannelA}-{test.ChannelB} {test.Measure}, {test.ConditionA} ({test.TrialsA} trials) − {test.ConditionB} ({test.TrialsB} trials): {test.Draws} label permutations, cluster-forming |z| > {test.ZThreshold:0.##} (pointwise {test.Threshold:G3}); {test.Clusters.Count} cluster(s), {significant.Length} with p ≤ 0.05 (family-wise over the map)"));
            foreach (var c in significant)
                sb.AppendLine(string.Create(inv,
                    $"  - cluster {c.Id}: {(c.Sign > 0 ? "A above B" : "A below B")}, {c.LowHz:G4}-{c.HighHz:G4} Hz, {c.Start:G4} to {c.End:G4} s, {c.Cells} cells, mass {c.Mass:0.#}, p = {c.P:G3}"));
            sb.AppendLine("- A significant cluster shows that the conditions differ; its extent in frequency and time is descriptive, not itself tested.");
        }
        sb.AppendLine();
    }
}
