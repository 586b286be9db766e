using Coupling.Graphs;
using Coupling.Results;
using ScottPlot;

namespace Coupling.Figures;

/// <summary>Draws a result's significant pairs as a network of channels (PNG and/or SVG).</summary>
/// <remarks>
/// Channels are placed by <see cref="ChannelLayout"/>: at the input's positions when every channel has one; else at
/// their 10-20/10-10 positions on a head seen from above (outline, nose at the top, ears, L and R marks; left on the
/// left), channels without a standard label in rows below; else, with no standard label at all, on an even grid in
/// channel order. Only significant pairs are drawn; an edge's width (1 to 7 px, thinner for many channels) grows with
/// |value| and its colour follows a colour bar that starts at 0: |value| from 0 to a round top on a sequential map
/// for measures that are never negative, and the signed value on a diverging map symmetric about 0 for signed
/// measures and condition differences (negative edges are also dashed). Colours in <see cref="FigureColours"/>.
/// A figure with no significant pair shows the channels and says so.
/// </remarks>
public static class NetworkFigure
{
    private const float MinWidth = 1f;
    private const float MaxWidth = 7f;

    /// <summary>Writes the network of <paramref name="result"/> to <paramref name="path"/> (.png or .svg).</summary>
    /// <param name="result">The result to draw.</param>
    /// <param name="path">Output path; its extension (.png or .svg) picks the format; written atomically.</param>
    /// <param name="width">Image width in pixels (at least 200).</param>
    /// <param name="height">Image height in pixels (at least 200).</param>
    /// <param name="valueLabel">What the values are, for the colour scale (default: the measure key).</param>
    public static void Save(PairResult result, string path, int width = 900, int height = 800, string? valueLabel = null) =>
        Save(result, [path], width, height, valueLabel);

    /// <summary>Draws <paramref name="result"/> once and writes it to every path (.png or .svg each).</summary>
    /// <param name="result">The result to draw.</param>
    /// <param name="paths">Output paths, each written atomically in the format of its extension.</param>
    /// <param name="width">Image width in pixels (at least 200).</param>
    /// <param name="height">Image height in pixels (at least 200).</param>
    /// <param name="valueLabel">What the values are, for the colour scale (default: the measure key).</param>
    public static void Save(PairResult result, IReadOnlyList<string> paths, int width = 900, int height = 800, string? valueLabel = null)
    {
        FigureStyle.CheckSize(width, height);
        using var plot = Build(result, width, valueLabel, out _);
        FigureStyle.Save(plot, paths, width, height);
    }

    /// <summary>The figure of <paramref name="result"/>, with the layout it used.</summary>
    internal static Plot Build(PairResult result, int width, string? valueLabel, out ChannelLayout layout)
    {
        var graph = ChannelGraphs.Build(result);
        int n = result.Channels.Count;
        if (n < 2) throw new ArgumentException($"Result {result.Condition}/{result.Band}/{result.Measure} has fewer than two channels.");
        var plot = FigureStyle.NewPlot();
        plot.HideAxesAndGrid();

        layout = ChannelLayout.For(result);
        var xy = layout.Points;
        if (layout.Kind == ChannelLayoutKind.Head) DrawHead(plot);

        var edges = graph.Edges.Where(e => double.IsFinite(e.Value)).OrderBy(e => e.Weight).ToArray();
        string label = valueLabel ?? result.Measure;
        bool signed = FigureStyle.IsSigned(result.Measure, result.Value.Where(double.IsFinite));
        double largest = edges.Length == 0 ? 1 : edges.Max(e => e.Weight);
        var scale = signed ? EdgeColorScale.Diverging(largest) : EdgeColorScale.Magnitude(largest);
        float maxWidth = n <= 20 ? MaxWidth : n <= 40 ? 5f : 3.5f;
        foreach (var e in edges)
        {
            var line = plot.Add.Line(xy[e.A], xy[e.B]);
            line.LineWidth = MinWidth + (maxWidth - MinWidth) * (float)scale.Strength(e.Value);
            line.LineColor = scale.ColorOf(e.Value);
            line.MarkerSize = 0;
            if (e.Value < 0) line.LinePattern = LinePattern.Dashed;
        }

        float nodeSize = (float)Math.Clamp(420.0 / Math.Max(n, 1), 6, 16);
        var nodes = plot.Add.Markers(xy, MarkerShape.FilledCircle, nodeSize, Colors.White);
        nodes.MarkerStyle.OutlineColor = FigureStyle.Ink;
        nodes.MarkerStyle.OutlineWidth = 1.5f;
        Label(plot, result.Channels, xy, layout.Kind, nodeSize, n);

        SetLimits(plot, xy, layout.Kind);

        string note;
        if (edges.Length == 0)
        {
            note = graph.EdgeCount == 0 ? "no pair significant: no edges to draw" : "significant pairs have no finite value to draw";
        }
        else
        {
            FigureStyle.AddColourBar(plot, scale, signed ? label : $"|{label}|");
            string sign = signed ? "; colour: sign and size (negative also dashed)" : "";
            note = $"{edges.Length} significant of {result.Significant.Length} pairs; width: |{label}|{sign}";
        }
        plot.Title($"{FigureStyle.Title(result)}\n{note}", FigureStyle.TitleSize(width));
        if (layout.Note is not null)
        {
            var annotation = plot.Add.Annotation(layout.Note, Alignment.LowerCenter);
            annotation.LabelFontSize = 12;
            annotation.LabelFontColor = FigureStyle.Ink;
            annotation.LabelBackgroundColor = Colors.White;
            annotation.LabelBorderColor = Colors.Transparent;
            annotation.LabelShadowColor = Colors.Transparent;
        }
        // Fixed margins: room for the two-line title at the top, the colour bar with its ticks and title at the right.
        plot.Layout.Fixed(new PixelPadding(left: 30, right: edges.Length == 0 ? 30 : 140, bottom: 30, top: 64));
        return plot;
    }

    /// <summary>Head seen from above: outline at the nasion-inion level, nose to the front, ears, and L / R marks.</summary>
    private static void DrawHead(Plot plot)
    {
        const double r = ChannelLayout.HeadRadius;
        var outline = plot.Add.Circle(0, 0, r);
        outline.FillStyle.Color = Colors.Transparent;
        outline.LineStyle.Color = FigureStyle.Quiet.Darken(0.3);
        outline.LineStyle.Width = 2;
        var nose = plot.Add.Scatter(new[] { -0.1 * r, 0, 0.1 * r }, new[] { 0.995 * r, 1.1 * r, 0.995 * r });
        nose.Color = FigureStyle.Quiet.Darken(0.3);
        nose.LineWidth = 2;
        nose.MarkerSize = 0;
        foreach (double side in (double[])[-1, 1])
        {
            var ear = plot.Add.Ellipse(side * 1.03 * r, 0, 0.05 * r, 0.15 * r);
            ear.FillStyle.Color = Colors.Transparent;
            ear.LineStyle.Color = FigureStyle.Quiet.Darken(0.3);
            ear.LineStyle.Width = 2;
            var mark = plot.Add.Text(side < 0 ? "L" : "R", new Coordinates(side * 1.17 * r, 0));
            mark.LabelFontSize = 16;
            mark.LabelBold = true;
            mark.LabelFontColor = FigureStyle.Ink;
            mark.LabelAlignment = Alignment.MiddleCenter;
        }
    }

    private static void Label(Plot plot, IReadOnlyList<string> channels, Coordinates[] xy, ChannelLayoutKind kind, float nodeSize, int n)
    {
        float font = n <= 20 ? 13 : n <= 64 ? 10 : 8;
        var centre = new Coordinates(xy.Average(c => c.X), xy.Average(c => c.Y));
        for (int i = 0; i < n; i++)
        {
            var text = plot.Add.Text(channels[i], xy[i]);
            text.LabelFontSize = font;
            text.LabelFontColor = FigureStyle.Ink;
            text.LabelBackgroundColor = Colors.White.WithAlpha(0.75);
            float push = nodeSize * 0.6f + 2;
            if (kind != ChannelLayoutKind.Electrodes)
            {
                // Above the node: the same place for every channel reads fastest on a head or a grid.
                text.LabelAlignment = Alignment.LowerCenter;
                text.OffsetY = -push;
                continue;
            }
            // Away from the centre of the layout, off the node.
            double dx = xy[i].X - centre.X, dy = xy[i].Y - centre.Y;
            double len = Math.Sqrt(dx * dx + dy * dy);
            text.OffsetX = len > 0 ? (float)(push * dx / len) : 0;
            text.OffsetY = len > 0 ? (float)(-push * dy / len) : -push;
            text.LabelAlignment = AlignmentFor(dx, dy, len);
        }
    }

    private static void SetLimits(Plot plot, Coordinates[] xy, ChannelLayoutKind kind)
    {
        double minX = xy.Min(c => c.X), maxX = xy.Max(c => c.X), minY = xy.Min(c => c.Y), maxY = xy.Max(c => c.Y);
        if (kind == ChannelLayoutKind.Head)
        {
            const double r = ChannelLayout.HeadRadius;
            minX = Math.Min(minX, -1.25 * r); maxX = Math.Max(maxX, 1.25 * r);
            minY = Math.Min(minY, -r); maxY = Math.Max(maxY, 1.1 * r);
        }
        double span = Math.Max(Math.Max(maxX - minX, maxY - minY), 1e-9);
        double pad = kind == ChannelLayoutKind.Electrodes ? 0.22 : 0.08;
        plot.Axes.SetLimits(minX - pad * span, maxX + pad * span, minY - 0.1 * span, maxY + 0.12 * span);
        plot.Axes.SquareUnits();
    }

    private static Alignment AlignmentFor(double dx, double dy, double len)
    {
        if (len == 0) return Alignment.LowerCenter;
        double ux = dx / len, uy = dy / len;
        const double side = 0.38; // about 22 degrees off an axis still counts as straight up/down/left/right
        bool right = ux > side, left = ux < -side, up = uy > side, down = uy < -side;
        return (up, down, left, right) switch
        {
            (true, _, true, _) => Alignment.LowerRight,
            (true, _, _, true) => Alignment.LowerLeft,
            (true, _, _, _) => Alignment.LowerCenter,
            (_, true, true, _) => Alignment.UpperRight,
            (_, true, _, true) => Alignment.UpperLeft,
            (_, true, _, _) => Alignment.UpperCenter,
            (_, _, true, _) => Alignment.MiddleRight,
            _ => Alignment.MiddleLeft,
        };
    }
}
