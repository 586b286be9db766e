using System.Numerics;
using Coupling.Spectral;

namespace Coupling.Tests.Spectral;

public class AnalyticTests
{
    // Reference: scipy.signal.hilbert 1.10.1 (Debian python3-scipy), Fixtures/Spectral/analytic_signal.json, lengths
    // 1, 2, 3, 8, 17, 64, 101, 250 (odd and even). Both are FFT round trips of size n (MathNet uses Bluestein for
    // lengths that are not powers of two): rounding ~ eps log2(n) times the signal norm, so 1e-12 of the norm.
    [Fact]
    public void Analytic_signal_matches_scipy_hilbert_for_odd_and_even_lengths()
    {
        int checkedCases = 0;
        foreach (var c in SpectralFixtures.Cases("analytic_signal.json"))
        {
            double[] x = c.Doubles("x"), re = c.Doubles("re"), im = c.Doubles("im");
            var z = Analytic.Hilbert(x);
            double norm = Math.Sqrt(x.Sum(v => v * v));
            for (int i = 0; i < x.Length; i++)
            {
                Assert.Equal(re[i], z[i].Real, 1e-12 * norm);
                Assert.Equal(im[i], z[i].Imaginary, 1e-12 * norm);
            }
            checkedCases++;
        }
        Assert.Equal(8, checkedCases);
    }

    // Marple (1999): the analytic signal of cos(w n) with a whole number of periods in the segment is exp(i w n).
    [Theory]
    [InlineData(256, 10)]
    [InlineData(255, 7)]
    public void Analytic_signal_of_a_cosine_is_a_complex_exponential(int n, int periods)
    {
        double w = 2 * Math.PI * periods / n;
        var x = Enumerable.Range(0, n).Select(i => Math.Cos(w * i + 0.4)).ToArray();
        var z = Analytic.Hilbert(x);
        for (int i = 0; i < n; i++)
        {
            var expected = Complex.FromPolarCoordinates(1, w * i + 0.4);
            Assert.True((z[i] - expected).Magnitude < 1e-12, $"sample {i}: {z[i]} vs {expected}");
        }
    }

    // Parseval with Marple's weights: sum |z|^2 = (1/n)(|X0|^2 + |X_{n/2}|^2 + 4 sum_pos |Xk|^2)
    // = 2 sum x^2 - (|X0|^2 + |X_{n/2}|^2) / n, where X0 = sum x and (even n) X_{n/2} = sum (-1)^i x[i].
    // Also Re z = x (Marple 1999, property 1).
    [Theory]
    [InlineData(128)]
    [InlineData(129)]
    public void Analytic_signal_keeps_the_real_part_and_doubles_the_energy_outside_DC_and_Nyquist(int n)
    {
        var random = new Random(3);
        var x = Enumerable.Range(0, n).Select(_ => random.NextDouble() + 0.2).ToArray();
        var z = Analytic.Hilbert(x);
        double energy = x.Sum(v => v * v);
        double dc = x.Sum();
        double nyquist = n % 2 == 0 ? x.Select((v, i) => i % 2 == 0 ? v : -v).Sum() : 0;
        double expected = 2 * energy - (dc * dc + nyquist * nyquist) / n;
        Assert.Equal(expected, z.Sum(v => v.Magnitude * v.Magnitude), 1e-12 * energy);
        for (int i = 0; i < n; i++) Assert.Equal(x[i], z[i].Real, 1e-13);
    }
}
