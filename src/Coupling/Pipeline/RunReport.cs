using System.Globalization;
using System.Text;
using Coupling.Graphs;
using Coupling.Measures;
using Coupling.Outputs;
using Coupling.Plans;

namespace Coupling.Pipeline;

/// <summary>Writes report.md: what was analysed, how, and what came out, in words and tables a reader can check.</summary>
public static class RunReport
{
    /// <summary>The caution every report opens with.</summary>
    public const string ResearchUseNotice =
        "Research use only. Coupling is not a medical device and its results must not be used for clinical decisions. " +
        "Results depend on recording quality and on the analysis choices listed below (reference, bands, window, " +
        "trial count, measure, number of surrogates); report them with any result.";

    /// <summary>Writes the report (atomically) to <paramref name="path"/>.</summary>
    public static void Write(Plan plan, LoadedInput input, Analysis analysis, IReadOnlyList<ChannelGraph> graphs, string path)
    {
        var inv = CultureInfo.InvariantCulture;
        var sb = new StringBuilder();
        sb.AppendLine("# Connectivity report");
        sb.AppendLine();
        sb.AppendLine($"> {ResearchUseNotice}");
        sb.AppendLine();
        foreach (var w in analysis.Warnings) sb.AppendLine($"> **Warning.** {w}").AppendLine();
        sb.AppendLine("## Input");
        sb.AppendLine();
        sb.AppendLine($"- Recording: `{Path.GetFileName(input.Source)}`, {input.Channels.Count} channels at {input.SampleRate.ToString("G6", inv)} Hz");
        sb.AppendLine($"- Channels: {string.Join(", ", input.Channels.Select(c => c.Label))}");
        foreach (var note in input.Notes) sb.AppendLine($"- Note from reading: {note}");
        sb.AppendLine();
        sb.AppendLine("| condition | event labels | trials kept | trials dropped |");
        sb.AppendLine("|---|---|---|---|");
        foreach (var (spec, summary) in plan.Conditions.Zip(analysis.Conditions))
            sb.AppendLine($"| {spec.Name} | {string.Join(", ", spec.EventLabels)} | {summary.Trials} | {summary.Dropped.Count} |");
        foreach (var d in analysis.Conditions.SelectMany(c => c.Dropped)) sb.AppendLine($"- Dropped: {d}");
        sb.AppendLine();

        sb.AppendLine("## Analysis");
        sb.AppendLine();
        sb.AppendLine(string.Create(inv, $"- Trials: {plan.Trial.Start} to {plan.Trial.End} s around each onset; analysis window {plan.Window.Start} to {plan.Window.End} s"));
        sb.AppendLine($"- Evoked response: {(plan.SubtractEvoked ? "each condition's trial mean subtracted before band isolation" : "kept (trial-shuffle surrogates keep it too, so it is not called coupling)")}");
        sb.AppendLine($"- Band isolation: {plan.Decomposition.Method}; every trial padded by {analysis.PadSamples} samples at each end");
        sb.AppendLine($"- Measures: {string.Join(", ", plan.Measures.Select(MeasureCatalog.Key))}");
        if (plan.Surrogates == 0)
            sb.AppendLine("- Significance: not tested (surrogates: 0, values only); p, z and corrected p are empty (NA) and no pair is significant");
        else
        sb.AppendLine($"- Significance: {plan.Surrogates} trial-shuffle surrogates per condition and band (seed {plan.Seed}); p = (b+1)/(M+1); " +
                      $"Benjamini-Hochberg false discovery rate at q = {plan.Q.ToString("G4", inv)} across the pairs of each condition x band x measure");
        sb.AppendLine();
        sb.AppendLine("| band | Hz | decomposition (as used) | time step (samples) |");
        sb.AppendLine("|---|---|---|---|");
        for (int i = 0; i < plan.Bands.Count; i++)
        {
            var b = plan.Bands[i];
            var info = analysis.Decompositions[i];
            string used = string.Join(", ", info.Parameters.Select(p => $"{p.Key} {p.Value.ToString("G5", inv)}"));
            sb.AppendLine(string.Create(inv, $"| {b.Name} | {b.Low}-{b.High} | {used} | {analysis.TimeSteps[i]} |"));
        }
        sb.AppendLine();

        sb.AppendLine("## Results");
        sb.AppendLine();
        sb.AppendLine("Significant pairs after correction, of all pairs tested; the strongest by z-score are listed.");
        sb.AppendLine();
        sb.AppendLine("| condition | band | measure | significant | density | strongest significant pairs (value, z) |");
        sb.AppendLine("|---|---|---|---|---|---|");
        for (int i = 0; i < analysis.Results.Count; i++)
        {
            var r = analysis.Results[i];
            var g = graphs[i];
            var top = g.Edges.OrderByDescending(e => double.IsNaN(e.Z) ? double.NegativeInfinity : Math.Abs(e.Z)).Take(3)
                .Select(e => string.Create(inv, $"{r.Channels[e.A]}-{r.Channels[e.B]} ({e.Value:0.###}, {e.Z:0.#})"));
            sb.AppendLine(string.Create(inv,
                $"| {r.Condition} | {r.Band} | {r.Measure} | {g.EdgeCount} / {r.Value.Length} | {g.Density:0.###} | {string.Join("; ", top)} |"));
        }
        sb.AppendLine();
        if (analysis.Contrasts.Count > 0)
        {
            sb.AppendLine("## Condition contrasts");
            sb.AppendLine();
            sb.AppendLine($"Differences A − B tested by {plan.Surrogates} random reassignments of the condition labels of the pooled trials " +
                          $"(group sizes kept; two-sided p = (b+1)/(M+1); Benjamini-Hochberg at q = {plan.Q.ToString("G4", inv)} across the pairs of each contrast x band x measure). " +
                          "A pair significant in one condition and not in the other is NOT evidence that the two differ; this test is.");
            sb.AppendLine();
            sb.AppendLine("| contrast | band | measure | significant | largest significant differences (A, B, A − B, z) |");
            sb.AppendLine("|---|---|---|---|---|");
            foreach (var c in analysis.Contrasts)
            {
                int found = c.Significant.Count(s => s);
                var top = Enumerable.Range(0, c.Difference.Length).Where(k => c.Significant[k])
                    .OrderByDescending(k => double.IsNaN(c.Z[k]) ? double.NegativeInfinity : Math.Abs(c.Z[k])).Take(3)
                    .Select(k =>
                    {
                        var (a, b) = PairIndex.Channels(k, c.Channels.Count);
                        return string.Create(inv, $"{c.Channels[a]}-{c.Channels[b]} ({c.ValueA[k]:0.###}, {c.ValueB[k]:0.###}, {c.Difference[k]:0.###}, {c.Z[k]:0.#})");
                    });
                sb.AppendLine($"| {c.ConditionA} vs {c.ConditionB} | {c.Band} | {c.Measure} | {found} / {c.Difference.Length} | {string.Join("; ", top)} |");
            }
            sb.AppendLine();
        }

        sb.AppendLine("## Reading these results");
        sb.AppendLine();
        sb.AppendLine("- plv, ppc and coherence also respond to volume conduction (one source seen by two channels at zero lag); " +
                      "pli, wpli, wpli-debiased, imag-coherency and aec-orth do not, so a pair significant only under the first group may be a shared source.");
        sb.AppendLine("- Trial-shuffle surrogates keep each channel's stimulus-locked (evoked) activity, so a response shared only through the stimulus is not significant; " +
                      "the null hypothesis is no trial-by-trial dependence between the two channels.");
        sb.AppendLine("- Correction is within each condition x band x measure; looking across many tables raises the chance of a false finding again.");
        sb.AppendLine("- Files: edges.tsv (every pair), nodes.tsv (degree, strength, clustering, component, module), graphs.tsv (graph measures), matrices/ (CSV), graphs/ (GraphML), figures/ (PNG and SVG), manifest.json (everything the run depended on)" +
                      (analysis.Contrasts.Count > 0 ? "; contrasts.tsv, matrices/contrasts/ and figures/contrasts/ (condition differences)." : "."));
        AtomicFile.WriteAllText(path, sb.ToString());
    }
}
