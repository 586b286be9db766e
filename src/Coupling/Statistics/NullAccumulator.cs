namespace Coupling.Statistics;

/// <summary>
/// Running summaries of surrogate values for many (measure, pair) cells at once: Welford's mean and sum of squared
/// deviations, and the counts of draws strictly below and strictly above the observed value, from which
/// <see cref="PermutationP"/> forms the p-value of either tail and the rank-based z. Chunks are merged with the pairwise
/// formula of Chan, Golub and LeVeque; counts add.
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
        Below = new int[cells];
        Above = new int[cells];
    }

    public long Count { get; private set; }
    public double[] Mean { get; }
    public double[] SquaredDeviations { get; }
    /// <summary>Per cell: draws strictly below the observed value.</summary>
    public int[] Below { get; }

    /// <summary>Per cell: draws strictly above the observed value (a NaN draw is in neither count).</summary>
    public int[] Above { get; }

    public void Reset()
    {
        Count = 0;
        Array.Clear(Mean);
        Array.Clear(SquaredDeviations);
        Array.Clear(Below);
        Array.Clear(Above);
    }

    /// <summary>Adds one draw: its values, compared with the observed values of the same cells.</summary>
    public void Add(ReadOnlySpan<double> values, ReadOnlySpan<double> observed)
    {
        Count++;
        double count = Count;
        for (int i = 0; i < values.Length; i++)
        {
            double v = values[i];
            double delta = v - Mean[i];
            Mean[i] += delta / count;
            SquaredDeviations[i] += delta * (v - Mean[i]);
            if (v < observed[i]) Below[i]++;
            else if (v > observed[i]) Above[i]++;
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
            other.Below.CopyTo(Below, 0);
            other.Above.CopyTo(Above, 0);
            return;
        }
        double n = Count + other.Count, nA = Count, nB = other.Count;
        for (int i = 0; i < Mean.Length; i++)
        {
            double delta = other.Mean[i] - Mean[i];
            Mean[i] += delta * (nB / n);
            SquaredDeviations[i] += other.SquaredDeviations[i] + delta * delta * (nA * nB / n);
            Below[i] += other.Below[i];
            Above[i] += other.Above[i];
        }
        Count += other.Count;
    }

    /// <summary>
    /// The null summary of the cells <c>[slot·pairs, (slot+1)·pairs)</c> after <paramref name="draws"/> draws: mean,
    /// standard deviation (n − 1 denominator; NaN for one draw), exceedance count b, p and rank-based z of the test's
    /// <paramref name="tail"/> (<see cref="PermutationP"/>; p and z are NaN where the observed value is NaN).
    /// </summary>
    public NullSummary Summarise(int slot, int pairs, int draws, ReadOnlySpan<double> observed, Measures.TestTail tail)
    {
        var summary = new NullSummary(new double[pairs], new double[pairs], new int[pairs], new double[pairs], new double[pairs]);
        for (int p = 0; p < pairs; p++)
        {
            int i = slot * pairs + p;
            bool missing = double.IsNaN(observed[i]);
            summary.Mean[p] = Mean[i];
            summary.Sd[p] = draws > 1 ? Math.Sqrt(SquaredDeviations[i] / (draws - 1)) : double.NaN;
            summary.Exceedances[p] = PermutationP.Exceedances(tail, Below[i], Above[i], draws);
            summary.P[p] = missing ? double.NaN : PermutationP.Of(tail, Below[i], Above[i], draws);
            summary.Z[p] = missing ? double.NaN : PermutationP.RankZ(Below[i], Above[i], draws);
        }
        return summary;
    }
}

/// <summary>Per pair: null mean and standard deviation, exceedance count, p and z.</summary>
internal sealed record NullSummary(double[] Mean, double[] Sd, int[] Exceedances, double[] P, double[] Z);
