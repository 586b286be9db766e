using Coupling.TimeFrequency;
using ScottPlot;

namespace Coupling.Figures;

/// <summary>Draws one pair's connectivity spectrum (value against frequency), one line per condition (PNG and SVG).</summary>
/// <remarks>
/// Lines take the Okabe-Ito colours in condition order (Okabe M, Ito K, 2008, "Color universal design", distinguishable
/// with the common colour-vision deficiencies), with a marker at each computed frequency; signed measures get a zero
/// line. Axis ticks are a few round values (<see cref="FigureStyle.RoundTicks"/>).
/// </remarks>
public static class SpectrumFigure
{
    /// <summary>The Okabe-Ito palette without black.</summary>
    internal static readonly Color[] Palette =
        new[] { "#0072B2", "#D55E00", "#009E73", "#CC79A7", "#E69F00", "#56B4E9", "#F0E442" }.Select(Color.FromHex).ToArray();

    /// <summary>Writes the figure to every path, as PNG or SVG by its extension (<see cref="FigureStyle.Save"/>).</summary>
    /// <param name="spectra">One spectrum (one time bin) per condition, all of one pair and measure.</param>
    /// <param name="paths">Output paths (.png, .svg); each written atomically.</param>
    /// <param name="width">Image width in pixels (at least 200).</param>
    /// <param name="height">Image height in pixels (at least 200).</param>
    /// <exception cref="ArgumentException">No spectra, or spectra of different pairs, measures or frequencies.</exception>
    public static void Save(IReadOnlyList<TimeFrequencyValues> spectra, IReadOnlyList<string> paths, int width = 900, int height = 600)
    {
        if (spectra.Count == 0) throw new ArgumentException("No spectrum to draw.", nameof(spectra));
        var first = spectra[0];
        if (spectra.Any(s => s.ChannelA != first.ChannelA || s.ChannelB != first.ChannelB || s.Measure != first.Measure
                || !s.Frequencies.SequenceEqual(first.Frequencies) || s.Times.Count != 1))
            throw new ArgumentException("Spectra of one pair, one measure, the same frequencies and one time bin are expected.", nameof(spectra));
        using var plot = FigureStyle.NewPlot();
        var xs = first.Frequencies.ToArray();
        for (int i = 0; i < spectra.Count; i++)
        {
            var line = plot.Add.Scatter(xs, spectra[i].Values);
            line.Color = Palette[i % Palette.Length];
            line.LineWidth = 2;
            line.MarkerSize = xs.Length <= 60 ? 5 : 0;
            line.LegendText = spectra[i].Condition;
        }
        var finite = spectra.SelectMany(s => s.Values).Where(double.IsFinite).ToArray();
        double low = finite.Length == 0 ? 0 : Math.Min(0, finite.Min()), high = finite.Length == 0 ? 1 : finite.Max();
        if (FigureStyle.IsSigned(first.Measure, finite))
        {
            var zero = plot.Add.HorizontalLine(0);
            zero.Color = FigureStyle.Quiet;
            zero.LineWidth = 1;
        }
        double margin = 0.05 * Math.Max(high - low, 1e-12);
        plot.Axes.SetLimits(xs[0] - 0.02 * (xs[^1] - xs[0] + 1), xs[^1] + 0.02 * (xs[^1] - xs[0] + 1), low - margin, high + margin);
        SetRoundTicks(plot.Axes.Bottom, xs[0], xs[^1]);
        SetRoundTicks(plot.Axes.Left, low - margin, high + margin);
        plot.Axes.Bottom.Label.Text = "frequency (Hz)";
        plot.Axes.Left.Label.Text = first.Measure;
        plot.ShowLegend(Alignment.UpperRight);
        plot.Title($"{first.ChannelA} – {first.ChannelB} · {first.Measure} over {Window(first.Times[0])}", FigureStyle.TitleSize(width));
        FigureStyle.Save(plot, paths, width, height);
    }

    /// <summary>Puts a few round ticks between <paramref name="low"/> and <paramref name="high"/> on <paramref name="axis"/>.</summary>
    internal static void SetRoundTicks(ScottPlot.IAxis axis, double low, double high)
    {
        var ticks = FigureStyle.RoundTicks(low, high);
        axis.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks, ticks.Select(t => FigureStyle.TickText(t, ticks)).ToArray());
        axis.MinorTickStyle.Length = 0;
    }

    private static string Window(double centre) =>
        $"the analysis window (centre {centre.ToString("G4", System.Globalization.CultureInfo.InvariantCulture)} s)";
}
