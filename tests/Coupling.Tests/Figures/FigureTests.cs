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
    public void Pairs_that_are_not_significant_are_drawn_paler_in_the_matrix()
    {
        using var dir = new TempFolder();
        var all = SampleResults.Grid(3, (_, _) => true);
        var none = all with { Significant = new bool[all.Significant.Length] };
        MatrixFigure.Save(all, dir["all.png"], 400, 400);
        MatrixFigure.Save(none, dir["none.png"], 400, 400);
        Assert.True(MeanLightness(dir["none.png"]) > MeanLightness(dir["all.png"]) + 0.05);
    }

    [Fact]
    public void Significant_edges_appear_in_the_network_and_missing_ones_leave_it_empty()
    {
        using var dir = new TempFolder();
        var all = SampleResults.Grid(5, (_, _) => true);
        var none = all with { Significant = new bool[all.Significant.Length] };
        NetworkFigure.Save(all, dir["all.png"], 400, 400);
        NetworkFigure.Save(none, dir["none.png"], 400, 400);
        Assert.True(MeanLightness(dir["none.png"]) > MeanLightness(dir["all.png"]) + 0.02);
    }

    [Fact]
    public void A_network_with_some_positions_missing_falls_back_to_the_circle()
    {
        using var dir = new TempFolder();
        var r = SampleResults.FourChannels() with
        {
            Positions = [new ChannelPosition(0, 1, 0), null, new ChannelPosition(1, 0, 0), new ChannelPosition(0, 0, 0)],
        };
        NetworkFigure.Save(r, dir["n.png"], 400, 400);
        Assert.Equal((400, 400), PngHeader.Read(dir["n.png"]));
    }

    [Fact]
    public void A_too_small_figure_is_refused_and_nothing_is_written()
    {
        using var dir = new TempFolder();
        Assert.Throws<ArgumentOutOfRangeException>(() => MatrixFigure.Save(SampleResults.FourChannels(), dir["x.png"], 50, 50));
        Assert.Empty(dir.Entries());
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
