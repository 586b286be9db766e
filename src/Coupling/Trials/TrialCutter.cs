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
    public static TrialSet Cut(Recording recording, ConditionSpec condition, TimeRange span, int padSamples)
    {
        double rate = recording.SampleRate;
        int length = (int)Math.Round(span.Length * rate);
        int offset = (int)Math.Round(span.Start * rate);
        if (length < 2)
            throw new InputException($"{recording.Source}: the trial span {Fmt(span.Start)}..{Fmt(span.End)} s holds fewer than 2 samples at {Fmt(rate)} Hz.");
        if (length > recording.SampleCount)
            throw new InputException($"{recording.Source}: the trial span ({Fmt(span.Length)} s) is longer than the recording ({Fmt(recording.Duration)} s).");
        int total = length + 2 * padSamples;
        int channels = recording.Channels.Count;
        var labels = new HashSet<string>(condition.EventLabels, StringComparer.Ordinal);
        var starts = new List<int>();
        var onsets = new List<double>();
        var dropped = new List<string>();
        foreach (var e in recording.Events)
        {
            if (!labels.Contains(e.Label)) continue;
            int first = (int)Math.Round(e.Onset * rate) + offset;
            if (first < 0 || first + length > recording.SampleCount)
            {
                dropped.Add($"{condition.Name}: event '{e.Label}' at {Fmt(e.Onset)} s: trial {Fmt(e.Onset + span.Start)}..{Fmt(e.Onset + span.End)} s runs past the recording (0..{Fmt(recording.Duration)} s)");
                continue;
            }
            starts.Add(first - padSamples);
            onsets.Add(e.Onset);
        }
        var data = new double[(long)starts.Count * channels * total];
        for (int n = 0; n < starts.Count; n++)
            for (int c = 0; c < channels; c++)
                CopyReflected(recording.Samples[c], starts[n], data.AsSpan((n * channels + c) * total, total));
        return new TrialSet(condition.Name, recording.Channels.Select(ch => ch.Label).ToArray(), rate, starts.Count,
            total, padSamples, offset / rate, data, onsets, dropped);
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
