using Coupling.Spectral;

namespace Coupling.Tests.Spectral;

public class DpssTapersTests
{
    // Reference: scipy.signal.windows.dpss 1.10.1 (Debian python3-scipy), sym=True, norm=2, return_ratios=True;
    // Fixtures/Spectral/dpss_tapers.json made by make_dpss_fixture.py. scipy solves the same tridiagonal problem with
    // LAPACK's stebz/stein, this code with MathNet's dense symmetric QL: both give eigenvectors to about N eps of the
    // largest sample (N <= 250, so ~6e-14); 1e-10 allows for the eigenvector's conditioning (the gap between adjacent
    // eigenvalues of the tridiagonal matrix is of order N, its norm of order N^2).
    [Fact]
    public void Tapers_and_concentrations_match_scipy()
    {
        int cases = 0;
        foreach (var c in SpectralFixtures.Cases("dpss_tapers.json"))
        {
            int length = c.Int("length"), count = c.Int("count");
            var dpss = DpssTapers.Create(length, c.Double("nw"), count);
            var expected = c.GetProperty("tapers").EnumerateArray().Select(r => r.EnumerateArray().Select(v => v.GetDouble()).ToArray()).ToArray();
            double[] ratios = c.Doubles("ratios");
            Assert.Equal(count, dpss.Count);
            for (int k = 0; k < count; k++)
            {
                for (int i = 0; i < length; i++)
                    Assert.True(Math.Abs(expected[k][i] - dpss.Tapers[k][i]) <= 1e-10,
                        $"N={length} NW={c.Double("nw")} taper {k} sample {i}: {dpss.Tapers[k][i]} vs {expected[k][i]}");
                // scipy forms the ratio from an FFT autocorrelation, this code from a direct one: sums of N products,
                // agreeing to ~N eps; 1e-12 absolute.
                Assert.True(Math.Abs(ratios[k] - dpss.Concentrations[k]) <= 1e-12, $"ratio {k}: {dpss.Concentrations[k]} vs {ratios[k]}");
            }
            cases++;
        }
        Assert.Equal(5, cases);
    }

    // Slepian (1978): the sequences are eigenvectors of a symmetric matrix, hence orthonormal. Tolerance: inner products
    // of N <= 300 unit-scale terms, ~N eps = 7e-14, after a QL decomposition accurate to a few N eps; 1e-12.
    [Theory]
    [InlineData(50, 2.0, 3)]
    [InlineData(300, 4.0, 7)]
    public void Tapers_are_orthonormal(int length, double nw, int count)
    {
        var dpss = DpssTapers.Create(length, nw, count);
        for (int j = 0; j < count; j++)
            for (int k = 0; k < count; k++)
            {
                double dot = 0;
                for (int i = 0; i < length; i++) dot += dpss.Tapers[j][i] * dpss.Tapers[k][i];
                Assert.Equal(j == k ? 1.0 : 0.0, dot, 1e-12);
            }
    }

    // Thomson (1982), section III; Percival and Walden (1993), section 8.3: the concentrations are decreasing and lie in
    // (0, 1); the first 2NW - 1 are near 1 (for NW = 4, N = 512 the seventh is about 0.94 and the first above
    // 0.99999999, Percival and Walden table 390, from memory, so checked only as "above 0.9" and "above 0.9999999").
    // Also checked directly: the fraction of each taper's energy within |f| <= W from a zero-padded DFT, against the ratio.
    [Fact]
    public void Concentrations_decrease_lie_in_the_unit_interval_and_equal_the_in_band_energy()
    {
        const int length = 128;
        var dpss = DpssTapers.Create(length, 4.0, 8);
        for (int k = 0; k < dpss.Count; k++)
        {
            Assert.InRange(dpss.Concentrations[k], 0.0, 1.0);
            if (k > 0) Assert.True(dpss.Concentrations[k] < dpss.Concentrations[k - 1]);
        }
        Assert.True(dpss.Concentrations[0] > 0.9999999);
        Assert.True(dpss.Concentrations[6] > 0.9);
        Assert.True(dpss.Concentrations[7] < dpss.Concentrations[6]);

        // In-band energy by a Riemann sum of |V(f)|^2 over a fine frequency grid (Parseval: the whole band [-1/2, 1/2)
        // holds energy 1). 16384 points over the unit interval; the integrand is smooth and only the two cells at the band edges are cut, so the error is at most about 2 max|V|^2 / 16384 times the small in-band-edge level, far
        // below 1e-6, the tolerance.
        const int grid = 16384;
        double w = dpss.HalfBandwidth;
        for (int k = 0; k < 3; k++)
        {
            double inBand = 0;
            for (int g = 0; g < grid; g++)
            {
                double f = -0.5 + (g + 0.5) / grid;
                if (Math.Abs(f) > w) continue;
                double re = 0, im = 0;
                for (int i = 0; i < length; i++)
                {
                    re += dpss.Tapers[k][i] * Math.Cos(2 * Math.PI * f * i);
                    im -= dpss.Tapers[k][i] * Math.Sin(2 * Math.PI * f * i);
                }
                inBand += (re * re + im * im) / grid;
            }
            Assert.Equal(dpss.Concentrations[k], inBand, 1e-6);
        }
    }

    [Fact]
    public void Out_of_range_arguments_are_refused_with_the_value_named()
    {
        var e = Assert.Throws<InputException>(() => DpssTapers.Create(1, 1, 1));
        Assert.Contains("length 1", e.Message);
        Assert.Throws<InputException>(() => DpssTapers.Create(10, 5, 1));
        Assert.Throws<InputException>(() => DpssTapers.Create(10, 2, 11));
        Assert.Equal(7, DpssTapers.DefaultCount(4));
    }
}
