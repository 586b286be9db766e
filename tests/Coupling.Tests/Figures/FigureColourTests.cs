using Coupling.Figures;
using ScottPlot;

namespace Coupling.Tests.Figures;

public class FigureColourTests
{
    /// <summary>
    /// CIE 1976 L* of an 8-bit sRGB colour: sRGB decoding of IEC 61966-2-1:1999 (linear below 0.04045, else
    /// ((c + 0.055) / 1.055)^2.4), luminance Y = 0.2126 R + 0.7152 G + 0.0722 B (ITU-R BT.709 primaries, D65), and
    /// L* = 116 f(Y) - 16 with f(t) = t^(1/3) above (6/29)^3, else t / (3 (6/29)^2) + 4/29 (CIE 15:2004, CIE 1976 L*a*b*).
    /// </summary>
    internal static double Lightness(Color c)
    {
        static double Linear(byte v)
        {
            double s = v / 255.0;
            return s <= 0.04045 ? s / 12.92 : Math.Pow((s + 0.055) / 1.055, 2.4);
        }
        double y = 0.2126 * Linear(c.R) + 0.7152 * Linear(c.G) + 0.0722 * Linear(c.B);
        const double e = 6.0 / 29;
        double f = y > e * e * e ? Math.Cbrt(y) : y / (3 * e * e) + 4.0 / 29;
        return 116 * f - 16;
    }

    private static double[] Profile(IColormap map, double from, double to, int steps = 64) =>
        Enumerable.Range(0, steps + 1).Select(i => Lightness(map.GetColor(from + (to - from) * i / steps))).ToArray();

    // The maps are tables of 8-bit colours: one step of one channel moves L* by up to about 0.4 (dark greens), so a
    // step counts as going the wrong way only beyond that.
    private const double Rounding = 0.4;

    private static void AssertRises(double[] l, string what)
    {
        for (int i = 1; i < l.Length; i++)
            Assert.True(l[i] >= l[i - 1] - Rounding, $"{what}: L* falls from {l[i - 1]:F2} to {l[i]:F2} at step {i}");
        Assert.True(l[^1] - l[0] > 30, $"{what}: L* spans only {l[0]:F1} to {l[^1]:F1}");
    }

    [Fact]
    public void The_lightness_formula_gives_the_cie_values_of_black_white_and_middle_grey()
    {
        // CIE 1976: L*(black) = 0, L*(white) = 100; sRGB 119/255 grey has Y = 0.1845 -> L* = 50.0 (common practice:
        // the sRGB middle grey; value by the same formulas, to 0.1).
        Assert.Equal(0, Lightness(new Color(0, 0, 0)), 1e-12);
        Assert.Equal(100, Lightness(new Color(255, 255, 255)), 1e-9);
        Assert.Equal(50.0, Lightness(new Color(119, 119, 119)), 0.2);
    }

    [Fact]
    public void The_magnitude_map_gets_lighter_throughout()
    {
        AssertRises(Profile(FigureColours.Magnitude, 0, 1), "matrix magnitude map");
    }

    [Fact]
    public void The_edge_magnitude_map_gets_darker_throughout_and_starts_clearly_off_white()
    {
        AssertRises(Profile(FigureColours.EdgeMagnitude, 1, 0), "edge magnitude map (read from the top)");
        Assert.True(Lightness(FigureColours.EdgeMagnitude.GetColor(0)) < 90);
    }

    [Theory]
    [InlineData("signed")]
    [InlineData("edge-signed")]
    public void Each_half_of_a_diverging_map_gets_lighter_toward_zero(string which)
    {
        var map = which == "signed" ? FigureColours.Signed : FigureColours.EdgeSigned;
        AssertRises(Profile(map, 0, 0.4999), $"{which}, negative half");
        AssertRises(Profile(map, 1, 0.5001), $"{which}, positive half (read from the top)");
        // Balanced: the two ends are about equally dark (Thyng et al. 2016 build Balance with matched lightness).
        Assert.Equal(Lightness(map.GetColor(0)), Lightness(map.GetColor(1)), 8.0);
    }

    [Fact]
    public void The_weakest_significant_edge_is_drawn_in_a_clear_colour_on_a_scale_from_zero()
    {
        // Edges from 0.3 to 0.6: the scale starts at 0 and the weakest edge sits half way, well away from white.
        var scale = EdgeColorScale.Magnitude(0.6);
        Assert.Equal(0, scale.Low);
        Assert.Equal(0.6, scale.High, 1e-15);
        Assert.True(Lightness(scale.ColorOf(0.3)) < 75, $"L* {Lightness(scale.ColorOf(0.3)):F1}");
        var signed = EdgeColorScale.Diverging(0.6);
        Assert.Equal(-signed.High, signed.Low);
        Assert.True(Lightness(signed.ColorOf(-0.05)) < 85);
        Assert.True(Lightness(signed.ColorOf(0.05)) < 85);
    }

    [Theory]
    [InlineData(0, 1)]
    [InlineData(-0.08, 0.08)]
    [InlineData(0, 0.6)]
    [InlineData(-0.25, 0.25)]
    [InlineData(0, 0.015)]
    [InlineData(-3, 3)]
    [InlineData(0, 120)]
    [InlineData(0.2, 0.9)]
    [InlineData(-1.2, 1.2)]
    public void Colour_bars_get_between_four_and_seven_round_ticks(double low, double high)
    {
        var ticks = FigureStyle.RoundTicks(low, high);
        Assert.InRange(ticks.Length, 4, 7);
        Assert.All(ticks, t => Assert.InRange(t, low - 1e-12, high + 1e-12));
        double step = ticks[1] - ticks[0];
        double mantissa = step / Math.Pow(10, Math.Floor(Math.Log10(step)));
        Assert.Contains(Math.Round(mantissa, 9), new[] { 1, 2, 2.5, 5 });
        for (int i = 1; i < ticks.Length; i++) Assert.Equal(step, ticks[i] - ticks[i - 1], 1e-9 * Math.Max(1, high - low));
        Assert.All(ticks, t => Assert.True(Math.Abs(t / step - Math.Round(t / step)) < 1e-9, $"{t} is not a multiple of {step}"));
    }

    [Theory]
    [InlineData(0.92, 1.0)]
    [InlineData(0.07, 0.08)]
    [InlineData(0.5, 0.5)]
    [InlineData(0.61, 0.8)]
    [InlineData(13, 15)]
    public void Scale_tops_are_round_numbers_at_or_above_the_largest_value(double largest, double top)
    {
        Assert.Equal(top, FigureStyle.NiceCeiling(largest), 1e-12);
    }

    [Fact]
    public void Tick_labels_carry_the_decimals_of_the_step_and_a_true_minus()
    {
        double[] ticks = [-0.075, -0.05, -0.025, 0, 0.025, 0.05, 0.075];
        Assert.Equal("\u22120.075", FigureStyle.TickText(-0.075, ticks));
        Assert.Equal("0.000", FigureStyle.TickText(0, ticks));
        Assert.Equal("0.2", FigureStyle.TickText(0.2, [0, 0.2, 0.4]));
    }
}
