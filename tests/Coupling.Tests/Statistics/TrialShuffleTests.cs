using Coupling.Statistics;

namespace Coupling.Tests.Statistics;

public class TrialShuffleTests
{
    [Fact]
    public void SplitMix64_reproduces_the_reference_stream()
    {
        // Output of Vigna's reference splitmix64.c for seed 1234567, as listed in the reference-vector tests of
        // several public SplitMix64 ports; seed 0's first outputs 0xE220A8397B1DCDAF, 0x6E789E6AA1B965F4 likewise.
        var random = new SplitMix64(1234567);
        Assert.Equal(6457827717110365317UL, random.Next());
        Assert.Equal(3203168211198807973UL, random.Next());
        Assert.Equal(9817491932198370423UL, random.Next());
        Assert.Equal(4593380528125082431UL, random.Next());
        Assert.Equal(16408922859458223821UL, random.Next());
        var zero = new SplitMix64(0);
        Assert.Equal(0xE220A8397B1DCDAFUL, zero.Next());
        Assert.Equal(0x6E789E6AA1B965F4UL, zero.Next());
    }

    [Fact]
    public void Each_draw_is_a_permutation_fixed_by_seed_and_draw_index()
    {
        var first = new int[13];
        var again = new int[13];
        var next = new int[13];
        TrialShuffle.Generate(99, 5, first);
        TrialShuffle.Generate(99, 5, again);
        TrialShuffle.Generate(99, 6, next);
        Assert.Equal(first, again);
        Assert.NotEqual(first, next);
        Assert.Equal(Enumerable.Range(0, 13), first.Order());
    }

    [Fact]
    public void All_orders_of_three_trials_are_equally_likely()
    {
        // Fisher-Yates gives each of the N! orders probability 1/N! (Knuth, TAOCP vol. 2, 3.4.2). Pearson's
        // chi-square over the 6 orders from 60000 draws has 5 degrees of freedom; 20.52 is its 0.999 quantile
        // (standard chi-square table).
        var counts = new Dictionary<string, int>();
        var perm = new int[3];
        const int draws = 60000;
        for (int d = 0; d < draws; d++)
        {
            TrialShuffle.Generate(2024, d, perm);
            string key = string.Join(",", perm);
            counts[key] = counts.GetValueOrDefault(key) + 1;
        }
        Assert.Equal(6, counts.Count);
        double expected = draws / 6.0;
        double chiSquare = counts.Values.Sum(c => (c - expected) * (c - expected) / expected);
        Assert.True(chiSquare < 20.52, $"chi-square {chiSquare}");
    }

    [Fact]
    public void Bounded_integers_stay_in_range_and_cover_it()
    {
        var random = new SplitMix64(5);
        var seen = new bool[7];
        for (int i = 0; i < 1000; i++)
        {
            int v = random.NextBelow(7);
            Assert.InRange(v, 0, 6);
            seen[v] = true;
        }
        Assert.All(seen, Assert.True);
        Assert.Throws<ArgumentOutOfRangeException>(() => random.NextBelow(0));
    }
}
