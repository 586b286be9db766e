namespace Coupling.Formats;

/// <summary>
/// A continuous multichannel recording at one sampling rate, in physical units, with its events.
/// Samples are channel-major: <c>Samples[c][s]</c> is channel c at sample s.
/// </summary>
public sealed class Recording : ISampleSource
{
    /// <summary>Creates a recording; every channel must have the same number of samples.</summary>
    public Recording(string source, double sampleRate, IReadOnlyList<ChannelInfo> channels, double[][] samples,
        IReadOnlyList<RecordingEvent> events, IReadOnlyList<string>? notes = null)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(sampleRate);
        if (channels.Count != samples.Length)
            throw new ArgumentException($"{channels.Count} channels but {samples.Length} sample rows.", nameof(samples));
        int n = samples.Length == 0 ? 0 : samples[0].Length;
        for (int c = 0; c < samples.Length; c++)
            if (samples[c].Length != n)
                throw new ArgumentException($"Channel '{channels[c].Label}' has {samples[c].Length} samples, expected {n}.", nameof(samples));
        Source = source;
        SampleRate = sampleRate;
        Channels = channels;
        Samples = samples;
        Events = events;
        Notes = notes ?? Array.Empty<string>();
    }

    /// <summary>Where the recording came from (a path, or a description for generated data).</summary>
    public string Source { get; }

    /// <summary>Sampling rate in Hz shared by all channels.</summary>
    public double SampleRate { get; }

    /// <summary>The channels, in the order of <see cref="Samples"/>.</summary>
    public IReadOnlyList<ChannelInfo> Channels { get; }

    /// <summary>Physical samples, channel-major.</summary>
    public double[][] Samples { get; }

    /// <summary>Event markers, sorted by onset.</summary>
    public IReadOnlyList<RecordingEvent> Events { get; }

    /// <summary>Messages from reading, e.g. signals left out because their sampling rate differs.</summary>
    public IReadOnlyList<string> Notes { get; }

    /// <summary>Number of samples per channel.</summary>
    public int SampleCount => Samples.Length == 0 ? 0 : Samples[0].Length;

    /// <summary>Duration in seconds.</summary>
    public double Duration => SampleCount / SampleRate;

    /// <inheritdoc/>
    public void Read(int firstSample, int length, Span<double> target)
    {
        SampleSegment.Check(firstSample, length, SampleCount, Channels.Count, target.Length);
        for (int c = 0; c < Samples.Length; c++)
            Samples[c].AsSpan(firstSample, length).CopyTo(target.Slice(c * length, length));
    }

    /// <summary>Index of the channel with the given label (ordinal, case-sensitive), or -1.</summary>
    public int IndexOf(string label)
    {
        for (int i = 0; i < Channels.Count; i++)
            if (string.Equals(Channels[i].Label, label, StringComparison.Ordinal)) return i;
        return -1;
    }
}
