using System.Numerics;
using Coupling.Measures;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

public class NetworkBasedStatisticTests
{
    [Fact]
    public void Components_of_a_small_graph_are_labelled_with_their_edge_counts()
    {
        // Worked by hand on 6 channels: edges 0-1, 1-2, 0-2 (a triangle: 3 edges), 3-4 (1 edge); channel 5 isolated.
        const int channels = 6;
        var edges = new bool[PairIndex.Count(channels)];
        foreach (var (a, b) in new[] { (0, 1), (1, 2), (0, 2), (3, 4) }) edges[PairIndex.Of(a, b, channels)] = true;
        var component = new int[edges.Length];
        var extent = NetworkComponents.Label(channels, edges, component);
        Assert.Equal([3, 1], extent);
        Assert.Equal(0, component[PairIndex.Of(1, 2, channels)]);
        Assert.Equal(1, component[PairIndex.Of(3, 4, channels)]);
        Assert.Equal(-1, component[PairIndex.Of(4, 5, channels)]);
        Assert.Equal(3, NetworkComponents.LargestExtent(channels, edges));
    }

    [Fact]
    public void Component_p_counts_the_draws_whose_largest_component_reaches_its_extent()
    {
        // Zalesky et al. (2010), NeuroImage 53:1197: p = (1 + #{d: largest extent_d >= extent})/(M + 1); by hand.
        const int channels = 4;
        var t = new double[PairIndex.Count(channels)];
        t[PairIndex.Of(0, 1, channels)] = 5;
        t[PairIndex.Of(1, 2, channels)] = 4;
        t[PairIndex.Of(0, 3, channels)] = 2; // below the threshold 3
        var (component, extent, p) = NetworkBasedStatistic.Test(channels, t, 3, [0, 1, 2, 2, 3]);
        Assert.Equal([2], extent);
        Assert.Equal((1 + 3) / 6.0, p[0]);
        Assert.Equal(-1, component[PairIndex.Of(0, 3, channels)]);
    }

    [Fact]
    public void Family_wise_error_is_nominal_under_the_null_at_unequal_trial_counts()
    {
        // Contrast of two conditions from one distribution, 6 and 18 trials: any component declared significant is a
        // family-wise error; its rate must lie within the 99 % binomial acceptance region of Binomial(n, alpha) (exact).
        const int experiments = 120, draws = 19;
        const double alpha = 0.1;
        var random = new Random(21);
        var (lo, hi) = BinomialInterval.Of(experiments, alpha);
        int any = 0;
        var spec = new CorrectionSpec(CorrectionMethod.NetworkBased, Threshold: 1.5);
        for (int e = 0; e < experiments; e++)
        {
            var a = TestSignals.Random(5, 6, 5, seed: random.Next());
            var b = TestSignals.Random(5, 18, 5, seed: random.Next());
            var tested = FamilyCorrection.TestContrast(a, b, [Measure.Coherence], draws, (ulong)e, "x", spec, alpha, maxThreads: 1);
            if (tested[0].Outcome.Significant.Any(s => s)) any++;
        }
        Assert.True(any >= lo && any <= hi, $"{any} of {experiments} with a significant component, expected {lo}..{hi}");
    }

    [Fact]
    public void A_planted_network_is_found_as_one_component()
    {
        // Channels 0, 1, 2 share a trial-by-trial phase (coupled); 3..7 are independent. The component {0, 1, 2} must be
        // found with the smallest attainable p and no edge outside it may be in a significant component.
        var random = new Random(5);
        const int channels = 8, trials = 30, times = 6;
        var common = new Complex[trials * times];
        for (int i = 0; i < common.Length; i++) common[i] = TestSignals.UniformPhasor(random);
        var set = TestSignals.Build(channels, trials, times, (t, c, n) =>
            (c < 3 ? 1.5 * common[t * trials + n] : Complex.Zero) + TestSignals.Gaussian(random));
        var spec = new CorrectionSpec(CorrectionMethod.NetworkBased, Threshold: 3);
        var outcome = FamilyCorrection.TestCondition(set, [Measure.Plv], 99, 2, "x", spec, 0.05)[0].Outcome;
        var planted = new[] { PairIndex.Of(0, 1, channels), PairIndex.Of(0, 2, channels), PairIndex.Of(1, 2, channels) };
        foreach (int k in planted) Assert.True(outcome.Significant[k]);
        Assert.Equal(1 / 100.0, outcome.PCorrected[planted[0]]);
        for (int k = 0; k < outcome.Significant.Length; k++)
            if (!planted.Contains(k)) Assert.False(outcome.Significant[k], $"pair {k} significant outside the planted network");
    }
}
