using System.Diagnostics;
using Coupling.Measures;
using Coupling.Pipeline;
using Coupling.Spectral;
using Coupling.Trials;
using Coupling.Statistics;

namespace Coupling.Benchmarks;

/// <summary>Times the reference workload end to end: band isolation, surrogate tests, correction.</summary>
public static class EndToEnd
{
    public static void Run(int channels, int trials, int draws, int conditions, int threads, int? step, TextWriter output)
    {
        var measures = new[]
        {
            Measure.Plv, Measure.Ppc, Measure.Wpli, Measure.WpliDebiased, Measure.Coherence, Measure.ImagCoherency,
            Measure.Aec, Measure.AecOrth,
        };
        var decompositions = Workload.Decompositions();
        int pad = decompositions.Max(d => d.PadSamples);
        output.WriteLine($"workload: {channels} channels, {conditions} conditions x {trials} trials, {Workload.Bands.Length} bands, " +
            $"{measures.Length} measures, {draws} surrogates, threads {(threads > 0 ? threads.ToString() : "all")} ({Environment.ProcessorCount} cores)");
        double extract = 0, surrogates = 0, correction = 0, generate = 0;
        long totalDrawWork = 0;
        var clock = Stopwatch.StartNew();
        for (int condition = 0; condition < conditions; condition++)
        {
            var t0 = Stopwatch.GetTimestamp();
            TrialSet? trialSet = Workload.Trials($"c{condition}", channels, trials, pad, seed: 1000 + (ulong)condition);
            generate += Stopwatch.GetElapsedTime(t0).TotalSeconds;
            // As the pipeline does (AnalysisRunner, BandOrder): every band first, then the trials are let go, when the
            // narrowband sets are the smaller.
            var steps = decompositions.Select(d => step ?? TimeStep.Default(d.Info, Workload.SampleRate)).ToArray();
            var sets = new NarrowbandSet?[decompositions.Length];
            var isolation = new double[decompositions.Length];
            if (BandOrder.IsolateAllFirst(trialSet, Workload.Window, steps))
            {
                for (int b = 0; b < decompositions.Length; b++)
                {
                    t0 = Stopwatch.GetTimestamp();
                    sets[b] = NarrowbandExtractor.Extract(trialSet, decompositions[b], Workload.Window, steps[b], threads);
                    isolation[b] = Stopwatch.GetElapsedTime(t0).TotalSeconds;
                }
                trialSet = null;
            }
            for (int b = 0; b < decompositions.Length; b++)
            {
                int k = steps[b];
                t0 = Stopwatch.GetTimestamp();
                var set = sets[b] ?? NarrowbandExtractor.Extract(trialSet!, decompositions[b], Workload.Window, k, threads);
                sets[b] = null;
                double e = isolation[b] + Stopwatch.GetElapsedTime(t0).TotalSeconds;
                extract += e;
                t0 = Stopwatch.GetTimestamp();
                var results = SurrogateTest.Run(set, measures, draws, seed: (ulong)(17 + 31 * condition + b), $"c{condition}",
                    threads > 0 ? threads : null);
                double s = Stopwatch.GetElapsedTime(t0).TotalSeconds;
                surrogates += s;
                t0 = Stopwatch.GetTimestamp();
                foreach (var r in results) FalseDiscoveryRate.BenjaminiHochberg(r.P);
                correction += Stopwatch.GetElapsedTime(t0).TotalSeconds;
                totalDrawWork += draws;
                if (condition == 0)
                    output.WriteLine($"  band {Workload.Bands[b].Name,-10} step {k,2} samples, {set.TimeCount,3} time points: " +
                        $"isolation {e,7:F2} s, surrogates {s,8:F2} s ({draws / s,8:F1} draws/s)");
            }
        }
        double wall = clock.Elapsed.TotalSeconds;
        output.WriteLine($"stages: synthetic data {generate:F2} s, band isolation {extract:F2} s, surrogate tests {surrogates:F2} s, correction {correction:F3} s");
        output.WriteLine($"total {wall:F2} s; {totalDrawWork / surrogates:F1} draws/s over all (condition, band) tables (each draw: all {measures.Length} measures, all {PairIndex.Count(channels)} pairs)");
        output.WriteLine($"peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / (1024.0 * 1024.0):F0} MiB");
    }
}
