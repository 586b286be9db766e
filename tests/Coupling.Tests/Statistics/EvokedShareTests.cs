using Coupling.Measures;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Simulation;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Trials;

namespace Coupling.Tests.Statistics;

/// <summary>
/// The evoked share of band power and its warning. A stimulus-locked response whose latency varies from trial to trial,
/// shared by the channels, is trial-by-trial covariation that neither trial shuffling nor subtracting the average
/// response removes, so it reads as coupling (Truccolo, Ding, Knuth, Nakamura and Bressler 2002, Clin Neurophysiol
/// 113:206-226).
/// </summary>
public class EvokedShareTests
{
    private const double Rate = 250;
    private static readonly Band Alpha = new("alpha", 8, 12);
    private static readonly TimeRange Window = new(0.1, 0.6);

    /// <summary>
    /// Three channels, 40 trials from −0.5 to 1.0 s: every trial carries one 10 Hz burst (Gaussian envelope, sd 0.1 s,
    /// centred 0.35 s after onset, amplitude 5 in channel A, 4 in B, 0 in C) delayed by one latency per trial drawn
    /// with sd 10 ms (0.63 rad at 10 Hz) and shared by A and B, plus independent unit white noise in every channel.
    /// </summary>
    private static TrialSet JitteredResponse(int seed, int pad)
    {
        const int trials = 40;
        var random = new Random(seed);
        int samples = (int)(1.5 * Rate) + 2 * pad;
        double[] amplitude = [5, 4, 0];
        var data = new double[trials * 3 * samples];
        for (int n = 0; n < trials; n++)
        {
            double latency = 0.010 * Gaussian(random);
            for (int c = 0; c < 3; c++)
                for (int s = 0; s < samples; s++)
                {
                    double t = -0.5 + (s - pad) / Rate - 0.35 - latency;
                    data[(n * 3 + c) * samples + s] = amplitude[c] * Math.Exp(-t * t / (2 * 0.1 * 0.1)) * Math.Cos(2 * Math.PI * 10 * t)
                        + Gaussian(random);
                }
        }
        return new TrialSet("cue", ["A", "B", "C"], Rate, trials, samples, pad, -0.5, data, Enumerable.Repeat(double.NaN, trials).ToArray(), []);
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());

    [Fact]
    public void A_jittered_evoked_response_raises_the_warning_and_is_significant_coupling_even_after_evoked_removal()
    {
        var decomposition = BandDecompositions.Create(BandDecompositions.Morlet, Alpha, Rate);
        var trials = JitteredResponse(seed: 1, decomposition.PadSamples);
        var removed = EvokedRemoval.Mean(trials);
        EvokedRemoval.SubtractInPlace(trials);
        var narrowband = NarrowbandExtractor.Extract(trials, decomposition, Window, 1, 1);
        var removedBand = NarrowbandExtractor.Extract(removed, decomposition, Window, 1, 1);
        var shares = EvokedShare.Compute(narrowband, removedBand);
        Assert.True(shares[0] > 0.3 && shares[1] > 0.3, $"shares {string.Join(", ", shares)}");
        Assert.True(Math.Abs(shares[2]) < EvokedShare.WarningThreshold, $"noise channel share {shares[2]}");
        string? warning = EvokedShare.Warning("cue", "alpha", trials.Channels, shares);
        Assert.NotNull(warning);
        Assert.Contains("A 0.", warning);
        Assert.Contains("B 0.", warning);
        Assert.DoesNotContain("C ", warning);
        // What the warning is about: after the average response is subtracted, the jitter's residuals still couple A and
        // B trial by trial, so the trial-shuffle test finds coupling where the channels share nothing but the response
        // (M = 99, smallest p 1/100).
        var tested = SurrogateTest.Run(narrowband, [Measure.Plv, Measure.Coherence], 99, seed: 3, "cue", maxThreads: 1);
        int pair = PairIndex.Of(0, 1, 3);
        Assert.All(tested, r => Assert.Equal(0.01, r.P[pair]));
    }

    [Fact]
    public void The_share_is_the_same_whether_the_mean_was_removed_first_or_not()
    {
        // Band isolation is linear, so adding the removed mean's narrowband signal back gives the recorded data's share.
        var decomposition = BandDecompositions.Create(BandDecompositions.Morlet, Alpha, Rate);
        var trials = JitteredResponse(seed: 2, decomposition.PadSamples);
        var direct = EvokedShare.Compute(NarrowbandExtractor.Extract(trials, decomposition, Window, 1, 1));
        var removed = EvokedRemoval.Mean(trials);
        EvokedRemoval.SubtractInPlace(trials);
        var afterRemoval = EvokedShare.Compute(NarrowbandExtractor.Extract(trials, decomposition, Window, 1, 1),
            NarrowbandExtractor.Extract(removed, decomposition, Window, 1, 1));
        // Rounding of the FFT convolution (about 1e-15 relative) and of the subtraction; 1e-9 is far above both.
        for (int c = 0; c < 3; c++) Assert.Equal(direct[c], afterRemoval[c], 1e-9);
    }

    [Fact]
    public void The_demo_scenario_plain_noise_channels_give_no_warning_in_any_band()
    {
        // The demo's channels other than R2 and R3 carry background noise and couplings that are not locked to the
        // events; R2 and R3 carry the deliberately stimulus-locked 10 Hz response, which the check is meant to name.
        var options = new ScenarioOptions { TrialsPerCondition = 30 };
        var scenario = Simulator.Generate(options);
        var input = LoadedInput.FromRecording(scenario.Recording);
        var condition = new ConditionSpec(options.BetaCondition, [options.BetaCondition]);
        var window = new TimeRange(options.WindowStart, options.WindowEnd);
        foreach (var band in Simulator.Bands)
        {
            var decomposition = BandDecompositions.Create(BandDecompositions.FirHilbert, band, options.SampleRate);
            var trials = input.Trials(condition, new TimeRange(options.TrialStart, options.TrialEnd), decomposition.PadSamples);
            var shares = EvokedShare.Compute(NarrowbandExtractor.Extract(trials, decomposition, window, 1, 1));
            var noise = trials.Channels.Select((c, i) => (c, i)).Where(x => x.c is not ("R2" or "R3")).ToArray();
            string? warning = EvokedShare.Warning(condition.Name, band.Name, noise.Select(x => x.c).ToArray(),
                noise.Select(x => shares[x.i]).ToArray());
            Assert.True(warning is null, warning);
            if (band.Name == "alpha")
                Assert.NotNull(EvokedShare.Warning(condition.Name, band.Name, trials.Channels, shares));
        }
    }
}
