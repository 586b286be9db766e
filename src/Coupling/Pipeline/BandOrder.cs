using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Trials;

namespace Coupling.Pipeline;

/// <summary>
/// In which order one condition's bands are isolated and tested, so that memory stays bounded: either every band is
/// isolated first and the padded trials are dropped before any surrogate test (when the narrowband sets of all bands
/// together are smaller than the padded trials, as with many channels and long filters), or each band is isolated just
/// before its test (when the sets are the larger, as with many bands at a time step of one sample). Either order gives
/// the same results; only what is held at once differs.
/// </summary>
public static class BandOrder
{
    /// <summary>
    /// True when the complex narrowband values of every band (16 bytes each) take no more memory than the padded
    /// trials (8 bytes per sample), so that isolating every band first and dropping the trials lowers the peak.
    /// </summary>
    /// <param name="trials">The padded trials of one condition.</param>
    /// <param name="window">The analysis window.</param>
    /// <param name="steps">The time step of each band, in samples.</param>
    public static bool IsolateAllFirst(TrialSet trials, TimeRange window, IReadOnlyList<int> steps)
    {
        ArgumentNullException.ThrowIfNull(trials);
        ArgumentNullException.ThrowIfNull(steps);
        long timePoints = steps.Sum(step => (long)NarrowbandExtractor.WindowSamples(trials, window, step).Length);
        return 16 * timePoints * trials.ChannelCount * trials.TrialCount <= 8L * trials.Data.LongLength;
    }
}
