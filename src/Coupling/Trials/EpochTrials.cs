using System.Globalization;
using Coupling.Plans;

namespace Coupling.Trials;

/// <summary>Builds trial sets from input that is already cut into epochs (trials x channels x samples).</summary>
public static class EpochTrials
{
    /// <summary>
    /// Selects the epochs of one condition and the samples of the trial span, padding each end by
    /// <paramref name="padSamples"/> with samples of the epoch outside the span where it has them and with zeros past
    /// the epoch's own ends (counted in <see cref="TrialSet.ZerosBefore"/> and <see cref="TrialSet.ZerosAfter"/>).
    /// </summary>
    /// <param name="source">Names the input in errors.</param>
    /// <param name="data">Epochs in C order: epoch, channel, sample.</param>
    /// <param name="epochs">Number of epochs.</param>
    /// <param name="channels">Channel labels in array order.</param>
    /// <param name="samples">Samples per epoch.</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <param name="firstSampleTime">Time of each epoch's first sample relative to its event onset, seconds.</param>
    /// <param name="epochLabels">Event label of each epoch.</param>
    /// <param name="condition">The condition to select.</param>
    /// <param name="span">The trial span; it must lie within the epochs.</param>
    /// <param name="padSamples">Padding samples at each end.</param>
    public static TrialSet Select(string source, double[] data, int epochs, IReadOnlyList<string> channels, int samples,
        double sampleRate, double firstSampleTime, IReadOnlyList<string> epochLabels, ConditionSpec condition,
        TimeRange span, int padSamples)
    {
        if (epochLabels.Count != epochs)
            throw new InputException($"{source}: {epochs} epochs but {epochLabels.Count} epoch labels.");
        int offset = (int)Math.Round((span.Start - firstSampleTime) * sampleRate);
        int length = (int)Math.Round(span.Length * sampleRate);
        if (offset < 0 || offset + length > samples)
            throw new InputException(string.Create(CultureInfo.InvariantCulture,
                $"{source}: the trial span {span.Start}..{span.End} s runs past the epochs, which cover {firstSampleTime}..{firstSampleTime + samples / sampleRate} s around onset."));
        var labels = new HashSet<string>(condition.EventLabels, StringComparer.Ordinal);
        var chosen = Enumerable.Range(0, epochs).Where(e => labels.Contains(epochLabels[e])).ToArray();
        int total = length + 2 * padSamples, cc = channels.Count;
        var result = new double[(long)chosen.Length * cc * total];
        int zerosBefore = 0, zerosAfter = 0;
        for (int n = 0; n < chosen.Length; n++)
            for (int c = 0; c < cc; c++)
            {
                var epoch = data.AsSpan((chosen[n] * cc + c) * samples, samples);
                var (before, after) = TrialCutter.CopyPadded(epoch, offset - padSamples, result.AsSpan((n * cc + c) * total, total));
                zerosBefore = Math.Max(zerosBefore, before);
                zerosAfter = Math.Max(zerosAfter, after);
            }
        return new TrialSet(condition.Name, channels, sampleRate, chosen.Length, total, padSamples,
            firstSampleTime + offset / sampleRate, result, Enumerable.Repeat(double.NaN, chosen.Length).ToArray(),
            Array.Empty<string>())
        {
            ZerosBefore = zerosBefore,
            ZerosAfter = zerosAfter,
        };
    }
}
