using System.Globalization;
using Coupling.Formats;
using Coupling.Measures;
using Coupling.Spectral;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;

namespace Coupling.Simulation;

/// <summary>
/// Generates the invented demo scenario: a ten-electrode surface montage (L1..L5, R1..R5) recorded during a cued
/// task with two cue conditions, with five channel pairs whose relation is known (see <see cref="GroundTruth"/>).
/// </summary>
/// <remarks>
/// <para>Every channel carries its own 1/f^alpha background (power spectral density proportional to f^(−alpha), alpha =
/// <see cref="ScenarioOptions.BackgroundExponent"/>, 1 by default): the spectrum of white Gaussian noise is multiplied by the
/// amplitude gain f^(−alpha/2), held flat below <see cref="ScenarioOptions.BackgroundFloorHz"/>, and inverted with the MathNet
/// FFT (the white-noise bins are drawn directly in their known distribution; see the internal SpectralShaping). All
/// band-limited sources are made the same way with a flat gain and raised-cosine flanks. On top of the background:</para>
/// <list type="bullet">
/// <item>L1→R4: band-limited noise at 5–7 Hz (theta), R4 a copy delayed by <see cref="ScenarioOptions.ThetaLag"/>, all the time.</item>
/// <item>L2→R5: band-limited noise at 17–23 Hz (beta); R5 carries a copy delayed by <see cref="ScenarioOptions.BetaLag"/> around the
/// trials of <see cref="ScenarioOptions.BetaCondition"/> and an independent band-limited noise of the same power elsewhere, crossfaded
/// with constant power (m·s + sqrt(1-m²)·u, m ramped by raised cosines).</item>
/// <item>L4, L5: one band-limited noise at 9–12 Hz (alpha) with real gains 1 and <see cref="ScenarioOptions.MixingGain"/>, no delay.</item>
/// <item>R1, L3: 38 Hz carriers with independent Wiener phase noise (Lorentzian line, half-width 0.5 Hz), both multiplied by
/// one envelope exp(0.6·l(t)), l a unit-variance band-limited noise at 0.5–3 Hz running through the whole recording.</item>
/// <item>R2, R3: the same response A·(t/τ)·exp(1 − t/τ)·sin(2π·10 Hz·t), τ = 0.3 s, from every event onset on.</item>
/// </list>
/// <para>Randomness: one MathNet.Numerics.Random.Xoshiro256StarStar seeded with <see cref="ScenarioOptions.Seed"/> draws the trial
/// order, the gaps and one seed per component; each component then has its own Xoshiro256StarStar. Gaussian samples come from
/// MathNet.Numerics.Distributions.Normal.Samples. The same seed and options give the same samples.</para>
/// <para>The Wiener phase-noise line shape: if Var[φ(t+s) − φ(t)] = D·s, the spectrum of exp(iφ) is a Lorentzian with
/// half-width D/2 rad/s (from memory; standard result for phase diffusion).</para>
/// </remarks>
public static class Simulator
{
    internal const double ThetaSourceLow = 5.0, ThetaSourceHigh = 7.0;
    internal const double AlphaSourceLow = 9.0, AlphaSourceHigh = 12.0;
    internal const double BetaSourceLow = 17.0, BetaSourceHigh = 23.0;
    internal const double SourceTaperHz = 0.5;
    internal const double EnvelopeLow = 0.5, EnvelopeHigh = 3.0, EnvelopeTaperHz = 0.25;
    internal const double EnvelopeDepth = 0.6;
    internal const double GammaCarrierHz = 38.0, GammaHalfWidthHz = 0.5;
    internal const double EvokedFrequencyHz = 10.0, EvokedRiseSeconds = 0.3;
    internal const double CouplingMarginSeconds = 0.25, CouplingRampSeconds = 0.1;

    /// <summary>The analysis bands of the scenario: theta 4–8 Hz, alpha 8–13 Hz, beta 15–25 Hz, gamma 30–45 Hz.</summary>
    public static IReadOnlyList<Band> Bands { get; } =
        [new Band("theta", 4, 8), new Band("alpha", 8, 13), new Band("beta", 15, 25), new Band("gamma", 30, 45)];

    /// <summary>Generates the recording and its ground truth for the given options.</summary>
    /// <exception cref="InputException">An option is out of range; the message names it.</exception>
    public static SimulatedScenario Generate(ScenarioOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        Validate(options);
        double fs = options.SampleRate;
        var master = new Xoshiro256StarStar(options.Seed);

        // Trial order and timing, in samples.
        int trialCount = 2 * options.TrialsPerCondition;
        var labels = new string[trialCount];
        for (int i = 0; i < trialCount; i++) labels[i] = i < options.TrialsPerCondition ? options.BetaCondition : options.OtherCondition;
        for (int i = trialCount - 1; i > 0; i--)
        {
            int j = master.Next(i + 1);
            (labels[i], labels[j]) = (labels[j], labels[i]);
        }
        int spanStart = (int)Math.Round(options.TrialStart * fs);
        int spanEnd = (int)Math.Round(options.TrialEnd * fs);
        int lead = (int)Math.Round(options.LeadSeconds * fs);
        var onsets = new int[trialCount];
        int next = lead - spanStart;
        for (int i = 0; i < trialCount; i++)
        {
            onsets[i] = next;
            next += spanEnd - spanStart + (int)Math.Round((options.GapMin + master.NextDouble() * options.GapJitter) * fs);
        }
        int n = onsets[^1] + spanEnd + lead;
        int m = SpectralShaping.TransformLength(n);

        var componentSeeds = new int[16];
        for (int i = 0; i < componentSeeds.Length; i++) componentSeeds[i] = master.Next();
        Random Component(int i) => new Xoshiro256StarStar(componentSeeds[i]);

        // All Gaussian processes are drawn as shaped spectra, then inverted together (two per transform).
        int channelCount = Montage.Labels.Length;
        double[] pink = SpectralShaping.Gain(m, fs, SpectralShaping.PowerLawShape(options.BackgroundExponent, options.BackgroundFloorHz));
        double[] thetaGain = SpectralShaping.Gain(m, fs, SpectralShaping.BandShape(ThetaSourceLow, ThetaSourceHigh, SourceTaperHz));
        double[] betaGain = SpectralShaping.Gain(m, fs, SpectralShaping.BandShape(BetaSourceLow, BetaSourceHigh, SourceTaperHz));
        double[] alphaGain = SpectralShaping.Gain(m, fs, SpectralShaping.BandShape(AlphaSourceLow, AlphaSourceHigh, SourceTaperHz));
        double[] slowGain = SpectralShaping.Gain(m, fs, SpectralShaping.BandShape(EnvelopeLow, EnvelopeHigh, EnvelopeTaperHz));
        var spectra = new List<System.Numerics.Complex[]>();
        for (int c = 0; c < channelCount; c++) spectra.Add(SpectralShaping.RandomSpectrum(Component(c), pink));
        var theta = SpectralShaping.RandomSpectrum(Component(10), thetaGain);
        var beta = SpectralShaping.RandomSpectrum(Component(11), betaGain);
        spectra.Add(theta);
        spectra.Add(SpectralShaping.Delayed(theta, fs, options.ThetaLag));
        spectra.Add(beta);
        spectra.Add(SpectralShaping.Delayed(beta, fs, options.BetaLag));
        spectra.Add(SpectralShaping.RandomSpectrum(Component(12), betaGain));
        spectra.Add(SpectralShaping.RandomSpectrum(Component(13), alphaGain));
        spectra.Add(SpectralShaping.RandomSpectrum(Component(14), slowGain));
        var signals = SpectralShaping.ToSignals(spectra, n);
        int sourceBase = channelCount;
        double[] thetaA = signals[sourceBase], thetaB = signals[sourceBase + 1];
        double[] betaA = signals[sourceBase + 2], betaDelayed = signals[sourceBase + 3], betaIndependent = signals[sourceBase + 4];
        double[] alpha = signals[sourceBase + 5], slow = signals[sourceBase + 6];

        // Background: independent 1/f^alpha noise on every channel.
        var samples = new double[channelCount][];
        for (int c = 0; c < channelCount; c++)
        {
            samples[c] = signals[c];
            for (int i = 0; i < n; i++) samples[c][i] *= options.BackgroundRms;
        }
        double BandVariance(string band)
        {
            var b = Bands.First(x => x.Name == band);
            return options.BackgroundRms * options.BackgroundRms * SpectralShaping.BandFraction(pink, fs, b.Low, b.High);
        }
        double[] Channel(string label) => samples[Montage.IndexOf(label)];

        // (a) theta, phase-coupled at a lag, always.
        double thetaAmp = Math.Sqrt(options.CoupledSnr * BandVariance("theta"));
        AddTo(Channel(Montage.ThetaA), thetaA, thetaAmp);
        AddTo(Channel(Montage.ThetaB), thetaB, thetaAmp);

        // (b) beta, phase-coupled at a lag around the trials of one condition, independent of equal power elsewhere.
        double betaAmp = Math.Sqrt(options.CoupledSnr * BandVariance("beta"));
        AddTo(Channel(Montage.BetaA), betaA, betaAmp);
        var mask = CouplingMask(n, fs, onsets, labels, options);
        var betaB = Channel(Montage.BetaB);
        for (int i = 0; i < n; i++)
            betaB[i] += betaAmp * (mask[i] * betaDelayed[i] + Math.Sqrt(1.0 - mask[i] * mask[i]) * betaIndependent[i]);

        // (c) alpha, one source seen by two channels with different real gains and no delay.
        double alphaAmp = Math.Sqrt(options.MixingSnr * BandVariance("alpha"));
        AddTo(Channel(Montage.MixA), alpha, alphaAmp);
        AddTo(Channel(Montage.MixB), alpha, options.MixingGain * alphaAmp);

        // (d) gamma carriers with independent phases sharing one slow envelope.
        // E[exp(2κl)] = exp(2κ²) for unit-variance Gaussian l; a unit cosine has mean square 1/2.
        double gammaAmp = Math.Sqrt(2.0 * options.EnvelopeSnr * BandVariance("gamma") / Math.Exp(2.0 * EnvelopeDepth * EnvelopeDepth));
        var carrierRng = Component(15);
        foreach (var label in new[] { Montage.EnvelopeA, Montage.EnvelopeB })
        {
            var carrier = PhaseDiffusionCarrier(carrierRng, n, fs, GammaCarrierHz, GammaHalfWidthHz);
            var target = Channel(label);
            for (int i = 0; i < n; i++) target[i] += gammaAmp * Math.Exp(EnvelopeDepth * slow[i]) * carrier[i];
        }

        // (e) the same stimulus-locked response at every onset in two channels.
        double evokedPeak = options.EvokedPeakRatio * Math.Sqrt(BandVariance("alpha"));
        int evokedLength = (int)Math.Round((options.TrialEnd + options.GapMin) * fs);
        var response = new double[evokedLength];
        for (int s = 0; s < evokedLength; s++) response[s] = EvokedResponse(s / fs, evokedPeak);
        foreach (var label in new[] { Montage.EvokedA, Montage.EvokedB })
        {
            var target = Channel(label);
            foreach (int onset in onsets)
                for (int s = 0; s < evokedLength && onset + s < n; s++) target[onset + s] += response[s];
        }

        var events = new RecordingEvent[trialCount];
        for (int i = 0; i < trialCount; i++) events[i] = new RecordingEvent(onsets[i] / fs, 0.0, labels[i]);
        string source = string.Create(CultureInfo.InvariantCulture,
            $"simulated: ten-electrode montage, cued task with conditions '{options.BetaCondition}' and '{options.OtherCondition}', seed {options.Seed}");
        var recording = new Recording(source, fs, Montage.Channels(), samples, events,
            ["Simulated recording with known ground truth; no real data."]);
        return new SimulatedScenario(recording, BuildTruth(options, n / fs));
    }

    /// <summary>
    /// The stimulus-locked response t seconds after an onset: peak·(t/τ)·exp(1 − t/τ)·sin(2π·f·t) with f = 10 Hz and
    /// τ = 0.3 s, so its envelope rises from 0 at the onset to <paramref name="peak"/> at τ and then decays; 0 before the onset.
    /// </summary>
    internal static double EvokedResponse(double t, double peak)
    {
        if (t < 0) return 0.0;
        double u = t / EvokedRiseSeconds;
        return peak * u * Math.Exp(1.0 - u) * Math.Sin(2.0 * Math.PI * EvokedFrequencyHz * t);
    }

    /// <summary>
    /// Weight of the coupled beta copy on the second beta channel: 1 over each trial span of the beta condition widened
    /// by <see cref="CouplingMarginSeconds"/> on both sides, raised-cosine ramps of <see cref="CouplingRampSeconds"/> outside that, else 0.
    /// </summary>
    internal static double[] CouplingMask(int n, double fs, int[] onsets, string[] labels, ScenarioOptions options)
    {
        var mask = new double[n];
        int ramp = Math.Max(1, (int)Math.Round(CouplingRampSeconds * fs));
        for (int t = 0; t < onsets.Length; t++)
        {
            if (labels[t] != options.BetaCondition) continue;
            int from = onsets[t] + (int)Math.Round((options.TrialStart - CouplingMarginSeconds) * fs);
            int to = onsets[t] + (int)Math.Round((options.TrialEnd + CouplingMarginSeconds) * fs);
            for (int i = Math.Max(0, from - ramp); i < Math.Min(n, to + ramp); i++)
            {
                double w = i < from ? 0.5 - 0.5 * Math.Cos(Math.PI * (i - (from - ramp)) / ramp)
                    : i >= to ? 0.5 - 0.5 * Math.Cos(Math.PI * (to + ramp - i) / ramp)
                    : 1.0;
                mask[i] = Math.Max(mask[i], w);
            }
        }
        return mask;
    }

    /// <summary>
    /// cos(φ(t)) with φ advancing by 2π·f/fs per sample plus a Gaussian step of variance 4π·halfWidth/fs (Wiener phase
    /// noise with a Lorentzian line of the given half-width in Hz), starting from a uniform random phase.
    /// </summary>
    internal static double[] PhaseDiffusionCarrier(Random rng, int n, double fs, double frequencyHz, double halfWidthHz)
    {
        var steps = new double[n];
        Normal.Samples(rng, steps, 0.0, Math.Sqrt(4.0 * Math.PI * halfWidthHz / fs));
        double phase = 2.0 * Math.PI * rng.NextDouble();
        double advance = 2.0 * Math.PI * frequencyHz / fs;
        var carrier = new double[n];
        for (int i = 0; i < n; i++)
        {
            carrier[i] = Math.Cos(phase);
            phase = Math.IEEERemainder(phase + advance + steps[i], 2.0 * Math.PI);
        }
        return carrier;
    }

    private static void AddTo(double[] target, double[] values, double gain = 1.0)
    {
        for (int i = 0; i < target.Length; i++) target[i] += gain * values[i];
    }

    private static void Validate(ScenarioOptions o)
    {
        static void Require(bool ok, string field, object value, string expected)
        {
            if (!ok)
                throw new InputException(string.Create(CultureInfo.InvariantCulture,
                    $"Scenario option {field} = {value}: expected {expected}."));
        }
        Require(o.SampleRate >= 100 && double.IsFinite(o.SampleRate), nameof(o.SampleRate), o.SampleRate, "at least 100 Hz (the gamma band reaches 45 Hz)");
        Require(o.TrialsPerCondition >= 2, nameof(o.TrialsPerCondition), o.TrialsPerCondition, "at least 2");
        Require(!string.IsNullOrWhiteSpace(o.BetaCondition), nameof(o.BetaCondition), $"'{o.BetaCondition}'", "a non-empty label");
        Require(!string.IsNullOrWhiteSpace(o.OtherCondition) && o.OtherCondition != o.BetaCondition, nameof(o.OtherCondition),
            $"'{o.OtherCondition}'", "a non-empty label different from BetaCondition");
        Require(o.TrialStart < 0 && o.TrialEnd > 0, "TrialStart..TrialEnd", $"{o.TrialStart}..{o.TrialEnd}", "a span around the onset (start < 0 < end)");
        Require(o.WindowStart >= o.TrialStart && o.WindowEnd <= o.TrialEnd && o.WindowStart < o.WindowEnd,
            "WindowStart..WindowEnd", $"{o.WindowStart}..{o.WindowEnd}", "a window inside the trial span");
        double minGap = 2.0 * (CouplingMarginSeconds + CouplingRampSeconds);
        Require(o.GapMin >= minGap, nameof(o.GapMin), o.GapMin, $"at least {minGap} s so the beta coupling of one trial ends before the next span");
        Require(o.GapJitter >= 0 && double.IsFinite(o.GapJitter), nameof(o.GapJitter), o.GapJitter, "0 or more seconds");
        Require(o.LeadSeconds >= 0 && double.IsFinite(o.LeadSeconds), nameof(o.LeadSeconds), o.LeadSeconds, "0 or more seconds");
        Require(o.BackgroundRms > 0 && double.IsFinite(o.BackgroundRms), nameof(o.BackgroundRms), o.BackgroundRms, "a positive amplitude in microvolts");
        Require(o.BackgroundExponent >= 0 && o.BackgroundExponent <= 3, nameof(o.BackgroundExponent), o.BackgroundExponent, "an exponent from 0 to 3");
        Require(o.BackgroundFloorHz > 0 && o.BackgroundFloorHz < 4, nameof(o.BackgroundFloorHz), o.BackgroundFloorHz, "a frequency above 0 and below 4 Hz");
        // Lag phases must stay strictly between 0 and π at the band centre, or the sign-based measures change their answer.
        Require(o.ThetaLag > 0 && o.ThetaLag < 1.0 / (2 * 6.0), nameof(o.ThetaLag), o.ThetaLag, "between 0 and 1/(2·6 Hz) s");
        Require(o.BetaLag > 0 && o.BetaLag < 1.0 / (2 * 20.0), nameof(o.BetaLag), o.BetaLag, "between 0 and 1/(2·20 Hz) s");
        Require(o.CoupledSnr > 0 && double.IsFinite(o.CoupledSnr), nameof(o.CoupledSnr), o.CoupledSnr, "a positive power ratio");
        Require(o.MixingSnr > 0 && double.IsFinite(o.MixingSnr), nameof(o.MixingSnr), o.MixingSnr, "a positive power ratio");
        Require(o.MixingGain > 0 && o.MixingGain < 1, nameof(o.MixingGain), o.MixingGain, "a gain between 0 and 1");
        Require(o.EnvelopeSnr > 0 && double.IsFinite(o.EnvelopeSnr), nameof(o.EnvelopeSnr), o.EnvelopeSnr, "a positive power ratio");
        Require(o.EvokedPeakRatio > 0 && double.IsFinite(o.EvokedPeakRatio), nameof(o.EvokedPeakRatio), o.EvokedPeakRatio, "a positive ratio");
    }

    private static GroundTruth BuildTruth(ScenarioOptions o, double duration)
    {
        Measure[] phase = [Measure.Plv, Measure.Ppc, Measure.Pli, Measure.Wpli, Measure.WpliDebiased, Measure.Coherence, Measure.ImagCoherency];
        Measure[] all = [.. phase, Measure.Aec, Measure.AecOrth];
        string[] both = [o.BetaCondition, o.OtherCondition];
        double evokedSnr = 0.5 * o.EvokedPeakRatio * o.EvokedPeakRatio; // mean square of a sine of that peak over band variance
        var inv = CultureInfo.InvariantCulture;
        var pairs = new List<TruthPair>
        {
            new(Montage.ThetaA, Montage.ThetaB, TruthKind.PhaseCoupled, "theta", o.ThetaLag, both, o.CoupledSnr, o.CoupledSnr,
                all, [],
                string.Create(inv, $"One 5-7 Hz band-limited noise source; {Montage.ThetaB} is a copy of {Montage.ThetaA} delayed by {o.ThetaLag * 1000:0.#} ms " +
                $"(phase {2 * Math.PI * 6.0 * o.ThetaLag:0.###} rad at 6 Hz), in both conditions. The shared source also shares its " +
                $"envelope, and the lag leaves a part orthogonal to the leading channel, so aec and aec-orth find it as well.")),
            new(Montage.BetaA, Montage.BetaB, TruthKind.PhaseCoupled, "beta", o.BetaLag, [o.BetaCondition], o.CoupledSnr, o.CoupledSnr,
                all, [],
                string.Create(inv, $"One 17-23 Hz band-limited noise source; {Montage.BetaB} is a copy of {Montage.BetaA} delayed by {o.BetaLag * 1000:0.#} ms " +
                $"(phase {2 * Math.PI * 20.0 * o.BetaLag:0.###} rad at 20 Hz) only in '{o.BetaCondition}' trials. In '{o.OtherCondition}' trials " +
                $"{Montage.BetaB} carries independent beta activity of the same power, so no measure should find the pair there and band power " +
                $"does not tell the conditions apart.")),
            new(Montage.MixA, Montage.MixB, TruthKind.ZeroLagMixing, "alpha", 0.0, both, o.MixingSnr, Math.Round(o.MixingSnr * o.MixingGain * o.MixingGain, 9),
                [Measure.Plv, Measure.Ppc, Measure.Coherence, Measure.Aec],
                [Measure.Pli, Measure.Wpli, Measure.WpliDebiased, Measure.ImagCoherency, Measure.AecOrth],
                string.Create(inv, $"One 9-12 Hz band-limited noise source seen by {Montage.MixA} with gain 1 and by {Montage.MixB} with gain {o.MixingGain}, " +
                $"no delay (volume conduction). Measures that accept zero-lag phase differences find it; measures built to ignore zero lag " +
                $"(sign of the phase difference, imaginary part, orthogonalized envelopes) do not.")),
            new(Montage.EnvelopeA, Montage.EnvelopeB, TruthKind.EnvelopeOnly, "gamma", null, both, o.EnvelopeSnr, o.EnvelopeSnr,
                [Measure.Aec, Measure.AecOrth], phase,
                $"38 Hz carriers with independent random phases (phase diffusion) on each channel, both multiplied by one slowly varying " +
                "positive envelope (0.5-3 Hz band-limited, different in every trial, not locked to the onsets). Only envelope measures find it."),
            new(Montage.EvokedA, Montage.EvokedB, TruthKind.StimulusLocked, "alpha", null, both, evokedSnr, evokedSnr,
                [], all,
                $"The same deterministic damped 10 Hz oscillation starts at every onset in both channels, with identical phase in every " +
                "trial, over independent backgrounds (its SNR is stated at the peak of the response's envelope, 0.3 s after onset). This is not coupling: raw plv, ppc and coherence are high in the window, but " +
                "trial-shuffle surrogates keep the stimulus-locked part and reproduce them, so no measure is significant; subtracting the " +
                "condition's trial mean removes the response."),
        };
        string description =
            "Invented scenario: a ten-electrode surface montage (left row L1-L5, right row R1-R5, front to back, 2 mm apart) recorded " +
            $"during a cued task with two cue conditions, '{o.BetaCondition}' and '{o.OtherCondition}', {o.TrialsPerCondition} trials each in " +
            "random order. Every channel has independent 1/f background noise. Five pairs carry a known relation (listed in pairs); all " +
            "other channel pairs are independent. Simulated data; no real recording or person.";
        return new GroundTruth(description, o.Seed, o.SampleRate, duration, Montage.Labels,
            [
                new ConditionTruth(o.BetaCondition, o.BetaCondition, o.TrialsPerCondition, "Cue of the first kind; the beta pair is phase-coupled around these trials."),
                new ConditionTruth(o.OtherCondition, o.OtherCondition, o.TrialsPerCondition, "Cue of the second kind; the beta pair is independent here."),
            ],
            o.TrialStart, o.TrialEnd, o.WindowStart, o.WindowEnd, Bands, o.BackgroundExponent, o.BackgroundRms, pairs);
    }
}
