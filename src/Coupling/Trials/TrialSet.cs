namespace Coupling.Trials;

/// <summary>
/// The trials of one condition, cut from a recording (or read already cut), padded at both ends so that
/// band-pass filtering and wavelet convolution keep their edge effects out of the trial span.
/// Layout is trial-major, then channel, then sample: sample s of channel c in trial n is at
/// <c>Data[(n * ChannelCount + c) * SampleCount + s]</c>.
/// </summary>
public sealed class TrialSet
{
    /// <summary>Creates a trial set; <paramref name="data"/> must hold trials x channels x samples values.</summary>
    public TrialSet(string condition, IReadOnlyList<string> channels, double sampleRate, int trialCount,
        int sampleCount, int padSamples, double spanStart, double[] data, IReadOnlyList<double> onsets,
        IReadOnlyList<string> droppedTrials)
    {
        if (data.Length != (long)trialCount * channels.Count * sampleCount)
            throw new ArgumentException($"Expected {trialCount}x{channels.Count}x{sampleCount} values, got {data.Length}.", nameof(data));
        if (onsets.Count != trialCount)
            throw new ArgumentException($"Expected {trialCount} onsets, got {onsets.Count}.", nameof(onsets));
        if (padSamples < 0 || 2 * padSamples >= sampleCount)
            throw new ArgumentOutOfRangeException(nameof(padSamples));
        Condition = condition;
        Channels = channels;
        SampleRate = sampleRate;
        TrialCount = trialCount;
        SampleCount = sampleCount;
        PadSamples = padSamples;
        SpanStart = spanStart;
        Data = data;
        Onsets = onsets;
        DroppedTrials = droppedTrials;
    }

    /// <summary>Condition name from the plan.</summary>
    public string Condition { get; }

    /// <summary>Channel labels in data order.</summary>
    public IReadOnlyList<string> Channels { get; }

    /// <summary>Number of channels.</summary>
    public int ChannelCount => Channels.Count;

    /// <summary>Sampling rate in Hz.</summary>
    public double SampleRate { get; }

    /// <summary>Number of kept trials.</summary>
    public int TrialCount { get; }

    /// <summary>Samples per trial, padding included.</summary>
    public int SampleCount { get; }

    /// <summary>Padding samples at each end of every trial (outside the trial span).</summary>
    public int PadSamples { get; }

    /// <summary>Time of the first sample after the padding, in seconds relative to the event onset (e.g. -0.5).</summary>
    public double SpanStart { get; }

    /// <summary>The samples, trial-major (see the type's remarks).</summary>
    public double[] Data { get; }

    /// <summary>Onset in seconds from the recording start of each kept trial (NaN when the input was already cut).</summary>
    public IReadOnlyList<double> Onsets { get; }

    /// <summary>
    /// Samples at the start of the padding that hold zeros because the recording or epoch has no data there (the most
    /// over the trials; 0 when every trial is padded with recorded data).
    /// </summary>
    public int ZerosBefore { get; init; }

    /// <summary>Samples at the end of the padding that hold zeros for want of data (the most over the trials).</summary>
    public int ZerosAfter { get; init; }

    /// <summary>One line per trial that was left out, saying which and why.</summary>
    public IReadOnlyList<string> DroppedTrials { get; }

    /// <summary>The padded samples of one channel in one trial.</summary>
    public Span<double> Trial(int trial, int channel) =>
        Data.AsSpan((trial * ChannelCount + channel) * SampleCount, SampleCount);

    /// <summary>Time in seconds relative to onset of sample <paramref name="s"/> (padding included, so s = PadSamples is <see cref="SpanStart"/>).</summary>
    public double TimeOf(int s) => SpanStart + (s - PadSamples) / SampleRate;
}
