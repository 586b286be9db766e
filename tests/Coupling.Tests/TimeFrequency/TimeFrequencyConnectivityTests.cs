using Coupling.Measures;
using Coupling.Plans;
using Coupling.Spectral;
using Coupling.TimeFrequency;

namespace Coupling.Tests.TimeFrequency;

public class TimeFrequencyConnectivityTests
{
    private static readonly Measure[] PhaseAndCross = [Measure.Plv, Measure.Coherence, Measure.ImagCoherency];

    [Fact]
    public void Sliding_bins_step_inside_the_span()
    {
        var bins = TimeBin.Sliding(-0.5, 0.5, 0.2, 0.1);
        Assert.Equal(9, bins.Count);
        Assert.Equal(-0.4, bins[0].Centre, 1e-12);
        Assert.Equal(0.4, bins[^1].Centre, 1e-12);
        // Rounded to 1e-9 s: exactly the decimals a reader expects (0.6 + 0.8 alone would give 0.7000000000000001).
        Assert.Equal(0.0, bins[5].Start);
        Assert.Equal(0.7, TimeBin.Sliding(0, 1, 0.2, 0.1)[6].Centre);
        var points = TimeBin.Sliding(0, 0.05, 0, 0.01);
        Assert.Equal(5, points.Count);
        Assert.True(points.All(p => p.IsPoint));
        Assert.Throws<InputException>(() => TimeBin.Sliding(0, 0.1, 0.2, 0.1));
    }

    [Fact]
    public void A_morlet_spectrum_cell_equals_the_band_analysis_of_the_same_wavelet()
    {
        // Reuse check: the cell at f with c cycles is the band route of MorletDecomposition with the wavelet of c cycles at
        // the centre of f (1 +- 1/c), over the same window and time step, so the values are the same to the bit.
        var random = new Random(5);
        var trials = TimeFrequencyTrials.Make(12, 3, 200, -0.5, 300, 120, (n, c, t) => TimeFrequencyTrials.Normal(random));
        var window = new TimeRange(0, 0.6);
        var cells = MorletCells.Build(trials, [8.0, 20.0], 5, [new TimeBin(window.Start, window.End)], maxThreads: 1);
        for (int f = 0; f < 2; f++)
        {
            var band = MorletCells.BandOf(cells.Frequencies[f], 5);
            var decomposition = MorletDecomposition.Create(band, 200, 5);
            var set = NarrowbandExtractor.Extract(trials, decomposition, window, TimeStep.Default(decomposition.Info, 200), 1);
            var expected = PairwiseKernels.ComputeObserved(set, PhaseAndCross);
            var actual = PairwiseKernels.ComputeObserved(cells.Cell(f, 0), PhaseAndCross);
            for (int m = 0; m < PhaseAndCross.Length; m++) Assert.Equal(expected[m], actual[m]);
        }
    }

    [Theory]
    [InlineData("morlet")]
    [InlineData("multitaper")]
    public void A_constant_phase_lag_gives_plv_one_and_imaginary_coherency_of_its_sine(string method)
    {
        // Analytic invariant (Lachaux et al. 1999; Nolte et al. 2004): channel 2 = channel 1 delayed by a quarter cycle at
        // 10 Hz with the same amplitude in every trial, random phase across trials: PLV = 1 and |coherency| = 1 at 10 Hz,
        // imaginary coherency = sin(lag) = +-1 (the sign convention: z_1 conj(z_2), channel 1 leading gives +).
        // Tolerance: a cosine's image at -10 Hz enters with a phase that differs between the channels. Through the
        // wavelet it is damped by the Gaussian spectrum, exp(-(20 Hz / sf)^2 / 2) with sf = 10/7 Hz, far below 1e-20,
        // so 1e-6 (rounding) for Morlet. Through the tapers (0.5 s, W = 4 Hz, NW = 2, K = 3) it leaks by the tapers'
        // side lobes 20 Hz from their centre, and the third taper keeps only 1 - lambda_2 = 4 % of its energy out of
        // band in all; the leak enters the coherence squared, hence 1e-3 for multitaper.
        var random = new Random(9);
        var phases = Enumerable.Range(0, 10).Select(_ => 2 * Math.PI * random.NextDouble()).ToArray();
        var trials = TimeFrequencyTrials.Make(10, 2, 250, -0.5, 250, 250,
            (n, c, t) => Math.Cos(2 * Math.PI * 10 * t + phases[n] - (c == 1 ? Math.PI / 2 : 0)));
        TimeBin[] bins = [new TimeBin(-0.3, 0.2), new TimeBin(-0.2, 0.3)];
        var cells = method == "morlet"
            ? MorletCells.Build(trials, [10.0], 7, bins, 1)
            : MultitaperCells.Build(trials, [10.0], 4, bins);
        // Multitaper weighs each taper's cross-spectrum by its power; phase-only measures (PLV) would count the odd tapers,
        // which carry almost none of a spectral line and so no reliable phase of it, as much as the others, and are
        // not offered for multitaper (MultitaperCells.Measures).
        Measure[] measures = method == "morlet" ? PhaseAndCross : [Measure.Coherence, Measure.ImagCoherency];
        var values = TimeFrequencyConnectivity.Compute(cells, "x", [(0, 1)], measures, null);
        double tolerance = method == "morlet" ? 1e-6 : 1e-3;
        Assert.All(values, v => Assert.All(v.Values, x => Assert.Equal(1, x, tolerance)));
    }

    [Fact]
    public void Multitaper_coherence_of_a_noisy_copy_is_the_signal_to_total_power_ratio()
    {
        // Bendat and Piersol (2010), Random Data, 4th ed., section 6.1.4: y = x + n with n independent of x has coherence
        // G_xx / (G_xx + G_nn); white x and n of variances 1 and 1 give 0.5 at every frequency. The estimate averages
        // over 200 trials x 3 tapers = 600 observations; its bias (1 - C)^2 / L = 4e-4 and standard deviation
        // sqrt(2) C (1 - C) / sqrt(L) = 0.014 (Carter, Knapp and Nuttall 1973, IEEE Trans Audio Electroacoust 21:337)
        // make 0.05 a four-sd bound.
        var random = new Random(2026);
        var noise = new double[200, 250];
        var trials = TimeFrequencyTrials.Make(200, 2, 250, 0, 250, 0, (n, c, t) => 0);
        for (int n = 0; n < 200; n++)
        {
            var x = trials.Trial(n, 0);
            var y = trials.Trial(n, 1);
            for (int s = 0; s < 250; s++)
            {
                x[s] = TimeFrequencyTrials.Normal(random);
                y[s] = x[s] + TimeFrequencyTrials.Normal(random);
            }
        }
        var cells = MultitaperCells.Build(trials, [10.0, 30.0, 60.0], 2, [new TimeBin(0, 1)]);
        Assert.Equal(3, cells.ObservationsPerTrial);
        var coherence = TimeFrequencyConnectivity.Compute(cells, "x", [(0, 1)], [Measure.Coherence], null)[0];
        Assert.All(coherence.Values, v => Assert.Equal(0.5, v, 0.05));
    }

    [Fact]
    public void Change_from_baseline_shows_coupling_that_starts_at_onset()
    {
        // Channel 2 follows channel 1's 12 Hz oscillation only after 0 s (same phase in every trial's pair, random phase
        // across trials); before it, independent noise. The PLV change from the baseline -0.6..-0.2 s is near 0 in the
        // baseline bins and large (> 0.5) in bins wholly after onset; exact baseline arithmetic checked too.
        var random = new Random(3);
        var phase = Enumerable.Range(0, 30).Select(_ => 2 * Math.PI * random.NextDouble()).ToArray();
        var other = Enumerable.Range(0, 30).Select(_ => 2 * Math.PI * random.NextDouble()).ToArray();
        var trials = TimeFrequencyTrials.Make(30, 2, 200, -0.8, 320, 100, (n, c, t) =>
            c == 0 || t >= 0
                ? Math.Cos(2 * Math.PI * 12 * t + phase[n]) + 0.2 * TimeFrequencyTrials.Normal(random)
                : Math.Cos(2 * Math.PI * 12 * t + other[n]) + 0.2 * TimeFrequencyTrials.Normal(random));
        var bins = TimeBin.Sliding(-0.8, 0.8, 0.2, 0.1);
        var cells = MorletCells.Build(trials, [12.0], 6, bins, 1);
        var baseline = new TimeRange(-0.6, -0.2);
        var plv = TimeFrequencyConnectivity.Compute(cells, "x", [(0, 1)], [Measure.Plv], baseline)[0];
        var inBaseline = TimeFrequencyConnectivity.BaselineBins(bins, baseline);
        double mean = inBaseline.Average(b => plv.Values[b]);
        for (int b = 0; b < bins.Count; b++)
        {
            Assert.Equal(plv.Values[b] - mean, plv.Change![b], 1e-15);
            if (inBaseline.Contains(b)) Assert.True(Math.Abs(plv.Change[b]) < 0.25, $"bin {b}: {plv.Change[b]}");
            if (bins[b].Start >= 0.1) Assert.True(plv.Change[b] > 0.5, $"bin {b}: {plv.Change[b]}");
        }
    }

    [Fact]
    public void Multitaper_refuses_point_bins_and_segments_too_short_for_one_taper()
    {
        var trials = TimeFrequencyTrials.Make(3, 2, 100, 0, 100, 0, (n, c, t) => t);
        Assert.Throws<InputException>(() => MultitaperCells.Build(trials, [10.0], 2, [new TimeBin(0.1, 0.1)]));
        var e = Assert.Throws<InputException>(() => MultitaperCells.Build(trials, [10.0], 2, [new TimeBin(0, 0.2)]));
        Assert.Contains("NW", e.Message);
    }
}
