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

    /// <summary>Renders <paramref name="plot"/> to a PNG of the given size and writes it atomically.</summary>
    public static void SavePng(Plot plot, string path, int width, int height)
    {
        if (width < 200 || height < 200)
            throw new ArgumentOutOfRangeException(nameof(width), $"Figure size {width} x {height} px is below 200 x 200.");
        byte[] png = plot.GetImageBytes(width, height, ImageFormat.Png);
        Outputs.AtomicFile.WriteAllBytes(path, png);
    }
}
