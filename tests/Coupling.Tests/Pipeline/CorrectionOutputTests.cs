using System.Text.Json.Nodes;
using Coupling.Pipeline;
using Coupling.Plans;

namespace Coupling.Tests.Pipeline;

/// <summary>A run with a family-wise correction, jackknife intervals and matching: what the tables, report and manifest say.</summary>
public sealed class CorrectionOutputTests
{
    [Fact]
    public void A_max_statistic_run_names_its_correction_and_family_and_finds_the_coupled_pair()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        string plan = Path.Combine(folder.Path, "plan.yaml");
        // 19 surrogates: 1/20 <= alpha = 0.05, enough for the family-wise correction (no warning), where
        // Benjamini-Hochberg over 6 pairs would need 119 (SurrogateCountWarningTests).
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: 19) +
            "\ncorrection: { method: max-statistic, alpha: 0.05 }\nintervals: jackknife\nmatch_trials: 5\ndirection: true\n");
        var outcome = AnalysisRunner.Run(PlanReader.Read(plan));
        Assert.Empty(outcome.Warnings);
        // A and B share a 10 Hz source (SmallStudy): the PLV of A-B is significant after family-wise correction.
        var plv = outcome.Results.Single(r => r.Measure == "plv");
        Assert.True(plv.Significant[0]);

        var rows = File.ReadAllLines(Path.Combine(outcome.OutputFolder, "edges.tsv")).Select(l => l.Split('\t')).ToArray();
        var header = rows[0].ToList();
        var first = rows[1];
        Assert.Equal("max-statistic", first[header.IndexOf("correction")]);
        Assert.Equal("6", first[header.IndexOf("family_size")]);
        Assert.Equal("counted", first[header.IndexOf("p_source")]);
        double low = double.Parse(first[header.IndexOf("ci_low")], System.Globalization.CultureInfo.InvariantCulture);
        double high = double.Parse(first[header.IndexOf("ci_high")], System.Globalization.CultureInfo.InvariantCulture);
        double value = double.Parse(first[header.IndexOf("value")], System.Globalization.CultureInfo.InvariantCulture);
        Assert.True(low < value && value < high);
        // One condition: it is its own smallest, so the matched value is the value itself.
        Assert.Equal(first[header.IndexOf("value")], first[header.IndexOf("value_matched")]);

        // The significant pair gets a direction row. A and B share one source at zero lag (SmallStudy), so the phase is
        // near 0 and the lag small next to the 100 ms period of 10 Hz.
        var directions = File.ReadAllLines(Path.Combine(outcome.OutputFolder, "directions.tsv")).Select(l => l.Split('\t')).ToArray();
        Assert.Equal(Coupling.Outputs.DirectionTableWriter.Columns, directions[0]);
        var ab = directions.Skip(1).Single(r => r[2] == "A" && r[3] == "B");
        Assert.Contains("plv", ab[4].Split(','));
        Assert.InRange(Math.Abs(double.Parse(ab[6], System.Globalization.CultureInfo.InvariantCulture)), 0, 10);

        string report = System.Net.WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html")));
        Assert.Contains("family-wise error at alpha = 0.05 by the maximum over pairs", report);
        Assert.Contains("family: all channel pairs of one condition x band x measure", report);
        // The methods paragraph names the correction's published source (Nichols & Holmes 2002, Hum Brain Mapp 15:1-25).
        Assert.Contains("Nichols & Holmes 2002", report);
        var manifest = JsonNode.Parse(File.ReadAllText(Path.Combine(outcome.OutputFolder, "manifest.json")))!;
        var correction = manifest["extra"]!["correction"]!;
        Assert.Equal("max-statistic", (string?)correction["method"]);
        Assert.Equal(0.05, (double)correction["alpha"]!);
        Assert.Equal("all channel pairs of one condition x band x measure", (string?)correction["family"]);
    }

    [Fact]
    public void A_network_based_run_lists_its_components_in_the_report()
    {
        using var folder = new TempFolder();
        SmallStudy.WriteRecording(folder.Path);
        string plan = Path.Combine(folder.Path, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: 19) + "\ncorrection: { method: network-based, alpha: 0.05, threshold: 3 }\n");
        var outcome = AnalysisRunner.Run(PlanReader.Read(plan));
        string report = System.Net.WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(outcome.OutputFolder, "report.html")));
        Assert.Contains("<h2>Network components</h2>", report);
        string components = report[report.IndexOf("<h2>Network components</h2>", StringComparison.Ordinal)..];
        Assert.Contains("go / alpha / plv", components[..components.IndexOf("</section>", StringComparison.Ordinal)]);
        var rows = File.ReadAllLines(Path.Combine(outcome.OutputFolder, "edges.tsv")).Select(l => l.Split('\t')).ToArray();
        int component = rows[0].ToList().IndexOf("component");
        Assert.Equal("1", rows.Skip(1).First(r => r[2] == "plv")[component]);
    }
}
