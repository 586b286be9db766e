namespace Coupling.Measures;

/// <summary>
/// The order in which channel pairs are stored: all pairs (a, b) with a &lt; b, row by row:
/// (0,1), (0,2), ..., (0,C-1), (1,2), ... Every per-pair array in the program uses this order.
/// </summary>
public static class PairIndex
{
    /// <summary>Number of pairs of <paramref name="channels"/> channels.</summary>
    public static int Count(int channels) => channels * (channels - 1) / 2;

    /// <summary>Index of pair (a, b), a &lt; b, among <paramref name="channels"/> channels.</summary>
    public static int Of(int a, int b, int channels)
    {
        if (a >= b) throw new ArgumentException($"Pair ({a},{b}) must have a < b.");
        return a * channels - a * (a + 1) / 2 + (b - a - 1);
    }

    /// <summary>The channels (a, b) of pair <paramref name="index"/>.</summary>
    public static (int A, int B) Channels(int index, int channels)
    {
        int a = 0, start = 0;
        while (start + (channels - a - 1) <= index) { start += channels - a - 1; a++; }
        return (a, a + 1 + (index - start));
    }
}
