using Coupling.Graphs;
using Coupling.Outputs;
using Coupling.Results;
using ScottPlot;

namespace Coupling.Figures;

/// <summary>Draws a result's significant pairs as a network of channels, as a PNG.</summary>
/// <remarks>
/// Nodes sit at the channels' (x, y) positions when every channel has one (equal units on both axes, as seen
/// from above), else evenly on a circle, the first channel at the top and the rest clockwise. Only significant
/// pairs are drawn; an edge's width (1 to 7 px, thinner for many channels) and colour grow with |value| on a scale
/// from the smallest to the largest significant |value| (from 0 when they are all equal), with the colour bar beside. Negative values, for signed measures, are dashed. The
/// colours are the upper 85 % of the perceptually uniform cmocean Amp map (Thyng KM, Greene CA, Hetland RD,
/// Zimmerle HM, DiMarco SF, 2016, True colors of oceanography, Oceanography 29(3):9-13), so that the weakest
/// edge is still visible. A figure with no significant pair shows the nodes and says so.
/// </remarks>
public static class NetworkFigure
{
    private const float MinWidth = 1f;
    private const float MaxWidth = 7f;

    /// <summary>Writes the network of <paramref name="result"/> to <paramref name="path"/> as a PNG.</summary>
    /// <param name="result">The result to draw.</param>
    /// <param name="path">Output PNG path; written atomically.</param>
    /// <param name="width">Image width in pixels (at least 200).</param>
    /// <param name="height">Image height in pixels (at least 200).</param>
    /// <param name="valueLabel">What the values are, for the colour scale (default: the measure key).</param>
    public static void Save(PairResult result, string path, int width = 900, int height = 800, string? valueLabel = null)
    {
        var graph = ChannelGraphs.Build(result);
        int n = result.Channels.Count;
        if (n < 2) throw new ArgumentException($"Result {result.Condition}/{result.Band}/{result.Measure} has fewer than two channels.");
        using var plot = FigureStyle.NewPlot();
        plot.HideAxesAndGrid();

        bool placed = result.Positions is not null && n > 0 && result.Positions.All(p => p.HasValue);
        var xy = placed ? Placed(result) : Circle(n);

        var edges = graph.Edges.Where(e => !double.IsNaN(e.Weight)).OrderBy(e => e.Weight).ToArray();
        var finite = edges.Where(e => double.IsFinite(e.Weight)).ToArray();
        double high = finite.Length == 0 ? 1 : finite[^1].Weight;
        double low = finite.Length == 0 ? 0 : finite[0].Weight;
        if (!(high - low > 1e-9 * Math.Abs(high))) low = high > 0 ? 0 : high - 1; // all equal: scale from 0
        var scale = new EdgeColorScale(new ScottPlot.Colormaps.Amp(), 0.15, low, high);
        float maxWidth = n <= 20 ? MaxWidth : n <= 40 ? 5f : 3.5f;
        foreach (var e in edges)
        {
            var line = plot.Add.Line(xy[e.A], xy[e.B]);
            line.LineWidth = MinWidth + (maxWidth - MinWidth) * (float)scale.Fraction(e.Weight);
            line.LineColor = scale.ColorOf(e.Weight);
            line.MarkerSize = 0;
            if (e.Value < 0) line.LinePattern = LinePattern.Dashed;
        }

        float nodeSize = (float)Math.Clamp(420.0 / Math.Max(n, 1), 6, 16);
        var nodes = plot.Add.Markers(xy, MarkerShape.FilledCircle, nodeSize, Colors.White);
        nodes.MarkerStyle.OutlineColor = FigureStyle.Ink;
        nodes.MarkerStyle.OutlineWidth = 1.5f;

        float font = n <= 20 ? 13 : n <= 64 ? 10 : 8;
        var centre = new Coordinates(xy.Average(c => c.X), xy.Average(c => c.Y));
        for (int i = 0; i < n; i++)
        {
            var text = plot.Add.Text(result.Channels[i], xy[i]);
            text.LabelFontSize = font;
            text.LabelFontColor = FigureStyle.Ink;
            // Push the label away from the centre of the layout, off the node.
            double dx = xy[i].X - centre.X, dy = xy[i].Y - centre.Y;
            double len = Math.Sqrt(dx * dx + dy * dy);
            float push = nodeSize * 0.6f + 3;
            text.OffsetX = len > 0 ? (float)(push * dx / len) : 0;
            text.OffsetY = len > 0 ? (float)(-push * dy / len) : -push;
            text.Alignment = AlignmentFor(dx, dy, len);
        }

        // Limits: the nodes' bounding box plus room for the labels outside the outermost nodes.
        double minX = xy.Min(c => c.X), maxX = xy.Max(c => c.X), minY = xy.Min(c => c.Y), maxY = xy.Max(c => c.Y);
        double span = Math.Max(Math.Max(maxX - minX, maxY - minY), 1e-9);
        plot.Axes.SetLimits(minX - 0.22 * span, maxX + 0.22 * span, minY - 0.12 * span, maxY + 0.12 * span);
        plot.Axes.SquareUnits();

        string note;
        if (edges.Length == 0)
        {
            note = "no pair significant: no edges to draw";
        }
        else
        {
            var bar = plot.Add.ColorBar(scale);
            // No bar label: the title's second line names the scale (a label here would collide with the ticks).
            bar.Axis.MinorTickStyle.Length = 0;
            string dashed = edges.Any(e => e.Value < 0) ? "; dashed: negative" : "";
            note = $"{edges.Length} significant of {result.Significant.Length} pairs; width and colour: |{valueLabel ?? result.Measure}|{dashed}";
        }
        plot.Title($"{FigureStyle.Title(result)}\n{note}", FigureStyle.TitleSize(width));
        // Fixed margins: room for the two-line title at the top and the colour bar at the right.
        plot.Layout.Fixed(new PixelPadding(left: 30, right: edges.Length == 0 ? 30 : 100, bottom: 40, top: 64));
        if (!placed && result.Positions is not null)
            plot.XLabel("not every channel has a position: channels placed on a circle", 12);
        FigureStyle.SavePng(plot, path, width, height);
    }

    private static Coordinates[] Placed(PairResult r) =>
        r.Positions!.Select(p => new Coordinates(p!.Value.X, p.Value.Y)).ToArray();

    private static Coordinates[] Circle(int n) =>
        Enumerable.Range(0, n)
            .Select(i => Math.PI / 2 - 2 * Math.PI * i / Math.Max(n, 1))
            .Select(a => new Coordinates(Math.Cos(a), Math.Sin(a)))
            .ToArray();

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
