using Coupling.Measures;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

/// <summary>Error rates of the false discovery rate corrections, no correction and the Pareto tail under the null.</summary>
public class CorrectionCalibrationTests
{
    [Fact]
    public void False_discovery_rate_corrections_and_no_correction_hold_their_level_at_unequal_trial_counts()
    {
        // Contrasts of two conditions from one distribution, 7 and 21 trials (the label split keeps the group sizes, so
        // the permutation null is exact). Every null is true, so the false discovery rate equals the chance of any
        // rejection: Benjamini-Yekutieli keeps it at most q under any dependence (Benjamini & Yekutieli 2001, Ann Stat
        // 29:1165, theorem 1.3) and Benjamini-Hochberg under positive dependence; their counts of experiments with a
        // rejection must not exceed the upper end of the 99 % binomial acceptance region of Binomial(n, q). Without
        // correction one fixed pair is rejected at rate alpha exactly (up to the discreteness of p, (M+1)·alpha being a
        // whole number here): its count must lie within the region. M = 149 lets one pair pass Benjamini-Yekutieli
        // alone (1/150 <= 0.1/(6·c(6)) = 0.0068), so the checks could fail.
        const int experiments = 120, draws = 149;
        const double level = 0.1;
        var random = new Random(31);
        var (lo, hi) = BinomialInterval.Of(experiments, level);
        int bh = 0, by = 0, none = 0;
        foreach (int e in Enumerable.Range(0, experiments))
        {
            var a = TestSignals.Random(4, 7, 4, seed: random.Next());
            var b = TestSignals.Random(4, 21, 4, seed: random.Next());
            var results = ConditionContrast.Run(a, b, [Measure.Coherence], draws, (ulong)e, "x", maxThreads: 1);
            var p = results[0].P;
            if (FalseDiscoveryRate.BenjaminiHochbergOfDefined(p).Any(v => v <= level)) bh++;
            if (FalseDiscoveryRate.BenjaminiYekutieliOfDefined(p).Any(v => v <= level)) by++;
            if (p[0] <= level) none++;
        }
        Assert.True(bh <= hi, $"benjamini-hochberg: {bh} of {experiments} with a rejection, at most {hi} allowed");
        Assert.True(by <= hi, $"benjamini-yekutieli: {by} of {experiments} with a rejection, at most {hi} allowed");
        Assert.InRange(none, lo, hi);
    }

    [Fact]
    public void Pareto_tail_p_values_are_valid_below_the_counting_floor()
    {
        // The observed statistic drawn from the same null as its M = 499 draws (a PLV over 20 trials): a valid p satisfies
        // P(p <= 0.001) <= 0.001, a level below the counting floor 1/500, so only tail p-values can reach it. Over 2500
        // experiments the count must not exceed the upper end of the 99 % binomial acceptance region of
        // Binomial(2500, 0.001).
        // The tail fit is conservative by design (ParetoTail: a negative shape becomes the exponential tail).
        const int experiments = 2500, draws = 499;
        const double level = 0.001;
        var random = new Random(41);
        int small = 0, fitted = 0;
        for (int e = 0; e < experiments; e++)
        {
            double observed = NullPlvSampler.Draw(random, 20);
            var tail = Enumerable.Range(0, draws).Select(_ => NullPlvSampler.Draw(random, 20)).OrderDescending().Take(TailSampleKept(draws)).ToArray();
            var (p, fit) = ParetoTail.UpperP(observed, tail, draws);
            if (fit) fitted++;
            if (p <= level) small++;
        }
        var (_, hi) = BinomialInterval.Of(experiments, level);
        Assert.True(fitted > 15, $"only {fitted} tail fits: the check would not test the fit");
        Assert.True(small <= hi, $"{small} of {experiments} with p <= {level}, at most {hi} allowed");
    }

    private static int TailSampleKept(int draws) => Math.Min(ParetoTail.MaximumFitted, draws / ParetoTail.TailFraction) + 1;
}
