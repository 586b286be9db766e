using Coupling.Measures;
using Coupling.Spectral;

namespace Coupling.Statistics;

/// <summary>
/// Runs a surrogate test or a condition contrast and corrects each measure's p-values across the family of all channel
/// pairs of that table with the method of a <see cref="CorrectionSpec"/>.
/// </summary>
/// <remarks>
/// <para>Benjamini-Hochberg, Benjamini-Yekutieli and no correction use the per-pair p-values only. The maximum statistic
/// and the network-based statistic need, per draw, the statistic of every pair on a common scale
/// (<see cref="StudentisedStatistic"/>), whose centre and scale are known only once all draws are summarised: the draws are
/// therefore kept while drawing (<see cref="KeptDraws"/>, up to <see cref="KeptDraws.LimitBytes"/>) and read back, or,
/// when they would take more memory than that, made a second time with the same seed and so the same trial orders (or
/// label splits) and the same values; either way each draw's maximum and largest supra-threshold component are recorded
/// (<see cref="MaxStatistic"/>, <see cref="NetworkBasedStatistic"/>), and the result is the same. The second pass doubles
/// the time of the resampling stage and keeps memory at one value per draw and family.</para>
/// <para>With the Pareto tail option, the upper tails of every pair's draws are kept while drawing
/// (<see cref="TailSample"/>) and p-values resting on fewer than <see cref="ParetoTail.MinimumExceedances"/> exceedances
/// are refined by <see cref="ParetoTail"/>.</para>
/// </remarks>
public static class FamilyCorrection
{
    /// <summary>The trial-shuffle surrogate test of one condition's set, corrected per measure across its pairs.</summary>
    /// <exception cref="InputException">As <see cref="SurrogateTest.Run"/>.</exception>
    public static IReadOnlyList<(SurrogateResult Test, FamilyOutcome Outcome)> TestCondition(NarrowbandSet set,
        IReadOnlyList<Measure> measures, int draws, ulong seed, string condition, CorrectionSpec correction, double level,
        int? maxThreads = null, IProgress<int>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(measures);
        ArgumentNullException.ThrowIfNull(correction);
        int pairs = PairIndex.Count(set.ChannelCount), cells = measures.Count * pairs;
        var twoSided = new bool[cells];
        for (int k = 0; k < measures.Count; k++)
            twoSided.AsSpan(k * pairs, pairs).Fill(MeasureCatalog.TailOf(measures[k]) == TestTail.TwoSided);
        var tail = correction.ParetoTail ? new TailSample(cells, TailSample.KeptFor(draws)) : null;
        var kept = tail is null ? KeptDraws.For(correction, draws, cells) : null;
        var tested = SurrogateTest.RunObserved(set, measures, draws, seed, condition, maxThreads, progress, cancellationToken, (IDrawObserver?)tail ?? kept);
        var maxima = Replay(correction, tested.Select(t => (t.Observed, t.NullMean, t.NullSd)).ToArray(), twoSided, draws,
            set.ChannelCount, kept, observer => SurrogateTest.RunObserved(set, measures, draws, seed, condition, maxThreads, progress, cancellationToken, observer));
        return tested.Select((t, k) => (t, Finish(correction, level, k, pairs, set.ChannelCount, draws, t.Observed, t.P,
            twoSided[k * pairs], tail, maxima))).ToArray();
    }

    /// <summary>The condition-label permutation test of a contrast, corrected per measure across its pairs (two-sided).</summary>
    /// <exception cref="InputException">As <see cref="ConditionContrast"/>.</exception>
    public static IReadOnlyList<(ContrastResult Test, FamilyOutcome Outcome)> TestContrast(NarrowbandSet a, NarrowbandSet b,
        IReadOnlyList<Measure> measures, int draws, ulong seed, string contrast, CorrectionSpec correction, double level,
        int? maxThreads = null, IProgress<int>? progress = null, CancellationToken cancellationToken = default,
        bool subtractEvoked = false)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(measures);
        ArgumentNullException.ThrowIfNull(correction);
        int pairs = PairIndex.Count(a.ChannelCount), cells = measures.Count * pairs;
        var twoSided = Enumerable.Repeat(true, cells).ToArray();
        var tail = correction.ParetoTail ? new TailSample(cells, TailSample.KeptFor(draws)) : null;
        var kept = tail is null ? KeptDraws.For(correction, draws, cells) : null;
        var tested = ConditionContrast.RunObserved(a, b, measures, draws, seed, contrast, maxThreads, progress, cancellationToken,
            (IDrawObserver?)tail ?? kept, subtractEvoked);
        var maxima = Replay(correction, tested.Select(t => (t.Difference, t.NullMean, t.NullSd)).ToArray(), twoSided, draws,
            a.ChannelCount, kept, observer => ConditionContrast.RunObserved(a, b, measures, draws, seed, contrast, maxThreads, progress, cancellationToken, observer, subtractEvoked));
        return tested.Select((t, k) => (t, Finish(correction, level, k, pairs, a.ChannelCount, draws, t.Difference, t.P,
            true, tail, maxima))).ToArray();
    }

    /// <summary>Whether <paramref name="correction"/> needs each draw's values (maximum statistic, network-based statistic, Pareto tail),
    /// not only the per-pair p-values.</summary>
    public static bool NeedsDraws(CorrectionSpec correction)
    {
        ArgumentNullException.ThrowIfNull(correction);
        return correction.ParetoTail || correction.Method is CorrectionMethod.MaxStatistic or CorrectionMethod.NetworkBased;
    }

    /// <summary>
    /// The outcome of a correction that needs only the per-pair p-values (Benjamini-Hochberg, Benjamini-Yekutieli, none,
    /// with counted p): the same as <see cref="TestCondition"/> or <see cref="TestContrast"/> would give for those p.
    /// </summary>
    /// <exception cref="ArgumentException">The correction needs the draws (<see cref="NeedsDraws"/>).</exception>
    public static FamilyOutcome FromPValues(CorrectionSpec correction, double level, double[] p)
    {
        ArgumentNullException.ThrowIfNull(p);
        if (NeedsDraws(correction))
            throw new ArgumentException($"Correction '{CorrectionSpec.Key(correction.Method)}' needs the surrogate draws, not only p-values.", nameof(correction));
        return Finish(correction, level, 0, p.Length, 0, 0, p, p, false, null, null);
    }

    private static (FamilyMaxima Maxima, StudentisedStatistic Statistic)? Replay(CorrectionSpec correction,
        (double[] Observed, double[] Mean, double[] Sd)[] families, bool[] twoSided, int draws, int channels,
        KeptDraws? kept, Action<IDrawObserver> run)
    {
        if (correction.Method is not (CorrectionMethod.MaxStatistic or CorrectionMethod.NetworkBased)) return null;
        var statistic = new StudentisedStatistic(families.SelectMany(f => f.Observed).ToArray(),
            families.SelectMany(f => f.Mean).ToArray(), families.SelectMany(f => f.Sd).ToArray(), draws, twoSided);
        var maxima = new FamilyMaxima(statistic, families.Length, channels, draws,
            correction.Method == CorrectionMethod.NetworkBased ? correction.Threshold ?? CorrectionSpec.DefaultThreshold : null);
        if (kept is not null) kept.Replay(maxima);
        else run(maxima);
        return (maxima, statistic);
    }

    private static FamilyOutcome Finish(CorrectionSpec correction, double level, int family, int pairs, int channels, int draws,
        double[] observed, double[] countedP, bool twoSided, TailSample? tail,
        (FamilyMaxima Maxima, StudentisedStatistic Statistic)? replay)
    {
        var p = countedP.ToArray();
        var source = Enumerable.Repeat(PSourceCounted, pairs).ToArray();
        if (tail is not null)
            for (int k = 0; k < pairs; k++)
            {
                if (double.IsNaN(p[k])) continue;
                var refined = tail.PValue(family * pairs + k, observed[k], twoSided, draws);
                if (refined.Source == PSourcePareto) { p[k] = refined.P; source[k] = PSourcePareto; }
            }
        double[] corrected;
        int[] component = [], extent = [];
        double[] componentP = [];
        bool[] significant;
        switch (correction.Method)
        {
            case CorrectionMethod.BenjaminiHochberg:
                corrected = FalseDiscoveryRate.BenjaminiHochbergOfDefined(p);
                break;
            case CorrectionMethod.BenjaminiYekutieli:
                corrected = FalseDiscoveryRate.BenjaminiYekutieliOfDefined(p);
                break;
            case CorrectionMethod.None:
                corrected = p.ToArray();
                break;
            case CorrectionMethod.MaxStatistic:
            {
                var (maxima, statistic) = replay!.Value;
                var t = ObservedStatistic(statistic, family, pairs, observed);
                corrected = MaxStatistic.Adjust(t, maxima.Maxima.AsSpan(family * draws, draws));
                break;
            }
            case CorrectionMethod.NetworkBased:
            {
                var (maxima, statistic) = replay!.Value;
                var t = ObservedStatistic(statistic, family, pairs, observed);
                (component, extent, componentP) = NetworkBasedStatistic.Test(channels, t,
                    correction.Threshold ?? CorrectionSpec.DefaultThreshold, maxima.LargestExtent.AsSpan(family * draws, draws));
                corrected = new double[pairs];
                for (int k = 0; k < pairs; k++)
                    corrected[k] = double.IsNaN(t[k]) ? double.NaN : component[k] >= 0 ? componentP[component[k]] : 1;
                break;
            }
            default:
                throw new ArgumentOutOfRangeException(nameof(correction), correction.Method, null);
        }
        significant = corrected.Select(q => q <= level).ToArray();
        return new FamilyOutcome(correction.Method, level, p, source, corrected, significant, component, extent, componentP);
    }

    private static double[] ObservedStatistic(StudentisedStatistic statistic, int family, int pairs, double[] observed)
    {
        var t = new double[pairs];
        for (int k = 0; k < pairs; k++) t[k] = statistic.Of(family * pairs + k, observed[k]);
        return t;
    }

    /// <summary>The <see cref="FamilyOutcome.PSource"/> of a p counted from exceedances, (b+1)/(M+1).</summary>
    public const string PSourceCounted = "counted";

    /// <summary>The <see cref="FamilyOutcome.PSource"/> of a p from the generalised Pareto tail approximation.</summary>
    public const string PSourcePareto = "pareto-tail";
}
