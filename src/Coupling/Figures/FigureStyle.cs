using ScottPlot;

namespace Coupling.Figures;

/// <summary>Shared look of the program's figures: fonts, title text and which measures are signed.</summary>
internal static class FigureStyle
{
    /// <summary>Dark grey for text and outlines.</summary>
    public static readonly Color Ink = Color.FromHex("#2b2b2b");

    /// <summary>Light grey for cells and notes that carry no data.</summary>
    public static readonly Color Quiet = Color.FromHex("#d9d9d9");

    /// <summary>Measures whose values can be negative: imaginary coherency, envelope correlations, and the
    /// unbiased estimators (PPC, debiased wPLI) whose sampling noise crosses zero.</summary>
    private static readonly HashSet<string> SignedKeys =
        new(["imag-coherency", "aec", "aec-orth", "ppc", "wpli-debiased"], StringComparer.OrdinalIgnoreCase);

    /// <summary>Whether values of <paramref name="measure"/> are drawn on a scale centred on zero.</summary>
    public static bool IsSigned(string measure, IEnumerable<double> values) =>
        SignedKeys.Contains(measure) || values.Any(v => v < 0);

    /// <summary>"condition · band · measure".</summary>
    public static string Title(Results.PairResult r) => $"{r.Condition} · {r.Band} · {r.Measure}";

    /// <summary>A plot with a sans-serif font (DejaVu Sans where installed) and no grid.</summary>
    public static Plot NewPlot()
    {
        var plot = new Plot();
        string sans = Fonts.GetTypeface("DejaVu Sans", false, false)?.FamilyName == "DejaVu Sans" ? "DejaVu Sans" : Fonts.Sans;
        plot.Font.Set(sans);
        plot.HideGrid();
        return plot;
    }

    /// <summary>Title font size for a figure <paramref name="width"/> pixels wide: 15 px at 900 px and up, down to 10 px.</summary>
    public static float TitleSize(int width) => (float)Math.Clamp(width / 60.0, 10, 15);

    /// <summary>Throws unless the figure is at least 200 x 200 px.</summary>
    public static void CheckSize(int width, int height)
    {
        if (width < 200 || height < 200)
            throw new ArgumentOutOfRangeException(nameof(width), $"Figure size {width} x {height} px is below 200 x 200.");
    }

    /// <summary>
    /// Renders <paramref name="plot"/> at the given size to every path, as PNG or SVG by the path's extension
    /// (<c>.png</c>, <c>.svg</c>), each written atomically.
    /// </summary>
    /// <exception cref="ArgumentException">A path has another extension (checked before anything is written).</exception>
    public static void Save(Plot plot, IReadOnlyList<string> paths, int width, int height)
    {
        CheckSize(width, height);
        foreach (var path in paths)
            if (!IsPng(path) && !IsSvg(path))
                throw new ArgumentException($"Figure file {path}: expected a .png or .svg name.", nameof(paths));
        foreach (var path in paths)
        {
            if (IsPng(path))
                Outputs.AtomicFile.WriteAllBytes(path, plot.GetImageBytes(width, height, ImageFormat.Png));
            else
                Outputs.AtomicFile.WriteAllText(path, plot.GetSvgXml(width, height));
        }
    }

    private static bool IsPng(string path) => path.EndsWith(".png", StringComparison.OrdinalIgnoreCase);

    private static bool IsSvg(string path) => path.EndsWith(".svg", StringComparison.OrdinalIgnoreCase);

    /// <summary>
    /// The smallest "round" number at or above <paramref name="x"/> (&gt; 0): 1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6 or 8 times a
    /// power of ten; 1 for x &lt;= 0 or not finite.
    /// </summary>
    public static double NiceCeiling(double x)
    {
        if (!(x > 0) || !double.IsFinite(x)) return 1;
        double decade = Math.Pow(10, Math.Floor(Math.Log10(x)));
        foreach (double m in (double[])[1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10])
            if (m * decade >= x * (1 - 1e-12)) return m * decade;
        return 10 * decade;
    }

    /// <summary>
    /// A few round ticks (4 to 7) covering [<paramref name="low"/>, <paramref name="high"/>]: multiples of a step of
    /// 1, 2 or 5 times a power of ten (2.5 only when none of those gives 4 to 7 ticks), the largest such step, each tick
    /// rounded to the step's decimals.
    /// </summary>
    public static double[] RoundTicks(double low, double high)
    {
        if (!(high > low) || !double.IsFinite(low) || !double.IsFinite(high)) return [low];
        double decade = Math.Pow(10, Math.Floor(Math.Log10(high - low)));
        foreach (double[] family in (double[][])[[5, 2, 1, 0.5, 0.2, 0.1, 0.05], [2.5, 0.25, 0.025]])
            foreach (double m in family)
            {
                var ticks = Multiples(low, high, m * decade);
                if (ticks.Length is >= 4 and <= 7) return ticks;
            }
        return Multiples(low, high, (high - low) / 4);
    }

    private static double[] Multiples(double low, double high, double step)
    {
        int decimals = Decimals(step);
        var list = new List<double>();
        for (double k = Math.Ceiling(low / step - 1e-9); k * step <= high + 1e-9 * step; k++)
            list.Add(Math.Round(k * step, decimals) + 0.0); // + 0.0: no negative zero
        return list.ToArray();
    }

    /// <summary>Decimals needed to write <paramref name="step"/> exactly (at most 12; 0 for 0 or not finite).</summary>
    private static int Decimals(double step)
    {
        if (!(step > 0) || !double.IsFinite(step)) return 0;
        string text = Math.Round(step, 12).ToString("0.############", System.Globalization.CultureInfo.InvariantCulture);
        int dot = text.IndexOf('.');
        return dot < 0 ? 0 : text.Length - dot - 1;
    }

    /// <summary>The text of tick <paramref name="value"/> in a list of ticks: as many decimals as the step needs, a true minus sign.</summary>
    public static string TickText(double value, IReadOnlyList<double> ticks)
    {
        int decimals = ticks.Count > 1 ? Decimals(Math.Abs(ticks[1] - ticks[0])) : Decimals(Math.Abs(value));
        string text = value.ToString("F" + decimals, System.Globalization.CultureInfo.InvariantCulture);
        return text.StartsWith('-') ? "\u2212" + text[1..] : text;
    }

    /// <summary>
    /// Adds a colour bar for <paramref name="source"/> on the right with round ticks (<see cref="RoundTicks"/>) and
    /// <paramref name="title"/> written along it, clear of the tick labels.
    /// </summary>
    public static ScottPlot.Panels.ColorBar AddColourBar(Plot plot, IHasColorAxis source, string title)
    {
        var range = source.GetRange();
        var ticks = RoundTicks(range.Min, range.Max);
        var bar = plot.Add.ColorBar(source);
        bar.Axis.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks, ticks.Select(t => TickText(t, ticks)).ToArray());
        bar.Axis.MinorTickStyle.Length = 0;
        bar.Axis.TickLabelStyle.FontSize = 13;
        bar.Label = title;
        bar.LabelStyle.FontSize = 14;
        bar.LabelStyle.Bold = false;
        return bar;
    }
}
