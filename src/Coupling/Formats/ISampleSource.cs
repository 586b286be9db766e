namespace Coupling.Formats;

/// <summary>
/// Continuous samples of several channels at one sampling rate, in physical units, read a segment at a time:
/// a recording held in memory, or a file read on demand.
/// </summary>
public interface ISampleSource
{
    /// <summary>Where the samples come from (a path, or a description for generated data).</summary>
    string Source { get; }

    /// <summary>Sampling rate in Hz shared by all channels.</summary>
    double SampleRate { get; }

    /// <summary>Number of samples per channel.</summary>
    int SampleCount { get; }

    /// <summary>The channels, in the order <see cref="Read"/> writes them.</summary>
    IReadOnlyList<ChannelInfo> Channels { get; }

    /// <summary>
    /// Copies samples <c>firstSample .. firstSample + length - 1</c> of every channel into <paramref name="target"/>,
    /// channel-major: channel c fills <c>target[c * length .. (c + 1) * length)</c>.
    /// </summary>
    /// <param name="firstSample">First sample to read, 0 or more.</param>
    /// <param name="length">Samples per channel; <c>firstSample + length</c> may not pass <see cref="SampleCount"/>.</param>
    /// <param name="target">Destination of exactly <c>Channels.Count * length</c> values.</param>
    /// <exception cref="ArgumentOutOfRangeException">The segment runs outside the samples, or the target has the wrong length.</exception>
    void Read(int firstSample, int length, Span<double> target);
}
