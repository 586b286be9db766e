using Coupling.Formats;
using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Tests.Outputs;

/// <summary>Small hand-made pair results shared by the output, graph and figure tests.</summary>
internal static class SampleResults
{
    /// <summary>
    /// Four channels Pz, Cz, Fz, Oz (label order differs from index order on purpose). Pairs in PairIndex order:
    /// Pz-Cz 0.5 sig, Pz-Fz -0.3 sig, Pz-Oz 0.1, Cz-Fz 0.9 (not significant), Cz-Oz NaN, Fz-Oz 0.2 sig.
    /// </summary>
    public static PairResult FourChannels(bool withPositions = false) => new(
        "rest", "alpha", "plv",
        ["Pz", "Cz", "Fz", "Oz"],
        Value: [0.5, -0.3, 0.1, 0.9, double.NaN, 0.2],
        Z: [4.25, -3.5, 0.75, 1.5, double.NaN, 2.875],
        P: [0.001, 0.002, 0.4, 0.06, double.NaN, 0.004],
        PCorrected: [0.003, 0.004, 0.48, 0.072, double.NaN, 0.006],
        Significant: [true, true, false, false, false, true],
        Positions: withPositions
            ? [new ChannelPosition(0, -0.5, 0), new ChannelPosition(0, 0, 0.9), new ChannelPosition(0, 0.6, 0.3), new ChannelPosition(0, -0.9, 0)]
            : null);

    /// <summary>A result of <paramref name="channels"/> channels with deterministic values and the given significance rule.</summary>
    public static PairResult Grid(int channels, Func<int, int, bool> significant, string measure = "wpli", bool signed = false)
    {
        int n = PairIndex.Count(channels);
        var value = new double[n];
        var z = new double[n];
        var p = new double[n];
        var pc = new double[n];
        var sig = new bool[n];
        for (int k = 0; k < n; k++)
        {
            var (a, b) = PairIndex.Channels(k, channels);
            double v = (1 + (a * 7 + b * 3) % 10) / 10.0;
            value[k] = signed && (a + b) % 2 == 1 ? -v : v;
            z[k] = 5 * v;
            p[k] = 1.0 / (k + 2);
            pc[k] = Math.Min(1, 2.0 / (k + 2));
            sig[k] = significant(a, b);
        }
        var labels = Enumerable.Range(0, channels).Select(i => $"Ch{i + 1}").ToArray();
        return new PairResult("task", "theta", measure, labels, value, z, p, pc, sig);
    }
}
