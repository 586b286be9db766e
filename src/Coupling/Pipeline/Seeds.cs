namespace Coupling.Pipeline;

/// <summary>Derives the seed of each condition x band from the plan's one seed.</summary>
public static class Seeds
{
    /// <summary>
    /// A seed for condition <paramref name="condition"/> and band <paramref name="band"/>: the SplitMix64 finaliser
    /// (Steele, Lea &amp; Flood 2014, "Fast splittable pseudorandom number generators", OOPSLA) of the plan seed
    /// combined with both indices, so every condition x band draws its own, reproducible permutations.
    /// </summary>
    public static ulong For(ulong seed, int condition, int band) => Mix(seed, 1 + (ulong)condition * 1024 + (ulong)band);

    /// <summary>
    /// A seed for the condition-label permutations of contrast <paramref name="contrast"/> in band <paramref name="band"/>,
    /// from the same finaliser with an index offset by 2^40, so it never coincides with a seed of <see cref="For"/>
    /// (whose indices stay below 2^40 for any plausible number of conditions and bands).
    /// </summary>
    public static ulong ForContrast(ulong seed, int contrast, int band) =>
        Mix(seed, (1UL << 40) + 1 + (ulong)contrast * 1024 + (ulong)band);

    /// <summary>
    /// A seed for the trial subsets that match condition <paramref name="condition"/> in band <paramref name="band"/> to the
    /// smallest trial count, with an index offset by 2^41 (apart from <see cref="For"/> and <see cref="ForContrast"/>).
    /// </summary>
    public static ulong ForMatching(ulong seed, int condition, int band) =>
        Mix(seed, (1UL << 41) + 1 + (ulong)condition * 1024 + (ulong)band);

    /// <summary>A seed for the phase-slope-index surrogates of condition x band, with an index offset by 2^42.</summary>
    public static ulong ForDirection(ulong seed, int condition, int band) =>
        Mix(seed, (1UL << 42) + 1 + (ulong)condition * 1024 + (ulong)band);

    private static ulong Mix(ulong seed, ulong index)
    {
        ulong z = unchecked(seed + 0x9E3779B97F4A7C15UL * index);
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }
}
