namespace Coupling.Trials;

/// <summary>Removes the evoked (stimulus-locked) response of a condition from its trials.</summary>
public static class EvokedRemoval
{
    /// <summary>
    /// Subtracts, per channel and sample, the mean over the condition's trials from every trial, padding included,
    /// so that a response phase-locked to the event is not read as coupling between channels.
    /// Changes the trial set's data in place.
    /// </summary>
    /// <remarks>
    /// With N trials the residual of trial n is x_n - (1/N) Σ_m x_m; it keeps the induced (non-phase-locked) activity.
    /// The subtraction is done before band decomposition, as is common practice (e.g. Kalcher &amp; Pfurtscheller 1995,
    /// on separating induced from evoked activity by subtracting the average). It removes only the part of the response
    /// that is the same in every trial: a latency or amplitude that varies from trial to trial leaves residuals shared by
    /// the channels, which read as coupling (Truccolo et al. 2002, Clin Neurophysiol 113:206-226); the run warns when
    /// the evoked share of a band's power is high (Statistics.EvokedShare).
    /// </remarks>
    public static void SubtractInPlace(TrialSet trials)
    {
        ArgumentNullException.ThrowIfNull(trials);
        if (trials.TrialCount == 0) return;
        SubtractInPlace(trials, Mean(trials));
    }

    /// <summary>
    /// Subtracts <paramref name="mean"/>, a set of one trial as <see cref="Mean"/> returns for these trials, from every
    /// trial, padding included; with the set's own mean this is <see cref="SubtractInPlace(TrialSet)"/>.
    /// Changes the trial set's data in place.
    /// </summary>
    /// <exception cref="ArgumentException"><paramref name="mean"/> is not one trial of the set's channels and samples.</exception>
    public static void SubtractInPlace(TrialSet trials, TrialSet mean)
    {
        ArgumentNullException.ThrowIfNull(trials);
        ArgumentNullException.ThrowIfNull(mean);
        if (mean.TrialCount != 1 || mean.ChannelCount != trials.ChannelCount || mean.SampleCount != trials.SampleCount)
            throw new ArgumentException("The mean must be one trial with the set's channels and samples.", nameof(mean));
        for (int ch = 0; ch < trials.ChannelCount; ch++)
        {
            var m = mean.Trial(0, ch);
            for (int t = 0; t < trials.TrialCount; t++)
            {
                var x = trials.Trial(t, ch);
                for (int i = 0; i < x.Length; i++) x[i] -= m[i];
            }
        }
    }

    /// <summary>
    /// The trial mean of <paramref name="trials"/> (per channel and sample, padding included) as a set of one trial with
    /// the same channels, rate, padding and span: what <see cref="SubtractInPlace(TrialSet)"/> subtracts.
    /// </summary>
    /// <exception cref="ArgumentException">The set holds no trial.</exception>
    public static TrialSet Mean(TrialSet trials)
    {
        ArgumentNullException.ThrowIfNull(trials);
        int n = trials.TrialCount, c = trials.ChannelCount, s = trials.SampleCount;
        if (n == 0) throw new ArgumentException("No trial to average.", nameof(trials));
        var mean = new double[c * s];
        for (int ch = 0; ch < c; ch++)
        {
            var target = mean.AsSpan(ch * s, s);
            for (int t = 0; t < n; t++)
            {
                var x = trials.Trial(t, ch);
                for (int i = 0; i < s; i++) target[i] += x[i];
            }
            for (int i = 0; i < s; i++) target[i] /= n;
        }
        return new TrialSet(trials.Condition, trials.Channels, trials.SampleRate, 1, s, trials.PadSamples, trials.SpanStart, mean,
            [double.NaN], []);
    }
}
