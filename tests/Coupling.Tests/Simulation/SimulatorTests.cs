using System.Numerics;
using Coupling.Simulation;

namespace Coupling.Tests.Simulation;

[Collection(ScenarioCollection.Name)]
public sealed class SimulatorTests(ScenarioFixture fixture)
{
    // Small scenario for the tests that generate several recordings.
    private static readonly ScenarioOptions Small = new() { TrialsPerCondition = 8 };

    [Fact]
    public void The_same_seed_gives_the_same_samples_and_events()
    {
        var first = Simulator.Generate(Small with { Seed = 7 }).Recording;
        var second = Simulator.Generate(Small with { Seed = 7 }).Recording;
        Assert.Equal(first.Events, second.Events);
        Assert.Equal(first.Channels.Count, second.Channels.Count);
        for (int c = 0; c < first.Channels.Count; c++)
            Assert.True(first.Samples[c].AsSpan().SequenceEqual(second.Samples[c]), $"channel {first.Channels[c].Label} differs");
    }

    [Fact]
    public void A_different_seed_gives_different_samples()
    {
        var first = Simulator.Generate(Small with { Seed = 7 }).Recording;
        var second = Simulator.Generate(Small with { Seed = 8 }).Recording;
        for (int c = 0; c < first.Channels.Count; c++)
        {
            int n = Math.Min(first.SampleCount, second.SampleCount);
            Assert.False(first.Samples[c].AsSpan(0, n).SequenceEqual(second.Samples[c].AsSpan(0, n)), $"channel {first.Channels[c].Label} unchanged");
        }
    }

    [Fact]
    public void Events_carry_the_condition_labels_in_the_stated_counts_and_spacing()
    {
        var rec = fixture.Scenario.Recording;
        var o = fixture.Options;
        double fs = rec.SampleRate;
        Assert.Equal(o.TrialsPerCondition, rec.Events.Count(e => e.Label == o.BetaCondition));
        Assert.Equal(o.TrialsPerCondition, rec.Events.Count(e => e.Label == o.OtherCondition));
        Assert.Equal(2 * o.TrialsPerCondition, rec.Events.Count);
        // Both conditions appear in a mixed order, not in two blocks.
        int switches = rec.Events.Zip(rec.Events.Skip(1)).Count(p => p.First.Label != p.Second.Label);
        Assert.True(switches > 10, $"only {switches} condition changes");
        double span = o.TrialEnd - o.TrialStart;
        double halfSample = 0.5 / fs;
        Assert.True(rec.Events[0].Onset + o.TrialStart >= o.LeadSeconds - halfSample);
        Assert.True(rec.Events[^1].Onset + o.TrialEnd <= rec.Duration - o.LeadSeconds + halfSample);
        foreach (var e in rec.Events)
            Assert.Equal(Math.Round(e.Onset * fs), e.Onset * fs, 6); // onsets fall on samples
        for (int i = 1; i < rec.Events.Count; i++)
        {
            double gap = rec.Events[i].Onset - rec.Events[i - 1].Onset - span;
            // Gaps are GapMin + U(0, GapJitter), rounded to whole samples.
            Assert.InRange(gap, o.GapMin - 1.01 / fs, o.GapMin + o.GapJitter + 1.01 / fs);
        }
    }

    [Fact]
    public void Channels_have_labels_positions_and_microvolt_units()
    {
        var rec = fixture.Scenario.Recording;
        Assert.Equal(10, rec.Channels.Count);
        Assert.Equal(rec.Channels.Count, rec.Channels.Select(c => c.Label).Distinct().Count());
        Assert.All(rec.Channels, c => Assert.Equal("uV", c.Unit));
        Assert.All(rec.Channels, c => Assert.NotNull(c.Position));
        Assert.Equal(rec.Channels.Count, rec.Channels.Select(c => c.Position).Distinct().Count());
        // Every channel named by the truth exists in the recording.
        foreach (var p in fixture.Scenario.Truth.Pairs)
        {
            Assert.True(rec.IndexOf(p.ChannelA) >= 0, p.ChannelA);
            Assert.True(rec.IndexOf(p.ChannelB) >= 0, p.ChannelB);
            Assert.Contains(fixture.Scenario.Truth.Bands, b => b.Name == p.Band);
        }
    }

    [Fact]
    public void An_out_of_range_option_is_refused_with_its_name()
    {
        var e = Assert.Throws<InputException>(() => Simulator.Generate(new ScenarioOptions { GapMin = 0.1 }));
        Assert.Contains("GapMin", e.Message);
        e = Assert.Throws<InputException>(() => Simulator.Generate(new ScenarioOptions { OtherCondition = "tone" }));
        Assert.Contains("OtherCondition", e.Message);
    }

    [Fact]
    public void Theta_pair_cross_spectrum_phase_matches_the_stated_lag()
    {
        // A delay τ of b behind a gives cross-spectrum angle 2π·f·τ (common practice; shift theorem of the Fourier transform).
        var o = fixture.Options;
        var pair = fixture.Scenario.Truth.Pairs.Single(p => p.Band == "theta" && p.Kind == TruthKind.PhaseCoupled);
        Assert.Equal(o.ThetaLag, pair.LagSeconds);
        var (angle, coherence, segments) = PhaseAtCentre(pair.ChannelA, pair.ChannelB, fixture.SpanStarts(), 6.0);
        double expected = 2 * Math.PI * 6.0 * o.ThetaLag;
        AssertPhase(expected, angle, coherence, segments);
    }

    [Fact]
    public void Beta_pair_is_lagged_in_one_condition_and_independent_with_equal_power_in_the_other()
    {
        var o = fixture.Options;
        var pair = fixture.Scenario.Truth.Pairs.Single(p => p.Band == "beta");
        Assert.Equal([o.BetaCondition], pair.Conditions);
        var (angle, coherence, segments) = PhaseAtCentre(pair.ChannelA, pair.ChannelB, fixture.SpanStarts(o.BetaCondition), 20.0);
        AssertPhase(2 * Math.PI * 20.0 * o.BetaLag, angle, coherence, segments);

        // In the other condition the band coherence magnitude stays near the level of independent signals: for K segments
        // and B bins its estimate has expectation about sqrt(1/(K·B)) (Bendat & Piersol 2010, Random Data, 4th ed., ch. 9;
        // from memory); 4 times that bound is allowed.
        int len = fixture.SpanLength;
        var other = fixture.SpanStarts(o.OtherCondition);
        var (kLow, kHigh) = Bins(15, 25, len);
        double magnitude = SegmentSpectra.BandCoherency(fixture.Channel(pair.ChannelA), fixture.Channel(pair.ChannelB), other, len, kLow, kHigh).Magnitude;
        Assert.True(magnitude < 4 * Math.Sqrt(1.0 / other.Length), $"coherence {magnitude:0.000} in '{o.OtherCondition}'");
        var tone = fixture.SpanStarts(o.BetaCondition);
        Assert.True(SegmentSpectra.BandCoherency(fixture.Channel(pair.ChannelA), fixture.Channel(pair.ChannelB), tone, len, kLow, kHigh).Magnitude > 0.5);

        // Beta power of the second channel does not differ between conditions beyond 4 standard errors of the difference
        // of two means of per-trial band powers.
        var bChannel = fixture.Channel(pair.ChannelB);
        double[] PerTrial(int[] starts) => starts.Select(s => BandPower(bChannel, s, len, kLow, kHigh)).ToArray();
        var pTone = PerTrial(tone);
        var pOther = PerTrial(other);
        double se = Math.Sqrt(Variance(pTone) / pTone.Length + Variance(pOther) / pOther.Length);
        Assert.True(Math.Abs(pTone.Average() - pOther.Average()) < 4 * se,
            $"beta power {pTone.Average():0.0} vs {pOther.Average():0.0}, standard error {se:0.0}");
    }

    [Fact]
    public void Zero_lag_pair_cross_spectrum_in_alpha_is_almost_real()
    {
        var pair = fixture.Scenario.Truth.Pairs.Single(p => p.Kind == TruthKind.ZeroLagMixing);
        Assert.Equal(0.0, pair.LagSeconds);
        int len = fixture.SpanLength;
        var starts = fixture.SpanStarts();
        var (kLow, kHigh) = Bins(8, 13, len);
        Complex s = 0;
        var sab = SegmentSpectra.Cross(fixture.Channel(pair.ChannelA), fixture.Channel(pair.ChannelB), starts, len);
        for (int k = kLow; k <= kHigh; k++) s += sab[k];
        Complex coherency = SegmentSpectra.BandCoherency(fixture.Channel(pair.ChannelA), fixture.Channel(pair.ChannelB), starts, len, kLow, kHigh);
        Assert.True(coherency.Magnitude > 0.5, $"coherence {coherency.Magnitude:0.000}");
        // |Im S| / |S| is the sine of the phase; its spread follows the phase standard deviation (see AssertPhase), here
        // for a sum over B bins of K segments: about K·B/1.5 independent estimates, 1.5 bins being the equivalent noise
        // bandwidth of the Hann window (Harris 1978, Proc. IEEE 66:51-83, table 1).
        double tolerance = 4 * PhaseStandardDeviation(coherency.Magnitude, (int)(starts.Length * (kHigh - kLow + 1) / 1.5));
        Assert.True(Math.Abs(s.Imaginary) / s.Magnitude < tolerance,
            $"|Im|/|S| = {Math.Abs(s.Imaginary) / s.Magnitude:0.0000}, allowed {tolerance:0.0000}");
        Assert.True(s.Real > 0, "the gains have the same sign");
    }

    [Fact]
    public void Envelope_pair_shares_gamma_envelopes_but_not_gamma_phase()
    {
        var pair = fixture.Scenario.Truth.Pairs.Single(p => p.Kind == TruthKind.EnvelopeOnly);
        var a = fixture.Channel(pair.ChannelA);
        var b = fixture.Channel(pair.ChannelB);
        int len = fixture.SpanLength;
        var starts = fixture.SpanStarts();
        var (kLow, kHigh) = Bins(30, 45, len);
        double magnitude = SegmentSpectra.BandCoherency(a, b, starts, len, kLow, kHigh).Magnitude;
        Assert.True(magnitude < 4 * Math.Sqrt(1.0 / starts.Length), $"gamma coherence {magnitude:0.000}");

        // Envelopes: magnitude of the analytic signal restricted to 30-45 Hz (one-sided spectrum; Marple 1999,
        // IEEE Trans. Signal Process. 47:2600-2603), correlated over the whole recording (Pearson).
        var envA = BandEnvelope(a, fixture.Options.SampleRate, 30, 45);
        var envB = BandEnvelope(b, fixture.Options.SampleRate, 30, 45);
        var envControl = BandEnvelope(fixture.Channel("L1"), fixture.Options.SampleRate, 30, 45);
        double shared = MathNet.Numerics.Statistics.Correlation.Pearson(envA, envB);
        double control = MathNet.Numerics.Statistics.Correlation.Pearson(envA, envControl);
        Assert.True(shared > 0.3, $"envelope correlation {shared:0.000}");
        Assert.True(Math.Abs(control) < 0.1, $"envelope correlation with an unrelated channel {control:0.000}");
    }

    [Fact]
    public void Evoked_channels_trial_average_shows_the_response_from_the_onset()
    {
        var o = fixture.Options;
        var pair = fixture.Scenario.Truth.Pairs.Single(p => p.Kind == TruthKind.StimulusLocked);
        double fs = o.SampleRate;
        // Documented response: A·(t/τ)·exp(1 − t/τ)·sin(2π·10·t), τ = 0.3 s, A = EvokedPeakRatio × background RMS in the
        // alpha band. For a 1/f background flat below 1 Hz, the alpha share of the variance is
        // ln(13/8) / (1 + ln(fs/2)) (integral of the power law; the discrete FFT grid differs by far less than 1%).
        double alphaRms = o.BackgroundRms * Math.Sqrt(Math.Log(13.0 / 8.0) / (1.0 + Math.Log(fs / 2)));
        double peak = o.EvokedPeakRatio * alphaRms;
        int len = fixture.SpanLength;
        int onsetIndex = (int)Math.Round(-o.TrialStart * fs);
        var template = new double[len];
        for (int i = 0; i < len; i++)
        {
            double t = (i - onsetIndex) / fs;
            template[i] = t < 0 ? 0 : (t / 0.3) * Math.Exp(1 - t / 0.3) * Math.Sin(2 * Math.PI * 10 * t);
        }
        double tt = template.Sum(x => x * x);
        foreach (var label in new[] { pair.ChannelA, pair.ChannelB, "L1" })
        {
            var avg = TrialAverage(fixture.Channel(label), fixture.SpanStarts(), len);
            double amplitude = avg.Zip(template).Sum(p => p.First * p.Second) / tt;
            if (label == "L1")
            {
                Assert.True(Math.Abs(amplitude) < 0.2 * peak, $"unrelated channel shows amplitude {amplitude:0.00}");
                continue;
            }
            // Residual background in a 120-trial average is about 20 µV / sqrt(120) ≈ 1.8 µV RMS against a peak of ≈ 17 µV;
            // 20 % of the peak is several standard errors of the fitted amplitude.
            Assert.InRange(amplitude, 0.8 * peak, 1.2 * peak);
            // The best alignment of the template with the average is at the onset (lag 0 within ±1 sample).
            int bestLag = Enumerable.Range(-25, 51).MaxBy(lag => Enumerable.Range(0, len)
                .Where(i => i + lag >= 0 && i + lag < len).Sum(i => template[i] * avg[i + lag]));
            Assert.InRange(bestLag, -1, 1);
            double before = Math.Sqrt(avg.Take(onsetIndex).Select(x => x - avg.Take(onsetIndex).Average()).Sum(x => x * x) / onsetIndex);
            Assert.True(before < 0.25 * peak, $"pre-onset average RMS {before:0.00} against peak {peak:0.00}");
        }
    }

    private (double Angle, double Coherence, int Segments) PhaseAtCentre(string a, string b, int[] starts, double centreHz)
    {
        int len = fixture.SpanLength;
        int k = (int)Math.Round(centreHz * len / fixture.Options.SampleRate);
        var xa = fixture.Channel(a);
        var xb = fixture.Channel(b);
        var sab = SegmentSpectra.Cross(xa, xb, starts, len)[k];
        double coherence = sab.Magnitude / Math.Sqrt(SegmentSpectra.Power(xa, starts, len)[k] * SegmentSpectra.Power(xb, starts, len)[k]);
        return (sab.Phase, coherence, starts.Length);
    }

    private static void AssertPhase(double expected, double angle, double coherence, int segments)
    {
        Assert.True(coherence > 0.4, $"coherence {coherence:0.000} too low to read a phase");
        double tolerance = 4 * PhaseStandardDeviation(coherence, segments);
        double error = Math.Abs(Math.IEEERemainder(angle - expected, 2 * Math.PI));
        Assert.True(error < tolerance, $"phase {angle:0.000} rad, expected {expected:0.000} ± {tolerance:0.000}");
    }

    // Standard deviation of a cross-spectral phase estimate from n segments at coherence magnitude |γ|:
    // sqrt(1 − γ²) / (|γ|·sqrt(2n)) (Bendat & Piersol 2010, Random Data, 4th ed., table 9.6; from memory).
    private static double PhaseStandardDeviation(double coherence, int segments) =>
        Math.Sqrt(1 - coherence * coherence) / (coherence * Math.Sqrt(2.0 * segments));

    private (int Low, int High) Bins(double lowHz, double highHz, int len)
    {
        double df = fixture.Options.SampleRate / len;
        return ((int)Math.Ceiling(lowHz / df), (int)Math.Floor(highHz / df));
    }

    private static double BandPower(double[] x, int start, int len, int kLow, int kHigh)
    {
        var z = SegmentSpectra.Transform(x, start, len);
        double p = 0;
        for (int k = kLow; k <= kHigh; k++) p += z[k].Real * z[k].Real + z[k].Imaginary * z[k].Imaginary;
        return p;
    }

    private static double Variance(double[] v)
    {
        double mean = v.Average();
        return v.Sum(x => (x - mean) * (x - mean)) / (v.Length - 1);
    }

    private static double[] TrialAverage(double[] x, int[] starts, int len)
    {
        var avg = new double[len];
        foreach (int s in starts)
            for (int i = 0; i < len; i++) avg[i] += x[s + i] / starts.Length;
        return avg;
    }

    private static double[] BandEnvelope(double[] x, double fs, double lowHz, double highHz)
    {
        int n = x.Length;
        var z = x.Select(v => new Complex(v, 0)).ToArray();
        MathNet.Numerics.IntegralTransforms.Fourier.Forward(z, MathNet.Numerics.IntegralTransforms.FourierOptions.Matlab);
        for (int k = 0; k < n; k++)
        {
            double f = k * fs / n;
            bool positiveInBand = k <= n / 2 && f >= lowHz && f <= highHz;
            z[k] = positiveInBand ? 2 * z[k] : Complex.Zero;
        }
        MathNet.Numerics.IntegralTransforms.Fourier.Inverse(z, MathNet.Numerics.IntegralTransforms.FourierOptions.Matlab);
        return z.Select(c => c.Magnitude).ToArray();
    }
}
