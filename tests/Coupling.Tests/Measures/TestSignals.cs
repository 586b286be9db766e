using System.Numerics;
using Coupling.Spectral;

namespace Coupling.Tests.Measures;

/// <summary>Invented narrowband data for the measure and statistics tests.</summary>
internal static class TestSignals
{
    public static readonly Band TestBand = new("test", 8, 12);

    /// <summary>Builds a set from a function of (time point, channel, trial).</summary>
    public static NarrowbandSet Build(int channels, int trials, int times, Func<int, int, int, Complex> value)
    {
        var data = new Complex[channels * trials * times];
        for (int t = 0; t < times; t++)
            for (int c = 0; c < channels; c++)
                for (int n = 0; n < trials; n++)
                    data[(t * channels + c) * trials + n] = value(t, c, n);
        return Wrap(channels, trials, times, data);
    }

    public static NarrowbandSet Wrap(int channels, int trials, int times, Complex[] data)
    {
        var labels = Enumerable.Range(1, channels).Select(c => $"ch{c}").ToArray();
        var timeAxis = Enumerable.Range(0, times).Select(t => t / 250.0).ToArray();
        return new NarrowbandSet(TestBand, labels, trials, timeAxis, data);
    }

    /// <summary>Independent circular complex Gaussian values (unit variance) with a random scale per channel.</summary>
    public static NarrowbandSet Random(int channels, int trials, int times, int seed, double zeroFraction = 0)
    {
        var random = new Random(seed);
        var scale = Enumerable.Range(0, channels).Select(_ => 0.5 + 2 * random.NextDouble()).ToArray();
        return Build(channels, trials, times, (t, c, n) =>
            random.NextDouble() < zeroFraction ? Complex.Zero : scale[c] * Gaussian(random));
    }

    /// <summary>A circular complex Gaussian value with E|z|² = 1 (Box-Muller).</summary>
    public static Complex Gaussian(Random random)
    {
        double u1 = 1 - random.NextDouble(), u2 = random.NextDouble();
        double radius = Math.Sqrt(-Math.Log(u1));
        return Complex.FromPolarCoordinates(radius, 2 * Math.PI * u2);
    }

    /// <summary>A unit phasor with a uniform random phase.</summary>
    public static Complex UniformPhasor(Random random) =>
        Complex.FromPolarCoordinates(1, 2 * Math.PI * random.NextDouble());

    public static int[] Identity(int n) => Enumerable.Range(0, n).ToArray();
}
