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
    /// on separating induced from evoked activity by subtracting the average).
    /// </remarks>
    public static void SubtractInPlace(TrialSet trials)
    {
        int n = trials.TrialCount, c = trials.ChannelCount, s = trials.SampleCount;
        if (n == 0) return;
        var mean = new double[s];
        for (int ch = 0; ch < c; ch++)
        {
            Array.Clear(mean);
            for (int t = 0; t < n; t++)
            {
                var x = trials.Trial(t, ch);
                for (int i = 0; i < s; i++) mean[i] += x[i];
            }
            for (int i = 0; i < s; i++) mean[i] /= n;
            for (int t = 0; t < n; t++)
            {
                var x = trials.Trial(t, ch);
                for (int i = 0; i < s; i++) x[i] -= mean[i];
            }
        }
    }
}
