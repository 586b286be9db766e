using ScottPlot;

namespace Coupling.Figures;

/// <summary>The colour maps of the figures, all with lightness that changes monotonically (each half, for the diverging ones).</summary>
/// <remarks>
/// Viridis: van der Walt S, Smith N (2015), matplotlib's perceptually uniform sequential map. Balance and Amp: cmocean,
/// Thyng KM, Greene CA, Hetland RD, Zimmerle HM, DiMarco SF (2016), True colors of oceanography: guidelines for
/// effective and accurate colormap selection, Oceanography 29(3):9-13 (Balance is diverging with a light centre, its
/// two halves perceptually balanced; Amp is sequential from near white to dark red). Lightness checked in the tests
/// as CIE 1976 L*.
/// </remarks>
internal static class FigureColours
{
    /// <summary>Matrix cells of measures that are never negative: Viridis, dark (0) to light.</summary>
    public static IColormap Magnitude { get; } = new ScottPlot.Colormaps.Viridis();

    /// <summary>Matrix cells of signed values: Balance, blue (negative) through near white (0) to red.</summary>
    public static IColormap Signed { get; } = new ScottPlot.Colormaps.Balance();

    /// <summary>Network edges by |value|: Amp from 15 % on (0 is a light but visible red, not white), growing darker.</summary>
    public static IColormap EdgeMagnitude { get; } = new Part(new ScottPlot.Colormaps.Amp(), 0.15, 1);

    /// <summary>
    /// Network edges by signed value: Balance without its lightest middle (the 30 % around 0), so that the weakest drawn
    /// edge of either sign keeps a clear colour; the bar shows the jump at 0.
    /// </summary>
    public static IColormap EdgeSigned { get; } = new Gapped(new ScottPlot.Colormaps.Balance(), 0.3);

    /// <summary>The part of <c>inner</c> from <c>from</c> to <c>to</c>, stretched over 0..1.</summary>
    private sealed class Part(IColormap inner, double from, double to) : IColormap
    {
        public string Name => $"{inner.Name} ({from:0.##}-{to:0.##})";

        public Color GetColor(double position) => inner.GetColor(from + (to - from) * Math.Clamp(position, 0, 1));
    }

    /// <summary><c>inner</c> with the band of width <c>gap</c> around its middle left out, each half stretched over its half.</summary>
    private sealed class Gapped(IColormap inner, double gap) : IColormap
    {
        public string Name => $"{inner.Name} (without the middle {gap:0.##})";

        public Color GetColor(double position)
        {
            double p = Math.Clamp(position, 0, 1);
            double half = (1 - gap) / 2;
            return inner.GetColor(p < 0.5 ? p * 2 * half : 1 - (1 - p) * 2 * half);
        }
    }
}
