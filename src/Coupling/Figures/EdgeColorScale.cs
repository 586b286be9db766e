using ScottPlot;

namespace Coupling.Figures;

/// <summary>
/// The colour scale of network edges: the upper part of a sequential map (so the weakest edge is still visible
/// on white) over [smallest, largest] drawn weight. Serves as the source of the figure's colour bar.
/// </summary>
internal sealed class EdgeColorScale : IHasColorAxis
{
    private readonly double _low;
    private readonly double _high;

    public EdgeColorScale(IColormap baseMap, double from, double low, double high)
    {
        Colormap = new Tail(baseMap, from);
        _low = low;
        _high = high;
    }

    public IColormap Colormap { get; set; }

    public ScottPlot.Range GetRange() => new(_low, _high);

    /// <summary>Colour of an edge of weight <paramref name="weight"/>.</summary>
    public Color ColorOf(double weight) => Colormap.GetColor(Fraction(weight));

    /// <summary>Where <paramref name="weight"/> lies between the scale's ends, 0 to 1.</summary>
    public double Fraction(double weight) => Math.Clamp((weight - _low) / (_high - _low), 0, 1);

    /// <summary>The part of <c>inner</c> from <c>from</c> to 1, stretched over 0..1.</summary>
    private sealed class Tail(IColormap inner, double from) : IColormap
    {
        public string Name => $"{inner.Name} (from {from:0.##})";

        public Color GetColor(double position) => inner.GetColor(from + (1 - from) * Math.Clamp(position, 0, 1));
    }
}
