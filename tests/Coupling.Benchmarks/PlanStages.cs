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
/// (<see cref="AnalysisRunner.Run"/>, writing the results) once more, warm. Each figure is "wall / cpu" seconds: on a
/// shared machine the process's processor time is the steadier of the two.
/// </summary>
public static class PlanStages
{
    public static void Run(string planPath, int threads, TextWriter output)
    {
        double startup = (DateTime.Now - Process.GetCurrentProcess().StartTime).TotalSeconds;
        var clock = Stopwatch.StartNew();
        var process = Process.GetCurrentProcess();
        var cpu = process.TotalProcessorTime;
        string Lap()
        {
            double s = clock.Elapsed.TotalSeconds;
            process.Refresh();
            double c = (process.TotalProcessorTime - cpu).TotalSeconds;
            cpu = process.TotalProcessorTime;
            clock.Restart();
            return $"{s:F2}/{c:F2} s";
        }

        var plan = PlanReader.Read(planPath);
        string read = Lap();
        var input = InputLoader.Load(plan);
        string load = Lap();
        var decompositions = plan.Bands.Select(b => BandDecompositions.Create(plan.Decomposition.Method, b, input.SampleRate,
            new BandDecompositionOptions(plan.Decomposition.TransitionHz, plan.Decomposition.AttenuationDb, plan.Decomposition.Cycles))).ToArray();
        int pad = decompositions.Max(d => d.PadSamples);
        string design = Lap();
        output.WriteLine($"start-up {startup:F2} s, plan {read}, input {load}, band design {design} (wall/cpu)");
        int workers = threads > 0 ? threads : plan.Threads;
        foreach (var condition in plan.Conditions)
        {
            var trials = input.Trials(condition, plan.Trial, pad);
            output.WriteLine($"{condition.Name}: cut {trials.TrialCount} trials x {trials.ChannelCount} channels x {trials.SampleCount} samples in {Lap()}");
            foreach (var d in decompositions)
            {
                int step = plan.Decomposition.TimeStep ?? TimeStep.Default(d.Info, input.SampleRate);
                var set = NarrowbandExtractor.Extract(trials, d, plan.Window, step, workers);
                string extract = Lap();
                var workspace = new PairwiseWorkspace(set, plan.Measures);
                string tables = Lap();
                var identity = Enumerable.Range(0, set.TrialCount).ToArray();
                var values = new double[workspace.OutputLength];
                PairwiseKernels.Compute(workspace, identity, values);
                string first = Lap();
                PairwiseKernels.Compute(workspace, identity, values);
                string second = Lap();
                SurrogateTest.Run(set, plan.Measures, plan.Surrogates, 1, condition.Name, workers > 0 ? workers : null);
                string test = Lap();
                output.WriteLine($"  {d.Band.Name}: {set.TimeCount} time points; band isolation {extract}, tables {tables}, " +
                    $"one computation {first} (again {second}), surrogate test ({plan.Surrogates} draws) {test}");
            }
        }
        var outcome = AnalysisRunner.Run(plan, threads: threads);
        output.WriteLine($"whole run again (warm, writing {outcome.OutputFolder}): {Lap()}");
        output.WriteLine($"peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / (1024.0 * 1024.0):F0} MiB");
    }
}
