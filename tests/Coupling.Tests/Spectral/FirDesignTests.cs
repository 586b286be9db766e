using Coupling.Spectral;

namespace Coupling.Tests.Spectral;

public class FirDesignTests
{
    // Reference: scipy.signal.firwin 1.10.1 (Debian python3-scipy) with window=('kaiser', beta), pass_zero=False,
    // scale=True, Fixtures/Spectral/bandpass_taps.json.
    [Fact]
    public void Windowed_sinc_taps_match_scipy_firwin()
    {
        int checkedCases = 0;
        foreach (var c in SpectralFixtures.Cases("bandpass_taps.json"))
        {
            var band = new Band("b", c.Double("low_hz"), c.Double("high_hz"));
            double[] expected = c.Doubles("taps");
            double[] actual = FirDesign.WindowedSincTaps(band, c.Double("sample_rate"), c.Int("numtaps"), c.Double("beta"));
            Assert.Equal(expected.Length, actual.Length);
            // Each tap is a product of a few terms of a few ulp each (I0 from two Chebyshev implementations agrees
            // to ~1e-15), divided by a sum of N <= 1300 terms added in a different order: at most ~N eps of the
            // largest tap, 3e-13; 1e-12 of the largest tap bounds it.
            double tolerance = 1e-12 * expected.Max(Math.Abs);
            for (int k = 0; k < expected.Length; k++)
                Assert.True(Math.Abs(expected[k] - actual[k]) <= tolerance, $"tap {k} of {band.Low}-{band.High} Hz: {actual[k]} vs {expected[k]}");
            checkedCases++;
        }
        Assert.Equal(6, checkedCases);
    }

    public static TheoryData<double, double, double, double> Designs => new()
    {
        { 4, 8, 250, 60 },
        { 8, 13, 500, 40 },
        { 30, 80, 1000, 80 },
        { 1, 4, 128, 50 },
    };

    // Kaiser (1974) / Oppenheim and Schafer section 7.5.3: the design aims at pass-band deviation and stop-band
    // gain both at most delta = 10^(-A/20). Checked on the taps' own zero-phase response (direct cosine sum),
    // on a grid twice as dense as the design's and offset from it, plus the four edges.
    [Theory]
    [MemberData(nameof(Designs))]
    public void Band_pass_meets_its_stated_ripple_and_attenuation_on_a_dense_grid(double low, double high, double fs, double attenuation)
    {
        var band = new Band("b", low, high);
        var f = FirDesign.BandPass(band, fs, FirDesign.DefaultTransitionHz(band, fs), attenuation);
        double delta = Math.Pow(10, -attenuation / 20);
        double step = fs / (64.0 * f.Length);
        double worstPass = 0, worstStop = 0;
        var grid = Enumerable.Range(0, (int)(0.5 * fs / step)).Select(i => (i + 0.37) * step)
            .Concat([f.PassLowHz, f.PassHighHz, f.StopLowHz, f.StopHighHz, 0.0, 0.5 * fs]);
        foreach (double hz in grid)
        {
            if (hz >= f.PassLowHz && hz <= f.PassHighHz) worstPass = Math.Max(worstPass, Math.Abs(f.Response(hz) - 1));
            else if (hz <= f.StopLowHz || hz >= f.StopHighHz) worstStop = Math.Max(worstStop, Math.Abs(f.Response(hz)));
        }
        Assert.True(worstPass <= delta, $"pass-band deviation {worstPass:E3} > {delta:E3}");
        Assert.True(worstStop <= delta, $"stop-band gain {worstStop:E3} > {delta:E3}");
        // The filter's own measurement agrees with the independent grid to the grid's resolution (0.5 %).
        Assert.Equal(worstPass, f.PassDeviation, 0.01 * delta);
        Assert.Equal(worstStop, f.StopGain, 0.01 * delta);
        Assert.True(f.MeasuredStopbandDb >= attenuation);
    }

    [Fact]
    public void Band_pass_taps_are_symmetric_with_odd_length_and_unit_gain_at_the_band_centre()
    {
        var band = new Band("theta", 4, 8);
        var f = FirDesign.BandPass(band, 250);
        Assert.Equal(1, f.Length % 2);
        for (int k = 0; k < f.Length / 2; k++) Assert.Equal(f.Taps[k], f.Taps[f.Length - 1 - k]);
        // firwin's scale=True: unit gain at the pass-band centre, to rounding of the N-term sum.
        Assert.Equal(1.0, f.Response(band.Centre), 1e-12);
    }

    // Window method (Oppenheim and Schafer section 7.5): the ideal step smoothed by the symmetric window spectrum
    // passes its cutoff at half height, -6 dB, up to the other edge's ripple and the centre scaling (each <= delta).
    [Fact]
    public void Band_edges_are_the_half_amplitude_points()
    {
        var band = new Band("alpha", 8, 12);
        var f = FirDesign.BandPass(band, 500, 2.0, 60);
        double delta = 1e-3;
        Assert.Equal(0.5, f.Response(band.Low), 2 * delta);
        Assert.Equal(0.5, f.Response(band.High), 2 * delta);
    }

    [Fact]
    public void Realised_edges_sit_half_a_transition_either_side_of_each_cutoff()
    {
        var band = new Band("beta", 13, 30);
        var f = FirDesign.BandPass(band, 1000, 3.0, 60);
        Assert.Equal(14.5, f.PassLowHz, 1e-12);
        Assert.Equal(28.5, f.PassHighHz, 1e-12);
        Assert.Equal(11.5, f.StopLowHz, 1e-12);
        Assert.Equal(31.5, f.StopHighHz, 1e-12);
    }

    [Theory]
    [InlineData(0.5, 2, 100)]
    [InlineData(1, 4, 250)]
    [InlineData(4, 8, 250)]
    [InlineData(40, 60, 128)]
    public void Default_transition_keeps_both_stop_bands_inside_zero_to_Nyquist(double low, double high, double fs)
    {
        var band = new Band("b", low, high);
        double tw = FirDesign.DefaultTransitionHz(band, fs);
        Assert.True(low - tw / 2 > 0);
        Assert.True(high + tw / 2 < fs / 2);
        Assert.True(tw <= band.Width / 2);
    }

    [Theory]
    [InlineData(4, 8, 0)]
    [InlineData(4, 8, 9)]
    [InlineData(1, 8, 2.5)]
    public void Band_pass_rejects_a_transition_that_does_not_fit(double low, double high, double tw)
    {
        var e = Assert.Throws<InputException>(() => FirDesign.BandPass(new Band("slow", low, high), 250, tw, 60));
        Assert.Contains("'slow'", e.Message);
        Assert.Contains("250 Hz", e.Message);
    }
}
