using Coupling.Measures;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

/// <summary>
/// The kept draws of one edge are the draws the surrogate test summarised: same trial orders, same values, hence the same
/// exceedance count, p = (b + 1)/(M + 1) (Phipson and Smyth 2010, Stat Appl Genet Mol Biol 9:39), mean and z.
/// </summary>
public class SurrogateDrawsTests
{
    [Theory]
    [InlineData(Measure.Plv)]
    [InlineData(Measure.Wpli)]
    [InlineData(Measure.ImagCoherency)]
    [InlineData(Measure.Aec)]
    public void The_draws_of_one_pair_reproduce_the_test_of_that_pair(Measure measure)
    {
        var set = TestSignals.Random(5, 11, 9, seed: 21);
        const ulong seed = 77;
        const int draws = 60;
        var test = SurrogateTest.Run(set, [measure], draws, seed, "go", maxThreads: 1).Single();
        foreach (var (a, b) in new[] { (0, 1), (1, 4), (2, 3) })
        {
            int k = PairIndex.Of(a, b, 5);
            var d = SurrogateDraws.ForPair(set, measure, a, b, draws, seed, "go", "plan");
            Assert.Equal(draws, d.Draws.Length);
            // The two-channel kernel sums the same products in another order: 1e-12 relative, the kernels' own tolerance
            // against the per-pair reference (docs/methods.md, section 8).
            Assert.Equal(test.Observed[k], d.Observed, 1e-12 * Math.Max(1, Math.Abs(test.Observed[k])));
            Assert.Equal(test.NullMean[k], d.Draws.Average(), 1e-12);
            Assert.Equal(test.P[k], d.P);
            Assert.Equal(test.Z[k], d.Z, 1e-9);
            Assert.Equal(set.Channels[a], d.ChannelA);
            Assert.Equal(set.Channels[b], d.ChannelB);
            Assert.Equal(MeasureCatalog.TailOf(measure) == TestTail.TwoSided, d.TwoSided);
        }
    }

    [Fact]
    public void A_pair_must_be_two_channels_in_order()
    {
        var set = TestSignals.Random(3, 6, 4, seed: 1);
        Assert.Throws<ArgumentOutOfRangeException>(() => SurrogateDraws.ForPair(set, Measure.Plv, 1, 1, 10, 1, "go", "plan"));
        Assert.Throws<ArgumentOutOfRangeException>(() => SurrogateDraws.ForPair(set, Measure.Plv, 0, 3, 10, 1, "go", "plan"));
    }
}
