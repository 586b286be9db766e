namespace Coupling.Graphs;

/// <summary>
/// A partition of a <see cref="ChannelGraph"/> into modules by the Louvain method, in a fixed order so that the same
/// graph always gives the same partition.
/// </summary>
/// <remarks>
/// Blondel VD, Guillaume J-L, Lambiotte R, Lefebvre E (2008). Fast unfolding of communities in large networks.
/// Journal of Statistical Mechanics P10008. Phase 1 visits the nodes in channel order (the paper's order is
/// arbitrary; no random order is drawn here) and moves each to the neighbouring module with the largest positive gain
/// in weighted modularity (resolution 1), the gain of joining module C being k_i,C / m - S_C k_i / (2 m^2) (the
/// paper's Eq. 2 up to the terms that do not depend on C); ties keep the current module, then the module met first.
/// Sweeps repeat until no node moves. Phase 2 merges each module into one node (internal weight as a self-loop) and
/// phase 1 runs again, until a level changes nothing. Channels without edges stay modules of their own.
/// </remarks>
public static class LouvainPartition
{
    /// <summary>
    /// Module of every channel (channel order), numbered from 1 in the order of each module's first channel; every
    /// channel in a module of its own when the graph has no edge or a weight is not finite.
    /// </summary>
    public static int[] Find(ChannelGraph graph)
    {
        ArgumentNullException.ThrowIfNull(graph);
        int n = graph.VertexCount;
        if (!GraphMeasures.ModularityDefined(graph)) return Enumerable.Range(1, n).ToArray();

        // a[i, j]: weight between level nodes i and j (j != i), a[i, i]: twice the weight inside node i, so that the
        // row sum is the node's strength and the sum of all entries is 2m.
        var a = new double[n, n];
        foreach (var e in graph.Edges)
        {
            a[e.A, e.B] += e.Weight;
            a[e.B, e.A] += e.Weight;
        }
        var membership = Enumerable.Range(0, n).ToArray();
        while (true)
        {
            var community = MoveNodes(a);
            var relabel = GraphMeasures.Renumber(community);
            int count = relabel.Max();
            if (count == a.GetLength(0)) break; // nothing moved at this level
            for (int i = 0; i < n; i++) membership[i] = relabel[membership[i]] - 1;
            a = Aggregate(a, relabel, count);
        }
        return GraphMeasures.Renumber(membership);
    }

    /// <summary>Phase 1 on the level graph <paramref name="a"/>: the community of each level node.</summary>
    private static int[] MoveNodes(double[,] a)
    {
        int n = a.GetLength(0);
        var k = new double[n];
        double twoM = 0;
        for (int i = 0; i < n; i++)
        {
            for (int j = 0; j < n; j++) k[i] += a[i, j];
            twoM += k[i];
        }
        var community = Enumerable.Range(0, n).ToArray();
        var total = (double[])k.Clone();
        var toCommunity = new double[n];
        var seen = new List<int>();
        double tolerance = 1e-12 * twoM; // gains below rounding of sums of the weights count as none
        bool moved = true;
        while (moved)
        {
            moved = false;
            for (int i = 0; i < n; i++)
            {
                int own = community[i];
                seen.Clear();
                seen.Add(own);
                for (int j = 0; j < n; j++)
                {
                    if (j == i || a[i, j] == 0) continue;
                    int c = community[j];
                    if (toCommunity[c] == 0 && !seen.Contains(c)) seen.Add(c);
                    toCommunity[c] += a[i, j];
                }
                total[own] -= k[i];
                int best = own;
                double bestGain = toCommunity[own] - total[own] * k[i] / twoM;
                foreach (int c in seen)
                {
                    double gain = toCommunity[c] - total[c] * k[i] / twoM;
                    if (gain > bestGain + tolerance) { best = c; bestGain = gain; }
                }
                total[best] += k[i];
                if (best != own) { community[i] = best; moved = true; }
                foreach (int c in seen) toCommunity[c] = 0;
            }
        }
        return community;
    }

    /// <summary>Phase 2: the graph whose nodes are the communities (labels 1..count) of <paramref name="a"/>.</summary>
    private static double[,] Aggregate(double[,] a, int[] label, int count)
    {
        int n = a.GetLength(0);
        var b = new double[count, count];
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
                b[label[i] - 1, label[j] - 1] += a[i, j];
        return b;
    }
}
