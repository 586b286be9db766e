using Coupling.Measures;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

/// <summary>
/// The maximum-statistic and network-based corrections read each draw a second time, once the studentising centre and
/// scale are known. Kept in memory or drawn again with the same seed, the draws are the same, so every corrected
/// outcome must be the same to the last bit (and at any thread count).
/// </summary>
[Collection(KeptDrawsLimit.Name)]
public sealed class KeptDrawsTests
{
    private static void AssertSame(FamilyOutcome a, FamilyOutcome b)
    {
        Assert.Equal(a.PCorrected.Select(BitConverter.DoubleToInt64Bits), b.PCorrected.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(a.Significant, b.Significant);
        Assert.Equal(a.Component, b.Component);
        Assert.Equal(a.ComponentExtent, b.ComponentExtent);
        Assert.Equal(a.ComponentP, b.ComponentP);
    }

    private static T WithLimit<T>(long bytes, Func<T> run)
    {
        long before = KeptDraws.LimitBytes;
        KeptDraws.LimitBytes = bytes;
        try { return run(); }
        finally { KeptDraws.LimitBytes = before; }
    }

    [Theory]
    [InlineData(CorrectionMethod.MaxStatistic, 1)]
    [InlineData(CorrectionMethod.MaxStatistic, 3)]
    [InlineData(CorrectionMethod.NetworkBased, 2)]
    public void Kept_draws_give_the_outcomes_of_drawing_again(CorrectionMethod method, int threads)
    {
        var spec = new CorrectionSpec(method, Threshold: method == CorrectionMethod.NetworkBased ? 1.0 : null);
        Measure[] measures = [Measure.Plv, Measure.Wpli, Measure.Coherence, Measure.Aec];
        var set = TestSignals.Random(7, 14, 6, seed: 4);
        var drawnAgain = WithLimit(0, () => FamilyCorrection.TestCondition(set, measures, 59, 3, "x", spec, 0.2, maxThreads: threads));
        var kept = WithLimit(long.MaxValue, () => FamilyCorrection.TestCondition(set, measures, 59, 3, "x", spec, 0.2, maxThreads: threads));
        for (int k = 0; k < measures.Length; k++) AssertSame(drawnAgain[k].Outcome, kept[k].Outcome);
        Assert.Contains(kept, t => t.Outcome.PCorrected.Any(p => p < 1));   // the comparison is not between empty outcomes

        var a = TestSignals.Random(6, 9, 5, seed: 5);
        var b = TestSignals.Random(6, 13, 5, seed: 6);
        var contrastAgain = WithLimit(0, () => FamilyCorrection.TestContrast(a, b, measures, 39, 8, "x", spec, 0.2, maxThreads: threads));
        var contrastKept = WithLimit(long.MaxValue, () => FamilyCorrection.TestContrast(a, b, measures, 39, 8, "x", spec, 0.2, maxThreads: threads));
        for (int k = 0; k < measures.Length; k++) AssertSame(contrastAgain[k].Outcome, contrastKept[k].Outcome);
    }

    [Fact]
    public void Draws_are_kept_only_for_the_corrections_that_read_them_again_and_within_the_limit()
    {
        Assert.NotNull(KeptDraws.For(new CorrectionSpec(CorrectionMethod.MaxStatistic), 1000, 1000));
        Assert.Null(KeptDraws.For(new CorrectionSpec(CorrectionMethod.BenjaminiHochberg), 1000, 1000));
        // 1000 draws of 32640 pairs x 8 measures would take 2 GB: drawn again instead.
        Assert.Null(KeptDraws.For(new CorrectionSpec(CorrectionMethod.NetworkBased), 1000, 32640 * 8));
    }
}

/// <summary>Tests that change <see cref="KeptDraws.LimitBytes"/> run one at a time.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class KeptDrawsLimit
{
    public const string Name = "kept draws limit";
}
