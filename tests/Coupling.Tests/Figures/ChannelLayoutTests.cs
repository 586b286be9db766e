using Coupling.Figures;
using Coupling.Formats;

namespace Coupling.Tests.Figures;

public class ChannelLayoutTests
{
    // Positions from the systems' definitions on a sphere (StandardPositions): Jasper (1958) 10-20, Chatrian et al.
    // (1985) 10-10. Seen from above: x to the right, y to the nose; angles from the vertex / 90 degrees as radius.

    private static (double X, double Y) At(string label)
    {
        Assert.True(StandardPositions.TryGet(label, out double x, out double y), label);
        return (x, y);
    }

    [Fact]
    public void C3_is_left_of_C4_and_Fz_in_front_of_Pz()
    {
        Assert.True(At("C3").X < 0 && At("C4").X > 0);
        Assert.True(At("C3").X < At("C4").X);
        Assert.True(At("Fz").Y > At("Pz").Y);
        Assert.True(At("Fp1").Y > At("O1").Y);
        Assert.True(At("T7").X < At("C3").X);
    }

    [Fact]
    public void Midline_and_circumference_points_sit_where_the_ten_percent_steps_put_them()
    {
        // Nasion-inion arc of 180 degrees in tenths of 18 degrees: Fpz and Oz at 72 degrees from the vertex (radius
        // 0.8), Fz at 36 (0.4); T7 at 10 % of the preauricular arc above the ear (0.8); Cz at the vertex; Nz on the outline.
        AssertAt("Cz", 0, 0);
        AssertAt("Fpz", 0, 0.8);
        AssertAt("Oz", 0, -0.8);
        AssertAt("Fz", 0, 0.4);
        AssertAt("Pz", 0, -0.4);
        AssertAt("T7", -0.8, 0);
        AssertAt("T8", 0.8, 0);
        AssertAt("C3", -0.4, 0);
        AssertAt("Nz", 0, 1);
        AssertAt("T9", -1, 0);
        // Fp1: 10 % of the Fpz-Oz half circumference (18 degrees of azimuth) from Fpz, on the 72 degree circle.
        AssertAt("Fp1", -0.8 * Math.Sin(Math.PI / 10), 0.8 * Math.Cos(Math.PI / 10));
    }

    private static void AssertAt(string label, double x, double y)
    {
        var p = At(label);
        // Trigonometry in double: 1e-12 is far above its rounding (~1e-15).
        Assert.Equal(x, p.X, 1e-12);
        Assert.Equal(y, p.Y, 1e-12);
    }

    [Fact]
    public void Even_numbers_mirror_odd_numbers_across_the_midline()
    {
        foreach (string label in StandardPositions.Labels.Where(l => char.IsDigit(l[^1]) && (l[^1] - '0') % 2 == 1 && !l.EndsWith("10")))
        {
            string prefix = label.TrimEnd("0123456789".ToCharArray());
            int number = int.Parse(label[prefix.Length..], System.Globalization.CultureInfo.InvariantCulture);
            if (!StandardPositions.TryGet($"{prefix}{number + 1}", out double x2, out double y2)) continue;
            var p = At(label);
            Assert.Equal(-p.X, x2, 1e-12);
            Assert.Equal(p.Y, y2, 1e-12);
        }
    }

    [Fact]
    public void Old_names_case_and_a_reference_suffix_are_recognised()
    {
        Assert.Equal(At("T7"), At("T3"));
        Assert.Equal(At("P8"), At("T6"));
        Assert.Equal(At("Fp1"), At("FP1"));
        Assert.Equal(At("C3"), At("EEG C3-REF"));
        Assert.False(StandardPositions.TryGet("L1", out _, out _));
        Assert.False(StandardPositions.TryGet("EOG", out _, out _));
    }

    [Fact]
    public void Positions_from_the_input_win_when_every_channel_has_one()
    {
        var layout = ChannelLayout.For(["C3", "C4"], [new ChannelPosition(5, 1, 0), new ChannelPosition(-5, 1, 0)]);
        Assert.Equal(ChannelLayoutKind.Electrodes, layout.Kind);
        Assert.Equal(5, layout.Points[0].X);
    }

    [Fact]
    public void Standard_labels_go_on_the_head_and_others_in_a_row_below_it()
    {
        var layout = ChannelLayout.For(["C4", "EOG", "C3", "Pz", "EMG"], null);
        Assert.Equal(ChannelLayoutKind.Head, layout.Kind);
        Assert.Equal(3, layout.StandardCount);
        Assert.True(layout.Points[2].X < layout.Points[0].X); // C3 left of C4
        Assert.True(layout.Points[1].Y < -ChannelLayout.HeadRadius && layout.Points[4].Y < -ChannelLayout.HeadRadius);
        Assert.True(layout.Points[1].X < layout.Points[4].X); // in channel order, left to right
        Assert.NotNull(layout.Note);
    }

    [Fact]
    public void Unknown_labels_are_laid_out_in_reading_order_not_on_a_ring()
    {
        var layout = ChannelLayout.For(["a", "b", "c", "d", "e"], null);
        Assert.Equal(ChannelLayoutKind.Even, layout.Kind);
        var p = layout.Points;
        // Three columns: a b c on the first row, d e centred below.
        Assert.True(p[0].X < p[1].X && p[1].X < p[2].X);
        Assert.Equal(p[0].Y, p[2].Y);
        Assert.True(p[3].Y < p[0].Y && p[3].X < p[4].X);
    }

    [Fact]
    public void A_network_of_standard_labels_is_drawn_on_the_head()
    {
        var r = Coupling.Tests.Outputs.SampleResults.FourChannels(); // Pz, Cz, Fz, Oz
        using var plot = NetworkFigure.Build(r, 600, null, out var layout);
        Assert.Equal(ChannelLayoutKind.Head, layout.Kind);
        Assert.True(layout.Points[2].Y > layout.Points[0].Y); // Fz in front of Pz
    }
}
