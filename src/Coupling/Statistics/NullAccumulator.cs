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
}
