using System.Diagnostics;
using Coupling.Figures;
using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Benchmarks;

/// <summary>
/// Times drawing and writing one matrix and one network figure as PNG, as SVG, and as both from one drawing:
/// medians over repeats, for a result of C channels with 10-10 labels and about 5 % of the pairs significant.
/// </summary>
internal static class FigureTiming
{
    private static readonly string[] Labels =
    [
        "Fp1", "Fpz", "Fp2", "AF7", "AF3", "AFz", "AF4", "AF8", "F7", "F5", "F3", "F1", "Fz", "F2", "F4", "F6", "F8",
        "FT7", "FC5", "FC3", "FC1", "FCz", "FC2", "FC4", "FC6", "FT8", "T7", "C5", "C3", "C1", "Cz", "C2", "C4", "C6", "T8",
        "TP7", "CP5", "CP3", "CP1", "CPz", "CP2", "CP4", "CP6", "TP8", "P7", "P5", "P3", "P1", "Pz", "P2", "P4", "P6", "P8",
        "PO7", "PO3", "POz", "PO4", "PO8", "O1", "Oz", "O2", "T9", "T10", "Iz",
    ];

    public static void Run(int channels, int repeats, TextWriter output)
    {
        var rng = new Random(7);
        int n = PairIndex.Count(channels);
        var value = Enumerable.Range(0, n).Select(_ => rng.NextDouble() * 0.6).ToArray();
        var sig = value.Select(_ => rng.NextDouble() < 0.05).ToArray();
        var p = new double[n];
        var names = Enumerable.Range(0, channels).Select(i => i < Labels.Length ? Labels[i] : $"X{i}").ToArray();
        var result = new PairResult("rest", "alpha", "plv", names, value, new double[n], p, p, sig);
        string dir = Directory.CreateTempSubdirectory("figure-timing").FullName;
        try
        {
            string png = Path.Combine(dir, "f.png"), svg = Path.Combine(dir, "f.svg");
            (string, Action)[] cases =
            [
                ("matrix png", () => MatrixFigure.Save(result, png)),
                ("matrix svg", () => MatrixFigure.Save(result, svg)),
                ("matrix png+svg", () => MatrixFigure.Save(result, [png, svg])),
                ("network png", () => NetworkFigure.Save(result, png)),
                ("network svg", () => NetworkFigure.Save(result, svg)),
                ("network png+svg", () => NetworkFigure.Save(result, [png, svg])),
            ];
            output.WriteLine($"figures: {channels} channels, {sig.Count(s => s)} significant pairs, median of {repeats} (ms)");
            foreach (var (name, action) in cases)
            {
                action(); // warm-up: fonts, JIT
                var times = new double[repeats];
                for (int r = 0; r < repeats; r++)
                {
                    var watch = Stopwatch.StartNew();
                    action();
                    times[r] = watch.Elapsed.TotalMilliseconds;
                }
                Array.Sort(times);
                output.WriteLine($"  {name,-16} median {times[repeats / 2],7:F1}  best {times[0],7:F1}");
            }
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}
