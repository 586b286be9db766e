using Coupling.Outputs;
using Coupling.Results;
using ScottPlot;

namespace Coupling.Figures;

/// <summary>Draws a result's channel x channel value matrix as a heatmap (PNG and/or SVG).</summary>
/// <remarks>
/// Row a, column b shows pair (a, b), first channel at the top left; the lower triangle mirrors the upper one
/// (negated for antisymmetric measures, as in the CSV matrices). Every cell is drawn at full colour, significant or
/// not; a significant pair carries an outline (a dark line with a light line inside, visible on any colour). The
/// diagonal and NaN values are left white. Colours (<see cref="FigureColours"/>): Viridis from 0 to a round top above
/// the largest value for measures that are never negative, and the diverging Balance map, symmetric about zero, for
/// signed ones. The colour bar has a few round ticks and the measure as its title.
/// </remarks>
public static class MatrixFigure
{
    /// <summary>Writes the heatmap of <paramref name="result"/> to <paramref name="path"/> (.png or .svg).</summary>
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
        using var plot = Build(result, width, valueLabel);
        FigureStyle.Save(plot, paths, width, height);
    }

    /// <summary>The figure of <paramref name="result"/>; cell (a, b) is centred at x = b, y = n - 1 - a.</summary>
    internal static Plot Build(PairResult result, int width, string? valueLabel)
    {
        PairResultShape.Check(result);
        int n = result.Channels.Count;
        if (n < 2) throw new ArgumentException($"Result {result.Condition}/{result.Band}/{result.Measure} has fewer than two channels.");
        var plot = FigureStyle.NewPlot();

        var values = PairResultShape.Matrix(result.Value, n, MeasureSymmetry.IsAntisymmetric(result.Measure));
        var finite = result.Value.Where(double.IsFinite).ToArray();
        bool signed = FigureStyle.IsSigned(result.Measure, finite);
        double top = FigureStyle.NiceCeiling(finite.Length == 0 ? 1 : finite.Max(Math.Abs));

        var heatmap = plot.Add.Heatmap(values);
        heatmap.Colormap = signed ? FigureColours.Signed : FigureColours.Magnitude;
        heatmap.ManualRange = signed ? new ScottPlot.Range(-top, top) : new ScottPlot.Range(0, top);
        heatmap.NaNCellColor = Colors.White;
        heatmap.Position = new CoordinateRect(0, n - 1, 0, n - 1); // centres of the corner cells (CellAlignment MiddleCenter)

        // Outline of each significant cell (row a is drawn at y = n - 1 - a): dark outside, light inside.
        float cellPixels = (float)(Math.Min(width, 900) - 160) / n;
        float line = Math.Clamp(cellPixels / 14, 1f, 3f);
        int shown = 0;
        for (int k = 0; k < result.Significant.Length; k++)
        {
            if (!result.Significant[k]) continue;
            shown++;
            var (a, b) = Measures.PairIndex.Channels(k, n);
            Outline(plot, b, n - 1 - a, line);
            Outline(plot, a, n - 1 - b, line);
        }

        FigureStyle.AddColourBar(plot, heatmap, valueLabel ?? result.Measure);

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

        bool tested = result.P.Any(p => !double.IsNaN(p));
        string note = !tested ? "values only: no test (surrogates: 0)"
            : shown == 0 ? "no pair significant"
            : $"{shown} of {result.Significant.Length} pairs significant (outlined)";
        plot.Title($"{FigureStyle.Title(result)}\n{note}", FigureStyle.TitleSize(width));
        return plot;
    }

    /// <summary>A dark line with a thinner light line centred on it, around the cell at (x, y): visible on any colour.</summary>
    private static void Outline(Plot plot, double x, double y, float width)
    {
        const double half = 0.46; // just inside the cell's half-width of 0.5
        foreach (var (colour, lineWidth) in new[] { (FigureStyle.Ink, 2 * width), (Colors.White, width * 0.75f) })
        {
            var line = plot.Add.Rectangle(x - half, x + half, y - half, y + half);
            line.FillStyle.Color = Colors.Transparent;
            line.LineStyle.Color = colour;
            line.LineStyle.Width = lineWidth;
        }
    }
}
