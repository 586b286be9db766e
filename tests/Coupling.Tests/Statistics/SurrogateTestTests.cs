using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

public class SurrogateTestTests
{
    private static readonly Measure[] Every = MeasureCatalog.All.ToArray();

    private static byte[] Bytes(IReadOnlyList<SurrogateResult> results) => results.SelectMany(r =>
        r.Observed.Concat(r.NullMean).Concat(r.NullSd).Concat(r.P).Concat(r.Z).SelectMany(BitConverter.GetBytes)
            .Concat(r.Exceedances.SelectMany(BitConverter.GetBytes))).ToArray();

    [Fact]
    public void The_same_seed_gives_the_same_bytes_and_another_seed_does_not()
    {
        // Randomness is an argument: a seed fixes every trial order (common practice for reproducible surrogates).
        var set = TestSignals.Random(4, 12, 6, seed: 3);
        var first = SurrogateTest.Run(set, Every, 50, seed: 42, "x");
        var again = SurrogateTest.Run(set, Every, 50, seed: 42, "x");
        var other = SurrogateTest.Run(set, Every, 50, seed: 43, "x");
        Assert.Equal(Bytes(first), Bytes(again));
        Assert.NotEqual(Bytes(first), Bytes(other));
    }

    [Fact]
    public void The_thread_count_does_not_change_a_single_bit()
    {
        // 300 draws make 38 chunks, more than one wave of chunks, so merging order is exercised.
        var set = TestSignals.Random(4, 12, 6, seed: 9);
        var one = Bytes(SurrogateTest.Run(set, Every, 300, seed: 7, "x", maxThreads: 1));
        var two = Bytes(SurrogateTest.Run(set, Every, 300, seed: 7, "x", maxThreads: 2));
        var all = Bytes(SurrogateTest.Run(set, Every, 300, seed: 7, "x"));
        Assert.Equal(one, two);
        Assert.Equal(one, all);
    }

    [Fact]
    public void The_thread_count_does_not_change_a_single_bit_over_several_kernel_tiles()
    {
        // 19 channels span three column tiles and a partial one, 13 trials and 9 time points fill no vector evenly;
        // workers share the per-set tables and each has its own sums, so any sharing mistake would show here.
        var set = TestSignals.Random(19, 13, 9, seed: 31);
        var one = Bytes(SurrogateTest.Run(set, Every, 70, seed: 11, "x", maxThreads: 1));
        var two = Bytes(SurrogateTest.Run(set, Every, 70, seed: 11, "x", maxThreads: 2));
        var four = Bytes(SurrogateTest.Run(set, Every, 70, seed: 11, "x", maxThreads: 4));
        Assert.Equal(one, two);
        Assert.Equal(one, four);
    }

    [Fact]
    public void Null_summaries_equal_those_of_the_draws_computed_one_by_one()
    {
        // The streaming mean, sample standard deviation and exceedance count against a direct computation from the
        // stored draws (textbook definitions); Phipson & Smyth (2010) p = (b+1)/(M+1).
        var set = TestSignals.Random(3, 9, 5, seed: 12);
        const int draws = 37;
        const ulong seed = 5;
        var results = SurrogateTest.Run(set, Every, draws, seed, "x");
        var workspace = new PairwiseWorkspace(set, Every);
        var perm = new int[9];
        var stored = new double[draws][];
        for (int d = 0; d < draws; d++)
        {
            TrialShuffle.Generate(seed, d, perm);
            stored[d] = new double[workspace.OutputLength];
            PairwiseKernels.Compute(workspace, perm, stored[d]);
        }
        int pairs = workspace.PairCount;
        for (int k = 0; k < Every.Length; k++)
            for (int p = 0; p < pairs; p++)
            {
                var v = stored.Select(s => s[k * pairs + p]).ToArray();
                double mean = v.Average();
                double sd = Math.Sqrt(v.Sum(x => (x - mean) * (x - mean)) / (draws - 1));
                // Tails: upper b = draws at or above the observed value; two-sided (signed measures) twice the smaller
                // one-sided p (Kulinskaya 2008, arXiv:0810.2124). z: the normal deviate of the observed value's
                // mid-rank, Φ⁻¹((below + ties/2 + 1/2)/(M+1)) (Hazen's plotting position; MathNet.Numerics Normal.InvCDF).
                double observed = results[k].Observed[p];
                int upper = v.Count(x => x >= observed), lower = v.Count(x => x <= observed);
                int below = v.Count(x => x < observed), ties = v.Count(x => x == observed);
                bool two = MeasureCatalog.TailOf(Every[k]) == TestTail.TwoSided;
                int b = two ? Math.Min(upper, lower) : upper;
                double expectedP = two ? Math.Min(1, 2 * (b + 1.0) / (draws + 1.0)) : (b + 1.0) / (draws + 1.0);
                Assert.Equal(mean, results[k].NullMean[p], 1e-13);
                Assert.Equal(sd, results[k].NullSd[p], 1e-13);
                Assert.Equal(b, results[k].Exceedances[p]);
                Assert.Equal(expectedP, results[k].P[p], 1e-15);
                double z = MathNet.Numerics.Distributions.Normal.InvCDF(0, 1, (below + 0.5 * ties + 0.5) / (draws + 1.0));
                Assert.Equal(z, results[k].Z[p], 1e-12);
            }
    }

    [Fact]
    public void P_values_lie_between_one_over_m_plus_one_and_one()
    {
        // Phipson & Smyth (2010), Stat Appl Genet Mol Biol 9:39: p = (b+1)/(M+1) is never 0.
        var set = TestSignals.Random(5, 10, 4, seed: 2);
        foreach (var result in SurrogateTest.Run(set, Every, 99, seed: 1, "x"))
            Assert.All(result.P, p => Assert.InRange(p, 1 / 100.0, 1));
    }

    [Fact]
    public void A_truly_coupled_pair_gets_the_smallest_possible_p_for_every_measure()
    {
        // Channel 1 is channel 0 with a constant lag of 0.7 rad plus a little noise; the phase and envelope of
        // channel 0 change from trial to trial, so any shuffle of the trials destroys the coupling and no draw reaches
        // the observed value: b = 0, p = 1/(M+1) (Phipson & Smyth 2010). Channel 2 is independent.
        const int trials = 20, times = 30, draws = 99;
        var random = new Random(61);
        var source = TestSignals.Random(1, trials, times, seed: 62);
        var lag = Complex.FromPolarCoordinates(1, 0.7);
        var set = TestSignals.Build(3, trials, times, (t, c, n) =>
        {
            var s = ReferenceMeasures.Z(source, t, 0, n);
            return c switch
            {
                0 => s,
                1 => lag * s + 0.05 * TestSignals.Gaussian(random),
                _ => TestSignals.Gaussian(random),
            };
        });
        var results = SurrogateTest.Run(set, Every, draws, seed: 3, "x");
        int pair = PairIndex.Of(0, 1, 3);
        // The two-sided (signed) measures get twice that. z is the rank-based deviate of the most extreme rank,
        // ±Φ⁻¹(1 − 1/(2(M+1))) = ±2.5758 for M = 99 (standard normal quantile of 0.995, statistical tables).
        foreach (var result in results)
        {
            bool two = MeasureCatalog.TailOf(result.Measure) == TestTail.TwoSided;
            double smallest = (two ? 2.0 : 1.0) / (draws + 1);
            Assert.True(result.P[pair] == smallest, $"{MeasureCatalog.Key(result.Measure)}: p = {result.P[pair]}");
            // z is signed: imaginary coherency of a lag of b behind a is negative (observed below every draw).
            Assert.Equal(2.5758, Math.Abs(result.Z[pair]), 4);
        }
        Assert.True(results[Array.IndexOf(Every, Measure.ImagCoherency)].Z[pair] < 0);
    }

    [Fact]
    public void Independent_channels_give_uniform_p_values()
    {
        // Under independence the trial order of one channel is exchangeable, so the randomised permutation p-value is
        // uniform on {1/(M+1), ..., 1} for a continuous statistic (Phipson & Smyth 2010). 200 independent data sets
        // (each its own seed); Kolmogorov-Smirnov distance at the grid points j/(M+1) against the uniform law, with
        // the asymptotic 0.999 critical value 1.95/sqrt(n) (Kolmogorov distribution; conservative for a discrete law).
        // PLI takes few distinct values, so ties (counted as exceedances) make it conservative rather than uniform:
        // for it only validity is checked, P(p <= 0.05) <= 0.05 + 3 binomial standard deviations.
        const int sets = 200, draws = 99;
        var p = new double[Every.Length][];
        for (int k = 0; k < Every.Length; k++) p[k] = new double[sets];
        for (int s = 0; s < sets; s++)
        {
            var set = TestSignals.Random(2, 16, 16, seed: 1000 + s);
            var results = SurrogateTest.Run(set, Every, draws, seed: (ulong)s, "x", maxThreads: 1);
            for (int k = 0; k < Every.Length; k++) p[k][s] = results[k].P[0];
        }
        double critical = 1.95 / Math.Sqrt(sets);
        for (int k = 0; k < Every.Length; k++)
        {
            if (Every[k] == Measure.Pli)
            {
                double small = p[k].Count(v => v <= 0.05) / (double)sets;
                Assert.True(small <= 0.05 + 3 * Math.Sqrt(0.05 * 0.95 / sets), $"pli: P(p <= 0.05) = {small}");
                continue;
            }
            double distance = 0;
            for (int j = 1; j <= draws + 1; j++)
            {
                double grid = j / (draws + 1.0);
                double empirical = p[k].Count(v => v <= grid + 1e-12) / (double)sets;
                distance = Math.Max(distance, Math.Abs(empirical - grid));
            }
            Assert.True(distance < critical, $"{MeasureCatalog.Key(Every[k])}: KS distance {distance:F3} >= {critical:F3}");
        }
    }

    [Fact]
    public void A_stimulus_locked_component_shared_by_both_channels_is_not_significant_against_trial_shuffling()
    {
        // Both channels contain the same evoked component, with the same phase in every trial, plus independent
        // noise. Phase locking between them is high, but it is the same in every trial, so reordering the trials keeps
        // it: the surrogates reach the observed values and the test finds nothing. That is what the trial shuffle is
        // for: only coupling beyond the shared stimulus-locked response counts. Checked over 20 independent data
        // sets: the number with p <= 0.05 is at most 5 (P(Binomial(20, 0.05) >= 6) ≈ 3e-4 when the test is valid).
        const int sets = 20, trials = 30, times = 20, draws = 99;
        Measure[] measures = [Measure.Plv, Measure.Ppc, Measure.Coherence, Measure.Wpli, Measure.ImagCoherency];
        var significant = new int[measures.Length];
        for (int s = 0; s < sets; s++)
        {
            var random = new Random(500 + s);
            var evoked = Enumerable.Range(0, times).Select(t => Complex.FromPolarCoordinates(1.5, 0.6 * t)).ToArray();
            var lag = Complex.FromPolarCoordinates(1, 0.9);
            NarrowbandSet set = TestSignals.Build(2, trials, times, (t, c, n) =>
                (c == 0 ? evoked[t] : lag * evoked[t]) + 0.7 * TestSignals.Gaussian(random));
            var results = SurrogateTest.Run(set, measures, draws, seed: (ulong)(77 + s), "x");
            Assert.True(results[0].Observed[0] > 0.8, $"observed PLV {results[0].Observed[0]}");
            Assert.True(results[0].NullMean[0] > 0.8, $"surrogate mean PLV {results[0].NullMean[0]}");
            for (int k = 0; k < measures.Length; k++)
                if (results[k].P[0] <= 0.05) significant[k]++;
        }
        for (int k = 0; k < measures.Length; k++)
            Assert.True(significant[k] <= 5, $"{MeasureCatalog.Key(measures[k])}: {significant[k]} of {sets} significant");
    }

    [Fact]
    public void Too_few_trials_for_the_surrogates_asked_is_refused_with_both_numbers()
    {
        var four = TestSignals.Random(2, 4, 3, seed: 1);
        var error = Assert.Throws<InputException>(() => SurrogateTest.Run(four, Every, 1000, 1, "rest"));
        Assert.Equal("condition 'rest' has 4 trials: at most 24 distinct trial orders, but 1000 surrogates were asked.", error.Message);
        Assert.Equal(24, SurrogateTest.Run(four, [Measure.Plv], 24, 1, "rest")[0].Draws);
        var one = TestSignals.Random(2, 1, 3, seed: 1);
        Assert.Contains("has 1 trial", Assert.Throws<InputException>(() => SurrogateTest.Run(one, Every, 10, 1, "rest")).Message);
        Assert.Throws<InputException>(() => SurrogateTest.Run(four, Every, 0, 1, "rest"));
    }

    [Fact]
    public void Progress_counts_every_draw()
    {
        var set = TestSignals.Random(3, 8, 4, seed: 1);
        var progress = new MaxProgress();
        SurrogateTest.Run(set, [Measure.Plv], 45, 1, "x", progress: progress);
        Assert.Equal(45, progress.Max);
    }

    private sealed class MaxProgress : IProgress<int>
    {
        private int _max;
        public int Max => Volatile.Read(ref _max);
        public void Report(int value)
        {
            int current;
            while (value > (current = Volatile.Read(ref _max)) && Interlocked.CompareExchange(ref _max, value, current) != current) { }
        }
    }
}
