namespace Coupling.Statistics;

/// <summary>
/// Every draw's values of a resampling test, kept while the test runs, so that a correction that needs the draws on a
/// scale known only afterwards (maximum statistic, network-based statistic) reads them back instead of drawing them all
/// again. Each draw is written at its own index, so the contents do not depend on the order in which draws arrive.
/// </summary>
internal sealed class KeptDraws : IDrawObserver
{
    /// <summary>
    /// The most memory the kept values may take; above it the draws are made a second time instead (the same draws, so
    /// the same result). Settable so that tests can compare the two ways.
    /// </summary>
    internal static long LimitBytes { get; set; } = 256L << 20;

    private readonly double[] _values;
    private readonly int _cells;

    private KeptDraws(int draws, int cells)
    {
        _cells = cells;
        _values = new double[(long)draws * cells];
    }

    /// <summary>Draws to keep for <paramref name="correction"/>, or null when it needs no second look at the draws or they would take more than <see cref="LimitBytes"/>.</summary>
    public static KeptDraws? For(CorrectionSpec correction, int draws, int cells)
    {
        if (correction.Method is not (CorrectionMethod.MaxStatistic or CorrectionMethod.NetworkBased)) return null;
        long bytes = (long)draws * cells * sizeof(double);
        return bytes <= LimitBytes && bytes <= (long)Array.MaxLength * sizeof(double) ? new KeptDraws(draws, cells) : null;
    }

    /// <summary>Number of draws the store holds.</summary>
    public int Draws => _cells == 0 ? 0 : _values.Length / _cells;

    /// <inheritdoc/>
    public void Observe(int draw, ReadOnlySpan<double> values) => values.CopyTo(_values.AsSpan(draw * _cells, _cells));

    /// <summary>Hands every kept draw, in draw order, to <paramref name="observer"/>.</summary>
    public void Replay(IDrawObserver observer)
    {
        for (int d = 0; d < Draws; d++) observer.Observe(d, _values.AsSpan(d * _cells, _cells));
    }
}
