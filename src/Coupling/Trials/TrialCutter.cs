using System.Globalization;
using Coupling.Formats;
using Coupling.Plans;

namespace Coupling.Trials;

/// <summary>Cuts the trials of one condition out of a continuous recording.</summary>
public static class TrialCutter
{
    /// <summary>
    /// Cuts one trial per event of the condition, from <c>onset + span.Start</c> to <c>onset + span.End</c>, plus
    /// <paramref name="padSamples"/> samples of padding at each end for the band decomposition's edge effects.
    /// </summary>
    /// <remarks>
    /// The onset sample is <c>round(onset * rate)</c>; the trial holds <c>round(span.Length * rate)</c> samples starting
    /// <c>round(span.Start * rate)</c> samples from it. A trial whose span runs past either end of the recording is
    /// dropped and reported in <see cref="TrialSet.DroppedTrials"/>. Padding that runs past an end of the recording is
    /// filled with zeros, never with time-reversed data (a reflected copy reverses time, so a lag between two channels
    /// would change sign there); how many samples that takes at each end is in <see cref="TrialSet.ZerosBefore"/> and
    /// <see cref="TrialSet.ZerosAfter"/>, and the run refuses a window that band isolation would reach from them.
    /// </remarks>
    /// <param name="recording">The recording (selected channels only).</param>
    /// <param name="condition">The condition whose event labels start trials.</param>
    /// <param name="span">Trial span in seconds relative to onset.</param>
    /// <param name="padSamples">Padding samples at each end.</param>
    public static TrialSet Cut(Recording recording, ConditionSpec condition, TimeRange span, int padSamples) =>
        Cut(recording, recording.Events, condition, span, padSamples);

    /// <summary>
    /// Cuts one trial per event of the condition from a source read a segment at a time, exactly as
    /// <see cref="Cut(Recording, ConditionSpec, TimeRange, int)"/> does from a recording in memory: the same samples,
    /// padding, dropped trials and messages. Each trial is read once, all channels together; only the trials are held.
    /// </summary>
    /// <param name="source">The samples (selected channels only).</param>
    /// <param name="events">Event markers, sorted by onset.</param>
    /// <param name="condition">The condition whose event labels start trials.</param>
    /// <param name="span">Trial span in seconds relative to onset.</param>
    /// <param name="padSamples">Padding samples at each end.</param>
    public static TrialSet Cut(ISampleSource source, IReadOnlyList<RecordingEvent> events, ConditionSpec condition, TimeRange span, int padSamples)
    {
        var located = Locate(source, events, condition, span);
        int total = located.Length + 2 * padSamples;
        int channels = source.Channels.Count;
        var data = new double[(long)located.Starts.Count * channels * total];
        double[]? scratch = null;
        int zerosBefore = 0, zerosAfter = 0;
        for (int n = 0; n < located.Starts.Count; n++)
        {
            var (before, after) = ReadPadded(source, located.Starts[n] - padSamples, total, data.AsSpan(n * channels * total, channels * total), ref scratch);
            zerosBefore = Math.Max(zerosBefore, before);
            zerosAfter = Math.Max(zerosAfter, after);
        }
        return new TrialSet(condition.Name, source.Channels.Select(ch => ch.Label).ToArray(), source.SampleRate, located.Starts.Count,
            total, padSamples, located.Offset / source.SampleRate, data, located.Onsets, located.Dropped)
        {
            ZerosBefore = zerosBefore,
            ZerosAfter = zerosAfter,
        };
    }

    /// <summary>
    /// The number of trials <see cref="Cut(ISampleSource, IReadOnlyList{RecordingEvent}, ConditionSpec, TimeRange, int)"/>
    /// would keep, found from the events alone without reading any sample (padding never changes which trials fit).
    /// </summary>
    /// <exception cref="InputException">The trial span is shorter than 2 samples or longer than the recording.</exception>
    public static int Count(ISampleSource source, IReadOnlyList<RecordingEvent> events, ConditionSpec condition, TimeRange span) =>
        Locate(source, events, condition, span).Starts.Count;

    private sealed record Located(int Length, int Offset, List<int> Starts, List<double> Onsets, List<string> Dropped);

    private static Located Locate(ISampleSource source, IReadOnlyList<RecordingEvent> events, ConditionSpec condition, TimeRange span)
    {
        double rate = source.SampleRate;
        int sampleCount = source.SampleCount;
        double duration = sampleCount / rate;
        int length = (int)Math.Round(span.Length * rate);
        int offset = (int)Math.Round(span.Start * rate);
        if (length < 2)
            throw new InputException($"{source.Source}: the trial span {Fmt(span.Start)}..{Fmt(span.End)} s holds fewer than 2 samples at {Fmt(rate)} Hz.");
        if (length > sampleCount)
            throw new InputException($"{source.Source}: the trial span ({Fmt(span.Length)} s) is longer than the recording ({Fmt(duration)} s).");
        var labels = new HashSet<string>(condition.EventLabels, StringComparer.Ordinal);
        var located = new Located(length, offset, [], [], []);
        foreach (var e in events)
        {
            if (!labels.Contains(e.Label)) continue;
            int first = (int)Math.Round(e.Onset * rate) + offset;
            if (first < 0 || first + length > sampleCount)
            {
                located.Dropped.Add($"{condition.Name}: event '{e.Label}' at {Fmt(e.Onset)} s: trial {Fmt(e.Onset + span.Start)}..{Fmt(e.Onset + span.End)} s runs past the recording (0..{Fmt(duration)} s)");
                continue;
            }
            located.Starts.Add(first);
            located.Onsets.Add(e.Onset);
        }
        return located;
    }

    /// <summary>
    /// Reads samples <c>start .. start + length - 1</c> of every channel into <paramref name="target"/> (channel-major),
    /// with zeros where the indices fall outside the source; <paramref name="scratch"/> is grown as needed and reused.
    /// </summary>
    /// <returns>The number of zeros before the first sample and after the last one.</returns>
    internal static (int Before, int After) ReadPadded(ISampleSource source, int start, int length, Span<double> target, ref double[]? scratch)
    {
        int n = source.SampleCount, channels = source.Channels.Count;
        int before = Math.Clamp(-start, 0, length), after = Math.Clamp(start + length - n, 0, length - before);
        int inside = length - before - after;
        if (before == 0 && after == 0)
        {
            source.Read(start, length, target);
            return (0, 0);
        }
        target.Clear();
        if (inside > 0)
        {
            if (scratch is null || scratch.Length < channels * inside) scratch = new double[channels * inside];
            source.Read(start + before, inside, scratch.AsSpan(0, channels * inside));
            for (int c = 0; c < channels; c++)
                scratch.AsSpan(c * inside, inside).CopyTo(target.Slice(c * length + before, inside));
        }
        return (before, after);
    }

    /// <summary>Copies <c>source[start .. start + target.Length)</c>, with zeros where the indices fall outside the source.</summary>
    /// <returns>The number of zeros before the first sample and after the last one.</returns>
    internal static (int Before, int After) CopyPadded(ReadOnlySpan<double> source, int start, Span<double> target)
    {
        int n = source.Length, length = target.Length;
        int before = Math.Clamp(-start, 0, length), after = Math.Clamp(start + length - n, 0, length - before);
        int inside = length - before - after;
        target.Clear();
        if (inside > 0) source.Slice(start + before, inside).CopyTo(target.Slice(before, inside));
        return (before, after);
    }

    private static string Fmt(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
}
