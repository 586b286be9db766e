using System.Globalization;
using System.Text;
using Coupling.Artefacts;
using Coupling.Measures;
using Coupling.Outputs;
using Coupling.Results;
using static Coupling.Reports.HtmlParts;

namespace Coupling.Reports;

/// <summary>
/// Writes report.html: one self-contained page per run (styles inline, every figure embedded as a data URI, no script,
/// no external resource) that opens offline in any browser. Like every output but the manifest, it holds nothing about
/// the run itself (no times): the same plan and data give the same bytes.
/// </summary>
/// <remarks>
/// Order: the research-use caution and any warnings; the overview figure of every condition x band x measure; a count
/// of significant pairs per table linking to the tables; the input, trials kept and dropped, and the decomposition
/// actually used per band; the artefact flags; per table the significant pairs (value, z, p, corrected p, lag) with the
/// table's figures; the condition contrasts; the spectra and the cluster test (<see cref="SpectrumSection"/>, with a
/// <c>spectrum</c> key only); the surrogate distribution of one edge; graph tables found in the results folder; the
/// methods paragraph with its references; the files of the folder. Figures are taken from the results folder's
/// <c>figures/</c> (whatever it holds for each table's file stem), graph tables from <c>nodes.tsv</c> and any
/// <c>graph*.tsv</c> beside it.
/// </remarks>
public static class HtmlReport
{
    /// <summary>The caution the report opens with.</summary>
    public const string ResearchUseNotice =
        "Research use only. Coupling is not a medical device and its results must not be used for clinical decisions. " +
        "Results depend on recording quality and on the analysis choices listed in this report (reference, bands, window, " +
        "trial count, measure, number of surrogates); report them with any result.";

    /// <summary>File name of the overview figure inside <c>figures/</c>.</summary>
    public const string OverviewFile = "overview.png";

    /// <summary>File name of the surrogate distribution figure inside <c>figures/</c>.</summary>
    public const string SurrogateFile = "surrogate-distribution.png";

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Writes the report of <paramref name="content"/> (atomically) to <paramref name="path"/>.</summary>
    /// <param name="content">What to report.</param>
    /// <param name="folder">The results folder as written so far, where figures and tables are read from.</param>
    /// <param name="path">The report file.</param>
    public static void Write(ReportContent content, string folder, string path)
    {
        ArgumentNullException.ThrowIfNull(content);
        AtomicFile.WriteAllText(path, Render(content, folder));
    }

    /// <summary>The report's HTML.</summary>
    public static string Render(ReportContent content, string folder)
    {
        ArgumentNullException.ThrowIfNull(content);
        var sb = new StringBuilder();
        var a = content.Analysis;
        string recording = Path.GetFileName(content.Recording);
        sb.Append("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">")
          .Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">")
          .Append($"<title>Connectivity report: {E(recording)}</title><style>{Style}</style></head><body>\n<main>\n");
        sb.Append($"<header><p class=\"kicker\">Connectivity report</p><h1>{E(recording)}</h1>")
          .Append($"<p class=\"sub\">{content.Channels.Count} channels · {a.Conditions.Count} condition{(a.Conditions.Count == 1 ? "" : "s")} · ")
          .Append($"{content.Plan.Bands.Count} band{(content.Plan.Bands.Count == 1 ? "" : "s")} · {content.Plan.Measures.Count} measure{(content.Plan.Measures.Count == 1 ? "" : "s")} · ")
          .Append($"{E(content.Manifest.Tool.Name)} {E(content.Manifest.Tool.Version.Split('+')[0])}</p></header>\n");
        sb.Append($"<aside class=\"caution\" id=\"caution\"><strong>Research use only.</strong> {E(ResearchUseNotice["Research use only. ".Length..])}</aside>\n");
        foreach (var w in a.Warnings) sb.Append($"<aside class=\"warning\"><strong>Warning.</strong> {E(w)}</aside>\n");

        Overview(sb, content, folder);
        InputSection(sb, content);
        FlagSection(sb, content);
        TableSections(sb, content, folder);
        ContrastSection(sb, content, folder);
        SpectrumSection.Append(sb, content.Plan, content.Manifest.Extra?["spectrum"], folder);
        SurrogateSection(sb, content, folder);
        ComponentSection(sb, content);
        GraphTables(sb, folder);
        MethodsSection(sb, content);
        FilesSection(sb, content);
        sb.Append("</main></body></html>\n");
        return sb.ToString();
    }

    private static string Anchor(PairResult r) => "t-" + OutputNames.Stem(r);

    private static void Overview(StringBuilder sb, ReportContent c, string folder)
    {
        var results = c.Analysis.Results;
        sb.Append("<section id=\"overview\"><h2>At a glance</h2>\n");
        string overview = Path.Combine(folder, "figures", OverviewFile);
        if (File.Exists(overview))
            sb.Append("<figure class=\"wide\">").Append(Image(overview, "Overview: every condition × band × measure", "overview-figure"))
              .Append("<figcaption>Every tested table: channel × channel values, significant pairs dotted; one colour scale per measure.</figcaption></figure>\n");
        else
            sb.Append("<p class=\"quiet\">No figures were drawn (<code>figures: false</code> in the plan).</p>\n");
        int total = results.Sum(r => r.Significant.Count(s => s));
        int pairs = results.Count == 0 ? 0 : results[0].Significant.Length;
        sb.Append($"<p>{results.Count} tables of {pairs} pairs each; {total} significant pairs in all after correction " +
                  $"({E(Pipeline.CorrectionText.Describe(c.Plan.Correction, c.Plan.Q))}; family: {Pipeline.CorrectionText.ConditionFamily}). Counts per table, linked to its details:</p>\n");
        var measures = results.Select(r => r.Measure).Distinct().ToArray();
        var rows = results.Select(r => (r.Condition, r.Band)).Distinct().Select(key =>
        {
            var cells = new List<string> { E(key.Condition), E(key.Band) };
            foreach (var m in measures)
            {
                var r = results.FirstOrDefault(x => x.Condition == key.Condition && x.Band == key.Band && x.Measure == m);
                int n = r?.Significant.Count(s => s) ?? 0;
                cells.Add(r is null ? "" : $"<a class=\"{(n > 0 ? "hit" : "none")}\" href=\"#{Anchor(r)}\">{n}</a>");
            }
            return (IReadOnlyList<string>)cells;
        });
        Table(sb, ["condition", "band", .. measures], rows, Enumerable.Range(2, measures.Length).ToHashSet(), "counts");
        sb.Append("</section>\n");
    }

    private static void InputSection(StringBuilder sb, ReportContent c)
    {
        var plan = c.Plan;
        sb.Append("<section id=\"input\"><h2>Input and processing</h2>\n<dl>");
        sb.Append($"<dt>Recording</dt><dd><code>{E(Path.GetFileName(c.Recording))}</code>, {c.Channels.Count} channels at {Num(c.SampleRate, "G6")} Hz</dd>");
        sb.Append($"<dt>Channels</dt><dd>{E(string.Join(", ", c.Channels))}</dd>");
        sb.Append($"<dt>Trial span</dt><dd>{Num(plan.Trial.Start, "0.###")} to {Num(plan.Trial.End, "0.###")} s around each onset</dd>");
        sb.Append($"<dt>Analysis window</dt><dd>{Num(plan.Window.Start, "0.###")} to {Num(plan.Window.End, "0.###")} s</dd>");
        sb.Append($"<dt>Evoked response</dt><dd>{(plan.SubtractEvoked ? "subtracted (each condition's trial mean, before band isolation)" : "kept")}</dd>");
        sb.Append(plan.Surrogates == 0
            ? "<dt>Significance</dt><dd>not tested (surrogates: 0, values only): p, z and corrected p are empty and no pair is significant</dd>"
            : $"<dt>Significance</dt><dd>{plan.Surrogates} trial-shuffle surrogates (seed {plan.Seed}); {E(Pipeline.CorrectionText.Describe(plan.Correction, plan.Q))}; " +
              $"family: {E(Pipeline.CorrectionText.ConditionFamily)} ({E(Pipeline.CorrectionText.ContrastFamily)} for contrasts)</dd>");
        foreach (var note in c.InputNotes) sb.Append($"<dt>Note from reading</dt><dd>{E(note)}</dd>");
        sb.Append("</dl>\n<h3>Trials per condition</h3>\n");
        var rows = plan.Conditions.Zip(c.Analysis.Conditions).Select(p => (IReadOnlyList<string>)
            [E(p.First.Name), E(string.Join(", ", p.First.EventLabels)), p.Second.Trials.ToString(Inv), p.Second.Dropped.Count.ToString(Inv)]);
        Table(sb, ["condition", "event labels", "kept", "dropped"], rows, new HashSet<int> { 2, 3 });
        var dropped = c.Analysis.Conditions.SelectMany(x => x.Dropped.Select(d => $"{x.Condition}: {d}")).ToArray();
        if (dropped.Length > 0)
            sb.Append($"<details><summary>{dropped.Length} dropped trial{(dropped.Length == 1 ? "" : "s")}, with reasons</summary><ul>")
              .Append(string.Concat(dropped.Select(d => $"<li>{E(d)}</li>"))).Append("</ul></details>\n");
        sb.Append("<h3>Band isolation as used</h3>\n");
        var bandRows = plan.Bands.Select((b, i) =>
        {
            var info = c.Analysis.Decompositions[i];
            return (IReadOnlyList<string>)[E(b.Name), $"{Num(b.Low, "0.##")}–{Num(b.High, "0.##")}", E(info.Method), E(Widths(info)),
                c.Analysis.TimeSteps[i].ToString(Inv)];
        });
        Table(sb, ["band", "Hz", "method", "actual widths", "time step (samples)"], bandRows, new HashSet<int> { 4 });
        sb.Append("</section>\n");
    }

    /// <summary>The widths a decomposition actually had, in words.</summary>
    internal static string Widths(Spectral.DecompositionInfo info)
    {
        double G(string k) => info.Parameters.TryGetValue(k, out var v) ? v : double.NaN;
        if (info.Method == "morlet")
        {
            const double fwhm = 2.3548200450309493; // 2·sqrt(2·ln 2): full width at half maximum of a Gaussian, in standard deviations
            return $"centre {Num(G("centre_hz"), "0.##")} Hz, {Num(G("cycles"), "0.##")} cycles; spectral sd {Num(G("freq_sd_hz"), "0.##")} Hz " +
                   $"(FWHM {Num(fwhm * G("freq_sd_hz"), "0.##")} Hz); temporal sd {Num(1000 * G("time_sd_s"), "0.#")} ms " +
                   $"(FWHM {Num(1000 * fwhm * G("time_sd_s"), "0.#")} ms)";
        }
        return $"pass band {Num(G("pass_low_hz"), "0.##")}–{Num(G("pass_high_hz"), "0.##")} Hz, stop below {Num(G("stop_low_hz"), "0.##")} " +
               $"and above {Num(G("stop_high_hz"), "0.##")} Hz (transition {Num(G("transition_hz"), "0.##")} Hz, {Num(G("attenuation_db"), "0")} dB); " +
               $"{Num(G("filter_taps"), "0")} taps = {Num(1000 * G("filter_length_s"), "0")} ms";
    }

    private static void FlagSection(StringBuilder sb, ReportContent c)
    {
        sb.Append("<section id=\"flags\"><h2>Artefact flags</h2>\n");
        sb.Append("<p>Findings that may not be coupling between the two sites: reasons to look again, not verdicts (<code>flags.tsv</code> lists them all).</p>\n");
        if (c.Flags.Count == 0) sb.Append("<p class=\"ok\">No flag raised.</p>\n");
        else
        {
            foreach (var group in c.Flags.GroupBy(f => f.Kind))
            {
                sb.Append($"<h3>{E(FlagTitle(group.Key))} <span class=\"count\">{group.Count()}</span></h3>\n");
                var rows = group.Select(f => (IReadOnlyList<string>)[E(f.Condition), E(f.Band),
                    E(f.ChannelB is null ? f.ChannelA : $"{f.ChannelA}–{f.ChannelB}"), E(f.Measures), E(f.Detail)]);
                Table(sb, ["condition", "band", group.Key == ArtefactKind.PowerOutlier ? "channel" : "pair", "measures", "detail"], rows,
                    cssClass: "flags");
            }
        }
        foreach (var note in c.UncheckedFlags) sb.Append($"<p class=\"quiet\">{E(note)}</p>\n");
        sb.Append("</section>\n");
    }

    private static string FlagTitle(ArtefactKind kind) => kind switch
    {
        ArtefactKind.ZeroLag => "Possibly zero lag (volume conduction or a common reference)",
        ArtefactKind.AmplitudeDriven => "Possibly driven by amplitude",
        ArtefactKind.SharedEvoked => "Shared stimulus-locked response, evoked response kept",
        ArtefactKind.PowerOutlier => "Channel power far from the others",
        _ => kind.ToString(),
    };

    private static void TableSections(StringBuilder sb, ReportContent c, string folder)
    {
        sb.Append("<section id=\"tables\"><h2>Significant pairs per table</h2>\n");
        sb.Append("<p>Per condition × band × measure, the pairs significant after correction, strongest |z| first. Lag: phase of the " +
                  "window-mean coherency as a time at the band centre, positive when the first channel leads; known only within half a period.</p>\n");
        if (c.Plan.Surrogates == 0)
            sb.Append("<p class=\"quiet\">Values only (surrogates: 0): no pair was tested, so none is listed; the figures and <code>edges.tsv</code> hold the values.</p>\n");
        string figures = Path.Combine(folder, "figures");
        foreach (var r in c.Analysis.Results)
        {
            var signals = c.Analysis.Signals?.FirstOrDefault(s => s.Condition == r.Condition && s.Band == r.Band);
            var hits = Enumerable.Range(0, r.Significant.Length).Where(k => r.Significant[k])
                .OrderByDescending(k => double.IsNaN(r.Z[k]) ? double.NegativeInfinity : Math.Abs(r.Z[k])).ToArray();
            sb.Append($"<article id=\"{Anchor(r)}\" class=\"{(hits.Length > 0 ? "table hit" : "table none")}\">")
              .Append($"<h3>{E(r.Condition)} · {E(r.Band)} · {E(r.Measure)} <span class=\"count\">{hits.Length} / {r.Significant.Length}</span></h3>\n");
            if (hits.Length > 0)
            {
                var rows = hits.Select(k =>
                {
                    var (ia, ib) = PairIndex.Channels(k, r.Channels.Count);
                    return (IReadOnlyList<string>)[E(r.Channels[ia]), E(r.Channels[ib]), Num(r.Value[k], "0.####"), Num(r.Z[k], "0.0"),
                        P(r.P[k]), P(r.PCorrected[k]), signals is null ? "–" : Num(signals.LagMs[k], "0.0")];
                });
                Table(sb, ["channel a", "channel b", "value", "z", "p", "corrected p", "lag (ms)"], rows, new HashSet<int> { 2, 3, 4, 5, 6 });
            }
            else sb.Append("<p class=\"quiet\">No pair significant.</p>\n");
            var images = ImagesStartingWith(figures, OutputNames.Stem(r) + "_");
            if (images.Count > 0)
                sb.Append(hits.Length > 0 ? "<details open>" : "<details>").Append("<summary>figures</summary><div class=\"figs\">")
                  .Append(string.Concat(images.Select(i => $"<figure>{Image(i, Path.GetFileName(i))}</figure>"))).Append("</div></details>\n");
            sb.Append("</article>\n");
        }
        sb.Append("</section>\n");
    }

    private static void ContrastSection(StringBuilder sb, ReportContent c, string folder)
    {
        var contrasts = c.Analysis.Contrasts;
        if (contrasts.Count == 0) return;
        sb.Append("<section id=\"contrasts\"><h2>Condition contrasts</h2>\n");
        sb.Append($"<p>Differences A − B tested by {c.Plan.Surrogates} random reassignments of the condition labels (group sizes kept, two-sided), " +
                  "corrected across the pairs of each contrast × band × measure. A pair significant in one condition and not in the other is not " +
                  "evidence that the two differ; this test is.</p>\n");
        string figures = Path.Combine(folder, "figures", "contrasts");
        var quiet = new List<string>();
        foreach (var x in contrasts)
        {
            var hits = Enumerable.Range(0, x.Significant.Length).Where(k => x.Significant[k])
                .OrderByDescending(k => double.IsNaN(x.Z[k]) ? double.NegativeInfinity : Math.Abs(x.Z[k])).ToArray();
            string name = $"{x.ConditionA} vs {x.ConditionB} · {x.Band} · {x.Measure}";
            if (hits.Length == 0) { quiet.Add(name); continue; }
            sb.Append($"<article class=\"table hit\"><h3>{E(name)} <span class=\"count\">{hits.Length} / {x.Significant.Length}</span></h3>\n");
            var rows = hits.Select(k =>
            {
                var (ia, ib) = PairIndex.Channels(k, x.Channels.Count);
                return (IReadOnlyList<string>)[E(x.Channels[ia]), E(x.Channels[ib]), Num(x.ValueA[k], "0.####"), Num(x.ValueB[k], "0.####"),
                    Num(x.Difference[k], "0.####"), Num(x.Z[k], "0.0"), P(x.P[k]), P(x.PCorrected[k])];
            });
            Table(sb, ["channel a", "channel b", x.ConditionA, x.ConditionB, "A − B", "z", "p", "corrected p"], rows,
                new HashSet<int> { 2, 3, 4, 5, 6, 7 });
            var images = ImagesStartingWith(figures, OutputNames.Stem(x.AsDifference()) + "_");
            if (images.Count > 0)
                sb.Append("<details open><summary>figures</summary><div class=\"figs\">")
                  .Append(string.Concat(images.Select(i => $"<figure>{Image(i, Path.GetFileName(i))}</figure>"))).Append("</div></details>\n");
            sb.Append("</article>\n");
        }
        if (quiet.Count > 0)
            sb.Append($"<p class=\"quiet\">No significant difference in: {E(string.Join("; ", quiet))}.</p>\n");
        sb.Append("</section>\n");
    }

    private static void SurrogateSection(StringBuilder sb, ReportContent c, string folder)
    {
        sb.Append("<section id=\"surrogates\"><h2>Surrogate distribution of one edge</h2>\n");
        var d = c.Analysis.SurrogateExample;
        string file = Path.Combine(folder, "figures", SurrogateFile);
        if (d is null)
        {
            sb.Append(!c.Plan.Figures ? "<p class=\"quiet\">No figures were drawn (<code>figures: false</code> in the plan).</p>\n"
                : c.Plan.Surrogates == 0 ? "<p class=\"quiet\">Values only (surrogates: 0): no surrogates were drawn.</p>\n"
                : "<p class=\"quiet\">No pair is significant and the plan names no edge (<code>surrogate_figure</code>), so none is drawn.</p>\n");
        }
        else
        {
            string how = d.Chosen == "plan" ? "named in the plan" : "the strongest significant edge (largest |z|)";
            sb.Append($"<p>{E(d.Condition)} · {E(d.Band)} · {E(d.Measure)}, {E(d.ChannelA)}–{E(d.ChannelB)}, {E(how)}: observed {Num(d.Observed, "0.####")} " +
                      $"against {d.Draws.Length} trial-shuffle surrogates, p = {P(d.P)}, z = {Num(d.Z, "0.0")}.</p>\n");
            if (File.Exists(file)) sb.Append("<figure class=\"mid\">").Append(Image(file, "Surrogate distribution with the observed value")).Append("</figure>\n");
        }
        sb.Append("</section>\n");
    }

    private static void GraphTables(StringBuilder sb, string folder)
    {
        var files = Directory.EnumerateFiles(folder, "*.tsv")
            .Where(f => Path.GetFileName(f) is var n && (n == "nodes.tsv" || n.StartsWith("graph", StringComparison.Ordinal)))
            .Order(StringComparer.Ordinal).ToArray();
        if (files.Length == 0) return;
        sb.Append("<section id=\"graphs\"><h2>Graph tables</h2>\n<p>As written in the results folder; the graphs hold the significant pairs of each table.</p>\n");
        foreach (var f in files)
        {
            var (header, rows) = ReadTsv(f);
            var numeric = Enumerable.Range(0, header.Length)
                .Where(i => rows.Count > 0 && rows.All(r => i < r.Length && double.TryParse(r[i], NumberStyles.Float, Inv, out _) || i < r.Length && r[i] == "NA"))
                .ToHashSet();
            sb.Append($"<details><summary><code>{E(Path.GetFileName(f))}</code>: {rows.Count} rows</summary>\n");
            Table(sb, header, rows.Select(r => (IReadOnlyList<string>)r.Select(Cell).ToArray()), numeric);
            sb.Append("</details>\n");
        }
        sb.Append("</section>\n");
    }

    private static void MethodsSection(StringBuilder sb, ReportContent c)
    {
        var methods = MethodsText.From(c.Manifest);
        sb.Append("<section id=\"methods\"><h2>Methods</h2>\n<p class=\"methods\">").Append(E(methods.Paragraph)).Append("</p>\n<h3>References</h3>\n<ol class=\"refs\">")
          .Append(string.Concat(methods.References.Select(r => $"<li>{E(r)}</li>"))).Append("</ol>\n")
          .Append("<p class=\"quiet\">Formulas and their sources in detail: docs/methods.md of the program. Every parameter is in <code>manifest.json</code>.</p></section>\n");
    }

    private static void ComponentSection(StringBuilder sb, ReportContent c)
    {
        if (!Pipeline.NetworkComponentsReport.Applies(c.Analysis)) return;
        sb.Append("<section id=\"components\"><h2>Network components</h2>\n<p>Connected components of supra-threshold edges " +
                  "(network-based statistic, Zalesky et al. 2010); the component number is the <code>component</code> column of the tables. " +
                  "A significant component says that coupling differs from the null somewhere in it, not at each of its edges.</p>\n");
        var rows = Pipeline.NetworkComponentsReport.Rows(c.Analysis);
        if (rows.Count == 0) sb.Append("<p class=\"quiet\">No edge was above the threshold in any table.</p>\n");
        else Table(sb, ["table", "component", "edges", "family-wise p", "channels"],
            rows.Select(r => (IReadOnlyList<string>)r.Select(x => E(x)).ToArray()), new HashSet<int> { 1, 2, 3 });
        sb.Append("</section>\n");
    }

    private static void FilesSection(StringBuilder sb, ReportContent c)
    {
        sb.Append("<section id=\"files\"><h2>Files of this run</h2>\n<p class=\"files\">")
          .Append(string.Join(" · ", c.Manifest.Outputs.Where(o => !o.StartsWith("figures/", StringComparison.Ordinal) && !o.StartsWith("matrices/", StringComparison.Ordinal) && !o.StartsWith("graphs/", StringComparison.Ordinal))
              .Select(o => $"<code>{E(o)}</code>")))
          .Append($" · <code>matrices/</code> ({c.Manifest.Outputs.Count(o => o.StartsWith("matrices/", StringComparison.Ordinal))} files)")
          .Append($" · <code>graphs/</code> ({c.Manifest.Outputs.Count(o => o.StartsWith("graphs/", StringComparison.Ordinal))} files)")
          .Append($" · <code>figures/</code> ({c.Manifest.Outputs.Count(o => o.StartsWith("figures/", StringComparison.Ordinal))} files)</p>\n")
          .Append($"<footer>{E(ResearchUseNotice)}</footer></section>\n");
    }

    private const string Style = """
        :root{--ink:#1f2430;--muted:#5d6472;--line:#d9dce3;--paper:#fbfbf8;--accent:#235b6e;--hit:#e8f1ee;--warn:#fff4d6;--caution:#f3ecf7}
        *{box-sizing:border-box}
        body{margin:0;background:var(--paper);color:var(--ink);font:15px/1.5 "DejaVu Sans",system-ui,sans-serif}
        main{max-width:1180px;margin:0 auto;padding:28px 24px 60px}
        header h1{margin:.1em 0 .2em;font-size:28px;letter-spacing:-.01em}
        .kicker{margin:0;color:var(--accent);font-size:13px;text-transform:uppercase;letter-spacing:.12em}
        .sub{margin:0 0 16px;color:var(--muted)}
        h2{margin:38px 0 10px;padding-bottom:6px;border-bottom:2px solid var(--ink);font-size:20px}
        h3{margin:22px 0 8px;font-size:16px}
        aside{padding:10px 14px;margin:10px 0;border-radius:4px}
        .caution{background:var(--caution);border-left:4px solid #6b4a85}
        .warning{background:var(--warn);border-left:4px solid #b07d00}
        figure{margin:10px 0}
        figure img{display:block;max-width:100%;height:auto;border:1px solid var(--line);background:#fff}
        figure.mid img{max-width:760px}
        figcaption{color:var(--muted);font-size:13px;margin-top:4px}
        .figs{display:grid;grid-template-columns:repeat(auto-fit,minmax(320px,1fr));gap:12px}
        .scroll{overflow-x:auto}
        table{border-collapse:collapse;margin:6px 0 12px;font-size:14px}
        th,td{padding:4px 10px;border-bottom:1px solid var(--line);text-align:left;vertical-align:top}
        th{font-weight:600;border-bottom:1.5px solid var(--ink)}
        td.n,th.n{text-align:right;font-variant-numeric:tabular-nums}
        table.counts a{display:inline-block;min-width:2.2em;text-align:center;border-radius:3px;text-decoration:none}
        table.counts a.hit{background:var(--accent);color:#fff;font-weight:600}
        table.counts a.none{color:var(--muted)}
        table.flags td:last-child{max-width:560px}
        article.table{padding:2px 0 6px;border-bottom:1px dashed var(--line)}
        article.none h3{color:var(--muted);font-weight:500}
        .count{display:inline-block;margin-left:6px;padding:0 7px;border-radius:10px;background:var(--hit);font-size:13px;font-weight:600}
        details summary{cursor:pointer;color:var(--accent)}
        dl{display:grid;grid-template-columns:max-content 1fr;gap:4px 16px;margin:8px 0}
        dt{color:var(--muted)} dd{margin:0}
        code{font-family:"DejaVu Sans Mono",monospace;font-size:13px}
        .quiet{color:var(--muted)} .ok{color:#2d6a3e}
        .methods{max-width:80ch}
        .refs{font-size:13px;max-width:90ch}
        footer{margin-top:30px;padding-top:10px;border-top:1px solid var(--line);color:var(--muted);font-size:13px}
        @media print{main{max-width:none} details{display:block}}
        """;
}
