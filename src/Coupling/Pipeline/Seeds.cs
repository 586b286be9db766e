namespace Coupling.Pipeline;

/// <summary>Derives the seed of each condition x band from the plan's one seed.</summary>
public static class Seeds
{
    /// <summary>
    /// A seed for condition <paramref name="condition"/> and band <paramref name="band"/>: the SplitMix64 finaliser
    /// (Steele, Lea &amp; Flood 2014, "Fast splittable pseudorandom number generators", OOPSLA) of the plan seed
    /// combined with both indices, so every condition x band draws its own, reproducible permutations.
    /// </summary>
    public static ulong For(ulong seed, int condition, int band)
    {
        ulong z = seed + 0x9E3779B97F4A7C15UL * (ulong)(1 + condition * 1024 + band);
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }
}
