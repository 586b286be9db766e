using System.Numerics;
using Coupling.Measures;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

public class MaxStatisticTests
{
    [Fact]
    public void Adjusted_p_counts_the_draws_whose_maximum_reaches_the_statistic()
    {
        // Nichols & Holmes (2002), Hum Brain Mapp 15:1, single-step maximum statistic, with the observed arrangement
        // counted (Phipson & Smyth 2010): p_i = (1 + #{d: max_d >= T_i})/(M + 1). Worked by hand for 4 draws.
        double[] maxima = [1.0, 3.0, 2.0, double.NaN];
        var p = MaxStatistic.Adjust([3.0, 0.5, 2.5, double.NaN, 4], maxima);
        Assert.Equal(2 / 5.0, p[0]);
        Assert.Equal(4 / 5.0, p[1]);
        Assert.Equal(2 / 5.0, p[2]);
        Assert.True(double.IsNaN(p[3]));
        Assert.Equal(1 / 5.0, p[4]);
    }

    /// <summary>Independent channels with a lagged response shared by every trial (the same in each), plus noise.</summary>
    private static Complex[] Data(int channels, int trials, int times, Random random, double evoked)
    {
        var data = new Complex[channels * trials * times];
        for (int t = 0; t < times; t++)
            for (int c = 0; c < channels; c++)
            {
                var shared = Complex.FromPolarCoordinates(evoked * (1 + 0.2 * c), 0.7 * t + 0.9 * c);
                for (int n = 0; n < trials; n++) data[(t * channels + c) * trials + n] = shared + TestSignals.Gaussian(random);
            }
        return data;
    }

    [Fact]
    public void Family_wise_error_of_the_surrogate_test_is_nominal_with_a_shared_lagged_response()
    {
        // Every null hypothesis is true (the channels' trial-by-trial fluctuations are independent; what they share is
        // a response identical in every trial, which shifts the trial-shuffle null of the signed measures away from 0).
        // The maximum-statistic correction must then reject anything in at most a share alpha of experiments, exactly
        // so (the test is exact under exchangeability, Nichols & Holmes 2002): the count of experiments with any
        // rejection must lie within the 99 % binomial acceptance region of Binomial(n, alpha). Two group sizes.
        const int experiments = 120, draws = 19;
        const double alpha = 0.1;
        Measure[] measures = [Measure.Plv, Measure.ImagCoherency, Measure.Aec, Measure.Coherence];
        var random = new Random(11);
        var (lo, hi) = BinomialInterval.Of(experiments, alpha);
        foreach (int trials in new[] { 9, 25 })
        {
            var any = new int[measures.Length];
            for (int e = 0; e < experiments; e++)
            {
                var set = TestSignals.Wrap(4, trials, 6, Data(4, trials, 6, random, evoked: 0.8));
                var tested = FamilyCorrection.TestCondition(set, measures, draws, (ulong)e, "x",
                    new CorrectionSpec(CorrectionMethod.MaxStatistic), alpha, maxThreads: 1);
                for (int k = 0; k < measures.Length; k++) if (tested[k].Outcome.Significant.Any(s => s)) any[k]++;
            }
            for (int k = 0; k < measures.Length; k++)
                Assert.True(any[k] >= lo && any[k] <= hi,
                    $"{MeasureCatalog.Key(measures[k])}, {trials} trials: {any[k]} of {experiments} with a rejection, expected {lo}..{hi}");
        }
    }

    [Fact]
    public void Family_wise_error_of_a_contrast_is_nominal_at_unequal_trial_counts()
    {
        // Two conditions from one distribution, 7 and 21 trials (the label split keeps the sizes, so the null is exact
        // even though PLV and coherence are biased by trial count). Count of experiments with any rejection within the
        // 99 % binomial acceptance region of Binomial(n, alpha) (exact binomial, see BinomialInterval).
        const int experiments = 120, draws = 19;
        const double alpha = 0.1;
        Measure[] measures = [Measure.Plv, Measure.ImagCoherency];
        var random = new Random(12);
        var (lo, hi) = BinomialInterval.Of(experiments, alpha);
        var any = new int[measures.Length];
        for (int e = 0; e < experiments; e++)
        {
            var a = TestSignals.Wrap(4, 7, 5, Data(4, 7, 5, random, evoked: 0));
            var b = TestSignals.Wrap(4, 21, 5, Data(4, 21, 5, random, evoked: 0));
            var tested = FamilyCorrection.TestContrast(a, b, measures, draws, (ulong)e, "x",
                new CorrectionSpec(CorrectionMethod.MaxStatistic), alpha, maxThreads: 1);
            for (int k = 0; k < measures.Length; k++) if (tested[k].Outcome.Significant.Any(s => s)) any[k]++;
        }
        for (int k = 0; k < measures.Length; k++)
            Assert.True(any[k] >= lo && any[k] <= hi,
                $"{MeasureCatalog.Key(measures[k])}: {any[k]} of {experiments} with a rejection, expected {lo}..{hi}");
    }

    [Fact]
    public void The_per_draw_maxima_equal_a_direct_computation_from_the_draws()
    {
        // Recompute every draw one by one (same trial orders) and studentise with the mean and sd (divisor M) of the
        // M + 1 values, the definition in StudentisedStatistic; p from the maxima as in Nichols & Holmes (2002).
        var set = TestSignals.Random(4, 10, 5, seed: 4);
        Measure[] measures = [Measure.Plv, Measure.ImagCoherency];
        const int draws = 29;
        var tested = FamilyCorrection.TestCondition(set, measures, draws, 8, "x", new CorrectionSpec(CorrectionMethod.MaxStatistic), 0.05);
        var workspace = new PairwiseWorkspace(set, measures);
        var perm = new int[10];
        var values = new double[draws + 1][];
        values[draws] = new double[workspace.OutputLength];
        PairwiseKernels.Compute(workspace, TestSignals.Identity(10), values[draws]);
        for (int d = 0; d < draws; d++)
        {
            TrialShuffle.Generate(8, d, perm);
            values[d] = new double[workspace.OutputLength];
            PairwiseKernels.Compute(workspace, perm, values[d]);
        }
        int pairs = workspace.PairCount;
        for (int k = 0; k < measures.Length; k++)
        {
            bool two = MeasureCatalog.TailOf(measures[k]) == TestTail.TwoSided;
            double T(int d, int p)
            {
                var all = values.Select(v => v[k * pairs + p]).ToArray();
                double mean = all.Average(), sd = Math.Sqrt(all.Sum(x => (x - mean) * (x - mean)) / draws);
                double t = (values[d][k * pairs + p] - mean) / sd;
                return two ? Math.Abs(t) : t;
            }
            var maxima = Enumerable.Range(0, draws).Select(d => Enumerable.Range(0, pairs).Max(p => T(d, p))).ToArray();
            for (int p = 0; p < pairs; p++)
            {
                double expected = (1 + maxima.Count(m => m >= T(draws, p) - 1e-12)) / (draws + 1.0);
                Assert.Equal(expected, tested[k].Outcome.PCorrected[p], 1e-12);
            }
        }
    }

    [Fact]
    public void The_thread_count_does_not_change_the_corrected_p()
    {
        var set = TestSignals.Random(6, 12, 5, seed: 6);
        Measure[] measures = [Measure.Plv, Measure.Aec];
        var spec = new CorrectionSpec(CorrectionMethod.NetworkBased, Threshold: 1.5);
        var one = FamilyCorrection.TestCondition(set, measures, 60, 3, "x", spec, 0.05, maxThreads: 1);
        var two = FamilyCorrection.TestCondition(set, measures, 60, 3, "x", spec, 0.05, maxThreads: 2);
        for (int k = 0; k < measures.Length; k++)
        {
            Assert.Equal(one[k].Outcome.PCorrected, two[k].Outcome.PCorrected);
            Assert.Equal(one[k].Outcome.Component, two[k].Outcome.Component);
        }
    }
}
