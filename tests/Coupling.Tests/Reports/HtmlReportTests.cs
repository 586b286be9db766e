using System.Text.RegularExpressions;
using Coupling.Outputs;
using Coupling.Reports;
using Coupling.Tests.Figures;

namespace Coupling.Tests.Reports;

/// <summary>
/// The HTML report of a small demo-like run: self-contained (no script, no external reference, every image a data URI
/// that decodes to a PNG; PNG signature and IHDR layout from the PNG specification, ISO/IEC 15948), overview first, the
/// sections in their order, the significant pairs with their lag, the flags the scenario's built-in artefacts must raise,
/// and a methods paragraph that cites every measure.
/// </summary>
[Collection(ReportRunCollection.Name)]
public sealed partial class HtmlReportTests(ReportRun run)
{
    private string Html => File.ReadAllText(run.Output("report.html"));

    [GeneratedRegex("<img[^>]*\\ssrc=\"([^\"]*)\"")]
    private static partial Regex ImageSource();

    [Fact]
    public void The_report_is_one_file_with_every_image_embedded_and_nothing_fetched()
    {
        string html = Html;
        Assert.StartsWith("<!DOCTYPE html>", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<link", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("url(", html, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotMatch("(src|href)=\"(https?:|//|file:)", html);
        var sources = ImageSource().Matches(html).Select(m => m.Groups[1].Value).ToArray();
        // Every figure of the results folder (matrix and network per table and contrast, overview, surrogate distribution) is in.
        int files = Directory.GetFiles(run.Output("figures"), "*.png", SearchOption.AllDirectories).Length;
        int tables = run.Outcome.Results.Count;
        Assert.True(sources.Length >= 2 * tables / 3, $"{sources.Length} images for {tables} tables");
        Assert.True(sources.Length <= files);
        using var folder = new Pipeline.TempFolder();
        foreach (var (src, i) in sources.Select((s, i) => (s, i)))
        {
            Assert.StartsWith("data:image/png;base64,", src, StringComparison.Ordinal);
            string png = Path.Combine(folder.Path, $"{i}.png");
            File.WriteAllBytes(png, Convert.FromBase64String(src["data:image/png;base64,".Length..]));
            var (w, h) = PngHeader.Read(png);
            Assert.True(w > 100 && h > 100, $"image {i}: {w}x{h}");
        }
    }

    [Fact]
    public void The_overview_comes_first_and_the_sections_follow_in_order()
    {
        string html = Html;
        var first = ImageSource().Match(html);
        Assert.Contains("id=\"overview-figure\"", first.Value);
        string[] order = ["id=\"caution\"", "id=\"overview\"", "id=\"input\"", "id=\"flags\"", "id=\"tables\"", "id=\"contrasts\"",
            "id=\"surrogates\"", "id=\"graphs\"", "id=\"methods\"", "id=\"files\""];
        var at = order.Select(o => html.IndexOf(o, StringComparison.Ordinal)).ToArray();
        Assert.All(at, (p, i) => Assert.True(p >= 0, order[i]));
        Assert.Equal(at.Order(), at);
        Assert.Contains("not a medical device", html);
    }

    [Fact]
    public void A_plan_without_a_spectrum_gets_no_spectrum_section()
    {
        Assert.Null(run.Plan.Spectrum);
        Assert.DoesNotContain("id=\"spectrum\"", Html);
        Assert.DoesNotContain("Spectra and time-frequency maps", Html);
    }

    [Fact]
    public void The_theta_pair_is_listed_with_its_lag_and_the_trial_counts_and_widths_are_shown()
    {
        // L1 leads R4 by 25 ms in theta (docs/simulated-scenario.md); the lag column shows the coherency phase as a time at
        // the band centre, 6 Hz, within half a period (±83 ms), so it must be positive and near 25.
        var summary = run.Outcome.Signals!.Single(s => s.Condition == "tone" && s.Band == "theta");
        int k = Coupling.Measures.PairIndex.Of(0, 1, 6);
        Assert.InRange(summary.LagMs[k], 15, 35);
        string html = Html;
        string anchor = "id=\"t-tone_theta_wpli\"";
        int start = html.IndexOf(anchor, StringComparison.Ordinal);
        Assert.True(start >= 0);
        string section = html[start..html.IndexOf("</article>", start, StringComparison.Ordinal)];
        Assert.Contains("<td>L1</td><td>R4</td>", section);
        Assert.Contains(HtmlPartsNumber(summary.LagMs[k]), section);
        Assert.Contains("<td class=\"n\">60</td>", html);
        Assert.Contains("taps", html);
        Assert.Contains("transition", html);
    }

    private static string HtmlPartsNumber(double v) => v.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture).Replace('-', '−');

    [Fact]
    public void The_zero_lag_and_stimulus_locked_pairs_of_the_scenario_are_flagged_in_the_report_and_the_flag_table()
    {
        // L4-L5 carry one source at zero lag in alpha: PLV finds it, wPLI cannot (Vinck et al. 2011). R2-R3 share a
        // stimulus-locked response that the plan keeps (evoked: keep).
        var rows = File.ReadAllLines(run.Output("flags.tsv")).Skip(1).Select(l => l.Split('\t')).ToArray();
        Assert.Contains(rows, r => r[0] == "zero-lag" && r[2] == "alpha" && r[3] == "L4" && r[4] == "L5");
        Assert.Contains(rows, r => r[0] == "shared-evoked" && r[2] == "alpha" && r[3] == "R2" && r[4] == "R3");
        Assert.DoesNotContain(rows, r => r[0] == "zero-lag" && r[3] == "L1" && r[4] == "R4");
        string html = Html;
        Assert.Contains("Possibly zero lag", html);
        Assert.Contains("Shared stimulus-locked response", html);
    }

    [Fact]
    public void The_methods_paragraph_cites_every_measure_and_test_with_its_full_reference()
    {
        var manifest = ManifestReader.Read(run.Output("manifest.json"));
        var methods = MethodsText.From(manifest);
        foreach (var m in run.Plan.Measures.Select(Coupling.Measures.MeasureCatalog.Key))
        {
            var source = MethodSources.Of(m);
            Assert.Contains(source.Citation, methods.Paragraph);
            Assert.Contains(source.Reference, methods.References);
            Assert.Contains(MethodsText.MeasureName(m), methods.Paragraph);
        }
        foreach (var key in new[] { "kaiser", "hilbert", "permutation-p", "fdr-bh", "label-permutation" })
            Assert.Contains(MethodSources.Of(key).Reference, methods.References);
        Assert.Contains("400 trial-shuffle surrogates", methods.Paragraph);
        Assert.Contains("tone (60 trials)", methods.Paragraph);
        Assert.Contains("The evoked response was kept", methods.Paragraph);
        Assert.Contains(System.Net.WebUtility.HtmlEncode(methods.Paragraph), Html);
    }

    [Fact]
    public void The_surrogate_figure_shows_the_strongest_significant_edge()
    {
        var d = run.Outcome.SurrogateExample ?? throw new Xunit.Sdk.XunitException("no surrogate example");
        var best = run.Outcome.Results.SelectMany(r => Enumerable.Range(0, r.Z.Length).Where(k => r.Significant[k]).Select(k => (r, k)))
            .MaxBy(x => Math.Abs(x.r.Z[x.k]));
        Assert.Equal((best.r.Condition, best.r.Band, best.r.Measure), (d.Condition, d.Band, d.Measure));
        Assert.Equal(400, d.Draws.Length);
        Assert.Equal(best.r.P[best.k], d.P);
        Assert.True(File.Exists(run.Output("figures/" + HtmlReport.SurrogateFile)));
        Assert.Contains("strongest significant edge", Html);
    }
}
