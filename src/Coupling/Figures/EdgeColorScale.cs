using ScottPlot;

namespace Coupling.Figures;

/// <summary>
/// The colour scale of network edges, also the source of the figure's colour bar: |value| from 0 to a round top on
/// <see cref="FigureColours.EdgeMagnitude"/>, or signed values from -top to top on <see cref="FigureColours.EdgeSigned"/>.
/// </summary>
internal sealed class EdgeColorScale : IHasColorAxis
{
    private EdgeColorScale(IColormap map, double low, double high, bool signed)
    {
        Colormap = map;
        Low = low;
        High = high;
        Signed = signed;
    }

    /// <summary>|value| from 0 to <see cref="FigureStyle.NiceCeiling"/>(<paramref name="largest"/>).</summary>
    public static EdgeColorScale Magnitude(double largest) =>
        new(FigureColours.EdgeMagnitude, 0, FigureStyle.NiceCeiling(largest), false);

    /// <summary>Signed values, symmetric about 0 up to <see cref="FigureStyle.NiceCeiling"/>(<paramref name="largest"/>).</summary>
    public static EdgeColorScale Diverging(double largest)
    {
        double top = FigureStyle.NiceCeiling(largest);
        return new(FigureColours.EdgeSigned, -top, top, true);
    }

    public IColormap Colormap { get; set; }

    /// <summary>Lower end of the scale.</summary>
    public double Low { get; }

    /// <summary>Upper end of the scale.</summary>
    public double High { get; }

    /// <summary>Whether the scale is signed (diverging) rather than of |value|.</summary>
    public bool Signed { get; }

    public ScottPlot.Range GetRange() => new(Low, High);

    /// <summary>Colour of an edge of value <paramref name="value"/> (|value| on a magnitude scale).</summary>
    public Color ColorOf(double value) =>
        Colormap.GetColor(Math.Clamp(((Signed ? value : Math.Abs(value)) - Low) / (High - Low), 0, 1));

    /// <summary>|value| as a share of the scale's top, 0 to 1: the edge's width.</summary>
    public double Strength(double value) => Math.Clamp(Math.Abs(value) / High, 0, 1);
}
