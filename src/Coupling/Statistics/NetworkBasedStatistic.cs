namespace Coupling.Statistics;

/// <summary>
/// The network-based statistic: family-wise error control on connected components of supra-threshold edges rather than
/// on single edges.
/// </summary>
/// <remarks>
/// Zalesky, Fornito and Bullmore (2010), "Network-based statistic: identifying differences in brain networks", NeuroImage
/// 53:1197-1207: edges whose test statistic exceeds a threshold chosen beforehand form a graph; each connected component
/// is scored by its extent (number of edges); the null distribution of the largest extent comes from the same permutation
/// draws, thresholded the same way; a component of extent e has the family-wise p = (1 + #{d : largest extent in draw d ≥
/// e})/(M + 1). The inference is on components: a significant component says the null is false somewhere in it, not at
/// each of its edges.
/// </remarks>
public static class NetworkBasedStatistic
{
    /// <summary>The observed components and their family-wise p-values.</summary>
    /// <param name="channels">Number of channels.</param>
    /// <param name="observed">The observed statistic per pair (PairIndex order); NaN is never supra-threshold.</param>
    /// <param name="threshold">An edge is supra-threshold when its statistic is strictly above this.</param>
    /// <param name="nullLargest">Per draw the largest extent of that draw's supra-threshold components.</param>
    /// <returns>Per pair its component (−1 for none) and per component its extent and p.</returns>
    /// <exception cref="ArgumentException">No draws, or <paramref name="observed"/> does not have one value per pair.</exception>
    public static (int[] Component, int[] Extent, double[] P) Test(int channels, ReadOnlySpan<double> observed, double threshold,
        ReadOnlySpan<int> nullLargest)
    {
        if (nullLargest.Length == 0) throw new ArgumentException("At least one draw is needed.", nameof(nullLargest));
        var edges = new bool[observed.Length];
        for (int k = 0; k < edges.Length; k++) edges[k] = observed[k] > threshold;
        var component = new int[observed.Length];
        var extent = NetworkComponents.Label(channels, edges, component);
        var p = new double[extent.Length];
        for (int c = 0; c < extent.Length; c++)
        {
            int atOrAbove = 0;
            foreach (int largest in nullLargest) if (largest >= extent[c]) atOrAbove++;
            p[c] = (atOrAbove + 1.0) / (nullLargest.Length + 1.0);
        }
        return (component, extent, p);
    }
}
