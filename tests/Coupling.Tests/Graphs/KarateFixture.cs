using System.Text.Json;
using Coupling.Graphs;
using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Tests.Graphs;

/// <summary>
/// Zachary's karate-club network (Zachary WW 1977, An information flow model for conflict and fission in small groups,
/// J Anthropol Res 33:452-473) and networkx's measures of it, read from Fixtures/Graphs/karate_networkx.json
/// (made by make_graph_fixtures.py there with Debian's networkx 2.8.8).
/// </summary>
internal static class KarateFixture
{
    public static string PathOf(string file) => Path.Combine(AppContext.BaseDirectory, "Fixtures", "Graphs", file);

    /// <summary>One variant ("binary", "weighted" or "strong") of the network with networkx's values.</summary>
    public static JsonElement Variant(string name)
    {
        using var document = JsonDocument.Parse(File.ReadAllText(PathOf("karate_networkx.json")));
        return document.RootElement.GetProperty("graphs").GetProperty(name).Clone();
    }

    /// <summary>The 34 members as channels v1..v34 (Zachary's numbering), the variant's edges as significant pairs.</summary>
    public static PairResult Result(JsonElement variant, int nodes = 34)
    {
        int n = PairIndex.Count(nodes);
        var value = new double[n];
        var z = new double[n];
        var p = new double[n];
        var pc = new double[n];
        var sig = new bool[n];
        Array.Fill(p, 0.5);
        Array.Fill(pc, 0.9);
        foreach (var e in variant.GetProperty("edges").EnumerateArray())
        {
            int a = e[0].GetInt32(), b = e[1].GetInt32();
            int k = PairIndex.Of(a, b, nodes);
            value[k] = e[2].GetDouble();
            z[k] = 2 * value[k] + 0.25;
            p[k] = 0.001;
            pc[k] = 0.01;
            sig[k] = true;
        }
        var labels = Enumerable.Range(1, nodes).Select(i => $"v{i}").ToArray();
        return new PairResult("club", "all", "ties", labels, value, z, p, pc, sig);
    }

    public static ChannelGraph Graph(string variant) => ChannelGraphs.Build(Result(Variant(variant)));

    public static double[] Doubles(this JsonElement e, string name) =>
        e.GetProperty(name).EnumerateArray().Select(v => v.GetDouble()).ToArray();

    public static int[] Ints(this JsonElement e, string name) =>
        e.GetProperty(name).EnumerateArray().Select(v => v.GetInt32()).ToArray();
}
