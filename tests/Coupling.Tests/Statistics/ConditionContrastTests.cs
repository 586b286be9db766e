using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

/// <summary>
/// The condition-label permutation test (Maris and Oostenveld 2007, J Neurosci Methods 164:177; Nichols and Holmes
/// 2002, Hum Brain Mapp 15:1): pooled trials reassigned at random with the group sizes kept, p = (b+1)/(M+1)
/// (Phipson and Smyth 2010, Stat Appl Genet Mol Biol 9:39).
/// </summary>
public class ConditionContrastTests
{
    private static readonly Measure[] Every = MeasureCatalog.All.ToArray();

    private static byte[] Bytes(IReadOnlyList<ContrastResult> results) => results.SelectMany(r =>
        r.ValueA.Concat(r.ValueB).Concat(r.Difference).Concat(r.NullMean).Concat(r.NullSd).Concat(r.P).Concat(r.Z)
            .SelectMany(BitConverter.GetBytes).Concat(r.Exceedances.SelectMany(BitConverter.GetBytes))).ToArray();

    /// <summary>The trials <paramref name="indices"/> of <paramref name="set"/>, in that order, as a new set.</summary>
    private static NarrowbandSet Subset(NarrowbandSet set, IReadOnlyList<int> indices) =>
        TestSignals.Build(set.ChannelCount, indices.Count, set.TimeCount, (t, c, n) => set.Row(t, c)[indices[n]]);

    /// <summary>A set's trials split at random into two halves: two conditions that do not differ.</summary>
    private static (NarrowbandSet A, NarrowbandSet B) Halves(NarrowbandSet set, int seed)
    {
        var order = Enumerable.Range(0, set.TrialCount).ToArray();
        new Random(seed).Shuffle(order);
        int half = set.TrialCount / 2;
        return (Subset(set, order[..half]), Subset(set, order[half..]));
    }

    [Fact]
    public void The_same_seed_gives_the_same_bytes_and_another_seed_does_not()
    {
        // Randomness is an argument: a seed fixes every reassignment (common practice for reproducible permutation tests).
        var a = TestSignals.Random(4, 7, 6, seed: 3);
        var b = TestSignals.Random(4, 9, 6, seed: 4);
        var first = ConditionContrast.Run(a, b, Every, 50, seed: 42, "x");
        var again = ConditionContrast.Run(a, b, Every, 50, seed: 42, "x");
        var other = ConditionContrast.Run(a, b, Every, 50, seed: 43, "x");
        Assert.Equal(Bytes(first), Bytes(again));
        Assert.NotEqual(Bytes(first), Bytes(other));
    }

    [Fact]
    public void The_thread_count_does_not_change_a_single_bit()
    {
        // 300 draws make 38 chunks of 8, more than one wave of 32 chunks, so the merging order is exercised.
        var a = TestSignals.Random(5, 6, 5, seed: 9);
        var b = TestSignals.Random(5, 8, 5, seed: 10);
        var one = Bytes(ConditionContrast.Run(a, b, Every, 300, seed: 7, "x", maxThreads: 1));
        var two = Bytes(ConditionContrast.Run(a, b, Every, 300, seed: 7, "x", maxThreads: 2));
        var all = Bytes(ConditionContrast.Run(a, b, Every, 300, seed: 7, "x"));
        Assert.Equal(one, two);
        Assert.Equal(one, all);
    }

    [Fact]
    public void Observed_values_and_null_summaries_equal_a_direct_computation_from_the_splits()
    {
        // Slow reference: each draw's split made by hand from the documented permutation (first N_A pooled trials to
        // A), both groups computed with PairwiseKernels.ComputeObserved, and the textbook mean, sample standard
        // deviation and two-sided exceedance count taken over the stored differences.
        var a = TestSignals.Random(3, 6, 5, seed: 12);
        var b = TestSignals.Random(3, 5, 5, seed: 13);
        const int draws = 29;
        const ulong seed = 5;
        var results = ConditionContrast.Run(a, b, Every, draws, seed, "x");
        var pooled = TestSignals.Build(3, 11, 5, (t, c, n) => n < 6 ? a.Row(t, c)[n] : b.Row(t, c)[n - 6]);
        var perm = new int[11];
        var stored = new double[draws][][];
        for (int d = 0; d < draws; d++)
        {
            TrialShuffle.Generate(seed, d, perm);
            var va = PairwiseKernels.ComputeObserved(Subset(pooled, perm[..6]), Every);
            var vb = PairwiseKernels.ComputeObserved(Subset(pooled, perm[6..]), Every);
            stored[d] = va.Select((row, k) => row.Select((v, p) => v - vb[k][p]).ToArray()).ToArray();
        }
        var observedA = PairwiseKernels.ComputeObserved(a, Every);
        var observedB = PairwiseKernels.ComputeObserved(b, Every);
        for (int k = 0; k < Every.Length; k++)
            for (int p = 0; p < 3; p++)
            {
                // Rounding: the kernels agree with their definitions to about 1e-15 relative on unit-scale data; the
                // same subsets computed twice agree exactly, but the sums are formed in another order, so 1e-12.
                Assert.Equal(observedA[k][p], results[k].ValueA[p], 1e-12);
                Assert.Equal(observedB[k][p], results[k].ValueB[p], 1e-12);
                double delta = results[k].Difference[p];
                Assert.Equal(results[k].ValueA[p] - results[k].ValueB[p], delta);
                var v = stored.Select(s => s[k][p]).ToArray();
                double mean = v.Average();
                double sd = Math.Sqrt(v.Sum(x => (x - mean) * (x - mean)) / (draws - 1));
                // Two-sided against the null itself: twice the smaller one-sided p (Kulinskaya 2008, arXiv:0810.2124).
                int exceed = Math.Min(v.Count(x => x >= delta), v.Count(x => x <= delta));
                Assert.Equal(mean, results[k].NullMean[p], 1e-12);
                Assert.Equal(sd, results[k].NullSd[p], 1e-12);
                Assert.Equal(exceed, results[k].Exceedances[p]);
                Assert.Equal(Math.Min(1, 2 * (exceed + 1.0) / (draws + 1.0)), results[k].P[p], 1e-15);
            }
    }

    [Fact]
    public void A_pair_coupled_in_one_condition_only_gets_the_smallest_possible_p_for_every_measure()
    {
        // In A, channel 1 is channel 0 lagged by 0.7 rad plus a little noise (phase and envelope change from trial to
        // trial); in B the channels are independent. Any reassignment mixes coupled and independent trials in both
        // groups and shrinks |Δ|, so no draw reaches the observed one on its side: b = 0, and the two-sided p is twice
        // the one-sided 1/(M+1) (Phipson and Smyth 2010; Kulinskaya 2008, arXiv:0810.2124).
        const int trials = 12, times = 30, draws = 99;
        var random = new Random(61);
        var source = TestSignals.Random(1, trials, times, seed: 62);
        var lag = Complex.FromPolarCoordinates(1, 0.7);
        var a = TestSignals.Build(3, trials, times, (t, c, n) =>
        {
            var s = ReferenceMeasures.Z(source, t, 0, n);
            return c switch
            {
                0 => s,
                1 => lag * s + 0.05 * TestSignals.Gaussian(random),
                _ => TestSignals.Gaussian(random),
            };
        });
        var b = TestSignals.Random(3, trials, times, seed: 63);
        var results = ConditionContrast.Run(a, b, Every, draws, seed: 3, "x");
        int pair = PairIndex.Of(0, 1, 3);
        foreach (var r in results)
            Assert.True(r.P[pair] == 2.0 / (draws + 1), $"{MeasureCatalog.Key(r.Measure)}: p = {r.P[pair]}");
    }

    [Fact]
    public void Two_halves_of_the_same_data_give_uniform_p_and_rarely_any_difference_after_correction()
    {
        // Trials split at random into two halves are exchangeable, so the permutation p-value is uniform on
        // {1/(M+1), ..., 1} for a continuous statistic (Phipson and Smyth 2010). 100 data sets of 5 channels
        // (10 pairs), 16 trials split 8/8. (1) Kolmogorov-Smirnov distance of one pair's p at the grid j/(M+1) against
        // the uniform law, below the asymptotic 0.999 critical value 1.95/sqrt(n) (Kolmogorov distribution;
        // conservative for a discrete law). PLI takes few distinct values and ties count as exceedances, so for it
        // only validity is checked: P(p <= 0.05) <= 0.05 + 3 binomial standard deviations. (2) Every null hypothesis
        // is true, so the false discovery rate equals the chance of any rejection, which Benjamini-Hochberg keeps at
        // or below q for independent or positively dependent tests (Benjamini and Hochberg 1995, J R Stat Soc B
        // 57:289; Benjamini and Yekutieli 2001, Ann Stat 29:1165): the share of data sets with any corrected
        // p <= 0.05 must stay below 0.05 + 3 binomial standard deviations. M = 199 so that 1/(M+1) <= 0.05/10 and
        // a rejection is possible at all (the check could fail).
        const int sets = 100, draws = 199;
        const double q = 0.05;
        var p = new double[Every.Length][];
        var anyRejected = new int[Every.Length];
        for (int k = 0; k < Every.Length; k++) p[k] = new double[sets];
        for (int s = 0; s < sets; s++)
        {
            var (a, b) = Halves(TestSignals.Random(5, 16, 12, seed: 2000 + s), seed: s);
            var results = ConditionContrast.Run(a, b, Every, draws, seed: (ulong)s, "x");
            for (int k = 0; k < Every.Length; k++)
            {
                p[k][s] = results[k].P[0];
                if (FalseDiscoveryRate.BenjaminiHochberg(results[k].P).Any(v => v <= q)) anyRejected[k]++;
            }
        }
        double critical = 1.95 / Math.Sqrt(sets), bound = q + 3 * Math.Sqrt(q * (1 - q) / sets);
        for (int k = 0; k < Every.Length; k++)
        {
            string key = MeasureCatalog.Key(Every[k]);
            Assert.True(anyRejected[k] / (double)sets <= bound, $"{key}: {anyRejected[k]} of {sets} data sets with a difference after correction");
            if (Every[k] == Measure.Pli)
            {
                double small = p[k].Count(v => v <= 0.05) / (double)sets;
                Assert.True(small <= bound, $"pli: P(p <= 0.05) = {small}");
                continue;
            }
            double distance = 0;
            for (int j = 1; j <= draws + 1; j++)
            {
                double grid = j / (draws + 1.0);
                double empirical = p[k].Count(v => v <= grid + 1e-12) / (double)sets;
                distance = Math.Max(distance, Math.Abs(empirical - grid));
            }
            Assert.True(distance < critical, $"{key}: KS distance {distance:F3} >= {critical:F3}");
        }
    }

    [Fact]
    public void Too_few_distinct_splits_for_the_surrogates_asked_is_refused_naming_the_contrast()
    {
        // C(4, 2) = 6 ways to split 2 + 2 pooled trials into groups of 2 (binomial coefficient).
        var two = TestSignals.Random(2, 2, 3, seed: 1);
        var other = TestSignals.Random(2, 2, 3, seed: 2);
        var error = Assert.Throws<InputException>(() => ConditionContrast.Run(two, other, Every, 10, 1, "cue-vs-rest"));
        Assert.Equal("contrast 'cue-vs-rest' has 2 and 2 trials: at most 6 distinct splits of the pooled trials, but 10 surrogates were asked.", error.Message);
        Assert.Equal(6, ConditionContrast.Run(two, other, [Measure.Plv], 6, 1, "cue-vs-rest")[0].Draws);
        // C(30, 15) = 155117520 (binomial coefficient) is more than any plan may ask (1,000,000).
        ConditionContrast.CheckFeasible(15, 15, 1_000_000, "x");
        var one = TestSignals.Random(2, 1, 3, seed: 1);
        Assert.Contains("each condition needs at least 2", Assert.Throws<InputException>(() => ConditionContrast.Run(one, other, Every, 1, 1, "x")).Message);
        Assert.Throws<InputException>(() => ConditionContrast.Run(two, other, Every, 0, 1, "x"));
    }

    [Fact]
    public void Conditions_with_different_channels_are_refused()
    {
        var a = TestSignals.Random(2, 4, 3, seed: 1);
        var b = TestSignals.Random(3, 4, 3, seed: 2);
        Assert.Throws<ArgumentException>(() => ConditionContrast.Run(a, b, Every, 5, 1, "x"));
    }
}
