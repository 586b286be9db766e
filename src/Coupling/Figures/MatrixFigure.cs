using Coupling.Outputs;
using Coupling.Results;
using ScottPlot;

namespace Coupling.Figures;

/// <summary>Draws a result's channel x channel value matrix as a PNG heatmap.</summary>
/// <remarks>
/// Row a, column b shows pair (a, b), first channel at the top left; the lower triangle mirrors the upper one
/// (negated for antisymmetric measures, as in the CSV matrices). Significant pairs are drawn at full colour
/// with a centred dot (up to 48 channels); pairs that are not significant are faded to a quarter of their opacity over the
/// white background; the diagonal and NaN values are left white. A result with no test (every p NaN: a values-only
/// run) is drawn at full colour and says so. Colours: the perceptually uniform Viridis
/// map (van der Walt S, Smith N, 2015, matplotlib) from 0 to the largest value for non-negative measures, and
/// the diverging cmocean Balance map (Thyng KM et al., 2016, Oceanography 29(3):9-13), symmetric about zero,
/// for signed ones.
/// </remarks>
public static class MatrixFigure
{
    /// <summary>Opacity of cells that are not significant (0-255).</summary>
    private const byte FadedAlpha = 64;

    /// <summary>Above this many channels the cells are too small for dots; fading alone marks them.</summary>
    private const int MaxMarkedChannels = 48;

    /// <summary>Relative luminance (ITU-R BT.709 weights on the 8-bit channels, no linearisation: enough to pick a dot colour).</summary>
    private static double Luminance(Color c) => (0.2126 * c.R + 0.7152 * c.G + 0.0722 * c.B) / 255.0;

    /// <summary>Writes the heatmap of <paramref name="result"/> to <paramref name="path"/> as a PNG.</summary>
    /// <param name="result">The result to draw.</param>
    /// <param name="path">Output PNG path; written atomically.</param>
    /// <param name="width">Image width in pixels (at least 200).</param>
    /// <param name="height">Image height in pixels (at least 200).</param>
    /// <param name="valueLabel">What the values are, for the colour scale (default: the measure key).</param>
    public static void Save(PairResult result, string path, int width = 900, int height = 800, string? valueLabel = null)
    {
        PairResultShape.Check(result);
        int n = result.Channels.Count;
        if (n < 2) throw new ArgumentException($"Result {result.Condition}/{result.Band}/{result.Measure} has fewer than two channels.");
        using var plot = FigureStyle.NewPlot();

        var values = PairResultShape.Matrix(result.Value, n, MeasureSymmetry.IsAntisymmetric(result.Measure));
        var significant = new bool[n, n];
        for (int k = 0; k < result.Significant.Length; k++)
        {
            if (!result.Significant[k]) continue;
            var (a, b) = Measures.PairIndex.Channels(k, n);
            significant[a, b] = significant[b, a] = true;
        }

        var finite = result.Value.Where(double.IsFinite).ToArray();
        bool signed = FigureStyle.IsSigned(result.Measure, finite);
        double top = finite.Length == 0 ? 1 : finite.Max(Math.Abs);
        if (top == 0) top = 1;

        bool tested = result.P.Any(p => !double.IsNaN(p));
        var alpha = new byte[n, n];
        for (int a = 0; a < n; a++)
            for (int b = 0; b < n; b++)
                alpha[a, b] = a == b || significant[a, b] || !tested ? (byte)255 : FadedAlpha;

        var heatmap = plot.Add.Heatmap(values);
        heatmap.Colormap = signed ? new ScottPlot.Colormaps.Balance() : new ScottPlot.Colormaps.Viridis();
        heatmap.ManualRange = signed ? new ScottPlot.Range(-top, top) : new ScottPlot.Range(0, top);
        heatmap.NaNCellColor = Colors.White;
        heatmap.AlphaMap = alpha;
        heatmap.Position = new CoordinateRect(0, n - 1, 0, n - 1); // centres of the corner cells (CellAlignment MiddleCenter)

        // A dot marks each significant cell (row a is drawn at y = n - 1 - a), in white or ink for contrast.
        if (n <= MaxMarkedChannels)
        {
            float dot = (float)Math.Clamp(240.0 / n, 3, 12);
            var light = new List<Coordinates>();
            var dark = new List<Coordinates>();
            var range = heatmap.ManualRange!.Value;
            for (int a = 0; a < n; a++)
                for (int b = 0; b < n; b++)
                {
                    if (!significant[a, b]) continue;
                    double f = (values[a, b] - range.Min) / (range.Max - range.Min);
                    var cell = heatmap.Colormap.GetColor(Math.Clamp(f, 0, 1));
                    (Luminance(cell) > 0.5 ? dark : light).Add(new Coordinates(b, n - 1 - a));
                }
            if (light.Count > 0) plot.Add.Markers(light.ToArray(), MarkerShape.FilledCircle, dot, Colors.White);
            if (dark.Count > 0) plot.Add.Markers(dark.ToArray(), MarkerShape.FilledCircle, dot, FigureStyle.Ink);
        }

        var bar = plot.Add.ColorBar(heatmap);
        bar.Label = valueLabel ?? result.Measure;
        bar.LabelStyle.FontSize = 14;
        bar.Axis.MinorTickStyle.Length = 0;

        var positions = Enumerable.Range(0, n).Select(i => (double)i).ToArray();
        var labels = result.Channels.ToArray();
        float tickFont = n <= 16 ? 13 : n <= 40 ? 10 : 7;
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(positions, labels);
        plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericManual(
            positions.Select(p => n - 1 - p).ToArray(), labels);
        plot.Axes.Bottom.TickLabelStyle.FontSize = tickFont;
        plot.Axes.Left.TickLabelStyle.FontSize = tickFont;
        if (n > 8)
        {
            plot.Axes.Bottom.TickLabelStyle.Rotation = -90;
            plot.Axes.Bottom.TickLabelStyle.Alignment = Alignment.MiddleRight;
        }
        plot.Axes.Bottom.MinorTickStyle.Length = 0;
        plot.Axes.Left.MinorTickStyle.Length = 0;
        plot.Axes.SetLimits(-0.5, n - 0.5, -0.5, n - 0.5);

        int shown = result.Significant.Count(s => s);
        string marks = n <= MaxMarkedChannels ? " (dotted)" : "";
        string note = !tested ? "values only: no test (surrogates: 0)"
            : shown == 0 ? "no pair significant; all cells faded"
            : $"{shown} of {result.Significant.Length} pairs significant{marks}; faded cells: not significant";
        plot.Title($"{FigureStyle.Title(result)}\n{note}", FigureStyle.TitleSize(width));
        FigureStyle.SavePng(plot, path, width, height);
    }
}
