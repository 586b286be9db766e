namespace Coupling.Statistics;

/// <summary>Trial orders for trial-shuffle surrogates, each one a function of (seed, draw index) only.</summary>
/// <remarks>
/// Draw d's generator is a <see cref="SplitMix64"/> seeded with the d-th output (counting from 0) of a SplitMix64
/// stream seeded with the run's seed, i.e. with Mix(seed + (d + 1)·Gamma). The order is then a Fisher-Yates shuffle
/// (Durstenfeld's in-place form: for i = N−1 down to 1, swap element i with a uniform element j of 0..i) of the
/// identity 0..N−1, which gives each of the N! orders with equal probability. Because a draw depends only on the seed
/// and its index, draws can be made in any order and on any thread.
/// Durstenfeld (1964), "Algorithm 235: Random permutation", Commun ACM 7(7):420; Knuth, The Art of Computer
/// Programming vol. 2, 3rd ed. (1997), section 3.4.2, algorithm P.
/// </remarks>
public static class TrialShuffle
{
    /// <summary>Writes the trial order of draw <paramref name="draw"/> into <paramref name="permutation"/>.</summary>
    /// <param name="seed">The run's seed.</param>
    /// <param name="draw">The draw index, 0-based.</param>
    /// <param name="permutation">Receives a permutation of 0..length−1.</param>
    public static void Generate(ulong seed, long draw, Span<int> permutation)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(draw);
        var random = new SplitMix64(DrawSeed(seed, draw));
        for (int n = 0; n < permutation.Length; n++) permutation[n] = n;
        for (int i = permutation.Length - 1; i > 0; i--)
        {
            int j = random.NextBelow(i + 1);
            (permutation[i], permutation[j]) = (permutation[j], permutation[i]);
        }
    }

    /// <summary>The seed of draw <paramref name="draw"/>'s generator: Mix(seed + (draw + 1)·Gamma).</summary>
    public static ulong DrawSeed(ulong seed, long draw) =>
        SplitMix64.Mix(unchecked(seed + ((ulong)draw + 1) * SplitMix64.Gamma));
}
