namespace Coupling.Spectral;

/// <summary>A named frequency band with edges in Hz.</summary>
/// <param name="Name">Band name used in outputs (e.g. "theta").</param>
/// <param name="Low">Lower edge in Hz.</param>
/// <param name="High">Upper edge in Hz.</param>
public sealed record Band(string Name, double Low, double High)
{
    /// <summary>Centre frequency (arithmetic mean of the edges), Hz.</summary>
    public double Centre => 0.5 * (Low + High);

    /// <summary>Width in Hz.</summary>
    public double Width => High - Low;
}
