using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Trials;

namespace Coupling.Pipeline;

/// <summary>
/// In which order one condition's bands are isolated and tested, so that memory stays bounded: either every band is
/// isolated first and the padded trials are dropped before any surrogate test (when the narrowband sets of all bands
/// together are smaller than the padded trials, as with many channels and long filters), or each band is isolated just
/// before its test (when the sets are the larger, as with many bands at a time step of one sample, or when the trials
/// are small enough not to matter). Either order gives the same results; only what is held at once differs. The
/// band-by-band order is kept for small trial sets because each unit (condition x band) then starts with its own band
/// isolation, so a run that is stopped has done no isolation work for units it never reached.
/// </summary>
public static class BandOrder
{
    /// <summary>Padded trials below this size (256 MiB) are kept through the band loop: the reordering would save little.</summary>
    public const long MinimumTrialBytes = 256L << 20;

    /// <summary>
    /// True when the padded trials (8 bytes per sample) take at least <see cref="MinimumTrialBytes"/> and the complex
    /// narrowband values of every band (16 bytes each) take no more, so that isolating every band first and dropping the
    /// trials lowers the peak.
    /// </summary>
    /// <param name="trials">The padded trials of one condition.</param>
    /// <param name="window">The analysis window.</param>
    /// <param name="steps">The time step of each band, in samples.</param>
    public static bool IsolateAllFirst(TrialSet trials, TimeRange window, IReadOnlyList<int> steps)
    {
        ArgumentNullException.ThrowIfNull(trials);
        ArgumentNullException.ThrowIfNull(steps);
        long trialBytes = 8L * trials.Data.LongLength;
        if (trialBytes < MinimumTrialBytes) return false;
        long timePoints = steps.Sum(step => (long)NarrowbandExtractor.WindowSamples(trials, window, step).Length);
        return 16 * timePoints * trials.ChannelCount * trials.TrialCount <= trialBytes;
    }
}
