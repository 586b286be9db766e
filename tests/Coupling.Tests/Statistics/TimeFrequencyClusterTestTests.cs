using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Tests.Measures;
using Coupling.TimeFrequency;

namespace Coupling.Tests.Statistics;

/// <summary>
/// Cluster-based permutation over frequency x time (Maris and Oostenveld 2007, J Neurosci Methods 164:177-190):
/// clusters of supra-threshold cells, cluster mass, the largest |mass| per label permutation, p = (b + 1) / (M + 1)
/// (Phipson and Smyth 2010, Stat Appl Genet Mol Biol 9:39).
/// </summary>
public class TimeFrequencyClusterTestTests
{
    private static readonly double[] Frequencies = [6, 10, 14];

    /// <summary>
    /// Cells of two channels over 3 frequencies x <paramref name="bins"/> bins of 2 time points; channel 2 is independent
    /// of channel 1 except in <paramref name="coupled"/> cells, where it is channel 1 turned by 0.8 rad plus noise of
    /// the given amplitude.
    /// </summary>
    internal static TimeFrequencyCells Cells(int trials, int bins, Random random, Func<int, bool>? coupled = null, double noise = 1)
    {
        var binList = Enumerable.Range(0, bins).Select(b => new TimeBin(0.1 * b, 0.1 * b + 0.1)).ToArray();
        var sets = new NarrowbandSet[Frequencies.Length * bins];
        for (int cell = 0; cell < sets.Length; cell++)
        {
            bool couple = coupled?.Invoke(cell) ?? false;
            var first = new Complex[2 * trials];
            sets[cell] = TestSignals.Build(2, trials, 2, (t, c, n) =>
            {
                if (c == 0) return first[t * trials + n] = TestSignals.Gaussian(random);
                var own = TestSignals.Gaussian(random);
                return couple ? first[t * trials + n] * Complex.FromPolarCoordinates(1, 0.8) + noise * own : own;
            });
        }
        return new TimeFrequencyCells(Frequencies, binList, trials, 1, sets);
    }

    [Fact]
    public void Clusters_are_edge_connected_runs_of_one_sign_with_their_summed_z()
    {
        // A 3 x 4 map worked by hand: threshold 1. Cells (0,0),(0,1),(1,1) positive and connected: one cluster of mass
        // 2+3+1.5; (2,3) positive alone; (1,3) negative alone (touching (2,3) but of the other sign); (2,0) at exactly
        // the threshold is not above it.
        double[] z =
        [
            2.0, 3.0, 0.0, 0.5,
            0.2, 1.5, 0.0, -4.0,
            1.0, 0.0, 0.0, 2.5,
        ];
        var labels = new int[12];
        var found = TimeFrequencyClusterTest.FindClusters(z, 3, 4, 1.0, labels);
        Assert.Equal([(6.5, 3), (-4.0, 1), (2.5, 1)], found);
        Assert.Equal([1, 1, 0, 0, 0, 1, 0, 2, 0, 0, 0, 3], labels);
    }

    [Fact]
    public void Family_wise_error_rate_is_nominal_under_the_null_at_unequal_trial_counts()
    {
        // Both conditions from one distribution (no coupling anywhere), 8 against 24 trials, PLV (whose bias depends on
        // the trial count, so a test that ignored the counts would fail here). 200 null maps, each tested with M = 19
        // permutations: the smallest p is 1/20, and under exchangeability P(p <= 0.05) = 0.05 exactly up to ties.
        // Rejections must fall in the 99% binomial interval of Binomial(200, 0.05): [3, 19] (scipy.stats.binom.interval
        // 1.10.1).
        var random = new Random(20261202);
        int rejections = 0;
        for (int run = 0; run < 200; run++)
        {
            var a = Cells(8, 4, random);
            var b = Cells(24, 4, random);
            var result = TimeFrequencyClusterTest.Run(a, b, Measure.Plv, "a", "b", 19, (ulong)run, 0.05, maxThreads: 1);
            if (result.Clusters.Any(c => c.P <= 0.05)) rejections++;
        }
        Assert.InRange(rejections, 3, 19);
    }

    [Fact]
    public void A_planted_time_frequency_effect_is_found_where_it_was_planted()
    {
        // Coupling in condition A only, at 10 and 14 Hz in bins 2 and 3 (cells 7, 8, 12, 13 of the 3 x 5 map).
        var random = new Random(7);
        int[] planted = [7, 8, 12, 13];
        var a = Cells(20, 5, random, cell => planted.Contains(cell), noise: 1.0);
        var b = Cells(20, 5, random);
        var result = TimeFrequencyClusterTest.Run(a, b, Measure.Plv, "a", "b", 199, 11, 0.05);
        var best = result.Clusters[0];
        Assert.True(best.P <= 0.01, $"p = {best.P}");
        Assert.Equal(1, best.Sign);
        Assert.Equal(10, best.LowHz);
        Assert.Equal(14, best.HighHz);
        var members = Enumerable.Range(0, 15).Where(i => result.Labels[i] == best.Id).ToArray();
        Assert.Subset(planted.ToHashSet(), members.ToHashSet());
        Assert.All(result.Clusters.Skip(1), c => Assert.True(c.P > 0.05));
    }

    [Fact]
    public void The_same_seed_gives_the_same_bytes_whatever_the_threads()
    {
        var a = Cells(6, 3, new Random(1));
        var b = Cells(9, 3, new Random(2));
        static byte[] Bytes(ClusterTestResult r) => r.Difference.Concat(r.Z).Concat(r.Clusters.Select(c => c.P))
            .SelectMany(BitConverter.GetBytes).ToArray();
        var one = TimeFrequencyClusterTest.Run(a, b, Measure.Coherence, "a", "b", 60, 5, 0.05, maxThreads: 1);
        var all = TimeFrequencyClusterTest.Run(a, b, Measure.Coherence, "a", "b", 60, 5, 0.05);
        var other = TimeFrequencyClusterTest.Run(a, b, Measure.Coherence, "a", "b", 60, 6, 0.05);
        Assert.Equal(Bytes(one), Bytes(all));
        Assert.NotEqual(Bytes(one), Bytes(other));
    }

    [Fact]
    public void Observed_difference_is_the_value_in_A_minus_the_value_in_B()
    {
        var a = Cells(6, 2, new Random(3));
        var b = Cells(7, 2, new Random(4));
        var result = TimeFrequencyClusterTest.Run(a, b, Measure.Wpli, "a", "b", 10, 1, 0.05);
        for (int cell = 0; cell < a.CellCount; cell++)
        {
            double expected = PairwiseKernels.ComputeObserved(a.Cell(cell), [Measure.Wpli])[0][0]
                - PairwiseKernels.ComputeObserved(b.Cell(cell), [Measure.Wpli])[0][0];
            Assert.Equal(expected, result.Difference[cell], 1e-15);
        }
    }

    [Fact]
    public void Too_few_trials_for_the_draws_are_refused()
    {
        var a = Cells(2, 2, new Random(3));
        var b = Cells(2, 2, new Random(4));
        Assert.Throws<InputException>(() => TimeFrequencyClusterTest.Run(a, b, Measure.Plv, "a", "b", 10, 1, 0.05));
        Assert.Throws<InputException>(() => TimeFrequencyClusterTest.Run(Cells(5, 2, new Random(1)), Cells(5, 2, new Random(2)),
            Measure.Plv, "a", "b", 10, 1, 1.5));
    }
}
