namespace Coupling.Statistics;

/// <summary>
/// Running summaries of surrogate values for many (measure, pair) cells at once: Welford's mean and sum of squared
/// deviations, and the exceedance count. Chunks are merged with the pairwise formula of Chan, Golub and LeVeque.
/// </summary>
/// <remarks>
/// Welford (1962), Technometrics 4:419-420; Chan, Golub, LeVeque (1983), "Algorithms for computing the sample
/// variance", Am Stat 37:242-247.
/// </remarks>
internal sealed class NullAccumulator
{
    public NullAccumulator(int cells)
    {
        Mean = new double[cells];
        SquaredDeviations = new double[cells];
        Exceedances = new int[cells];
    }

    public long Count { get; private set; }
    public double[] Mean { get; }
    public double[] SquaredDeviations { get; }
    public int[] Exceedances { get; }

    public void Reset()
    {
        Count = 0;
        Array.Clear(Mean);
        Array.Clear(SquaredDeviations);
        Array.Clear(Exceedances);
    }

    /// <summary>Adds one draw; a cell exceeds when its statistic is at or above the observed statistic.</summary>
    public void Add(ReadOnlySpan<double> values, ReadOnlySpan<double> observedStatistic, ReadOnlySpan<bool> twoSided)
    {
        Count++;
        double count = Count;
        for (int i = 0; i < values.Length; i++)
        {
            double v = values[i];
            double delta = v - Mean[i];
            Mean[i] += delta / count;
            SquaredDeviations[i] += delta * (v - Mean[i]);
            double statistic = twoSided[i] ? Math.Abs(v) : v;
            if (statistic >= observedStatistic[i]) Exceedances[i]++;
        }
    }

    /// <summary>Folds <paramref name="other"/> into this one.</summary>
    public void Merge(NullAccumulator other)
    {
        if (other.Count == 0) return;
        if (Count == 0)
        {
            Count = other.Count;
            other.Mean.CopyTo(Mean, 0);
            other.SquaredDeviations.CopyTo(SquaredDeviations, 0);
            other.Exceedances.CopyTo(Exceedances, 0);
            return;
        }
        double n = Count + other.Count, nA = Count, nB = other.Count;
        for (int i = 0; i < Mean.Length; i++)
        {
            double delta = other.Mean[i] - Mean[i];
            Mean[i] += delta * (nB / n);
            SquaredDeviations[i] += other.SquaredDeviations[i] + delta * delta * (nA * nB / n);
            Exceedances[i] += other.Exceedances[i];
        }
        Count += other.Count;
    }

    /// <summary>
    /// The null summary of the cells <c>[slot·pairs, (slot+1)·pairs)</c> after <paramref name="draws"/> draws: mean,
    /// standard deviation (n − 1 denominator; NaN for one draw), exceedance count b, p = (b+1)/(M+1) (Phipson &amp; Smyth
    /// 2010; NaN where the observed statistic is NaN) and z = (observed − mean)/sd (NaN where sd is not positive).
    /// </summary>
    public NullSummary Summarise(int slot, int pairs, int draws, ReadOnlySpan<double> observed, ReadOnlySpan<double> observedStatistic)
    {
        var summary = new NullSummary(new double[pairs], new double[pairs], new int[pairs], new double[pairs], new double[pairs]);
        for (int p = 0; p < pairs; p++)
        {
            int i = slot * pairs + p;
            summary.Mean[p] = Mean[i];
            summary.Sd[p] = draws > 1 ? Math.Sqrt(SquaredDeviations[i] / (draws - 1)) : double.NaN;
            summary.Exceedances[p] = Exceedances[i];
            summary.P[p] = double.IsNaN(observedStatistic[i]) ? double.NaN : (Exceedances[i] + 1.0) / (draws + 1.0);
            summary.Z[p] = summary.Sd[p] > 0 ? (observed[i] - summary.Mean[p]) / summary.Sd[p] : double.NaN;
        }
        return summary;
    }
}

/// <summary>Per pair: null mean and standard deviation, exceedance count, p and z.</summary>
internal sealed record NullSummary(double[] Mean, double[] Sd, int[] Exceedances, double[] P, double[] Z);
