using System.Globalization;
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
    private IReadOnlyList<(int Channel, int Start, int Length, string Kind)> _unusable = [];
    private IReadOnlyList<(string Label, string Description)> _dropped = [];

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
    /// <param name="source">Where the data came from.</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <param name="channels">The channels, in array order.</param>
    /// <param name="data">Epochs in C order (epoch, channel, sample).</param>
    /// <param name="epochCount">Number of epochs.</param>
    /// <param name="epochSamples">Samples per epoch.</param>
    /// <param name="firstSampleTime">Time of each epoch's first sample relative to its onset, seconds.</param>
    /// <param name="epochLabels">Event label of each epoch.</param>
    /// <param name="notes">Messages from reading (e.g. channels left out); null for none.</param>
    public static LoadedInput FromEpochs(string source, double sampleRate, IReadOnlyList<ChannelInfo> channels, double[] data,
        int epochCount, int epochSamples, double firstSampleTime, IReadOnlyList<string> epochLabels, IReadOnlyList<string>? notes = null) =>
        new(source, sampleRate, channels, epochLabels, notes ?? Array.Empty<string>(), null, null, data, epochCount, epochSamples,
            firstSampleTime, epochLabels);

    /// <summary>Where the data came from.</summary>
    public string Source { get; }

    /// <summary>Sampling rate in Hz.</summary>
    public double SampleRate { get; }

    /// <summary>The analysed channels.</summary>
    public IReadOnlyList<ChannelInfo> Channels { get; }

    /// <summary>Label of every event (or epoch), with repeats.</summary>
    public IReadOnlyList<string> EventLabels { get; }

    /// <summary>
    /// The input with the runs of unusable samples (NaN or infinite, clipped) of its analysed channels attached, so that
    /// <see cref="WithoutUnusableTrials"/> can leave out the trials that hold one.
    /// </summary>
    /// <param name="runs">Per run: the index into <see cref="Channels"/>, first sample, length and what is wrong ("NaN or infinite", "clipped").</param>
    public LoadedInput WithUnusableRuns(IReadOnlyList<(int Channel, int Start, int Length, string Kind)> runs)
    {
        var copy = Copy(_events);
        copy._unusable = runs;
        copy._dropped = _dropped;
        return copy;
    }

    /// <summary>The runs of unusable samples attached by <see cref="WithUnusableRuns"/>; empty when none are.</summary>
    public IReadOnlyList<(int Channel, int Start, int Length, string Kind)> UnusableRuns => _unusable;

    /// <summary>
    /// The input without the events whose trial, padding included, holds an unusable sample (see
    /// <see cref="WithUnusableRuns"/>), each listed with its reason among the dropped trials of its condition.
    /// Input already cut into epochs is returned as it is (its unusable epochs are left out when it is loaded, see <see cref="WithDroppedEpochs"/>).
    /// </summary>
    /// <param name="span">The trial span.</param>
    /// <param name="padSamples">Padding samples at each end of every trial.</param>
    public LoadedInput WithoutUnusableTrials(TimeRange span, int padSamples)
    {
        if (_samples is null || _unusable.Count == 0) return this;
        int length = (int)Math.Round(span.Length * SampleRate), offset = (int)Math.Round(span.Start * SampleRate);
        var kept = new List<RecordingEvent>();
        var dropped = new List<(string, string)>(_dropped);
        foreach (var e in _events!)
        {
            int first = (int)Math.Round(e.Onset * SampleRate) + offset;
            long lo = (long)first - padSamples, hi = (long)first + length + padSamples;
            var hit = _unusable.FirstOrDefault(u => u.Start < hi && u.Start + u.Length > lo);
            if (hit.Kind is null) { kept.Add(e); continue; }
            dropped.Add((e.Label, string.Create(CultureInfo.InvariantCulture,
                $"event '{e.Label}' at {e.Onset:0.###} s: the trial (with its padding) holds {hit.Kind} samples (channel '{Channels[hit.Channel].Label}' from {hit.Start / SampleRate:0.###} s)")));
        }
        var copy = Copy(kept);
        copy._unusable = _unusable;
        copy._dropped = dropped;
        return copy;
    }

    /// <summary>The input with descriptions of epochs left out when it was loaded, listed among the dropped trials of their condition.</summary>
    /// <param name="dropped">Per epoch left out: its label and why.</param>
    public LoadedInput WithDroppedEpochs(IReadOnlyList<(string Label, string Description)> dropped)
    {
        var copy = Copy(_events);
        copy._unusable = _unusable;
        copy._dropped = dropped;
        return copy;
    }

    /// <summary>Trials of <paramref name="condition"/> left out for unusable samples.</summary>
    public int UnusableTrialCount(ConditionSpec condition) => _dropped.Count(d => condition.EventLabels.Contains(d.Label));

    private LoadedInput Copy(IReadOnlyList<RecordingEvent>? events) =>
        new(Source, SampleRate, Channels, EventLabels, Notes, _samples, events, _epochs, _epochCount, _epochSamples, _firstSampleTime, _epochLabels);

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

    /// <summary>The padded trials of <paramref name="condition"/>; trials left out for unusable samples are listed among its dropped trials.</summary>
    public TrialSet Trials(ConditionSpec condition, TimeRange span, int padSamples)
    {
        var set = _samples is not null
            ? TrialCutter.Cut(_samples, _events!, condition, span, padSamples)
            : EpochTrials.Select(Source, _epochs!, _epochCount, Channels.Select(c => c.Label).ToArray(), _epochSamples,
                SampleRate, _firstSampleTime, _epochLabels!, condition, span, padSamples);
        var unusable = _dropped.Where(d => condition.EventLabels.Contains(d.Label)).Select(d => $"{condition.Name}: {d.Description}").ToArray();
        return unusable.Length == 0 ? set
            : new TrialSet(set.Condition, set.Channels, set.SampleRate, set.TrialCount, set.SampleCount, set.PadSamples, set.SpanStart,
                set.Data, set.Onsets, [.. set.DroppedTrials, .. unusable]);
    }

    /// <summary>
    /// The padded trials of <paramref name="condition"/> as <see cref="Trials"/> cuts them, with the condition's evoked
    /// response removed when <paramref name="subtractEvoked"/> is set: the trial mean, per channel and sample, padding
    /// included, subtracted from every trial (<see cref="EvokedRemoval.SubtractInPlace(TrialSet, TrialSet)"/>).
    /// </summary>
    /// <param name="condition">The condition.</param>
    /// <param name="span">The trial span.</param>
    /// <param name="padSamples">Padding samples at each end of every trial.</param>
    /// <param name="subtractEvoked">Whether to subtract the trial mean.</param>
    /// <returns>
    /// The trials and the mean subtracted from them as a set of one trial (<see cref="EvokedRemoval.Mean"/>); the mean is
    /// null when nothing was subtracted (no subtraction asked, or no trial).
    /// </returns>
    public (TrialSet Trials, TrialSet? RemovedMean) TrialsWithoutEvoked(ConditionSpec condition, TimeRange span, int padSamples,
        bool subtractEvoked)
    {
        var trials = Trials(condition, span, padSamples);
        if (!subtractEvoked || trials.TrialCount == 0) return (trials, null);
        var mean = EvokedRemoval.Mean(trials);
        EvokedRemoval.SubtractInPlace(trials, mean);
        return (trials, mean);
    }
}
