using BenchmarkDotNet.Attributes;
using Coupling.Measures;
using Coupling.Spectral;

namespace Coupling.Benchmarks;

/// <summary>One surrogate draw of each kernel group (one thread), for BenchmarkDotNet.</summary>
[MemoryDiagnoser]
public class KernelBenchmarks
{
    private NarrowbandSet _set = null!;
    private int[] _perm = [];
    private readonly Dictionary<string, (PairwiseWorkspace Workspace, double[] Values)> _work = [];

    [Params(16, 64)]
    public int Channels { get; set; }

    [Params(100)]
    public int Trials { get; set; }

    [Params(64)]
    public int Times { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        _set = SyntheticSets.Random(Channels, Trials, Times, seed: 5);
        _perm = SyntheticSets.Permutation(Trials, seed: 9);
        foreach (var (name, measures, _) in KernelTiming.Groups)
        {
            var workspace = new PairwiseWorkspace(_set, measures);
            _work[name] = (workspace, new double[workspace.OutputLength]);
        }
    }

    private void Draw(int group)
    {
        var (workspace, values) = _work[KernelTiming.Groups[group].Name];
        PairwiseKernels.Compute(workspace, _perm, values);
    }

    [Benchmark] public void Phase() => Draw(0);
    [Benchmark] public void Cross() => Draw(1);
    [Benchmark] public void Lag() => Draw(2);
    [Benchmark] public void Aec() => Draw(3);
    [Benchmark] public void AecOrth() => Draw(4);
    [Benchmark] public void AllNine() => Draw(5);
}
