using System.Globalization;
using Coupling.Outputs;
using Coupling.Results;
using SkiaSharp;

namespace Coupling.Figures;

/// <summary>
/// One image of every tested table at a glance: small channel x channel matrices in a grid, a row per condition x band
/// and a column per measure, significant pairs marked.
/// </summary>
/// <remarks>
/// <para>Rows follow the order of the results (condition, then band), columns the order in which measures first appear.
/// Each small matrix has the first channel at the top left; its lower triangle mirrors the upper one (negated for
/// imaginary coherency, as in the CSV matrices); the diagonal is light grey. Under each matrix: significant pairs / all
/// pairs.</para>
/// <para>One colour scale per column (per measure), shared by every condition and band so that they compare: Viridis
/// (van der Walt &amp; Smith 2015, matplotlib; perceptually uniform, lightness rising with the value) from 0 to the
/// column's largest |value| for non-negative measures, cmocean Balance (Thyng et al. 2016, Oceanography 29(3):9-13)
/// symmetric about 0 for signed ones, with the scale drawn under the column.</para>
/// <para>A significant pair carries a dot (light on dark cells, dark on light ones); when cells are too small for a dot
/// (below 5 px) the cell is outlined instead.</para>
/// </remarks>
public static class OverviewFigure
{
    private const int LabelWidth = 150, Gap = 18, Header = 86, Footer = 64, Right = 24;

    /// <summary>Draws the overview of <paramref name="results"/> and returns it as PNG bytes.</summary>
    /// <exception cref="ArgumentException">No results, or a result with fewer than two channels.</exception>
    public static byte[] Render(IReadOnlyList<PairResult> results) => Render(results, svg: false);

    /// <summary>Draws the overview of <paramref name="results"/> as PNG bytes, or as SVG text bytes when <paramref name="svg"/> is true.</summary>
    public static byte[] Render(IReadOnlyList<PairResult> results, bool svg)
    {
        ArgumentNullException.ThrowIfNull(results);
        if (results.Count == 0) throw new ArgumentException("No results to draw.", nameof(results));
        foreach (var r in results)
        {
            PairResultShape.Check(r);
            if (r.Channels.Count < 2) throw new ArgumentException($"Result {r.Condition}/{r.Band}/{r.Measure} has fewer than two channels.");
        }
        var rows = results.Select(r => (r.Condition, r.Band)).Distinct().ToArray();
        var columns = results.Select(r => r.Measure).Distinct(StringComparer.Ordinal).ToArray();
        int channels = results.Max(r => r.Channels.Count);
        int panel = Math.Clamp(channels * 10, 90, 160);
        int width = LabelWidth + columns.Length * (panel + Gap) + Right;
        int height = Header + rows.Length * (panel + Gap) + Footer;

        var scales = columns.ToDictionary(m => m, m =>
        {
            var values = results.Where(r => r.Measure == m).SelectMany(r => r.Value).Where(double.IsFinite).ToArray();
            double top = values.Length == 0 ? 1 : values.Max(Math.Abs);
            return (Signed: FigureStyle.IsSigned(m, values), Top: top > 0 ? top : 1);
        }, StringComparer.Ordinal);

        var info = new SKImageInfo(width, height, SKColorType.Rgba8888, SKAlphaType.Premul);
        using var svgStream = new MemoryStream();
        using var surface = svg ? null : SKSurface.Create(info);
        var canvas = svg ? SKSvgCanvas.Create(new SKRect(0, 0, width, height), svgStream) : surface!.Canvas;
        canvas.Clear(SKColors.White);
        using var typeface = SKTypeface.FromFamilyName("DejaVu Sans") ?? SKTypeface.Default;
        using var titleFont = new SKFont(typeface, 17);
        using var labelFont = new SKFont(typeface, 13);
        using var smallFont = new SKFont(typeface, 11);
        using var ink = new SKPaint { Color = new SKColor(0x2b, 0x2b, 0x2b), IsAntialias = true };
        using var quiet = new SKPaint { Color = new SKColor(0x6b, 0x6b, 0x6b), IsAntialias = true };
        using var fill = new SKPaint { IsAntialias = false, Style = SKPaintStyle.Fill };
        using var frame = new SKPaint { Color = new SKColor(0xb0, 0xb0, 0xb0), Style = SKPaintStyle.Stroke, StrokeWidth = 1 };

        canvas.DrawText("All conditions × bands × measures", LabelWidth, 26, SKTextAlign.Left, titleFont, ink);
        canvas.DrawText("Each square: channel × channel values, first channel top left. Dot: significant after correction. " +
                        "One colour scale per measure (below its column).", LabelWidth, 46, SKTextAlign.Left, smallFont, quiet);
        var order = results[0].Channels;
        if (order.Count <= 40)
            canvas.DrawText($"Channel order: {string.Join(", ", order)}", LabelWidth, 62, SKTextAlign.Left, smallFont, quiet);
        for (int j = 0; j < columns.Length; j++)
            canvas.DrawText(columns[j], LabelWidth + j * (panel + Gap) + panel / 2f, Header - 8, SKTextAlign.Center, labelFont, ink);

        for (int i = 0; i < rows.Length; i++)
        {
            float top = Header + i * (panel + Gap);
            canvas.DrawText(rows[i].Condition, LabelWidth - 10, top + panel / 2f - 2, SKTextAlign.Right, labelFont, ink);
            canvas.DrawText(rows[i].Band, LabelWidth - 10, top + panel / 2f + 14, SKTextAlign.Right, labelFont, quiet);
            for (int j = 0; j < columns.Length; j++)
            {
                float left = LabelWidth + j * (panel + Gap);
                var result = results.FirstOrDefault(r => r.Condition == rows[i].Condition && r.Band == rows[i].Band && r.Measure == columns[j]);
                if (result is null)
                {
                    canvas.DrawText("not computed", left + panel / 2f, top + panel / 2f, SKTextAlign.Center, smallFont, quiet);
                    continue;
                }
                DrawPanel(canvas, result, scales[columns[j]], left, top, panel, fill, frame);
                int found = result.Significant.Count(s => s);
                canvas.DrawText($"{found} / {result.Significant.Length}", left + panel, top + panel + 12, SKTextAlign.Right, smallFont,
                    found > 0 ? ink : quiet);
            }
        }

        float barTop = Header + rows.Length * (panel + Gap) + 6;
        for (int j = 0; j < columns.Length; j++)
            DrawScale(canvas, scales[columns[j]], LabelWidth + j * (panel + Gap), barTop, panel, fill, frame, smallFont, ink);

        if (svg)
        {
            canvas.Dispose(); // ends the SVG document
            return svgStream.ToArray();
        }
        using var image = surface!.Snapshot();
        using var data = image.Encode(SKEncodedImageFormat.Png, 100);
        return data.ToArray();
    }

    /// <summary>Draws the overview of <paramref name="results"/> to <paramref name="path"/>, as SVG for a .svg name, else PNG (atomically).</summary>
    public static void Save(IReadOnlyList<PairResult> results, string path) =>
        AtomicFile.WriteAllBytes(path, Render(results, Path.GetExtension(path).Equals(".svg", StringComparison.OrdinalIgnoreCase)));

    private static void DrawPanel(SKCanvas canvas, PairResult r, (bool Signed, double Top) scale, float left, float top, int panel,
        SKPaint fill, SKPaint frame)
    {
        int n = r.Channels.Count;
        float cell = (float)panel / n;
        var values = PairResultShape.Matrix(r.Value, n, MeasureSymmetry.IsAntisymmetric(r.Measure));
        var significant = new bool[n, n];
        for (int k = 0; k < r.Significant.Length; k++)
        {
            if (!r.Significant[k]) continue;
            var (a, b) = Measures.PairIndex.Channels(k, n);
            significant[a, b] = significant[b, a] = true;
        }
        using var dot = new SKPaint { IsAntialias = true, Style = SKPaintStyle.Fill };
        using var outline = new SKPaint { IsAntialias = false, Style = SKPaintStyle.Stroke, StrokeWidth = 1 };
        for (int a = 0; a < n; a++)
            for (int b = 0; b < n; b++)
            {
                var rect = new SKRect(left + b * cell, top + a * cell, left + (b + 1) * cell, top + (a + 1) * cell);
                double v = values[a, b];
                var colour = a == b ? new SKColor(0xe4, 0xe4, 0xe4) : double.IsFinite(v) ? Colour(scale, v) : SKColors.White;
                fill.Color = colour;
                canvas.DrawRect(rect, fill);
                if (!significant[a, b]) continue;
                var mark = Luminance(colour) > 0.5 ? new SKColor(0x1a, 0x1a, 0x1a) : SKColors.White;
                if (cell >= 5)
                {
                    dot.Color = mark;
                    canvas.DrawCircle(rect.MidX, rect.MidY, Math.Max(1.5f, cell * 0.22f), dot);
                }
                else
                {
                    outline.Color = mark;
                    canvas.DrawRect(rect, outline);
                }
            }
        canvas.DrawRect(new SKRect(left, top, left + panel, top + panel), frame);
    }

    private static void DrawScale(SKCanvas canvas, (bool Signed, double Top) scale, float left, float top, int panel, SKPaint fill,
        SKPaint frame, SKFont font, SKPaint ink)
    {
        const int steps = 64;
        float w = (float)panel / steps;
        double low = scale.Signed ? -scale.Top : 0;
        for (int s = 0; s < steps; s++)
        {
            fill.Color = Colour(scale, low + (scale.Top - low) * (s + 0.5) / steps);
            canvas.DrawRect(new SKRect(left + s * w, top, left + (s + 1) * w + 0.5f, top + 10), fill);
        }
        canvas.DrawRect(new SKRect(left, top, left + panel, top + 10), frame);
        canvas.DrawText(Number(low), left, top + 24, SKTextAlign.Left, font, ink);
        canvas.DrawText(Number(scale.Top), left + panel, top + 24, SKTextAlign.Right, font, ink);
        if (scale.Signed) canvas.DrawText("0", left + panel / 2f, top + 24, SKTextAlign.Center, font, ink);
    }

    private static string Number(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);

    private static readonly ScottPlot.IColormap Unsigned = new ScottPlot.Colormaps.Viridis();
    private static readonly ScottPlot.IColormap Signed = new ScottPlot.Colormaps.Balance();

    private static SKColor Colour((bool Signed, double Top) scale, double v)
    {
        double f = scale.Signed ? 0.5 + 0.5 * v / scale.Top : v / scale.Top;
        var c = (scale.Signed ? Signed : Unsigned).GetColor(Math.Clamp(f, 0, 1));
        return new SKColor(c.R, c.G, c.B);
    }

    /// <summary>Relative luminance with ITU-R BT.709 weights on the 8-bit channels (no linearisation: enough to pick a mark colour).</summary>
    private static double Luminance(SKColor c) => (0.2126 * c.Red + 0.7152 * c.Green + 0.0722 * c.Blue) / 255.0;
}
