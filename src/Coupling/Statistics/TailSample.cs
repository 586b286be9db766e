namespace Coupling.Statistics;

/// <summary>
/// Keeps, per (measure, pair) cell, the largest values of the draws and the largest of their negatives (the lower tail),
/// for <see cref="ParetoTail"/>. Each kept set is a bounded min-heap; the kept multiset does not depend on the order in
/// which draws arrive, so results stay the same whatever the number of threads.
/// </summary>
internal sealed class TailSample : IDrawObserver
{
    private readonly int _cells, _kept;
    private readonly double[] _upper, _lower;
    private readonly int[] _countUpper, _countLower;
    private readonly Lock _gate = new();

    /// <param name="cells">Number of cells.</param>
    /// <param name="kept">Values kept per cell and tail.</param>
    public TailSample(int cells, int kept)
    {
        _cells = cells;
        _kept = kept;
        _upper = new double[(long)cells * kept];
        _lower = new double[(long)cells * kept];
        _countUpper = new int[cells];
        _countLower = new int[cells];
    }

    /// <summary>Values to keep per tail for <paramref name="draws"/> draws: the N_exc + 1 that <see cref="ParetoTail.UpperP"/>
    /// can use, min(250, M/20) + 1.</summary>
    public static int KeptFor(int draws) => Math.Min(ParetoTail.MaximumFitted, draws / ParetoTail.TailFraction) + 1;

    public void Observe(int draw, ReadOnlySpan<double> values)
    {
        lock (_gate)
        {
            for (int i = 0; i < _cells; i++)
            {
                double v = values[i];
                if (double.IsNaN(v)) continue;
                Push(_upper.AsSpan(i * _kept, _kept), ref _countUpper[i], v);
                Push(_lower.AsSpan(i * _kept, _kept), ref _countLower[i], -v);
            }
        }
    }

    /// <summary>
    /// The p-value of <paramref name="observed"/> in cell <paramref name="cell"/> from the kept tails: one-sided upper, or
    /// two-sided as min(1, 2·min(p_upper, p_lower)) with each tail's p from <see cref="ParetoTail.UpperP"/>. Source is
    /// <see cref="FamilyCorrection.PSourcePareto"/> when the deciding tail's p came from a fit, else counted.
    /// </summary>
    public (double P, string Source) PValue(int cell, double observed, bool twoSided, int draws)
    {
        var (pu, fu) = ParetoTail.UpperP(observed, Descending(_upper, _countUpper, cell), draws);
        if (!twoSided) return (pu, fu ? FamilyCorrection.PSourcePareto : FamilyCorrection.PSourceCounted);
        var (pl, fl) = ParetoTail.UpperP(-observed, Descending(_lower, _countLower, cell), draws);
        bool upperDecides = pu <= pl;
        double p = Math.Min(1, 2 * Math.Min(pu, pl));
        bool fitted = upperDecides ? fu : fl;
        return (p, fitted ? FamilyCorrection.PSourcePareto : FamilyCorrection.PSourceCounted);
    }

    private double[] Descending(double[] heaps, int[] counts, int cell)
    {
        var values = heaps.AsSpan(cell * _kept, counts[cell]).ToArray();
        Array.Sort(values);
        Array.Reverse(values);
        return values;
    }

    /// <summary>Adds <paramref name="v"/> to the min-heap <paramref name="heap"/> of <paramref name="count"/> values, keeping the largest.</summary>
    private static void Push(Span<double> heap, ref int count, double v)
    {
        if (count < heap.Length)
        {
            int i = count++;
            heap[i] = v;
            while (i > 0)
            {
                int parent = (i - 1) / 2;
                if (heap[parent] <= heap[i]) break;
                (heap[parent], heap[i]) = (heap[i], heap[parent]);
                i = parent;
            }
            return;
        }
        if (v <= heap[0]) return;
        heap[0] = v;
        int k = 0;
        while (true)
        {
            int l = 2 * k + 1, r = l + 1, s = k;
            if (l < count && heap[l] < heap[s]) s = l;
            if (r < count && heap[r] < heap[s]) s = r;
            if (s == k) break;
            (heap[s], heap[k]) = (heap[k], heap[s]);
            k = s;
        }
    }
}
