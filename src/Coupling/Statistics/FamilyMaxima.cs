namespace Coupling.Statistics;

/// <summary>
/// Per draw and per family (one measure's pairs), the maximum of the studentised statistic over the family's pairs and,
/// when a threshold is given, the largest extent of the supra-threshold components; each draw writes at its own index,
/// so the result does not depend on the order in which draws arrive.
/// </summary>
internal sealed class FamilyMaxima : IDrawObserver
{
    private readonly StudentisedStatistic _statistic;
    private readonly int _families, _pairs, _draws, _channels;
    private readonly double? _threshold;

    public FamilyMaxima(StudentisedStatistic statistic, int families, int channels, int draws, double? threshold)
    {
        _statistic = statistic;
        _families = families;
        _channels = channels;
        _pairs = Measures.PairIndex.Count(channels);
        _draws = draws;
        _threshold = threshold;
        Maxima = new double[families * draws];
        LargestExtent = threshold is null ? [] : new int[families * draws];
    }

    /// <summary>T_max of family k in draw d at [k·M + d]; NaN where every pair was undefined.</summary>
    public double[] Maxima { get; }

    /// <summary>Largest supra-threshold extent of family k in draw d at [k·M + d]; empty without a threshold.</summary>
    public int[] LargestExtent { get; }

    public void Observe(int draw, ReadOnlySpan<double> values)
    {
        bool[]? edges = _threshold is null ? null : new bool[_pairs];
        for (int k = 0; k < _families; k++)
        {
            double max = double.NaN;
            for (int p = 0; p < _pairs; p++)
            {
                int cell = k * _pairs + p;
                double t = _statistic.Of(cell, values[cell]);
                if (t > max || (double.IsNaN(max) && !double.IsNaN(t))) max = t;
                if (edges is not null) edges[p] = t > _threshold!.Value;
            }
            Maxima[k * _draws + draw] = max;
            if (edges is not null) LargestExtent[k * _draws + draw] = NetworkComponents.LargestExtent(_channels, edges);
        }
    }
}
