using System.Diagnostics;
using Coupling.Measures;
using Coupling.Statistics;

namespace Coupling.Benchmarks;

/// <summary>
/// Times the surrogate stage of one condition x band under each correction (FamilyCorrection): Benjamini-Hochberg with
/// counted p, with the Pareto tail, the maximum statistic and the network-based statistic (both make the draws twice).
/// </summary>
public static class CorrectionTiming
{
    public static void Run(int channels, int trials, int times, int draws, int threads, int repeats, TextWriter output)
    {
        var set = SyntheticSets.Random(channels, trials, times, seed: 5);
        Measure[] measures = [Measure.Plv, Measure.Wpli];
        output.WriteLine($"corrections: {channels} channels, {trials} trials, {times} time points, {draws} draws, measures plv and wpli, " +
                         $"{(threads > 0 ? threads.ToString(System.Globalization.CultureInfo.InvariantCulture) : "all")} threads, median of {repeats}");
        (string Name, CorrectionSpec Spec)[] cases =
        [
            ("benjamini-hochberg", new CorrectionSpec(CorrectionMethod.BenjaminiHochberg)),
            ("benjamini-hochberg, tail: pareto", new CorrectionSpec(CorrectionMethod.BenjaminiHochberg, ParetoTail: true)),
            ("max-statistic", new CorrectionSpec(CorrectionMethod.MaxStatistic)),
            ("network-based", new CorrectionSpec(CorrectionMethod.NetworkBased, Threshold: 3)),
        ];
        // Warm up past tiered compilation with a short run of every path.
        foreach (var (_, spec) in cases) FamilyCorrection.TestCondition(set, measures, 20, 1, "x", spec, 0.05, threads > 0 ? threads : null);
        double reference = 0;
        foreach (var (name, spec) in cases)
        {
            var seconds = new double[repeats];
            for (int r = 0; r < repeats; r++)
            {
                long t0 = Stopwatch.GetTimestamp();
                FamilyCorrection.TestCondition(set, measures, draws, 7, "x", spec, 0.05, threads > 0 ? threads : null);
                seconds[r] = Stopwatch.GetElapsedTime(t0).TotalSeconds;
            }
            Array.Sort(seconds);
            double median = seconds[repeats / 2];
            if (reference == 0) reference = median;
            output.WriteLine($"  {name,-34} {median,8:F2} s  ({median / reference:F2} x benjamini-hochberg)");
        }
    }
}
