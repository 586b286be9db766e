using BenchmarkDotNet.Running;
using Coupling.Benchmarks;

// Entry point: "w1 [--channels N] [--trials N] [--draws N] [--conditions N] [--threads N] [--step K]" times the
// reference workload end to end; "kernels [...]" times each kernel group; "precision PLAN [--draws N]" compares
// single-precision storage with double; "figures [--channels N] [--repeats N]" times figure drawing and writing;
// "corrections [--channels N] [--trials N] [--times N] [--draws N] [--threads N]" times the surrogate stage under each
// correction; "stages PLAN [--threads N]" times each stage of a plan's analysis; "clusters [--frequencies N]
// [--trials-a N] [--trials-b N] [--draws N] [--threads N] [--repeats N]" times the cluster test with and without evoked
// removal; anything else goes to BenchmarkDotNet.
if (args.Length > 1 && args[0] == "stages")
{
    int i = Array.IndexOf(args, "--threads");
    PlanStages.Run(args[1], i > 0 ? int.Parse(args[i + 1], System.Globalization.CultureInfo.InvariantCulture) : 0, Console.Out);
    return 0;
}
if (args.Length > 1 && args[0] == "precision")
{
    int i = Array.IndexOf(args, "--draws");
    Precision.Run(args[1], i > 0 ? int.Parse(args[i + 1], System.Globalization.CultureInfo.InvariantCulture) : 1000, Console.Out);
    return 0;
}
if (args.Length > 0 && (args[0] == "w1" || args[0] == "kernels" || args[0] == "figures" || args[0] == "corrections" || args[0] == "clusters"))
{
    int Option(string name, int fallback)
    {
        int i = Array.IndexOf(args, "--" + name);
        return i >= 0 && i + 1 < args.Length ? int.Parse(args[i + 1], System.Globalization.CultureInfo.InvariantCulture) : fallback;
    }
    int? step = Array.IndexOf(args, "--step") >= 0 ? Option("step", 1) : null;
    if (args[0] == "w1")
        EndToEnd.Run(Option("channels", 64), Option("trials", 100), Option("draws", 1000), Option("conditions", 2),
            Option("threads", 0), step, Console.Out);
    else if (args[0] == "corrections")
        CorrectionTiming.Run(Option("channels", 64), Option("trials", 50), Option("times", 16), Option("draws", 499),
            Option("threads", 0), Option("repeats", 3), Console.Out);
    else if (args[0] == "clusters")
        ClusterTiming.Run(Option("frequencies", 20), Option("trials-a", 10), Option("trials-b", 40), Option("draws", 199), Option("threads", 1),
            Option("repeats", 5), Console.Out);
    else if (args[0] == "figures")
        FigureTiming.Run(Option("channels", 10), Option("repeats", 9), Console.Out);
    else
        KernelTiming.Run(Option("channels", 64), Option("trials", 100), Option("times", 64), Option("repeats", 7), Console.Out);
    return 0;
}
BenchmarkSwitcher.FromAssembly(typeof(KernelBenchmarks).Assembly).Run(args);
return 0;
