using Coupling.Measures;
using Coupling.Statistics;

namespace Coupling.Tests.Measures;

public class PairwiseKernelsTests
{
    private static readonly Measure[] Every = MeasureCatalog.All.ToArray();

    // Every measure is bounded by 1 in magnitude and is a sum of at most (trials x time points) terms of size <= 1, so
    // rounding differences between the kernel and the reference stay near (N + T) * 2^-52 ~ 1e-14; 1e-12 leaves room
    // for the ratios and the atanh of the Fisher combination (|r| well below 1 on random data).
    private const double Tolerance = 1e-12;

    public static TheoryData<int, int, int, int> Sizes => new()
    {
        { 3, 7, 5, 1 },
        { 5, 13, 9, 2 },
        { 7, 13, 4, 3 },
        { 2, 7, 11, 4 },
    };

    [Theory]
    [MemberData(nameof(Sizes))]
    public void Kernels_equal_the_reference_formulas_with_trials_in_their_own_order(int channels, int trials, int times, int seed)
    {
        var set = TestSignals.Random(channels, trials, times, seed);
        AssertMatchesReference(set, TestSignals.Identity(trials));
    }

    [Theory]
    [MemberData(nameof(Sizes))]
    public void Kernels_equal_the_reference_formulas_with_a_trial_permutation(int channels, int trials, int times, int seed)
    {
        var set = TestSignals.Random(channels, trials, times, seed + 100);
        var perm = new int[trials];
        TrialShuffle.Generate((ulong)seed, 0, perm);
        Assert.NotEqual(TestSignals.Identity(trials), perm);
        AssertMatchesReference(set, perm);
    }

    // Sizes that do not fill the kernels' vectors (four doubles) or tiles (4 or 2 rows by 8 or 4 channels): odd trial
    // counts, channel counts below, at and past one tile, and time counts that are not a multiple of four. At least 16
    // time points: with very few, a per-trial envelope correlation can lie so near ±1 that atanh magnifies rounding
    // (by 1/(1 − r²)) past the tolerance in kernel and reference alike.
    public static TheoryData<int, int, int> OddSizes()
    {
        var sizes = new TheoryData<int, int, int>();
        foreach (int channels in new[] { 2, 3, 9 })
            foreach (int trials in new[] { 1, 3, 5, 7, 17, 33 })
                sizes.Add(channels, trials, 17 + (channels * trials) % 6);
        sizes.Add(17, 5, 19);
        return sizes;
    }

    [Theory]
    [MemberData(nameof(OddSizes))]
    public void Kernels_equal_the_reference_formulas_at_sizes_that_do_not_fill_a_vector(int channels, int trials, int times)
    {
        var set = TestSignals.Random(channels, trials, times, seed: channels * 100 + trials);
        var perm = new int[trials];
        TrialShuffle.Generate((ulong)(channels + trials), 0, perm);
        AssertMatchesReference(set, perm);
    }

    [Fact]
    public void Kernels_equal_the_reference_formulas_when_some_amplitudes_are_exactly_zero()
    {
        // Zero amplitude: no phase, the trial's unit phasor counts as 0 (the documented convention).
        var set = TestSignals.Random(5, 9, 6, seed: 17, zeroFraction: 0.15);
        Assert.Contains(set.Data, z => z == System.Numerics.Complex.Zero);
        AssertMatchesReference(set, [8, 0, 7, 1, 6, 2, 5, 3, 4]);
    }

    [Theory]
    [InlineData(2, 5, 7)]
    [InlineData(3, 1, 9)]
    [InlineData(9, 33, 6)]
    [InlineData(17, 7, 5)]
    [InlineData(33, 12, 4)]
    public void The_eight_wide_tiles_give_the_same_bits_as_the_four_wide_ones(int channels, int trials, int times)
    {
        // Each vector lane computes its own pair's sums with the same operations in the same order in both forms, so
        // the processor's vector width changes no bit of any measure (the fused multiply-add is correctly rounded,
        // IEEE 754-2008 section 5.4.1, so it gives the same bits at either width). Processors without 512-bit vectors
        // run the wide form in software, which is slow but still exact.
        var set = TestSignals.Random(channels, trials, times, seed: channels * 7 + trials, zeroFraction: 0.05);
        var perm = new int[trials];
        TrialShuffle.Generate((ulong)(channels + 3 * trials), 0, perm);
        bool before = WideTileKernels.Enabled;
        try
        {
            WideTileKernels.Enabled = false;
            var narrow = Compute(set, Every, perm);
            WideTileKernels.Enabled = true;
            var wide = Compute(set, Every, perm);
            Assert.Equal(narrow, wide);
        }
        finally
        {
            WideTileKernels.Enabled = before;
        }
    }

    [Fact]
    public void Draws_computed_together_give_the_same_bits_as_draws_computed_one_by_one()
    {
        // The surrogate test computes a chunk's draws time point by time point together; each draw's sums still run
        // over the time points and trials in the same order, so nothing may change.
        var set = TestSignals.Random(11, 9, 13, seed: 21, zeroFraction: 0.05);
        var first = new PairwiseWorkspace(set, Every);
        var workspaces = new[] { first, first.CreateSibling(), first.CreateSibling() };
        var permutations = new int[3][];
        var together = new double[3][];
        for (int i = 0; i < 3; i++)
        {
            permutations[i] = new int[9];
            TrialShuffle.Generate(77, i, permutations[i]);
            together[i] = new double[first.OutputLength];
        }
        PairwiseKernels.ComputeTogether(workspaces, permutations, together);
        for (int i = 0; i < 3; i++)
        {
            var alone = new double[first.OutputLength];
            PairwiseKernels.Compute(new PairwiseWorkspace(set, Every), permutations[i], alone);
            Assert.Equal(alone, together[i]);
        }
        var stranger = new PairwiseWorkspace(TestSignals.Random(11, 9, 13, seed: 22), Every);
        Assert.Throws<ArgumentException>(() => PairwiseKernels.ComputeTogether([first, stranger], permutations[..2], together[..2]));
    }

    [Theory]
    [InlineData(5, 9, 17)]
    [InlineData(13, 4, 21)]
    public void Envelope_measures_from_the_trial_pair_table_are_the_same_bits_as_computed_per_draw(int channels, int trials, int times)
    {
        // The table holds atanh r of every trial pair; a draw adds N of its rows in trial order, the same additions
        // in the same order as computing them on the spot.
        var set = TestSignals.Random(channels, trials, times, seed: 31 + channels);
        var tabled = new PairwiseWorkspace(set, Every);
        PairwiseKernels.BuildTrialPairs(tabled, maxThreads: 2, CancellationToken.None);
        var sibling = tabled.CreateSibling();
        try
        {
            CompareWithTable(set, trials, tabled, sibling);
        }
        finally
        {
            PairwiseKernels.ReleaseTrialPairs(tabled);
        }
    }

    private static void CompareWithTable(Coupling.Spectral.NarrowbandSet set, int trials, PairwiseWorkspace tabled, PairwiseWorkspace sibling)
    {
        for (int d = 0; d < 4; d++)
        {
            var perm = new int[trials];
            TrialShuffle.Generate(5, d, perm);
            var expected = new double[tabled.OutputLength];
            PairwiseKernels.Compute(new PairwiseWorkspace(set, Every), perm, expected);
            var fromTable = new double[tabled.OutputLength];
            PairwiseKernels.Compute(tabled, perm, fromTable);
            Assert.Equal(expected, fromTable);
            var together = new[] { new double[tabled.OutputLength] };
            PairwiseKernels.ComputeTogether([sibling], [perm], together);
            Assert.Equal(expected, together[0]);
        }
    }

    [Fact]
    public void A_subset_of_measures_in_any_order_gives_the_same_values_as_all_measures()
    {
        var set = TestSignals.Random(4, 8, 6, seed: 5);
        var perm = new int[] { 3, 1, 0, 7, 6, 2, 5, 4 };
        var all = Compute(set, Every, perm);
        Measure[] subset = [Measure.AecOrth, Measure.Pli, Measure.Plv];
        var some = Compute(set, subset, perm);
        int pairs = PairIndex.Count(4);
        for (int k = 0; k < subset.Length; k++)
            Assert.Equal(all.AsSpan((int)subset[k] * pairs, pairs).ToArray(), some.AsSpan(k * pairs, pairs).ToArray());
    }

    [Fact]
    public void A_reused_workspace_gives_the_same_values_as_a_fresh_one()
    {
        var set = TestSignals.Random(4, 10, 5, seed: 8);
        var workspace = new PairwiseWorkspace(set, Every);
        var first = new double[workspace.OutputLength];
        var again = new double[workspace.OutputLength];
        var other = new double[workspace.OutputLength];
        var perm = new int[10];
        TrialShuffle.Generate(3, 0, perm);
        PairwiseKernels.Compute(workspace, perm, first);
        PairwiseKernels.Compute(workspace, TestSignals.Identity(10), other);
        PairwiseKernels.Compute(workspace.CreateSibling(), perm, again);
        Assert.Equal(first, again);
        PairwiseKernels.Compute(workspace, perm, again);
        Assert.Equal(first, again);
        Assert.NotEqual(first, other);
    }

    [Fact]
    public void A_sequence_that_is_not_a_permutation_is_refused()
    {
        var set = TestSignals.Random(3, 4, 2, seed: 1);
        var workspace = new PairwiseWorkspace(set, Every);
        var values = new double[workspace.OutputLength];
        Assert.Throws<ArgumentException>(() => PairwiseKernels.Compute(workspace, [0, 1, 1, 3], values));
        Assert.Throws<ArgumentException>(() => PairwiseKernels.Compute(workspace, [0, 1, 2], values));
        Assert.Throws<ArgumentException>(() => PairwiseKernels.Compute(workspace, [0, 1, 2, 4], values));
        Assert.Throws<ArgumentException>(() => PairwiseKernels.Compute(workspace, [0, 1, 2, 3], new double[3]));
        Assert.Throws<ArgumentException>(() => new PairwiseWorkspace(set, [Measure.Plv, Measure.Plv]));
    }

    private static double[] Compute(Coupling.Spectral.NarrowbandSet set, IReadOnlyList<Measure> measures, int[] perm)
    {
        var workspace = new PairwiseWorkspace(set, measures);
        var values = new double[workspace.OutputLength];
        PairwiseKernels.Compute(workspace, perm, values);
        return values;
    }

    private static void AssertMatchesReference(Coupling.Spectral.NarrowbandSet set, int[] perm)
    {
        var values = Compute(set, Every, perm);
        int channels = set.ChannelCount, pairs = PairIndex.Count(channels);
        for (int k = 0; k < Every.Length; k++)
            for (int p = 0; p < pairs; p++)
            {
                var (a, b) = PairIndex.Channels(p, channels);
                double expected = ReferenceMeasures.Value(Every[k], set, a, b, perm);
                double actual = values[k * pairs + p];
                // One trial: PPC divides by N − 1 = 0 and is NaN by its documented convention (the naive reference gives
                // ±Inf or NaN from the rounding of |u|² − 1).
                if (Every[k] == Measure.Ppc && set.TrialCount < 2)
                {
                    Assert.True(double.IsNaN(actual), $"ppc of one trial: {actual}");
                    continue;
                }
                Assert.True(Math.Abs(actual - expected) <= Tolerance * Math.Max(1, Math.Abs(expected)),
                    $"{MeasureCatalog.Key(Every[k])} pair ({a},{b}): kernel {actual:R}, reference {expected:R}");
            }
    }
}
