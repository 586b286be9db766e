using Coupling.Trials;

namespace Coupling.Tests.TimeFrequency;

/// <summary>Invented trials for the time-frequency tests.</summary>
internal static class TimeFrequencyTrials
{
    /// <summary>
    /// Trials of the given channels, sampled at <paramref name="rate"/> from <paramref name="start"/> s for
    /// <paramref name="samples"/> samples plus <paramref name="pad"/> at each end, valued by (trial, channel, time s).
    /// </summary>
    public static TrialSet Make(int trials, int channels, double rate, double start, int samples, int pad, Func<int, int, double, double> value)
    {
        int total = samples + 2 * pad;
        var data = new double[trials * channels * total];
        for (int n = 0; n < trials; n++)
            for (int c = 0; c < channels; c++)
                for (int s = 0; s < total; s++)
                    data[(n * channels + c) * total + s] = value(n, c, start + (s - pad) / rate);
        return new TrialSet("test", Enumerable.Range(1, channels).Select(c => $"ch{c}").ToArray(), rate, trials, total, pad, start,
            data, Enumerable.Repeat(double.NaN, trials).ToArray(), []);
    }

    /// <summary>Standard normal values (Box-Muller) from <paramref name="random"/>.</summary>
    public static double Normal(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
}
