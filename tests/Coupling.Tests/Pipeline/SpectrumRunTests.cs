using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Tests.Figures;
using Coupling.Tests.Outputs;

namespace Coupling.Tests.Pipeline;

/// <summary>The plan's spectrum key run end to end on the small CSV study (channels A and B share a 10 Hz source).</summary>
public class SpectrumRunTests
{
    /// <summary>
    /// Writes the study with alternate trials labelled go and stay (<paramref name="edit"/> may change cells of the
    /// recording, as in <see cref="SmallStudy.WriteRecording"/>), and a plan with the given spectrum key.
    /// </summary>
    internal static string Write(TempFolder folder, string spectrum, bool figures = false, int trials = 24, int threads = 1,
        bool overwrite = false, Func<int, int, double, double>? edit = null)
    {
        SmallStudy.WriteRecording(folder.Path, trials, edit: edit);
        var events = new StringBuilder("onset\tduration\ttrial_type\n");
        for (int n = 0; n < trials; n++)
            events.Append(string.Create(CultureInfo.InvariantCulture, $"{3 + 1.5 * n:R}\t0\t{(n % 2 == 0 ? "go" : "stay")}\n"));
        File.WriteAllText(folder["rec_events.tsv"], events.ToString());
        string plan = SmallStudy.PlanText(surrogates: 20, threads: threads, conditions: "{ go: [go], stay: [stay] }")
            .Replace("figures: false", $"figures: {(figures ? "true" : "false")}") + (overwrite ? "\noverwrite: true" : "") + "\n" + spectrum;
        File.WriteAllText(folder["plan.yaml"], plan);
        return folder["plan.yaml"];
    }

    [Fact]
    public void Spectrum_time_course_and_cluster_test_are_written_with_figures_and_manifest()
    {
        using var folder = new TempFolder();
        string path = Write(folder, """
            spectrum:
              frequencies: { from: 6, to: 16, step: 2 }
              cycles: 4
              pairs: [[B, A], [A, C]]
              measures: [plv, coherence]
              time:
                width: 0.2
                step: 0.1
                baseline: { start: -0.2, end: 0.0 }
              cluster_test: { pair: [A, B], measure: plv, conditions: [go, stay], draws: 19 }
            """, figures: true);
        var outcome = AnalysisRunner.Run(PlanReader.Read(path));
        string Out(string relative) => Path.Combine(outcome.OutputFolder, relative);

        // Spectrum: 2 conditions x 2 pairs x 2 measures x 6 frequencies. The pair named [B, A] is reported as A, B
        // (analysis order). A and B share a 10 Hz source (SmallStudy), A and C share nothing: PLV of A-B peaks at 10 Hz
        // and stands well above A-C there (a 2:1 source-to-noise amplitude gives PLV near 0.8; the trial-count bias of
        // PLV of independent channels at 12 trials is about sqrt(pi / (4 * 12)) = 0.26, Lachaux et al. 1999).
        var rows = TableParsing.Read(Out("spectrum/spectrum.tsv"), '\t');
        Assert.Equal(["condition", "channel_a", "channel_b", "measure", "frequency_hz", "value"], rows[0]);
        Assert.Equal(1 + 2 * 2 * 2 * 6, rows.Count);
        double Value(string condition, string a, string b, string measure, double f) => TableParsing.Number(rows.Single(r =>
            r[0] == condition && r[1] == a && r[2] == b && r[3] == measure && TableParsing.Number(r[4]) == f)[5]);
        Assert.DoesNotContain(rows, r => r[1] == "B");
        foreach (var condition in new[] { "go", "stay" })
        {
            double peak = Value(condition, "A", "B", "plv", 10);
            Assert.True(peak > 0.6, $"{condition}: PLV A-B at 10 Hz {peak}");
            Assert.True(peak > Value(condition, "A", "B", "plv", 16), "10 Hz above 16 Hz");
            Assert.True(Value(condition, "A", "C", "plv", 10) < 0.45);
        }

        var course = TableParsing.Read(Out("spectrum/time_frequency.tsv"), '\t');
        Assert.Equal(["condition", "channel_a", "channel_b", "measure", "frequency_hz", "time_s", "value", "change_from_baseline"], course[0]);
        // Bins of 0.2 s every 0.1 s over the trial span -0.25..0.75 s: centres -0.15 .. 0.65, 9 bins.
        Assert.Equal(1 + 2 * 2 * 2 * 6 * 9, course.Count);

        var clusters = TableParsing.Read(Out("spectrum/clusters.tsv"), '\t');
        Assert.Equal("channel_a", clusters[0][0]);
        var cells = TableParsing.Read(Out("spectrum/cluster_cells.tsv"), '\t');
        Assert.Equal(1 + 6 * 9, cells.Count);

        foreach (var png in new[]
        {
            "figures/spectrum/A-B_plv_spectrum.png", "figures/spectrum/A-B_coherence_spectrum.png",
            "figures/spectrum/A-B_go_plv_time_frequency.png", "figures/spectrum/A-B_stay_coherence_time_frequency.png",
            "figures/spectrum/A-B_plv_go-vs-stay_clusters.png",
        })
        {
            Assert.Equal((900, 600), PngHeader.Read(Out(png)));
            Assert.Contains("<svg", File.ReadAllText(Out(Path.ChangeExtension(png, ".svg"))));
        }

        using var manifest = JsonDocument.Parse(File.ReadAllText(Out("manifest.json")));
        var node = manifest.RootElement.GetProperty("extra").GetProperty("spectrum");
        Assert.Equal("morlet", node.GetProperty("method").GetString());
        Assert.Equal(9, node.GetProperty("time_bins_s").GetArrayLength());
        Assert.Equal(SpectrumRunner.ClusterSeed(42), node.GetProperty("cluster_test").GetProperty("seed").GetUInt64());
        Assert.Equal("kept", node.GetProperty("cluster_test").GetProperty("evoked").GetString());
        var outputs = manifest.RootElement.GetProperty("outputs").EnumerateArray().Select(e => e.GetString()).ToArray();
        Assert.Contains("spectrum/spectrum.tsv", outputs);
        Assert.Contains("figures/spectrum/A-B_plv_go-vs-stay_clusters.png", outputs);

        // The report's methods paragraph names the spectrum (pairs as the tables name them: [B, A] as A-B) and the
        // cluster test with the numbers of this run: 12 trials per condition (24 alternating), 19 draws, so 20
        // labellings; the default level 0.05 is |z| > 1.96.
        string methods = WebUtility.HtmlDecode(File.ReadAllText(Out("report.html")));
        Assert.Contains("For the channel pairs A-B, A-C, the phase-locking value and magnitude-squared coherence were also computed at " +
                        "6 frequencies (6, 8, 10, 12, 14, 16 Hz), by convolution with a unit-energy complex Morlet wavelet of 4 cycles at each " +
                        "frequency (Tallon-Baudry et al. 1996), over the analysis window and in 9 time bins 0.2 s wide every 0.1 s (centres -0.15 to 0.65 s).", methods);
        Assert.Contains("change from the baseline -0.2 to 0 s", methods);
        Assert.Contains("The difference go minus stay in the phase-locking value of the pair A-B (12 and 12 trials) was tested over the " +
                        "frequency-by-time map by a cluster-based permutation test (Maris & Oostenveld 2007): 19 random permutations of the condition " +
                        $"labels of the pooled trials keeping both group sizes; seed {SpectrumRunner.ClusterSeed(42)}.", methods);
        Assert.Contains("over all 20 labellings", methods);
        Assert.Contains("(|z| > 1.96, two-sided pointwise level 0.05)", methods);
        Assert.Contains("Maris E, Oostenveld R (2007). Nonparametric statistical testing of EEG- and MEG-data. J Neurosci Methods 164:177-190.", methods);
    }

    [Fact]
    public void With_evoked_subtract_the_manifest_and_methods_say_the_cluster_test_removed_each_groups_mean_in_every_labelling()
    {
        using var folder = new TempFolder();
        string path = Write(folder, """
            evoked: subtract
            spectrum:
              frequencies: [8, 10, 12]
              cycles: 4
              pairs: [[A, B]]
              measures: [coherence]
              time: { width: 0.2, step: 0.2 }
              cluster_test: { pair: [A, B], measure: coherence, conditions: [go, stay], draws: 9 }
            """);
        var outcome = AnalysisRunner.Run(PlanReader.Read(path));
        using var manifest = JsonDocument.Parse(File.ReadAllText(Path.Combine(outcome.OutputFolder, "manifest.json")));
        var test = manifest.RootElement.GetProperty("extra").GetProperty("spectrum").GetProperty("cluster_test");
        Assert.Equal("removed per group in every labelling", test.GetProperty("evoked").GetString());
        string report = WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html")));
        Assert.Contains("9 random permutations of the condition labels of the pooled trials keeping both group sizes; seed " +
                        $"{SpectrumRunner.ClusterSeed(42)}; in every labelling, the observed one included, each group's mean over its trials " +
                        "(the evoked response) was removed from its trials.", report);
    }

    [Fact]
    public void Multitaper_spectrum_runs_and_a_pair_of_an_unanalysed_channel_is_refused()
    {
        using var folder = new TempFolder();
        string path = Write(folder, """
            spectrum:
              method: multitaper
              half_bandwidth: 4
              frequencies: [8, 10, 12, 20]
              pairs: all
            """);
        var outcome = AnalysisRunner.Run(PlanReader.Read(path));
        var rows = TableParsing.Read(Path.Combine(outcome.OutputFolder, "spectrum/spectrum.tsv"), '\t');
        string methods = WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html")));
        Assert.Contains("For every channel pair, the weighted phase-lag index was also computed at 4 frequencies (8, 10, 12, 20 Hz)", methods);
        Assert.Contains("(Slepian 1978) of half-bandwidth 4 Hz (", methods);
        Assert.DoesNotContain("cluster-based permutation test", methods);
        // Plan measures plv, wpli, aec: multitaper offers wpli of them. 2 conditions x 6 pairs x 1 measure x 4 frequencies.
        Assert.Equal(1 + 2 * 6 * 4, rows.Count);
        Assert.All(rows.Skip(1), r => Assert.Equal("wpli", r[3]));

        using var other = new TempFolder();
        string bad = Write(other, """
            spectrum:
              frequencies: [10]
              pairs: [[A, Z]]
            """);
        var e = Assert.Throws<InputException>(() => AnalysisRunner.Run(PlanReader.Read(bad)));
        Assert.Contains("spectrum.pairs", e.Message);
        Assert.Contains("'Z'", e.Message);
    }
}
