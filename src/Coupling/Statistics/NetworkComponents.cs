using Coupling.Measures;

namespace Coupling.Statistics;

/// <summary>Connected components of a set of channel-pair edges (union-find with path halving and union by size).</summary>
/// <remarks>Tarjan (1975), "Efficiency of a good but not linear set union algorithm", J ACM 22(2):215-225.</remarks>
public static class NetworkComponents
{
    /// <summary>
    /// Labels the components formed by the edges marked in <paramref name="edges"/> (one flag per pair, in
    /// <see cref="PairIndex"/> order). Components are numbered 0, 1, ... in the order of their first edge; a pair that is
    /// not an edge gets −1. Returns each component's size as its number of edges (its extent).
    /// </summary>
    /// <exception cref="ArgumentException">The spans do not have one entry per pair.</exception>
    public static int[] Label(int channels, ReadOnlySpan<bool> edges, Span<int> component)
    {
        int pairs = PairIndex.Count(channels);
        if (edges.Length != pairs || component.Length != pairs)
            throw new ArgumentException($"Expected {pairs} entries, one per pair of {channels} channels.");
        var parent = new int[channels];
        var size = new int[channels];
        for (int c = 0; c < channels; c++) { parent[c] = c; size[c] = 1; }
        for (int k = 0; k < pairs; k++)
        {
            if (!edges[k]) continue;
            var (a, b) = PairIndex.Channels(k, channels);
            int ra = Find(parent, a), rb = Find(parent, b);
            if (ra == rb) continue;
            if (size[ra] < size[rb]) (ra, rb) = (rb, ra);
            parent[rb] = ra;
            size[ra] += size[rb];
        }
        var number = new int[channels];
        Array.Fill(number, -1);
        var sizes = new List<int>();
        for (int k = 0; k < pairs; k++)
        {
            if (!edges[k]) { component[k] = -1; continue; }
            int root = Find(parent, PairIndex.Channels(k, channels).A);
            if (number[root] < 0) { number[root] = sizes.Count; sizes.Add(0); }
            component[k] = number[root];
            sizes[number[root]]++;
        }
        return sizes.ToArray();
    }

    /// <summary>The number of edges of the largest component (0 when there are no edges).</summary>
    public static int LargestExtent(int channels, ReadOnlySpan<bool> edges)
    {
        var component = new int[edges.Length];
        var sizes = Label(channels, edges, component);
        return sizes.Length == 0 ? 0 : sizes.Max();
    }

    private static int Find(int[] parent, int x)
    {
        while (parent[x] != x)
        {
            parent[x] = parent[parent[x]];
            x = parent[x];
        }
        return x;
    }
}
