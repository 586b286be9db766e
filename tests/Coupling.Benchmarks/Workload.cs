using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Trials;

namespace Coupling.Benchmarks;

/// <summary>The reference workload: synthetic 1/f-like noise trials, five bands, one analysis window.</summary>
public static class Workload
{
    public const double SampleRate = 500;
    public const double TrialStart = -0.5, TrialEnd = 2.0;
    public static readonly TimeRange Window = new(0.5, 1.5);

    public static readonly Band[] Bands =
    [
        new("theta", 4, 8), new("alpha", 8, 13), new("beta", 13, 30), new("low-gamma", 30, 45), new("high-gamma", 55, 90),
    ];

    public static IBandDecomposition[] Decompositions() =>
        Bands.Select(b => BandDecompositions.Create(BandDecompositions.FirHilbert, b, SampleRate)).ToArray();

    /// <summary>
    /// Trials of one condition: each channel is an AR(1) process (coefficient 0.97, a spectrum falling roughly as
    /// 1/f² above a few Hz) plus a small white floor, independent across channels and trials.
    /// </summary>
    public static TrialSet Trials(string condition, int channels, int trials, int pad, ulong seed)
    {
        int span = (int)Math.Round((TrialEnd - TrialStart) * SampleRate);
        int samples = span + 2 * pad;
        var data = new double[(long)trials * channels * samples];
        var random = new SplitMix64(seed);
        for (int n = 0; n < trials; n++)
            for (int c = 0; c < channels; c++)
            {
                var row = data.AsSpan((n * channels + c) * samples, samples);
                double x = 0;
                for (int s = 0; s < samples; s++)
                {
                    x = 0.97 * x + Uniform(ref random);
                    row[s] = x + 0.1 * Uniform(ref random);
                }
            }
        var labels = Enumerable.Range(1, channels).Select(c => $"E{c}").ToArray();
        var onsets = Enumerable.Range(0, trials).Select(n => 10.0 * n).ToArray();
        return new TrialSet(condition, labels, SampleRate, trials, samples, pad, TrialStart, data, onsets, []);
    }

    private static double Uniform(ref SplitMix64 random) => (random.Next() >> 11) * (1.0 / (1UL << 53)) - 0.5;
}
