using System.Numerics;
using Coupling.Spectral;
using Coupling.Statistics;

namespace Coupling.Benchmarks;

/// <summary>Random narrowband sets for the kernel timings (independent circular Gaussian values).</summary>
public static class SyntheticSets
{
    public static NarrowbandSet Random(int channels, int trials, int times, ulong seed)
    {
        var random = new SplitMix64(seed);
        var data = new Complex[(long)channels * trials * times];
        for (long i = 0; i < data.Length; i++)
        {
            double u1 = 1 - (random.Next() >> 11) * (1.0 / (1UL << 53)), u2 = (random.Next() >> 11) * (1.0 / (1UL << 53));
            data[i] = Complex.FromPolarCoordinates(Math.Sqrt(-Math.Log(u1)), 2 * Math.PI * u2);
        }
        var labels = Enumerable.Range(1, channels).Select(c => $"E{c}").ToArray();
        var axis = Enumerable.Range(0, times).Select(t => t / 500.0).ToArray();
        return new NarrowbandSet(new Band("test", 8, 13), labels, trials, axis, data);
    }

    public static int[] Permutation(int trials, ulong seed)
    {
        var perm = new int[trials];
        TrialShuffle.Generate(seed, 0, perm);
        return perm;
    }
}
