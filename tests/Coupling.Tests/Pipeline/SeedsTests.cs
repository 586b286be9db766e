using Coupling.Pipeline;

namespace Coupling.Tests.Pipeline;

public sealed class SeedsTests
{
    [Fact]
    public void Contrast_seeds_differ_from_every_trial_shuffle_seed_and_from_each_other()
    {
        // The label permutations of a contrast must not reuse the trial orders of any condition x band; SplitMix64's
        // finaliser is a bijection of 64-bit words (Steele, Lea and Flood 2014, OOPSLA), so distinct indices give
        // distinct seeds, which this checks over 64 conditions or contrasts x 64 bands for two plan seeds.
        foreach (ulong seed in new ulong[] { 0, 1 })
        {
            var shuffle = new HashSet<ulong>();
            var contrast = new HashSet<ulong>();
            for (int i = 0; i < 64; i++)
                for (int b = 0; b < 64; b++)
                {
                    Assert.True(shuffle.Add(Seeds.For(seed, i, b)));
                    Assert.True(contrast.Add(Seeds.ForContrast(seed, i, b)));
                }
            Assert.Empty(shuffle.Intersect(contrast));
        }
    }
}
