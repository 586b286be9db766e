using System.Numerics;
using Coupling.Measures;
using Coupling.Results;
using Coupling.Spectral;

namespace Coupling.Statistics;

/// <summary>
/// Recomputes the surrogate draws of one channel pair of one measure, keeping every value: the same trial orders as
/// <see cref="SurrogateTest.Run"/> with the same seed (<see cref="TrialShuffle.Generate"/>(seed, d)), applied to the two
/// channels alone, so the draws are those the test summarised (up to the rounding of the all-pairs kernels, about 1e-15
/// relative).
/// </summary>
public static class SurrogateDraws
{
    /// <summary>The observed value and the <paramref name="draws"/> surrogate values of pair (a, b).</summary>
    /// <param name="set">The narrowband signals of the condition and band the test ran on.</param>
    /// <param name="measure">The measure.</param>
    /// <param name="a">Index of the first channel in <paramref name="set"/>.</param>
    /// <param name="b">Index of the second channel, greater than <paramref name="a"/>.</param>
    /// <param name="draws">Number of surrogates M, as in the test.</param>
    /// <param name="seed">The seed the test used for this condition and band.</param>
    /// <param name="chosen">How the edge was chosen, recorded in the result.</param>
    /// <param name="condition">Condition name, recorded in the result.</param>
    public static SurrogateDistribution ForPair(NarrowbandSet set, Measure measure, int a, int b, int draws, ulong seed,
        string condition, string chosen)
    {
        ArgumentNullException.ThrowIfNull(set);
        if (a < 0 || b <= a || b >= set.ChannelCount)
            throw new ArgumentOutOfRangeException(nameof(b), $"Pair ({a}, {b}) is not a pair a < b of {set.ChannelCount} channels.");
        SurrogateTest.CheckFeasible(set.TrialCount, draws, condition);
        var pair = TwoChannels(set, a, b);
        var workspace = new PairwiseWorkspace(pair, [measure]);
        var order = new int[set.TrialCount];
        for (int n = 0; n < order.Length; n++) order[n] = n;
        var value = new double[1];
        PairwiseKernels.Compute(workspace, order, value);
        double observed = value[0];
        var values = new double[draws];
        for (int d = 0; d < draws; d++)
        {
            TrialShuffle.Generate(seed, d, order);
            PairwiseKernels.Compute(workspace, order, value);
            values[d] = value[0];
        }
        var tail = MeasureCatalog.TailOf(measure);
        bool twoSided = tail == TestTail.TwoSided;
        // The same tails and z as the surrogate test (PermutationP): counts below and above the observed value.
        int below = values.Count(v => v < observed), above = values.Count(v => v > observed);
        double p = double.IsNaN(observed) ? double.NaN : PermutationP.Of(tail, below, above, draws);
        double z = double.IsNaN(observed) ? double.NaN : PermutationP.RankZ(below, above, draws);
        return new SurrogateDistribution(condition, set.Band.Name, MeasureCatalog.Key(measure), set.Channels[a], set.Channels[b],
            observed, values, twoSided, p, z, chosen);
    }

    private static NarrowbandSet TwoChannels(NarrowbandSet set, int a, int b)
    {
        int trials = set.TrialCount;
        var data = new Complex[set.TimeCount * 2 * trials];
        for (int t = 0; t < set.TimeCount; t++)
        {
            set.Row(t, a).CopyTo(data.AsSpan(2 * t * trials, trials));
            set.Row(t, b).CopyTo(data.AsSpan((2 * t + 1) * trials, trials));
        }
        return new NarrowbandSet(set.Band, [set.Channels[a], set.Channels[b]], trials, set.Times, data);
    }
}
