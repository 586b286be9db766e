using Coupling.Formats;
using Coupling.Plans;
using Coupling.Trials;

namespace Coupling.Pipeline;

/// <summary>
/// The analysed input of a run: a continuous recording with its events, or epochs that were already cut.
/// Either way it yields the padded trials of a condition.
/// </summary>
public sealed class LoadedInput
{
    private readonly ISampleSource? _samples;
    private readonly IReadOnlyList<RecordingEvent>? _events;
    private readonly double[]? _epochs;
    private readonly int _epochCount, _epochSamples;
    private readonly double _firstSampleTime;
    private readonly IReadOnlyList<string>? _epochLabels;

    private LoadedInput(string source, double sampleRate, IReadOnlyList<ChannelInfo> channels, IReadOnlyList<string> eventLabels,
        IReadOnlyList<string> notes, ISampleSource? samples, IReadOnlyList<RecordingEvent>? events, double[]? epochs, int epochCount, int epochSamples,
        double firstSampleTime, IReadOnlyList<string>? epochLabels)
    {
        Source = source;
        SampleRate = sampleRate;
        Channels = channels;
        EventLabels = eventLabels;
        Notes = notes;
        _samples = samples;
        _events = events;
        _epochs = epochs;
        _epochCount = epochCount;
        _epochSamples = epochSamples;
        _firstSampleTime = firstSampleTime;
        _epochLabels = epochLabels;
    }

    /// <summary>A continuous recording with its events.</summary>
    public static LoadedInput FromRecording(Recording recording) => FromSource(recording, recording.Events, recording.Notes);

    /// <summary>A continuous recording read a segment at a time (e.g. an EDF file), with its events.</summary>
    /// <param name="samples">The samples of the analysed channels.</param>
    /// <param name="events">Event markers, sorted by onset.</param>
    /// <param name="notes">Messages from reading.</param>
    public static LoadedInput FromSource(ISampleSource samples, IReadOnlyList<RecordingEvent> events, IReadOnlyList<string> notes) =>
        new(samples.Source, samples.SampleRate, samples.Channels, events.Select(e => e.Label).ToArray(),
            notes, samples, events, null, 0, 0, 0, null);

    /// <summary>Epochs in C order (epoch, channel, sample) with one event label per epoch.</summary>
    public static LoadedInput FromEpochs(string source, double sampleRate, IReadOnlyList<ChannelInfo> channels, double[] data,
        int epochCount, int epochSamples, double firstSampleTime, IReadOnlyList<string> epochLabels) =>
        new(source, sampleRate, channels, epochLabels, Array.Empty<string>(), null, null, data, epochCount, epochSamples,
            firstSampleTime, epochLabels);

    /// <summary>Where the data came from.</summary>
    public string Source { get; }

    /// <summary>Sampling rate in Hz.</summary>
    public double SampleRate { get; }

    /// <summary>The analysed channels.</summary>
    public IReadOnlyList<ChannelInfo> Channels { get; }

    /// <summary>Label of every event (or epoch), with repeats.</summary>
    public IReadOnlyList<string> EventLabels { get; }

    /// <summary>Samples per epoch for input cut into epochs (trial plus the padding it holds); null for a continuous recording.</summary>
    public int? EpochSamples => _epochs is null ? null : _epochSamples;

    /// <summary>Messages from reading (e.g. signals left out).</summary>
    public IReadOnlyList<string> Notes { get; }

    /// <summary>
    /// The number of trials <see cref="Trials"/> keeps for <paramref name="condition"/>, without reading samples from
    /// a recording (epochs, already in memory, are selected unpadded).
    /// </summary>
    public int TrialCount(ConditionSpec condition, TimeRange span) =>
        _samples is not null ? TrialCutter.Count(_samples, _events!, condition, span) : Trials(condition, span, 0).TrialCount;

    /// <summary>The padded trials of <paramref name="condition"/>.</summary>
    public TrialSet Trials(ConditionSpec condition, TimeRange span, int padSamples) =>
        _samples is not null
            ? TrialCutter.Cut(_samples, _events!, condition, span, padSamples)
            : EpochTrials.Select(Source, _epochs!, _epochCount, Channels.Select(c => c.Label).ToArray(), _epochSamples,
                SampleRate, _firstSampleTime, _epochLabels!, condition, span, padSamples);
}
