using Coupling.Spectral;

namespace Coupling.Tests.Spectral;

public class KaiserDesignTests
{
    // Reference: scipy.signal.kaiserord 1.10.1 (Debian python3-scipy), Fixtures/Spectral/kaiser_order.json,
    // which implements Kaiser (1974) as given in Oppenheim and Schafer, Discrete-Time Signal Processing, eq. 7.62-7.63.
    [Fact]
    public void Order_matches_scipy_kaiserord_raised_to_an_odd_length()
    {
        int checkedCases = 0;
        foreach (var c in SpectralFixtures.Cases("kaiser_order.json"))
        {
            double a = c.Double("attenuation_db"), tw = c.Double("transition_hz"), fs = c.Double("sample_rate");
            if (a < KaiserDesign.MinimumAttenuationDb) continue;
            int scipyTaps = c.Int("numtaps");
            var (taps, beta) = KaiserDesign.Order(a, tw, fs);
            Assert.Equal(scipyTaps % 2 == 0 ? scipyTaps + 1 : scipyTaps, taps);
            // Same closed form evaluated in the same order; Math.Pow and numpy's ** may differ by an ulp or two.
            Assert.Equal(c.Double("beta"), beta, 1e-14 * Math.Max(1, beta));
            checkedCases++;
        }
        Assert.True(checkedCases >= 40);
    }

    // Oppenheim and Schafer eq. 7.62: the three branches of beta, at values worked by hand from the formula.
    [Theory]
    [InlineData(20.0, 0.0)]
    [InlineData(21.0, 0.0)]
    [InlineData(60.0, 0.1102 * 51.3)]
    public void Beta_follows_the_piecewise_formula(double attenuation, double expected)
    {
        Assert.Equal(expected, KaiserDesign.Beta(attenuation), 1e-14);
    }

    [Fact]
    public void Beta_at_50_dB_takes_the_middle_branch()
    {
        // At exactly 50 dB eq. 7.62 takes the middle branch (scipy: "a > 50" for the upper one); the two branches
        // nearly meet there (4.533 and 4.551, worked from the formula).
        double middle = 0.5842 * Math.Pow(29, 0.4) + 0.07886 * 29;
        Assert.Equal(middle, KaiserDesign.Beta(50.0), 1e-14);
        Assert.Equal(0.1102 * (50 - 8.7), middle, 0.02);
    }

    [Fact]
    public void Order_rejects_an_attenuation_below_the_formula_range()
    {
        var e = Assert.Throws<InputException>(() => KaiserDesign.Order(7.0, 1.0, 250.0));
        Assert.Contains("7 dB", e.Message);
    }

    [Fact]
    public void Kaiser_window_of_beta_zero_is_rectangular_and_any_window_is_symmetric_with_unit_peak()
    {
        var rectangular = new double[9];
        KaiserDesign.Window(0.0, rectangular);
        Assert.All(rectangular, v => Assert.Equal(1.0, v, 1e-15));
        var w = new double[101];
        KaiserDesign.Window(5.65, w);
        Assert.Equal(1.0, w[50], 1e-15);
        for (int k = 0; k < 50; k++) Assert.Equal(w[k], w[100 - k]);
        Assert.True(w[0] < 0.03); // ends are 1 / I0(5.65) ~ 0.0205 (I0(x) ~ e^x / sqrt(2 pi x), Abramowitz and Stegun 9.7.1)
    }
}
