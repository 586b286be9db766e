using Coupling.Figures;
using Coupling.Formats;
using Coupling.Results;
using Coupling.Tests.Outputs;
using SkiaSharp;

namespace Coupling.Tests.Figures;

public class FigureTests
{
    [Fact]
    public void The_png_checker_knows_the_standard_crc_check_value()
    {
        // CRC-32 of "123456789" is 0xCBF43926: the check value of the CRC-32/ISO-HDLC parameter set
        // (Williams 1993, A painless guide to CRC error detection algorithms; same CRC as PNG Annex D).
        Assert.Equal(0xCBF43926u, PngHeader.Crc32("123456789"u8));
    }

    [Fact]
    public void A_matrix_figure_is_a_valid_png_of_the_stated_size()
    {
        using var dir = new TempFolder();
        MatrixFigure.Save(SampleResults.FourChannels(), dir["m.png"], 640, 480);
        Assert.Equal((640, 480), PngHeader.Read(dir["m.png"]));
        Assert.Equal(["m.png"], dir.Entries());
    }

    [Fact]
    public void A_matrix_figure_has_the_default_size_when_none_is_given()
    {
        using var dir = new TempFolder();
        MatrixFigure.Save(SampleResults.Grid(20, (a, b) => a + b < 10, measure: "imag-coherency", signed: true), dir["m.png"]);
        Assert.Equal((900, 800), PngHeader.Read(dir["m.png"]));
    }

    [Fact]
    public void A_network_figure_is_a_valid_png_of_the_stated_size_on_a_circle_and_at_positions()
    {
        using var dir = new TempFolder();
        NetworkFigure.Save(SampleResults.FourChannels(), dir["circle.png"], 700, 500);
        NetworkFigure.Save(SampleResults.FourChannels(withPositions: true), dir["placed.png"], 500, 700);
        Assert.Equal((700, 500), PngHeader.Read(dir["circle.png"]));
        Assert.Equal((500, 700), PngHeader.Read(dir["placed.png"]));
    }

    [Fact]
    public void Figures_with_no_significant_pair_still_render()
    {
        using var dir = new TempFolder();
        var none = SampleResults.Grid(6, (_, _) => false);
        MatrixFigure.Save(none, dir["m.png"], 600, 600);
        NetworkFigure.Save(none, dir["n.png"], 600, 600);
        Assert.Equal((600, 600), PngHeader.Read(dir["m.png"]));
        Assert.Equal((600, 600), PngHeader.Read(dir["n.png"]));
    }

    [Fact]
    public void Pairs_that_are_not_significant_keep_their_full_colour_in_the_matrix()
    {
        // Cell centres are not covered by the outline: with and without significance they must be the same colour.
        var all = SampleResults.Grid(3, (_, _) => true);
        var none = all with { Significant = new bool[all.Significant.Length] };
        var (withMarks, plotA) = Render(MatrixFigure.Build(all, 400, null), 400, 400);
        var (without, plotB) = Render(MatrixFigure.Build(none, 400, null), 400, 400);
        using (withMarks) using (without) using (plotA) using (plotB)
        {
            var centre = plotA.GetPixel(new ScottPlot.Coordinates(1, 2)); // cell (0, 1)
            Assert.Equal(withMarks.GetPixel((int)centre.X, (int)centre.Y), without.GetPixel((int)centre.X, (int)centre.Y));
        }
    }

    [Fact]
    public void Significant_cells_carry_an_outline_and_others_do_not()
    {
        // Grid(4, only pair (0, 2)): cell (0, 2) at x = 2, y = 3 and its mirror (2, 0) at x = 0, y = 1 are outlined.
        var r = SampleResults.Grid(4, (a, b) => a == 0 && b == 2);
        var (bitmap, plot) = Render(MatrixFigure.Build(r, 600, null), 600, 600);
        using (bitmap) using (plot)
        {
            Assert.True(HasOutline(bitmap, plot, 2, 3));
            Assert.True(HasOutline(bitmap, plot, 0, 1));
            Assert.False(HasOutline(bitmap, plot, 1, 3)); // cell (0, 1): not significant
            Assert.False(HasOutline(bitmap, plot, 3, 2)); // cell (1, 3): not significant
        }
    }

    [Fact]
    public void Figures_are_written_as_svg_that_is_well_formed_xml_of_the_stated_size()
    {
        // SVG 1.1 (W3C 2011): root element svg in the namespace http://www.w3.org/2000/svg with width and height.
        using var dir = new TempFolder();
        MatrixFigure.Save(SampleResults.FourChannels(), [dir["m.png"], dir["m.svg"]], 640, 480);
        NetworkFigure.Save(SampleResults.FourChannels(), dir["n.svg"], 500, 400);
        Assert.Equal((640, 480), PngHeader.Read(dir["m.png"]));
        foreach (var (file, w, h) in new[] { ("m.svg", 640, 480), ("n.svg", 500, 400) })
        {
            var doc = System.Xml.Linq.XDocument.Load(dir[file]);
            Assert.Equal(System.Xml.Linq.XName.Get("svg", "http://www.w3.org/2000/svg"), doc.Root!.Name);
            Assert.Equal(w.ToString(System.Globalization.CultureInfo.InvariantCulture), (string?)doc.Root.Attribute("width"));
            Assert.Equal(h.ToString(System.Globalization.CultureInfo.InvariantCulture), (string?)doc.Root.Attribute("height"));
            Assert.NotEmpty(doc.Descendants());
        }
    }

    [Fact]
    public void A_dashed_edge_is_written_to_svg_as_separate_dashes_of_the_dash_pattern()
    {
        // FourChannels: Pz-Fz (-0.3) is the one negative significant edge, so the one dashed edge (NetworkFigure draws
        // negative edges dashed); its colour on the diverging scale up to the largest |value| 0.5. The SVG device of the
        // pinned SkiaSharp writes a dashed stroke as one filled path of one rectangle per dash; a device that drops the
        // dash would write a single stroked line in that colour instead.
        using var dir = new TempFolder();
        NetworkFigure.Save(SampleResults.FourChannels(), dir["n.svg"], 500, 400);
        var colour = EdgeColorScale.Diverging(0.5).ColorOf(-0.3);
        string hex = $"#{colour.R:X2}{colour.G:X2}{colour.B:X2}";
        var paths = System.Xml.Linq.XDocument.Load(dir["n.svg"]).Descendants(System.Xml.Linq.XName.Get("path", "http://www.w3.org/2000/svg")).ToArray();
        Assert.DoesNotContain(paths, p => string.Equals((string?)p.Attribute("stroke"), hex, StringComparison.OrdinalIgnoreCase));
        var dashed = Assert.Single(paths, p => string.Equals((string?)p.Attribute("fill"), hex, StringComparison.OrdinalIgnoreCase));
        var dashes = ((string)dashed.Attribute("d")!).Split('M', StringSplitOptions.RemoveEmptyEntries);
        Assert.True(dashes.Length >= 3, $"{dashes.Length} dashes");
        float on = ScottPlot.LinePattern.Dashed.Intervals[0];
        int whole = 0;
        foreach (var dash in dashes)
        {
            var corners = dash.Split('L').Select(xy => xy.Trim().Split(' ').Select(v => double.Parse(v, System.Globalization.CultureInfo.InvariantCulture)).ToArray()).ToArray();
            Assert.Equal(4, corners.Length);
            double length = Math.Sqrt(Math.Pow(corners[1][0] - corners[0][0], 2) + Math.Pow(corners[1][1] - corners[0][1], 2));
            // Corners are written with 6 significant digits (about 1e-3 px here); the last dash may be cut by the edge's end.
            Assert.True(length <= on + 0.01, $"dash of {length} px, pattern {on} px");
            if (length >= on - 0.01) whole++;
        }
        Assert.True(whole >= 2, $"{whole} dashes of the pattern's {on} px");
    }

    [Fact]
    public void A_figure_name_that_is_neither_png_nor_svg_is_refused_before_anything_is_written()
    {
        using var dir = new TempFolder();
        Assert.Throws<ArgumentException>(() => MatrixFigure.Save(SampleResults.FourChannels(), [dir["m.png"], dir["m.jpg"]]));
        Assert.Empty(dir.Entries());
    }

    [Fact]
    public void Figures_decode_as_images()
    {
        using var dir = new TempFolder();
        MatrixFigure.Save(SampleResults.Grid(12, (a, b) => a < b && (a + b) % 5 == 0, "imag-coherency", signed: true), dir["m.png"], 500, 450);
        NetworkFigure.Save(SampleResults.Grid(12, (a, b) => a < b && (a + b) % 5 == 0, "imag-coherency", signed: true), dir["n.png"], 500, 450);
        foreach (var f in new[] { "m.png", "n.png" })
        {
            using var bitmap = SKBitmap.Decode(dir[f]);
            Assert.NotNull(bitmap);
            Assert.Equal((500, 450), (bitmap.Width, bitmap.Height));
        }
    }

    [Fact]
    public void A_signed_network_shows_the_sign_by_colour()
    {
        // Grid(…, signed) gives pair (a, b) a negative value when a + b is odd: pair (0, 1) negative, (0, 2) positive.
        // On the diverging edge map negative is blue and positive red (cmocean Balance, Thyng et al. 2016).
        var r = SampleResults.Grid(3, (a, b) => a == 0, measure: "aec", signed: true);
        var (bitmap, plot) = Render(NetworkFigure.Build(r, 600, null, out var layout), 600, 600);
        using (bitmap) using (plot)
        {
            var negative = Midpoint(plot, layout.Points[0], layout.Points[1]);
            var positive = Midpoint(plot, layout.Points[0], layout.Points[2]);
            var n = bitmap.GetPixel(negative.X, negative.Y);
            var p = bitmap.GetPixel(positive.X, positive.Y);
            Assert.True(n.Blue > n.Red + 40, $"negative edge drawn {n}");
            Assert.True(p.Red > p.Blue + 40, $"positive edge drawn {p}");
        }
    }

    private static (int X, int Y) Midpoint(ScottPlot.Plot plot, ScottPlot.Coordinates a, ScottPlot.Coordinates b)
    {
        var px = plot.GetPixel(new ScottPlot.Coordinates((a.X + b.X) / 2, (a.Y + b.Y) / 2));
        return ((int)Math.Round(px.X), (int)Math.Round(px.Y));
    }

    /// <summary>Renders and decodes the plot; afterwards plot.GetPixel maps coordinates to the image's pixels.</summary>
    private static (SKBitmap, ScottPlot.Plot) Render(ScottPlot.Plot plot, int width, int height) =>
        (SKBitmap.Decode(plot.GetImageBytes(width, height, ScottPlot.ImageFormat.Png)), plot);

    /// <summary>Whether the cell centred at (x, y) is drawn in another colour just inside its border, all the way round.</summary>
    private static bool HasOutline(SKBitmap bitmap, ScottPlot.Plot plot, double x, double y)
    {
        // The outline runs 0.04 cell inside the border (MatrixFigure); sample the four sides there at a quarter and
        // three quarters, and compare with the cell's centre, which the outline never covers.
        SKColor At(double cx, double cy)
        {
            var px = plot.GetPixel(new ScottPlot.Coordinates(cx, cy));
            return bitmap.GetPixel((int)Math.Round(px.X), (int)Math.Round(px.Y));
        }
        var centre = At(x, y);
        const double d = 0.46;
        (double, double)[] points = [(x - d, y - 0.25), (x - d, y + 0.25), (x + d, y - 0.25), (x + d, y + 0.25),
            (x - 0.25, y - d), (x + 0.25, y - d), (x - 0.25, y + d), (x + 0.25, y + d)];
        return points.All(p =>
        {
            var c = At(p.Item1, p.Item2);
            return Math.Abs(c.Red - centre.Red) + Math.Abs(c.Green - centre.Green) + Math.Abs(c.Blue - centre.Blue) > 60;
        });
    }

    /// <summary>Mean of (R+G+B)/(3*255) over all pixels, decoded with SkiaSharp.</summary>
    private static double MeanLightness(string path)
    {
        using var bitmap = SKBitmap.Decode(path);
        double sum = 0;
        for (int y = 0; y < bitmap.Height; y++)
            for (int x = 0; x < bitmap.Width; x++)
            {
                var c = bitmap.GetPixel(x, y);
                sum += (c.Red + c.Green + c.Blue) / (3.0 * 255);
            }
        return sum / (bitmap.Width * bitmap.Height);
    }
}
