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
    /// filled by even reflection about the end sample (x[-k] = x[k]), so every kept trial is still analysed on real data.
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
        for (int n = 0; n < located.Starts.Count; n++)
            ReadReflected(source, located.Starts[n] - padSamples, total, data.AsSpan(n * channels * total, channels * total), ref scratch);
        return new TrialSet(condition.Name, source.Channels.Select(ch => ch.Label).ToArray(), source.SampleRate, located.Starts.Count,
            total, padSamples, located.Offset / source.SampleRate, data, located.Onsets, located.Dropped);
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
    /// reflecting indices that fall outside the source as <see cref="CopyReflected"/> does. Only the samples the
    /// reflected indices reach are read; <paramref name="scratch"/> is grown as needed and reused.
    /// </summary>
    internal static void ReadReflected(ISampleSource source, int start, int length, Span<double> target, ref double[]? scratch)
    {
        int n = source.SampleCount;
        if (start >= 0 && start + length <= n)
        {
            source.Read(start, length, target);
            return;
        }
        int lo = int.MaxValue, hi = -1;
        for (int i = 0; i < length; i++)
        {
            int j = Reflect(start + i, n);
            lo = Math.Min(lo, j);
            hi = Math.Max(hi, j);
        }
        int width = hi - lo + 1, channels = source.Channels.Count;
        if (scratch is null || scratch.Length < channels * width) scratch = new double[channels * width];
        source.Read(lo, width, scratch.AsSpan(0, channels * width));
        for (int c = 0; c < channels; c++)
        {
            var row = scratch.AsSpan(c * width, width);
            var to = target.Slice(c * length, length);
            for (int i = 0; i < length; i++) to[i] = row[Reflect(start + i, n) - lo];
        }
    }

    /// <summary>Copies <c>source[start .. start + target.Length)</c>, reflecting indices that fall outside the source.</summary>
    internal static void CopyReflected(ReadOnlySpan<double> source, int start, Span<double> target)
    {
        int n = source.Length;
        if (start >= 0 && start + target.Length <= n)
        {
            source.Slice(start, target.Length).CopyTo(target);
            return;
        }
        for (int i = 0; i < target.Length; i++) target[i] = source[Reflect(start + i, n)];
    }

    /// <summary>Even reflection of an index into 0..n-1 (period 2n - 2).</summary>
    internal static int Reflect(int i, int n)
    {
        if (n == 1) return 0;
        int period = 2 * n - 2;
        i %= period;
        if (i < 0) i += period;
        return i < n ? i : period - i;
    }

    private static string Fmt(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
}
