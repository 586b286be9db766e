using System.Text;
using System.Text.RegularExpressions;
using Coupling.Outputs;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Reports;
using Coupling.Statistics;
using Coupling.Tests.Outputs;
using Coupling.Tests.Pipeline;
using TempFolder = Coupling.Tests.Pipeline.TempFolder;

namespace Coupling.Tests.Reports;

/// <summary>The report's section on the plan's <c>spectrum</c> key, on the small CSV study.</summary>
public sealed partial class SpectrumReportTests
{
    [GeneratedRegex("<section id=\"spectrum\">.*?</section>", RegexOptions.Singleline)]
    private static partial Regex Section();

    [GeneratedRegex("<tr>")]
    private static partial Regex Row();

    [GeneratedRegex("<img[^>]*\\ssrc=\"data:image/png;base64,")]
    private static partial Regex EmbeddedPng();

    private const string ClusterSpectrum = """
        spectrum:
          frequencies: { from: 6, to: 16, step: 2 }
          cycles: 4
          pairs: [[A, B], [A, C]]
          measures: [plv, coherence]
          time:
            width: 0.2
            step: 0.1
            baseline: { start: -0.2, end: 0.0 }
          cluster_test: { pair: [A, B], measure: plv, conditions: [go, stay], draws: 99 }
        """;

    /// <summary>
    /// The small study with 24 trials, alternately go and stay; in the stay trials (and 0.75 s around them, more than the
    /// widest wavelet reaches) channel B loses the 10 Hz source it shares with A: fresh noise of the same power takes its
    /// place. A-B then couples in go only, so the go − stay PLV map holds a positive cluster around 10 Hz.
    /// </summary>
    private static string Write(TempFolder folder, string spectrum, bool figures, int threads = 1)
    {
        const int trials = 24;
        var noise = new Random(5);
        bool InStay(int sample)
        {
            double t = sample / SmallStudy.Rate;
            int n = (int)Math.Round((t - 3) / 1.5);
            return n is >= 0 and < trials && n % 2 == 1 && Math.Abs(t - (3 + 1.5 * n)) < 0.75;
        }
        // The replaced cell keeps B's variance: unit noise plus a sine of amplitude 2 (variance 2) is variance 3.
        return SpectrumRunTests.Write(folder, spectrum, figures, trials, threads, overwrite: true,
            edit: (c, s, v) => c == 1 && InStay(s) ? Math.Sqrt(3) * TimeFrequency.TimeFrequencyTrials.Normal(noise) : v);
    }

    [Fact]
    public void A_spectrum_plan_with_a_cluster_test_gets_a_section_with_the_significant_clusters_of_the_written_table()
    {
        using var folder = new TempFolder();
        var outcome = AnalysisRunner.Run(PlanReader.Read(Write(folder, ClusterSpectrum, figures: true)));
        string Out(string relative) => Path.Combine(outcome.OutputFolder, relative);
        string html = File.ReadAllText(Out("report.html"));

        // After the per-table sections, before the surrogate distribution.
        int at = html.IndexOf("<section id=\"spectrum\">", StringComparison.Ordinal);
        Assert.True(at > html.IndexOf("id=\"tables\"", StringComparison.Ordinal));
        Assert.True(at < html.IndexOf("id=\"surrogates\"", StringComparison.Ordinal));
        string section = Section().Match(html).Value;
        Assert.Contains("complex Morlet wavelets, 4 cycles at every frequency", section);
        Assert.Contains("6 from 6 to 16 Hz: 6, 8, 10, 12, 14, 16", section);
        Assert.Contains("A–B, A–C", section);
        Assert.Contains("plv, coherence", section);
        // Bins of 0.2 s every 0.1 s over the trial span -0.25..0.75 s: centres -0.15 .. 0.65, 9 bins.
        Assert.Contains("9 bins, centres −0.15 to 0.65 s: 0.2 s wide every 0.1 s", section);
        Assert.Contains("−0.2 to 0 s: change = value − mean of the bins centred in it", section);
        Assert.Contains("99 label permutations", section);

        // The listed rows are the rows of clusters.tsv with p <= 0.05, in the table's order.
        var table = TableParsing.Read(Out("spectrum/clusters.tsv"), '\t');
        int p = Array.IndexOf(table[0], "p"), low = Array.IndexOf(table[0], "low_hz"), high = Array.IndexOf(table[0], "high_hz");
        var significant = table.Skip(1).Where(r => TableParsing.Number(r[p]) <= 0.05).ToArray();
        Assert.NotEmpty(significant);
        Assert.Equal(1 + significant.Length, Row().Matches(section).Count);
        Assert.Contains($"{significant.Length} of {table.Count - 1} cluster", section);
        var first = significant[0];
        Assert.Contains(first[low] == first[high] ? $"<td>{first[low]}</td>" : $"<td>{first[low]}–{first[high]}</td>", section);
        Assert.Contains("<td>go above stay</td>", section);
        Assert.Contains("<td>−0.15 to 0.65</td>", section);
        double firstLow = TableParsing.Number(first[low]), firstHigh = TableParsing.Number(first[high]);
        Assert.True(firstLow <= 10 && firstHigh >= 10, $"the strongest cluster spans {firstLow}-{firstHigh} Hz, not 10 Hz");

        // Every spectrum figure (PNG) is embedded, and nothing else in this section.
        int pngs = Directory.GetFiles(Out("figures/spectrum"), "*.png").Length;
        Assert.Equal(2 + 4 + 1, pngs);
        Assert.Equal(pngs, EmbeddedPng().Matches(section).Count);
    }

    [Fact]
    public void The_report_with_a_spectrum_is_the_same_bytes_with_one_or_two_threads()
    {
        using var folder = new TempFolder();
        string Report(int threads)
        {
            var outcome = AnalysisRunner.Run(PlanReader.Read(Write(folder, ClusterSpectrum, figures: true, threads)));
            return File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html"));
        }
        string one = Report(1);
        Assert.Contains("<section id=\"spectrum\">", one);
        Assert.Equal(one, Report(2));
    }

    [Fact]
    public void A_multitaper_spectrum_without_a_cluster_test_or_figures_shows_its_tapers_and_no_cluster_part()
    {
        using var folder = new TempFolder();
        var outcome = AnalysisRunner.Run(PlanReader.Read(Write(folder, """
            spectrum:
              method: multitaper
              half_bandwidth: 4
              frequencies: [8, 10, 12, 20]
              pairs: [[A, B]]
            """, figures: false)));
        string section = Section().Match(File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html"))).Value;
        // Window 0..0.5 s at half-bandwidth 4 Hz: NW = 2, K = 2 NW - 1 = 3 tapers (Percival and Walden 1993, ch. 7).
        Assert.Contains("multitaper (DPSS tapers), half-bandwidth 4 Hz; 3 tapers over the analysis window", section);
        Assert.Contains("none: the analysis window 0 to 0.5 s only", section);
        Assert.Contains("No figures were drawn", section);
        Assert.DoesNotContain("Cluster test", section);
        Assert.DoesNotContain("<img", section);
    }

    [Fact]
    public void Only_clusters_at_p_up_to_the_level_are_listed_in_the_order_of_the_written_table()
    {
        // A cluster table written by the tool's own writer with p = 0.01, exactly 0.05 and 0.2: the first two are
        // listed (p <= 0.05, the level the cluster figure marks), the third is only counted.
        using var folder = new TempFolder();
        var plan = PlanReader.Read(Write(folder, ClusterSpectrum, figures: false));
        string results = Path.Combine(folder.Path, "written");
        Directory.CreateDirectory(Path.Combine(results, "spectrum"));
        var result = new ClusterTestResult("A", "B", "plv", "go", "stay", 12, 12, [6, 8, 10], [-0.1, 0.1], new double[6], new double[6],
            new int[6],
            [
                new TimeFrequencyCluster(1, 1, 12.5, 3, 0.01, 8, 10, -0.1, 0.1),
                new TimeFrequencyCluster(2, -1, -6.5, 2, 0.05, 6, 6, -0.1, 0.1),
                new TimeFrequencyCluster(3, 1, 3.5, 1, 0.2, 10, 10, 0.1, 0.1),
            ], 99, 0.05, 1.96);
        ClusterTableWriter.WriteClusters(result, Path.Combine(results, "spectrum", "clusters.tsv"));
        var sb = new StringBuilder();
        SpectrumSection.Append(sb, plan, null, results);
        string section = sb.ToString();

        Assert.Equal(1 + 2, Row().Matches(section).Count);
        Assert.Contains("2 of 3 clusters at p ≤ 0.05", section);
        int first = section.IndexOf("<td>8–10</td><td>−0.1 to 0.1</td><td class=\"n\">3</td><td class=\"n\">12.5</td><td class=\"n\">0.01</td>", StringComparison.Ordinal);
        int second = section.IndexOf("<td>6</td><td>−0.1 to 0.1</td><td class=\"n\">2</td><td class=\"n\">−6.5</td><td class=\"n\">0.05</td>", StringComparison.Ordinal);
        Assert.True(first > 0 && second > first, section);
        Assert.Contains("<td>go above stay</td>", section);
        Assert.Contains("<td>go below stay</td>", section);
        Assert.DoesNotContain(">0.2<", section);
        Assert.DoesNotContain(">3.5<", section);
    }
}
