using System.Security.Cryptography;
using System.Xml.Linq;
using Coupling.Measures;
using Coupling.Outputs;
using Coupling.Pipeline;
using Coupling.Spectral;
using Coupling.Tests.Figures;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// The full pipeline recovers what the simulated scenario builds in (truth.json), and writes a complete results folder.
/// The expectations are those of the measures' definitions: zero-lag mixing leaves PLI, wPLI and imaginary coherency
/// at zero (Stam et al. 2007, Hum. Brain Mapp. 28:1178; Vinck et al. 2011, NeuroImage 55:1548; Nolte et al. 2004,
/// Clin. Neurophysiol. 115:2292); trial-shuffle surrogates keep a stimulus-locked response in every trial, so it is not
/// called coupling (common practice); envelope-only coupling is seen by envelope correlation and not by phase locking
/// (Hipp et al. 2012, Nat. Neurosci. 15:884).
/// </summary>
[Collection(ScenarioRunCollection.Name)]
public sealed class EndToEndTests(ScenarioRun run)
{
    private static string Describe(TruthCheckLine l) =>
        $"{l.ChannelA}-{l.ChannelB} {l.Kind} {l.Condition}/{l.Band}/{l.Measure}: expected {(l.ExpectSignificant ? "significant" : "not significant")}, " +
        $"got {(l.Significant ? "significant" : "not significant")} (corrected p {l.PCorrected:G3})";

    private IEnumerable<TruthCheckLine> Lines(string kind, string measure) => run.Lines.Where(l => l.Kind == kind && l.Measure == measure);

    [Fact]
    public void Every_expectation_of_the_ground_truth_is_met()
    {
        // 5 pairs x 2 conditions, each checked under the measures its truth names: never an empty check.
        Assert.True(run.Lines.Count >= 5 * 2 * 4, $"only {run.Lines.Count} lines compared");
        var bad = run.Lines.Where(l => !l.Agrees).Select(Describe).ToArray();
        Assert.True(bad.Length == 0, $"{bad.Length} of {run.Lines.Count} expectations not met:\n" + string.Join("\n", bad));
    }

    [Fact]
    public void Every_true_pair_is_significant_in_its_band_and_condition()
    {
        var expected = run.Lines.Where(l => l.ExpectSignificant).ToArray();
        foreach (var kind in new[] { "phase-coupled", "zero-lag-mixing", "envelope-only" })
            Assert.Contains(expected, l => l.Kind == kind);
        var missed = expected.Where(l => !l.Significant).Select(Describe).ToArray();
        Assert.True(missed.Length == 0, string.Join("\n", missed));
        // The beta pair is coupled in 'tone' only; in 'light' it must not be found.
        var betaLight = run.Lines.Where(l => l.Band == "beta" && l.Condition == "light").ToArray();
        Assert.NotEmpty(betaLight);
        Assert.All(betaLight, l => Assert.False(l.Significant, Describe(l)));
    }

    [Theory]
    [InlineData("wpli")]
    [InlineData("pli")]
    [InlineData("imag-coherency")]
    public void The_zero_lag_pair_is_not_significant_under_lag_insensitive_measures(string measure)
    {
        var lines = Lines("zero-lag-mixing", measure).ToArray();
        Assert.Equal(2, lines.Length);
        Assert.All(lines, l => Assert.False(l.Significant, Describe(l)));
        // while a measure that accepts zero lag finds it (so the pair is really there).
        Assert.All(Lines("zero-lag-mixing", "plv"), l => Assert.True(l.Significant, Describe(l)));
    }

    [Fact]
    public void The_stimulus_locked_pair_is_not_significant_against_trial_shuffle_surrogates()
    {
        var lines = run.Lines.Where(l => l.Kind == "stimulus-locked").ToArray();
        Assert.Equal(2 * MeasureCatalog.All.Count, lines.Length);
        Assert.All(lines, l => Assert.False(l.Significant, Describe(l)));
    }

    [Fact]
    public void The_envelope_only_pair_is_found_by_aec_and_not_by_plv()
    {
        var aec = Lines("envelope-only", "aec").ToArray();
        var plv = Lines("envelope-only", "plv").ToArray();
        Assert.Equal(2, aec.Length);
        Assert.Equal(2, plv.Length);
        Assert.All(aec, l => Assert.True(l.Significant, Describe(l)));
        Assert.All(plv, l => Assert.False(l.Significant, Describe(l)));
    }

    [Fact]
    public void The_results_folder_holds_report_manifest_tables_graphs_and_figures()
    {
        Assert.Equal(Path.Combine(run.Paths.Folder, "results"), run.Outcome.OutputFolder);
        foreach (var f in new[] { "report.html", "manifest.json", "edges.tsv", "nodes.tsv", "graphs.tsv", "flags.tsv" })
            Assert.True(File.Exists(run.Output(f)), f);
        int tables = run.Plan.Conditions.Count * run.Plan.Bands.Count * run.Plan.Measures.Count;
        Assert.Equal(2 * 4 * 9, tables);
        Assert.Equal(tables, run.Outcome.Results.Count);
        var graphml = Directory.GetFiles(run.Output("graphs"), "*.graphml");
        Assert.Equal(tables, graphml.Length);
        XNamespace ns = "http://graphml.graphdrawing.org/xmlns"; // GraphML 1.0 namespace (graphml.graphdrawing.org specification)
        foreach (var g in graphml)
        {
            var doc = XDocument.Load(g);
            Assert.Equal(ns + "graphml", doc.Root!.Name);
            Assert.Equal(10, doc.Descendants(ns + "node").Count());
        }
        var pngs = Directory.GetFiles(run.Output("figures"), "*.png");
        // A matrix and a network figure per table, the overview and the surrogate distribution of one edge.
        Assert.Equal(2 * tables + 2, pngs.Length);
        foreach (var p in pngs)
        {
            var (w, h) = PngHeader.Read(p);
            Assert.True(w > 100 && h > 100, $"{p}: {w}x{h}");
            Assert.True(File.Exists(Path.ChangeExtension(p, ".svg")), $"{p}: no SVG beside it");
        }
        // One row of graph measures per table, one row of node measures per channel per table.
        Assert.Equal(tables + 1, File.ReadAllLines(run.Output("graphs.tsv")).Length);
        Assert.Equal(10 * tables + 1, File.ReadAllLines(run.Output("nodes.tsv")).Length);
        // No temporary sibling is left beside the committed folder.
        Assert.Equal(["plan.yaml", "results", "scenario.edf", "scenario_channels.tsv", "scenario_electrodes.tsv", "truth.json"],
            Directory.EnumerateFileSystemEntries(run.Paths.Folder).Select(p => Path.GetFileName(p)!).Order(StringComparer.Ordinal).ToArray());
    }

    [Fact]
    public void The_edge_table_has_a_row_for_every_pair_of_every_table()
    {
        var lines = File.ReadAllLines(run.Output("edges.tsv"));
        // Rows: conditions x bands x measures x pairs, with 10 · 9 / 2 = 45 pairs of ten channels.
        Assert.Equal(2 * 4 * 9 * 45, lines.Length - 1);
        Assert.Equal(string.Join('\t', EdgeTableWriter.Columns), lines[0]);
        int columns = EdgeTableWriter.Columns.Count;
        Assert.All(lines.Skip(1), l => Assert.Equal(columns, l.Split('\t').Length));
    }

    [Fact]
    public void The_manifest_records_the_input_hash_decompositions_and_time_steps()
    {
        var m = ManifestReader.Read(run.Output("manifest.json"));
        var edf = Assert.Single(m.Inputs, i => i.Path == run.Paths.Recording);
        // SHA-256 per FIPS 180-4, computed here by the platform's own implementation, independent of the writer.
        string sha = Convert.ToHexStringLower(SHA256.HashData(File.ReadAllBytes(run.Paths.Recording)));
        Assert.Equal(sha, edf.Sha256);
        Assert.Equal(new FileInfo(run.Paths.Recording).Length, edf.Bytes);
        Assert.Contains(m.Inputs, i => i.Path == run.Paths.Plan);
        Assert.Equal(run.Plan.Seed, m.Seed);

        Assert.Equal(run.Plan.Bands.Select(b => b.Name), m.Decompositions.Select(d => d.Band));
        Assert.All(m.Decompositions, d => Assert.Equal("fir-hilbert", d.Method));
        for (int i = 0; i < run.Plan.Bands.Count; i++)
        {
            // The same design, rebuilt here, states the same parameters and gives the same default step.
            var rebuilt = BandDecompositions.Create("fir-hilbert", run.Plan.Bands[i], run.Truth.SampleRate).Info;
            var written = m.Decompositions[i].Parameters;
            Assert.Equal(rebuilt.Parameters.Keys.Order(StringComparer.Ordinal), written.Keys.Order(StringComparer.Ordinal));
            Assert.Contains("filter_taps", written.Keys);
            // Derived values (e.g. taps / rate) may be computed in another order: equal to a few units in the last place.
            foreach (var (key, value) in rebuilt.Parameters)
                Assert.True(Math.Abs(value - written[key]) <= 1e-12 * Math.Max(1, Math.Abs(value)), $"{key}: {value} vs {written[key]}");
            int step = TimeStep.Default(rebuilt, run.Truth.SampleRate);
            Assert.Equal(run.Plan.Bands[i].Name, m.TimeSteps[i].Band);
            Assert.Equal(step, m.TimeSteps[i].Samples);
            Assert.Equal(step / run.Truth.SampleRate, m.TimeSteps[i].Seconds, 12);
        }
        Assert.Equal(run.Plan.Conditions.Select(c => c.Name), m.Conditions.Select(c => c.Condition));
        Assert.All(m.Outputs, o => Assert.True(File.Exists(run.Output(o)), o));
    }

    [Fact]
    public void The_report_opens_with_the_research_use_notice()
    {
        string report = File.ReadAllText(run.Output("report.html"));
        Assert.Contains("Research use only", report);
        Assert.Contains("not a medical device", report);
        Assert.True(report.IndexOf("Research use only", StringComparison.Ordinal) < report.IndexOf("id=\"input\"", StringComparison.Ordinal));
    }

    [Fact]
    public void The_beta_pair_coupled_in_tone_only_differs_between_tone_and_light()
    {
        // A permutation test of the condition labels detects a difference where the relation exists in one condition
        // only (Maris and Oostenveld 2007, J Neurosci Methods 164:177): every measure that finds the pair in 'tone'.
        var beta = run.Truth.Pairs.Single(p => p.Band == "beta");
        var lines = run.ContrastLines.Where(l => l.Band == "beta" && l.ChannelA == beta.ChannelA && l.ChannelB == beta.ChannelB).ToArray();
        Assert.Equal(beta.DetectedBy.Count, lines.Length);
        Assert.All(lines, l => Assert.Equal("tone vs light", l.Condition));
        Assert.All(lines, l => Assert.True(l.Significant, Describe(l)));
    }

    [Fact]
    public void Pairs_built_the_same_in_both_conditions_do_not_differ()
    {
        // theta, zero-lag, envelope and stimulus-locked pairs are present in both conditions at one strength: the
        // labels are exchangeable for them, so no difference may be called significant.
        var lines = run.ContrastLines.Where(l => !l.ExpectSignificant).ToArray();
        Assert.Equal(4 * MeasureCatalog.All.Count, lines.Length);
        foreach (var kind in new[] { "phase-coupled", "zero-lag-mixing", "envelope-only", "stimulus-locked" })
            Assert.Contains(lines, l => l.Kind == kind);
        Assert.All(lines, l => Assert.False(l.Significant, Describe(l)));
    }

    [Fact]
    public void The_contrast_table_has_a_row_for_every_pair_of_every_band_and_measure()
    {
        var lines = File.ReadAllLines(run.Output("contrasts.tsv"));
        // Rows: 1 contrast x 4 bands x 9 measures x 45 pairs.
        Assert.Equal(1 * 4 * 9 * 45, lines.Length - 1);
        Assert.Equal(string.Join('\t', ContrastTableWriter.Columns), lines[0]);
        int columns = ContrastTableWriter.Columns.Count;
        Assert.All(lines.Skip(1), l => Assert.Equal(columns, l.Split('\t').Length));
        Assert.All(lines.Skip(1), l => Assert.StartsWith("tone-vs-light\ttone\tlight\t", l, StringComparison.Ordinal));
        Assert.Equal(4 * 9, run.Outcome.Contrasts.Count);
        Assert.Equal(3 * 4 * 9, Directory.GetFiles(run.Output("matrices/contrasts"), "*.csv").Length);
        Assert.Equal(2 * 4 * 9, Directory.GetFiles(run.Output("figures/contrasts"), "*.png").Length);
        Assert.Equal(2 * 4 * 9, Directory.GetFiles(run.Output("figures/contrasts"), "*.svg").Length);
        Assert.Contains("<section id=\"contrasts\">", File.ReadAllText(run.Output("report.html")));
    }
}
