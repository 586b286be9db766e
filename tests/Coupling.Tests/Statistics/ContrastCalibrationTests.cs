using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

/// <summary>
/// False-positive rate of the condition-label permutation test when both conditions come from one distribution, at
/// very unequal trial counts and with the evoked response removed. Under exchangeability every split of the pooled
/// trials is as likely as the observed one, so a level-α test rejects in about α of the data sets (Nichols and Holmes
/// 2002, Hum Brain Mapp 15:1-25; Maris and Oostenveld 2007, J Neurosci Methods 164:177-190).
/// </summary>
public class ContrastCalibrationTests
{
    // The measures read from the cross-products (cheap per draw); the others share the permutation and the centring.
    private static readonly Measure[] Tested = [Measure.Plv, Measure.Coherence, Measure.ImagCoherency];

    /// <summary>
    /// One condition's trials: a stimulus-locked response, the same in every trial (channel 1 lagging channel 0 by
    /// 0.8 rad), plus independent noise in each channel. Both conditions are drawn from this one law, so every null
    /// hypothesis of the contrast is true. Without trial-by-trial coupling the measures sit at their small-sample bias,
    /// which differs between 8 and 40 trials, so the null of Δ is not centred at 0.
    /// </summary>
    private static NarrowbandSet Condition(int trials, int times, Random random)
    {
        var evoked = Enumerable.Range(0, times).Select(t => Complex.FromPolarCoordinates(1.5, 0.9 * t)).ToArray();
        var lagged = Complex.FromPolarCoordinates(1, -0.8);
        return TestSignals.Build(2, trials, times, (t, c, n) => c == 0
            ? evoked[t] + TestSignals.Gaussian(random)
            : evoked[t] * lagged + TestSignals.Gaussian(random));
    }

    [Fact]
    public void Eight_against_forty_trials_with_the_evoked_response_removed_reject_at_the_nominal_rate()
    {
        // 250 data sets of 2 channels (one pair), 8 trials against 40, 30 time points, M = 39 label permutations. With
        // M = 39 the two-sided test at 0.05 rejects when the observed difference is the most extreme of 40 values on
        // either side, so its exact level for a continuous statistic is 2/40 = 0.05. The count of rejections must lie
        // in the central 99.9 % range of Binomial(250, 0.05) (exact binomial law). Residuals centred per original
        // condition before pooling, tested on |Δ|, gave 30 (PLV) and 50 (coherence) of 250 outside 3..25.
        const int sets = 250, draws = 39, times = 30;
        const double alpha = 0.05;
        var rejectedBySet = new bool[sets, Tested.Length];
        // Data sets are independent, each with its own seeds, so they may run in parallel without changing any result.
        Parallel.For(0, sets, s =>
        {
            var random = new Random(7000 + s);
            var a = Condition(8, times, random);
            var b = Condition(40, times, random);
            var results = ConditionContrast.Run(a, b, Tested, draws, seed: (ulong)s, "x", subtractEvoked: true, maxThreads: 1);
            for (int k = 0; k < Tested.Length; k++) rejectedBySet[s, k] = results[k].P[0] <= alpha;
        });
        var rejected = new int[Tested.Length];
        for (int s = 0; s < sets; s++)
            for (int k = 0; k < Tested.Length; k++)
                if (rejectedBySet[s, k]) rejected[k]++;
        var (low, high) = BinomialRange.Central(sets, alpha, 0.999);
        var failures = Tested.Select((m, k) => (m, k)).Where(x => rejected[x.k] < low || rejected[x.k] > high)
            .Select(x => $"{MeasureCatalog.Key(x.m)}: {rejected[x.k]}").ToArray();
        Assert.True(failures.Length == 0,
            $"rejections out of {sets} outside {low}..{high}: {string.Join(", ", failures)} (all: {string.Join(", ", Tested.Select((m, k) => $"{MeasureCatalog.Key(m)} {rejected[k]}"))})");
    }
}
