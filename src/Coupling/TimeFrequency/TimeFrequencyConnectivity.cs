using Coupling.Measures;
using Coupling.Plans;

namespace Coupling.TimeFrequency;

/// <summary>
/// The connectivity measures of chosen channel pairs at every cell of a <see cref="TimeFrequencyCells"/>, computed by
/// the all-pairs kernel (<see cref="PairwiseKernels"/>) on each cell's estimates, and their change from a baseline.
/// </summary>
/// <remarks>
/// In a cell every measure is the kernel's definition applied to the cell's observations and time points (docs/methods.md):
/// the across-observation value at each time point, averaged over the bin's time points; AEC and AEC-orth correlate
/// envelopes over the bin's time points and so need bins that hold several. Baseline change at frequency f:
/// value(f, b) - mean over the baseline bins b' of value(f, b'), the baseline bins being those whose centre lies in the
/// baseline span (a difference, not a ratio, because several measures are signed or near zero).
/// </remarks>
public static class TimeFrequencyConnectivity
{
    /// <summary>Computes the measures of <paramref name="pairs"/> (channel indices into the cells' channels, a &lt; b).</summary>
    /// <param name="cells">The condition's cells.</param>
    /// <param name="condition">Condition name, carried into the results.</param>
    /// <param name="pairs">The pairs, as channel indices.</param>
    /// <param name="measures">The measures.</param>
    /// <param name="baseline">Baseline span; null for none.</param>
    /// <returns>One result per pair x measure, pair-major.</returns>
    /// <exception cref="InputException">No bin centre lies inside the baseline span.</exception>
    public static IReadOnlyList<TimeFrequencyValues> Compute(TimeFrequencyCells cells, string condition,
        IReadOnlyList<(int A, int B)> pairs, IReadOnlyList<Measure> measures, TimeRange? baseline)
    {
        int channels = cells.Channels.Count, nF = cells.Frequencies.Count, nB = cells.Bins.Count;
        var values = new double[pairs.Count * measures.Count][];
        for (int i = 0; i < values.Length; i++) values[i] = new double[nF * nB];
        for (int cell = 0; cell < cells.CellCount; cell++)
        {
            var all = PairwiseKernels.ComputeObserved(cells.Cell(cell), measures);
            for (int p = 0; p < pairs.Count; p++)
            {
                int index = PairIndex.Of(pairs[p].A, pairs[p].B, channels);
                for (int m = 0; m < measures.Count; m++) values[p * measures.Count + m][cell] = all[m][index];
            }
        }
        var baselineBins = baseline is null ? null : BaselineBins(cells.Bins, baseline);
        var times = cells.Bins.Select(b => b.Centre).ToArray();
        var results = new List<TimeFrequencyValues>();
        for (int p = 0; p < pairs.Count; p++)
            for (int m = 0; m < measures.Count; m++)
            {
                var v = values[p * measures.Count + m];
                results.Add(new TimeFrequencyValues(condition, cells.Channels[pairs[p].A], cells.Channels[pairs[p].B],
                    MeasureCatalog.Key(measures[m]), cells.Frequencies, times, v,
                    baselineBins is null ? null : ChangeFromBaseline(v, nF, nB, baselineBins)));
            }
        return results;
    }

    /// <summary>The indices of the bins whose centre lies in [baseline.Start, baseline.End].</summary>
    /// <exception cref="InputException">None does.</exception>
    public static int[] BaselineBins(IReadOnlyList<TimeBin> bins, TimeRange baseline)
    {
        const double slack = 1e-9;
        var inside = Enumerable.Range(0, bins.Count)
            .Where(b => bins[b].Centre >= baseline.Start - slack && bins[b].Centre <= baseline.End + slack).ToArray();
        if (inside.Length == 0)
            throw new InputException($"no time bin has its centre in the baseline {baseline.Start:G6}..{baseline.End:G6} s.");
        return inside;
    }

    /// <summary>value(f, b) - mean over <paramref name="baselineBins"/> of value(f, ·), frequency-major.</summary>
    public static double[] ChangeFromBaseline(double[] values, int frequencies, int bins, IReadOnlyList<int> baselineBins)
    {
        var change = new double[values.Length];
        for (int f = 0; f < frequencies; f++)
        {
            double mean = baselineBins.Average(b => values[f * bins + b]);
            for (int b = 0; b < bins; b++) change[f * bins + b] = values[f * bins + b] - mean;
        }
        return change;
    }
}
