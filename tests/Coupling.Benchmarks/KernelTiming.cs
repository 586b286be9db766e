using System.Diagnostics;
using Coupling.Measures;

namespace Coupling.Benchmarks;

/// <summary>
/// Times one surrogate draw of each kernel group on one thread and reports the cost per pair and time point and,
/// for the matrix-product groups, the floating-point rate.
/// </summary>
public static class KernelTiming
{
    public static readonly (string Name, Measure[] Measures, double FlopsPerPairTrialTime)[] Groups =
    [
        // One complex product per pair, trial and time point: 4 real multiplications and 4 additions.
        ("phase (plv, ppc)", [Measure.Plv, Measure.Ppc], 8),
        ("cross (coherence, imag-coherency)", [Measure.Coherence, Measure.ImagCoherency], 8),
        ("lag (pli, wpli, wpli-debiased)", [Measure.Pli, Measure.Wpli, Measure.WpliDebiased], 0),
        ("lag, wpli alone", [Measure.Wpli], 0),
        ("lag, pli alone", [Measure.Pli], 0),
        // One multiply-add per pair, trial and time point.
        ("aec", [Measure.Aec], 2),
        ("aec-orth", [Measure.AecOrth], 0),
        ("all nine", MeasureCatalog.All.ToArray(), 0),
    ];

    public static void Run(int channels, int trials, int times, int repeats, TextWriter output)
    {
        var set = SyntheticSets.Random(channels, trials, times, seed: 5);
        var perm = SyntheticSets.Permutation(trials, seed: 9);
        int pairs = PairIndex.Count(channels);
        output.WriteLine($"kernels: {channels} channels, {trials} trials, {times} time points, one thread, median of {repeats}");
        foreach (var (name, measures, flops) in Groups)
        {
            var workspace = new PairwiseWorkspace(set, measures);
            var values = new double[workspace.OutputLength];
            var (seconds, processor) = Time(() => PairwiseKernels.Compute(workspace, perm, values), 1, pairs, trials, times, repeats);
            // As a surrogate test runs them: a chunk of draws through the time points together, each with its own trial
            // order and workspace over the same tables.
            var siblings = Enumerable.Range(0, Together).Select(i => i == 0 ? workspace : workspace.CreateSibling()).ToArray();
            var orders = Enumerable.Range(0, Together).Select(i => SyntheticSets.Permutation(trials, seed: 9 + (ulong)i)).ToArray();
            var outputs = Enumerable.Range(0, Together).Select(_ => new double[workspace.OutputLength]).ToArray();
            var (together, _) = Time(() => PairwiseKernels.ComputeTogether(siblings, orders, outputs), Together, pairs, trials, times, repeats);
            // The minimum is quoted beside the median: on a shared machine it is the best estimate of what the kernel
            // does when it has the core to itself.
            double draw = seconds[repeats / 2], best = seconds[0];
            double perPairTime = draw / ((double)pairs * times) * 1e9;
            double bestPerPairTime = best / ((double)pairs * times) * 1e9;
            string rate = flops > 0
                ? $", {flops * pairs * trials * times / draw / 1e9,6:F2} (best {flops * pairs * trials * times / best / 1e9,6:F2}) GFLOP/s"
                : "";
            output.WriteLine($"  {name,-36} {draw * 1e3,8:F3} ms/draw ({processor[repeats / 2] * 1e3,8:F3} processor), {perPairTime,7:F2} (best {bestPerPairTime,7:F2}) ns per pair and time point{rate}");
            output.WriteLine($"  {"  " + Together + " draws together",-36} {together[repeats / 2] * 1e3,8:F3} ms/draw (best {together[0] * 1e3,8:F3})" +
                             (flops > 0 ? $", {flops * pairs * trials * times / together[repeats / 2] / 1e9,6:F2} GFLOP/s" : ""));
        }
        // Not a draw: the report's power, stimulus locking and coherency lags, computed once per condition x band.
        var once = new double[repeats];
        SignalSummaries.Summarise(set, "timing");
        for (int r = 0; r < repeats; r++)
        {
            long t0 = Stopwatch.GetTimestamp();
            SignalSummaries.Summarise(set, "timing");
            once[r] = Stopwatch.GetElapsedTime(t0).TotalSeconds;
        }
        Array.Sort(once);
        output.WriteLine($"  {"signal summaries (once, not a draw)",-36} {once[repeats / 2] * 1e3,8:F3} ms, " +
                         $"{once[repeats / 2] / ((double)pairs * times) * 1e9,7:F2} (best {once[0] / ((double)pairs * times) * 1e9,7:F2}) ns per pair and time point");
    }

    /// <summary>Draws computed together per call in the second timing of each group (a surrogate test's chunk).</summary>
    private const int Together = 8;

    /// <summary>
    /// Per-draw wall and processor seconds of <paramref name="call"/> (which computes <paramref name="draws"/> draws),
    /// each sorted, after a warm-up past tiered compilation (at least 0.5 s and 60 calls).
    /// </summary>
    private static (double[] Wall, double[] Processor) Time(Action call, int draws, int pairs, int trials, int times, int repeats)
    {
        long warm = Stopwatch.GetTimestamp();
        for (int i = 0; i < 60 || Stopwatch.GetElapsedTime(warm).TotalSeconds < 0.5; i++) call();
        int inner = Math.Max(1, (int)(2e8 / ((double)pairs * trials * times * 8 * draws)));
        var seconds = new double[repeats];
        var processor = new double[repeats];
        var process = Process.GetCurrentProcess();
        for (int r = 0; r < repeats; r++)
        {
            process.Refresh();
            var c0 = process.TotalProcessorTime;
            long t0 = Stopwatch.GetTimestamp();
            for (int i = 0; i < inner; i++) call();
            seconds[r] = Stopwatch.GetElapsedTime(t0).TotalSeconds / (inner * draws);
            process.Refresh();
            processor[r] = (process.TotalProcessorTime - c0).TotalSeconds / (inner * draws);
        }
        Array.Sort(seconds);
        Array.Sort(processor);
        return (seconds, processor);
    }
}
