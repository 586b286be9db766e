using System.Globalization;
using Coupling.Results;
using ScottPlot;

namespace Coupling.Figures;

/// <summary>Draws the surrogate distribution of one edge as a histogram with its observed value marked.</summary>
/// <remarks>
/// The bars count the surrogate values in equal bins over the range of the draws (about sqrt(M) bins, 5 to 60: the
/// square-root rule, common practice). A solid line marks the observed value; for a two-sided measure (test statistic
/// |value|) a dashed line marks its mirror image, since draws beyond either line count as exceedances. An observed
/// value farther than half the draws' range beyond them is not drawn to scale (the histogram would shrink to a sliver);
/// a note names it and its side instead. The title names the edge and gives p and z.
/// </remarks>
public static class SurrogateFigure
{
    /// <summary>Observed-value line colour: a dark orange that stays distinct from the grey bars in greyscale too (darker).</summary>
    private static readonly Color Observed = Color.FromHex("#b34700");

    /// <summary>Writes the figure of <paramref name="distribution"/> to <paramref name="path"/> as a PNG, and beside it as SVG (atomically).</summary>
    public static void Save(SurrogateDistribution distribution, string path, int width = 900, int height = 500)
    {
        ArgumentNullException.ThrowIfNull(distribution);
        var draws = distribution.Draws.Where(double.IsFinite).ToArray();
        if (draws.Length == 0) throw new ArgumentException("No finite surrogate value to draw.", nameof(distribution));
        using var plot = FigureStyle.NewPlot();

        double observed = distribution.Observed;
        double low = draws.Min(), high = draws.Max();
        if (!(high > low)) { low -= 0.5; high += 0.5; }
        int bins = Math.Clamp((int)Math.Ceiling(Math.Sqrt(draws.Length)), 5, 60);
        double size = (high - low) / bins;
        var counts = new int[bins];
        foreach (double v in draws) counts[Math.Min(bins - 1, (int)((v - low) / size))]++;
        var bars = Enumerable.Range(0, bins).Select(i => new Bar
        {
            Position = low + (i + 0.5) * size,
            Value = counts[i],
            Size = size,
            FillColor = Color.FromHex("#9a9a9a"),
            LineWidth = 0,
        }).ToList();
        plot.Add.Bars(bars);

        // The observed value is drawn where it lies when that keeps the histogram readable (within half the draws' range
        // beyond them); farther out the axis keeps to the draws and a note says where the observed value is.
        double reach = 0.5 * (high - low);
        var marks = new List<(double X, bool Mirror)>();
        if (double.IsFinite(observed))
        {
            marks.Add((observed, false));
            if (distribution.TwoSided && observed != 0) marks.Add((-observed, true));
        }
        var shown = marks.Where(m => m.X >= low - reach && m.X <= high + reach).ToList();
        foreach (var (x, mirror) in shown)
        {
            var line = mirror ? plot.Add.VerticalLine(x, 2, Observed, LinePattern.Dashed) : plot.Add.VerticalLine(x, 3, Observed);
            line.LegendText = mirror ? "mirror (two-sided test on |value|)"
                : string.Create(CultureInfo.InvariantCulture, $"observed {observed:G4}");
        }
        if (shown.Count > 0) plot.ShowLegend(Alignment.UpperLeft);
        if (double.IsFinite(observed) && !shown.Any(m => !m.Mirror))
        {
            string side = observed > high ? "right" : "left";
            var note = plot.Add.Annotation(string.Create(CultureInfo.InvariantCulture,
                $"observed {observed:G4}: far to the {side} of every draw (off this scale)"),
                observed > high ? Alignment.UpperRight : Alignment.UpperLeft);
            note.LabelFontColor = Observed;
            note.LabelBorderColor = Observed;
            note.LabelBackgroundColor = Colors.White;
            note.LabelShadowColor = Colors.Transparent;
        }
        plot.Axes.Margins(bottom: 0);
        plot.XLabel(distribution.Measure);
        plot.YLabel("surrogate draws");
        string title = string.Create(CultureInfo.InvariantCulture,
            $"{distribution.Condition} · {distribution.Band} · {distribution.Measure} · {distribution.ChannelA}–{distribution.ChannelB}\n" +
            $"{distribution.Draws.Length} trial-shuffle surrogates; p = {distribution.P:G3}, z = {distribution.Z:0.##}");
        plot.Title(title, FigureStyle.TitleSize(width));
        FigureStyle.Save(plot, [path, Path.ChangeExtension(path, ".svg")], width, height);
    }
}
