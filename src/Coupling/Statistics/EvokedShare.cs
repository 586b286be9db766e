using System.Globalization;
using System.Numerics;
using Coupling.Spectral;

namespace Coupling.Statistics;

/// <summary>
/// The share of a band's power that is locked to the event (evoked), per channel over the analysis window, and the
/// warning the run gives when it is high: trial shuffling and evoked removal discount a stimulus-locked response only
/// if it is the same in every trial, and a response whose latency or amplitude varies from trial to trial, shared by the
/// channels, reads as trial-by-trial coupling under every measure (Truccolo, Ding, Knuth, Nakamura and Bressler 2002,
/// "Trial-to-trial variability of cortical evoked responses: implications for the analysis of functional
/// connectivity", Clin Neurophysiol 113:206-226).
/// </summary>
/// <remarks>
/// For channel c with N trials z_n(t) at the window's time points t, trial mean m(t) = (1/N) Σ_n z_n(t) and residual
/// sum of squares R(t) = Σ_n |z_n(t) − m(t)|², the evoked power |m(t)|² overestimates that of the true mean response
/// by R(t)/(N(N − 1)) on average (the variance of a mean of N trials, with the unbiased residual variance); the share is
/// <c>share = Σ_t (|m(t)|² − R(t)/(N(N − 1))) / Σ_t (|m(t)|² + R(t)/N)</c>, debiased evoked power over total power
/// (mean |z|² = |m|² + R/N). It is about 0 without an evoked response (whatever N) and 1 for a response that is the
/// same in every trial with no other activity; it can fall slightly below 0 by chance. When the evoked response has
/// been removed before band isolation, the removed trial mean's narrowband signal is passed as well and added back to
/// m (band isolation is linear), so the share describes the data as recorded. A latency jitter of standard deviation σ
/// lowers the evoked power at frequency f by about exp(−(2π f σ)²) (the characteristic function of a normal delay;
/// from memory), so a response jittered by more than about a sixth of a period (2π f σ above 1 rad) shows a small
/// evoked share and escapes this check, while still coupling the channels trial by trial.
/// </remarks>
public static class EvokedShare
{
    /// <summary>
    /// Share above which the run warns: a tenth of the band's power in the window locked to the event. A choice of
    /// this tool, not a published cut-off; a smaller evoked share with strong latency jitter can matter too.
    /// </summary>
    public const double WarningThreshold = 0.1;

    /// <summary>The evoked share of every channel of <paramref name="trials"/> (see remarks).</summary>
    /// <param name="trials">Narrowband signals of one condition in one band (at least 2 trials).</param>
    /// <param name="removedEvoked">The narrowband signal of a trial mean already subtracted from the trials (one
    /// trial, same channels and time points), or null when nothing was removed.</param>
    /// <returns>One share per channel, in channel order; NaN for a channel with no power.</returns>
    /// <exception cref="ArgumentException">Fewer than 2 trials, or a removed mean of another shape.</exception>
    public static double[] Compute(NarrowbandSet trials, NarrowbandSet? removedEvoked = null)
    {
        ArgumentNullException.ThrowIfNull(trials);
        int n = trials.TrialCount, channels = trials.ChannelCount;
        if (n < 2) throw new ArgumentException("The evoked share needs at least 2 trials.", nameof(trials));
        if (removedEvoked is not null && (removedEvoked.TrialCount != 1 || removedEvoked.ChannelCount != channels
            || removedEvoked.TimeCount != trials.TimeCount))
            throw new ArgumentException("The removed mean must be one trial with the same channels and time points.", nameof(removedEvoked));
        var shares = new double[channels];
        for (int c = 0; c < channels; c++)
        {
            double evoked = 0, residual = 0;
            for (int t = 0; t < trials.TimeCount; t++)
            {
                var row = trials.Row(t, c);
                Complex sum = Complex.Zero;
                foreach (var z in row) sum += z;
                var mean = sum / n;
                double squares = 0;
                foreach (var z in row)
                {
                    var d = z - mean;
                    squares += d.Real * d.Real + d.Imaginary * d.Imaginary;
                }
                if (removedEvoked is not null) mean += removedEvoked.Row(t, c)[0];
                evoked += mean.Real * mean.Real + mean.Imaginary * mean.Imaginary;
                residual += squares;
            }
            double total = evoked + residual / n;
            shares[c] = total > 0 ? (evoked - residual / ((double)n * (n - 1))) / total : double.NaN;
        }
        return shares;
    }

    /// <summary>
    /// The warning for one condition and band, or null when no channel's share exceeds <paramref name="threshold"/>.
    /// </summary>
    /// <param name="condition">Condition name.</param>
    /// <param name="band">Band name.</param>
    /// <param name="channels">Channel labels in the shares' order.</param>
    /// <param name="shares">Evoked share per channel (<see cref="Compute"/>).</param>
    /// <param name="threshold">Share above which a channel is named.</param>
    public static string? Warning(string condition, string band, IReadOnlyList<string> channels, IReadOnlyList<double> shares,
        double threshold = WarningThreshold)
    {
        ArgumentNullException.ThrowIfNull(channels);
        ArgumentNullException.ThrowIfNull(shares);
        var high = Enumerable.Range(0, shares.Count).Where(c => shares[c] > threshold)
            .Select(c => string.Create(CultureInfo.InvariantCulture, $"{channels[c]} {shares[c]:0.00}")).ToArray();
        if (high.Length == 0) return null;
        return string.Create(CultureInfo.InvariantCulture,
            $"{condition} / {band}: the event-locked (evoked) response carries more than {threshold:0.##} of the band's power in the window at {string.Join(", ", high)}. ") +
            "Trial shuffling and evoked removal discount it only if it is the same in every trial; if its latency or amplitude varies from trial to trial, " +
            "that shared variation is read as coupling by every measure (Truccolo et al. 2002). Check the single trials, or treat coupling between these channels with caution.";
    }
}
