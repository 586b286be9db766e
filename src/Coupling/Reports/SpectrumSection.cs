using System.Globalization;
using System.Text;
using System.Text.Json.Nodes;
using Coupling.Plans;
using static Coupling.Reports.HtmlParts;

namespace Coupling.Reports;

/// <summary>
/// The report's section on the plan's <c>spectrum</c> key: the settings the spectra were computed with, the cluster
/// test's clusters at p ≤ <see cref="ClusterLevel"/> as written in <c>spectrum/clusters.tsv</c>, and the figures of
/// <c>figures/spectrum/</c>. Pairs and measures are read from <c>spectrum/spectrum.tsv</c>, the time bins and tapers from
/// the manifest's <c>extra.spectrum</c>, so the section shows what the folder holds.
/// </summary>
internal static class SpectrumSection
{
    /// <summary>Cluster p-value at or below which a cluster is listed: the level the cluster figure marks.</summary>
    public const double ClusterLevel = 0.05;

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Appends the section; nothing when the plan has no <c>spectrum</c> key.</summary>
    /// <param name="sb">The report being built.</param>
    /// <param name="plan">The checked plan.</param>
    /// <param name="recorded">The manifest's <c>extra.spectrum</c> node; null when absent.</param>
    /// <param name="folder">The results folder as written so far.</param>
    public static void Append(StringBuilder sb, Plan plan, JsonNode? recorded, string folder)
    {
        var spec = plan.Spectrum;
        if (spec is null) return;
        sb.Append("<section id=\"spectrum\"><h2>Spectra and time-frequency maps</h2>\n");
        sb.Append("<p>Connectivity of chosen pairs per frequency over the analysis window (<code>spectrum/spectrum.tsv</code>)" +
                  (spec.Time is null ? "" : " and per frequency × time bin (<code>spectrum/time_frequency.tsv</code>)") +
                  ", per condition. Values carry each measure's trial-count bias; conditions are compared by the cluster test.</p>\n<dl>");
        sb.Append($"<dt>Method</dt><dd>{E(MethodText(spec, recorded))}</dd>");
        sb.Append($"<dt>Frequencies</dt><dd>{E(FrequencyText(spec.Frequencies))}</dd>");
        var (pairs, measures) = PairsAndMeasures(Path.Combine(folder, "spectrum", "spectrum.tsv"));
        sb.Append($"<dt>Pairs</dt><dd>{E(string.Join(", ", pairs))}</dd>");
        sb.Append($"<dt>Measures</dt><dd>{E(string.Join(", ", measures))}</dd>");
        sb.Append($"<dt>Time bins</dt><dd>{E(BinText(plan, recorded))}</dd>");
        if (spec.Time is not null)
            sb.Append($"<dt>Baseline</dt><dd>{E(spec.Time.Baseline is { } b
                ? $"{S(b.Start)} to {S(b.End)} s: change = value − mean of the bins centred in it, per frequency"
                : "none (values only)")}</dd>");
        if (recorded?["figure_pair"] is JsonArray shown && shown.Count == 2)
            sb.Append($"<dt>Figures show</dt><dd>{E($"{shown[0]}–{shown[1]}")}</dd>");
        sb.Append("</dl>\n");
        if (spec.ClusterTest is { } test) ClusterPart(sb, plan, test, recorded?["cluster_test"], folder);
        Figures(sb, plan, folder);
        sb.Append("</section>\n");
    }

    private static void ClusterPart(StringBuilder sb, Plan plan, ClusterTestSpec test, JsonNode? recorded, string folder)
    {
        sb.Append($"<h3>Cluster test: {E(test.ConditionA)} − {E(test.ConditionB)}</h3>\n");
        string trials = recorded?["trials"] is JsonArray t && t.Count == 2 ? $" ({t[0]} and {t[1]} trials)" : "";
        string zThreshold = recorded?["z_threshold"] is JsonValue z ? $", |z| > {Num(z.GetValue<double>(), "0.###")}" : "";
        string seed = recorded?["seed"] is JsonValue s ? $", seed {s.GetValue<ulong>().ToString(Inv)}" : "";
        sb.Append($"<p>{E(test.Pair.A)}–{E(test.Pair.B)}, {E(Measures.MeasureCatalog.Key(test.Measure))}, {E(test.ConditionA)} − {E(test.ConditionB)}{E(trials)}: " +
                  $"{test.Draws.ToString(Inv)} label permutations{E(seed)}; cells above the pointwise threshold {Num(test.Threshold, "0.###")} (two-sided{E(zThreshold)}) " +
                  "form clusters; a cluster's p is family-wise over the whole map." +
                  (plan.SubtractEvoked ? " The evoked response is removed inside the test, from each group of every labelling." : "") + "</p>\n");
        string path = Path.Combine(folder, "spectrum", "clusters.tsv");
        if (!File.Exists(path)) return;
        var (header, rows) = ReadTsv(path);
        int Col(string name) => Array.IndexOf(header, name);
        int pCol = Col("p");
        var listed = rows.Where(r => double.TryParse(r[pCol], NumberStyles.Float, Inv, out double p) && p <= ClusterLevel).ToArray();
        if (listed.Length == 0)
        {
            sb.Append($"<p class=\"quiet\">No cluster at p ≤ {Num(ClusterLevel, "0.##")} ({rows.Count} cluster{(rows.Count == 1 ? "" : "s")} in all; " +
                      "<code>spectrum/clusters.tsv</code> lists them).</p>\n");
            return;
        }
        string Range(string low, string high, string between) =>
            low == high ? Number(low, "0.###") : $"{Number(low, "0.###")}{between}{Number(high, "0.###")}";
        var cells = listed.Select(r => (IReadOnlyList<string>)
        [
            E($"{r[Col("channel_a")]}–{r[Col("channel_b")]}"), E(r[Col("measure")]), E(r[Col("cluster")]),
            E($"{r[Col("condition_a")]} {(r[Col("sign")] == "positive" ? "above" : "below")} {r[Col("condition_b")]}"),
            Range(r[Col("low_hz")], r[Col("high_hz")], "–"), Range(r[Col("start_s")], r[Col("end_s")], " to "), E(r[Col("cells")]),
            Number(r[Col("mass")], "0.0"), double.TryParse(r[pCol], NumberStyles.Float, Inv, out double pv) ? P(pv) : E(r[pCol]),
        ]);
        sb.Append($"<p>{listed.Length} of {rows.Count} cluster{(rows.Count == 1 ? "" : "s")} at p ≤ {Num(ClusterLevel, "0.##")}, by decreasing |mass| " +
                  "(frequency and time: the cells' frequencies and bin centres):</p>\n");
        Table(sb, ["pair", "measure", "cluster", "sign", "Hz", "time (s)", "cells", "mass", "p"], cells, new HashSet<int> { 2, 6, 7, 8 });
    }

    private static void Figures(StringBuilder sb, Plan plan, string folder)
    {
        var images = ImagesStartingWith(Path.Combine(folder, "figures", "spectrum"), "");
        if (images.Count == 0)
        {
            if (!plan.Figures) sb.Append("<p class=\"quiet\">No figures were drawn (<code>figures: false</code> in the plan).</p>\n");
            return;
        }
        sb.Append("<details open><summary>figures</summary><div class=\"figs\">")
          .Append(string.Concat(images.Select(i => $"<figure>{Image(i, Path.GetFileName(i))}</figure>"))).Append("</div></details>\n");
    }

    private static string MethodText(SpectrumSpec spec, JsonNode? recorded)
    {
        if (spec.Method == "morlet") return $"complex Morlet wavelets, {S(spec.Cycles)} cycles at every frequency";
        string tapers = recorded?["tapers_per_window"] is JsonArray k && k.Count > 0
            ? $"; {k[0]} tapers over the analysis window" + (k.Count > 1 ? $", {k[1]} per time bin" : "")
            : "";
        return $"multitaper (DPSS tapers), half-bandwidth {S(spec.HalfBandwidthHz)} Hz{tapers}";
    }

    private static string FrequencyText(IReadOnlyList<double> frequencies)
    {
        const int shown = 12;
        string list = string.Join(", ", frequencies.Take(shown).Select(S)) + (frequencies.Count > shown ? ", …" : "");
        return frequencies.Count == 1 ? $"{list} Hz" : $"{frequencies.Count} from {S(frequencies[0])} to {S(frequencies[^1])} Hz: {list}";
    }

    private static string BinText(Plan plan, JsonNode? recorded)
    {
        var time = plan.Spectrum!.Time;
        if (time is null) return $"none: the analysis window {S(plan.Window.Start)} to {S(plan.Window.End)} s only";
        string centres = recorded?["time_bins_s"] is JsonArray bins && bins.Count > 0
            ? $"{bins.Count} bins, centres {S(bins[0]!.GetValue<double>())} to {S(bins[^1]!.GetValue<double>())} s"
            : "bins";
        return time.Width == 0
            ? $"{centres}: single time points every {S(time.Step)} s"
            : $"{centres}: {S(time.Width)} s wide every {S(time.Step)} s";
    }

    /// <summary>The pairs ("A–B") and measure keys of the spectrum table, in the order of their first rows.</summary>
    private static (IReadOnlyList<string> Pairs, IReadOnlyList<string> Measures) PairsAndMeasures(string path)
    {
        if (!File.Exists(path)) return ([], []);
        var (header, rows) = ReadTsv(path);
        int a = Array.IndexOf(header, "channel_a"), b = Array.IndexOf(header, "channel_b"), m = Array.IndexOf(header, "measure");
        return (rows.Select(r => $"{r[a]}–{r[b]}").Distinct().ToArray(), rows.Select(r => r[m]).Distinct().ToArray());
    }

    /// <summary>A number of a written table in <paramref name="format"/>; the text itself when it is not a number.</summary>
    private static string Number(string text, string format) =>
        double.TryParse(text, NumberStyles.Float, Inv, out double v) ? Num(v, format) : E(text);

    /// <summary>A setting as written in the plan: up to three decimals, invariant culture, minus sign for negatives.</summary>
    private static string S(double v) => Num(v, "0.###");
}
