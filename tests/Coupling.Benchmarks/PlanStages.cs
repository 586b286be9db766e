using System.Diagnostics;
using Coupling.Measures;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Statistics;

namespace Coupling.Benchmarks;

/// <summary>
/// Times the stages of one plan's analysis in one process: start-up, reading the plan and the input, cutting trials,
/// band isolation, the kernel tables, one observed computation, the surrogate test, and then the whole run
/// (<see cref="AnalysisRunner.Run"/>, writing the results) once more, warm.
/// </summary>
public static class PlanStages
{
    public static void Run(string planPath, int threads, TextWriter output)
    {
        double startup = (DateTime.Now - Process.GetCurrentProcess().StartTime).TotalSeconds;
        var clock = Stopwatch.StartNew();
        double Lap() { double s = clock.Elapsed.TotalSeconds; clock.Restart(); return s; }

        var plan = PlanReader.Read(planPath);
        double read = Lap();
        var input = InputLoader.Load(plan);
        double load = Lap();
        var decompositions = plan.Bands.Select(b => BandDecompositions.Create(plan.Decomposition.Method, b, input.SampleRate,
            new BandDecompositionOptions(plan.Decomposition.TransitionHz, plan.Decomposition.AttenuationDb, plan.Decomposition.Cycles))).ToArray();
        int pad = decompositions.Max(d => d.PadSamples);
        double design = Lap();
        output.WriteLine($"start-up {startup:F2} s, plan {read:F3} s, input {load:F2} s, band design {design:F2} s");
        int workers = threads > 0 ? threads : plan.Threads;
        foreach (var condition in plan.Conditions)
        {
            var trials = input.Trials(condition, plan.Trial, pad);
            output.WriteLine($"{condition.Name}: cut {trials.TrialCount} trials x {trials.ChannelCount} channels x {trials.SampleCount} samples in {Lap():F2} s");
            foreach (var d in decompositions)
            {
                int step = plan.Decomposition.TimeStep ?? TimeStep.Default(d.Info, input.SampleRate);
                var set = NarrowbandExtractor.Extract(trials, d, plan.Window, step, workers);
                double extract = Lap();
                var workspace = new PairwiseWorkspace(set, plan.Measures);
                double tables = Lap();
                var identity = Enumerable.Range(0, set.TrialCount).ToArray();
                var values = new double[workspace.OutputLength];
                PairwiseKernels.Compute(workspace, identity, values);
                double first = Lap();
                PairwiseKernels.Compute(workspace, identity, values);
                double second = Lap();
                SurrogateTest.Run(set, plan.Measures, plan.Surrogates, 1, condition.Name, workers > 0 ? workers : null);
                double test = Lap();
                output.WriteLine($"  {d.Band.Name}: {set.TimeCount} time points; band isolation {extract:F2} s, tables {tables:F2} s, " +
                    $"one computation {first:F3} s (again {second:F3} s), surrogate test ({plan.Surrogates} draws) {test:F2} s");
            }
        }
        var outcome = AnalysisRunner.Run(plan, threads: threads);
        output.WriteLine($"whole run again (warm, writing {outcome.OutputFolder}): {Lap():F2} s");
        output.WriteLine($"peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / (1024.0 * 1024.0):F0} MiB");
    }
}
