using Coupling.Tests.Figures;
using Xunit.Abstractions;

namespace Coupling.Tests.Reports;

/// <summary>
/// The report of the demo-like run opened in a real browser (Debian's chromium, headless, network features off, a fresh
/// profile): every image loads (naturalWidth &gt; 0 and decodes), the console stays free of errors, nothing outside the
/// file is requested, the overview is the first image, and a screenshot is saved under the test output folder.
/// </summary>
[Collection(ReportRunCollection.Name)]
public sealed class ReportInBrowserTests(ReportRun run, ITestOutputHelper output)
{
    [Fact]
    public async Task The_report_opens_in_headless_chromium_with_every_image_loaded_and_no_console_error()
    {
        HeadlessChromium.EnsureInstalled();
        using var profile = new Pipeline.TempFolder();
        string page = run.Output("report.html");
        var seen = await HeadlessChromium.Open(page, Path.Combine(profile.Path, "open"));

        Assert.NotEmpty(seen.Images);
        Assert.Equal("overview-figure", seen.Images[0].Id);
        var broken = seen.Images.Where(i => i.NaturalWidth <= 0 || !i.Decoded).Select(i => i.Alt).ToArray();
        Assert.True(broken.Length == 0, $"{broken.Length} of {seen.Images.Count} images did not load: {string.Join(", ", broken)}");
        Assert.True(seen.ConsoleErrors.Count == 0, string.Join("\n", seen.ConsoleErrors));
        Assert.True(seen.Requests.Count == 0, "requested: " + string.Join(", ", seen.Requests));

        string shots = Path.Combine(AppContext.BaseDirectory, "test-output");
        Directory.CreateDirectory(shots);
        string png = Path.Combine(shots, "report-screenshot.png");
        if (File.Exists(png)) File.Delete(png);
        HeadlessChromium.Screenshot(page, png, Path.Combine(profile.Path, "shot"));
        Assert.True(File.Exists(png), $"no screenshot at {png}");
        var (w, h) = PngHeader.Read(png);
        Assert.Equal((1280, 2400), (w, h));
        output.WriteLine($"{seen.Images.Count} images loaded; screenshot: {png}");
    }
}
