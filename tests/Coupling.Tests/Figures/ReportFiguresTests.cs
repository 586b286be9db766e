using Coupling.Figures;
using Coupling.Results;
using Coupling.Tests.Outputs;
using SkiaSharp;

namespace Coupling.Tests.Figures;

/// <summary>
/// The overview of all tables and the surrogate distribution figure: valid PNGs (signature and IHDR as in the PNG
/// specification, ISO/IEC 15948) of the documented size, significant cells marked, refusals for nothing to draw.
/// </summary>
public class ReportFiguresTests
{
    private static PairResult With(PairResult r, string condition, string measure) => r with { Condition = condition, Measure = measure };

    [Fact]
    public void The_overview_has_a_row_per_condition_and_band_and_a_column_per_measure_with_significant_cells_dotted()
    {
        var r = SampleResults.FourChannels();
        var results = new[] { r, With(r, "rest", "wpli"), With(r, "rest", "aec"), With(r, "task", "plv"), With(r, "task", "wpli"), With(r, "task", "aec") };
        using var dir = new TempFolder();
        OverviewFigure.Save(results, dir["o.png"]);
        // Panels are max(90, 10·channels) = 90 px; width 150 + 3·(90 + 18) + 24, height 86 + 2·(90 + 18) + 64 (OverviewFigure layout).
        Assert.Equal((498, 366), PngHeader.Read(dir["o.png"]));
        using var bitmap = SKBitmap.Decode(dir["o.png"]);
        const float left = 150, top = 86, cell = 90f / 4;
        SKColor At(int a, int b, float dx = 0.5f, float dy = 0.5f) => bitmap.GetPixel((int)(left + (b + dx) * cell), (int)(top + (a + dy) * cell));
        // Pz-Cz (0, 1) is significant: its centre (the dot) differs from its corner; Cz-Fz (1, 2) is not: centre = corner.
        Assert.NotEqual(At(0, 1, 0.15f, 0.15f), At(0, 1));
        Assert.Equal(At(1, 2, 0.15f, 0.15f), At(1, 2));
        // The diagonal is light grey.
        Assert.Equal(new SKColor(0xe4, 0xe4, 0xe4), At(2, 2));
    }

    [Fact]
    public void The_overview_refuses_an_empty_list()
    {
        Assert.Throws<ArgumentException>(() => OverviewFigure.Render([]));
    }

    [Theory]
    [InlineData(0.3, false)]   // inside the draws' range
    [InlineData(5.0, false)]   // far beyond: noted, not drawn to scale
    [InlineData(-0.4, true)]   // two-sided: the mirror image is drawn too
    public void The_surrogate_figure_is_a_png_of_the_stated_size(double observed, bool twoSided)
    {
        var random = new Random(4);
        var draws = Enumerable.Range(0, 200).Select(_ => random.NextDouble() - 0.5).ToArray();
        var d = new SurrogateDistribution("rest", "alpha", "aec", "Pz", "Cz", observed, draws, twoSided, 0.01, 3, "plan");
        using var dir = new TempFolder();
        SurrogateFigure.Save(d, dir["s.png"]);
        Assert.Equal((900, 500), PngHeader.Read(dir["s.png"]));
        Assert.Equal(["s.png", "s.svg"], dir.Entries());
    }

    [Fact]
    public void A_surrogate_figure_needs_finite_draws()
    {
        var d = new SurrogateDistribution("rest", "alpha", "plv", "Pz", "Cz", 0.5, [double.NaN], false, double.NaN, double.NaN, "plan");
        using var dir = new TempFolder();
        Assert.Throws<ArgumentException>(() => SurrogateFigure.Save(d, dir["s.png"]));
        Assert.Empty(dir.Entries());
    }
}
