using System.Numerics;

namespace Coupling.Spectral;

/// <summary>
/// Complex narrowband (analytic) signals of one condition in one band, at the time points of the analysis window.
/// One time point is one contiguous block of channels x trials, channel-major:
/// value of channel c in trial n at time point t is <c>Data[(t * ChannelCount + c) * TrialCount + n]</c>.
/// The all-pairs work is then a product of that block with its conjugate transpose, or a tight loop over it.
/// </summary>
public sealed class NarrowbandSet
{
    /// <summary>Creates the set; <paramref name="data"/> must hold times x channels x trials values.</summary>
    public NarrowbandSet(Band band, IReadOnlyList<string> channels, int trialCount, IReadOnlyList<double> times, Complex[] data)
    {
        if (data.Length != (long)times.Count * channels.Count * trialCount)
            throw new ArgumentException($"Expected {times.Count}x{channels.Count}x{trialCount} values, got {data.Length}.", nameof(data));
        Band = band;
        Channels = channels;
        TrialCount = trialCount;
        Times = times;
        Data = data;
    }

    /// <summary>The band these signals were isolated in.</summary>
    public Band Band { get; }

    /// <summary>Channel labels in data order.</summary>
    public IReadOnlyList<string> Channels { get; }

    /// <summary>Number of channels.</summary>
    public int ChannelCount => Channels.Count;

    /// <summary>Number of trials.</summary>
    public int TrialCount { get; }

    /// <summary>Time of each time point in seconds relative to the event onset.</summary>
    public IReadOnlyList<double> Times { get; }

    /// <summary>Number of time points.</summary>
    public int TimeCount => Times.Count;

    /// <summary>The values, time-major (see the type's remarks).</summary>
    public Complex[] Data { get; }

    /// <summary>The channels x trials block of time point <paramref name="t"/>.</summary>
    public ReadOnlySpan<Complex> Block(int t) =>
        Data.AsSpan(t * ChannelCount * TrialCount, ChannelCount * TrialCount);

    /// <summary>The trials of channel <paramref name="c"/> at time point <paramref name="t"/>.</summary>
    public ReadOnlySpan<Complex> Row(int t, int c) =>
        Data.AsSpan((t * ChannelCount + c) * TrialCount, TrialCount);
}
