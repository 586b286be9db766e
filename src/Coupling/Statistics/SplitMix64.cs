namespace Coupling.Statistics;

/// <summary>
/// The SplitMix64 pseudo-random generator: a 64-bit state advanced by the constant 0x9E3779B97F4A7C15 and passed
/// through a fixed mixing function. Fully specified, so a seed gives the same stream on every platform and runtime.
/// </summary>
/// <remarks>
/// Steele, Lea, Flood (2014), "Fast splittable pseudorandom number generators", OOPSLA 2014, ACM SIGPLAN Notices
/// 49(10):453-472; constants as in Vigna's public-domain reference code splitmix64.c (mixing function "Mix13" of
/// Stafford). Bounded integers use Lemire's multiply-and-reject method, which is exactly uniform: Lemire (2019),
/// "Fast random integer generation in an interval", ACM Trans Model Comput Simul 29(1):3.
/// </remarks>
public struct SplitMix64
{
    /// <summary>The increment added to the state on every step (the odd integer nearest 2^64/φ).</summary>
    public const ulong Gamma = 0x9E3779B97F4A7C15UL;

    private ulong _state;

    /// <summary>Starts a stream whose state is <paramref name="seed"/>.</summary>
    public SplitMix64(ulong seed) => _state = seed;

    /// <summary>Advances the state by <see cref="Gamma"/> and returns the mixed state.</summary>
    public ulong Next()
    {
        _state = unchecked(_state + Gamma);
        return Mix(_state);
    }

    /// <summary>A uniform integer in [0, <paramref name="bound"/>), by Lemire's method (exactly uniform).</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="bound"/> is not positive.</exception>
    public int NextBelow(int bound)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(bound);
        ulong s = (ulong)bound;
        ulong high = Math.BigMul(Next(), s, out ulong low);
        if (low < s)
        {
            ulong threshold = unchecked(0UL - s) % s;
            while (low < threshold)
                high = Math.BigMul(Next(), s, out low);
        }
        return (int)high;
    }

    /// <summary>The SplitMix64 output function applied to <paramref name="z"/>.</summary>
    public static ulong Mix(ulong z)
    {
        unchecked
        {
            z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
            z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
            return z ^ (z >> 31);
        }
    }
}
