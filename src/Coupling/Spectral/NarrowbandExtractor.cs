using System.Numerics;
using System.Runtime.CompilerServices;
using Coupling.Plans;
using Coupling.Trials;

namespace Coupling.Spectral;

/// <summary>Turns the trials of one condition into complex narrowband signals of one band at the analysis window's time points.</summary>
public static class NarrowbandExtractor
{
    /// <summary>
    /// The sample indices (into each padded trial) of the analysis window's time points: the samples whose times lie in
    /// [window.Start, window.End), every <paramref name="step"/>-th one starting at the first.
    /// </summary>
    public static int[] WindowSamples(TrialSet trials, TimeRange window, int step)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(step, 1);
        double rate = trials.SampleRate;
        int first = trials.PadSamples + (int)Math.Round((window.Start - trials.SpanStart) * rate);
        int count = (int)Math.Round(window.Length * rate);
        int spanEnd = trials.SampleCount - trials.PadSamples;
        if (first < trials.PadSamples || first + count > spanEnd)
            throw new ArgumentException("The analysis window lies outside the trial span.", nameof(window));
        if (count < 1) throw new ArgumentException("The analysis window holds no sample.", nameof(window));
        var idx = new int[(count - 1) / step + 1];
        for (int i = 0; i < idx.Length; i++) idx[i] = first + i * step;
        return idx;
    }

    /// <summary>
    /// Applies <paramref name="decomposition"/> to every padded trial of every channel and keeps the analysis window's
    /// time points, laid out as <see cref="NarrowbandSet"/> requires (time, channel, trial).
    /// </summary>
    /// <param name="trials">Padded trials of one condition.</param>
    /// <param name="decomposition">The band's decomposition (its padding must fit in the trials' padding).</param>
    /// <param name="window">Analysis window in seconds relative to onset.</param>
    /// <param name="step">Keep every step-th sample of the window.</param>
    /// <param name="maxThreads">Worker threads; 0 or less for all cores. The result does not depend on it.</param>
    public static NarrowbandSet Extract(TrialSet trials, IBandDecomposition decomposition, TimeRange window, int step, int maxThreads = 0)
    {
        int[] samples = WindowSamples(trials, window, step);
        int nT = samples.Length, nC = trials.ChannelCount, nN = trials.TrialCount;
        var data = new Complex[(long)nT * nC * nN];
        var options = new ParallelOptions { MaxDegreeOfParallelism = maxThreads > 0 ? maxThreads : -1 };
        // Trials are padded for the band that needs the most; each band uses only the padding it needs itself, so the
        // transforms of high bands stay short.
        int skip = trials.PadSamples - Math.Min(decomposition.PadSamples, trials.PadSamples);
        int length = trials.SampleCount - 2 * skip;
        Parallel.For(0, nN * nC, options,
            () => new Complex[length],
            (job, _, buffer) =>
            {
                IsolateOne(trials, decomposition, job / nC, job % nC, skip, samples, buffer, data);
                return buffer;
            },
            _ => { });
        var times = samples.Select(s => trials.TimeOf(s)).ToArray();
        return new NarrowbandSet(decomposition.Band, trials.Channels, nN, times, data);
    }

    /// <summary>
    /// Isolates the band in trial <paramref name="n"/> of channel <paramref name="c"/> and stores the window's samples
    /// in the (time, channel, trial) layout. Compiled fully optimised at once: it runs only a few thousand times per
    /// band, too few for the runtime's tiering to replace its first, unoptimised code early.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void IsolateOne(TrialSet trials, IBandDecomposition decomposition, int n, int c, int skip, int[] samples,
        Complex[] buffer, Complex[] data)
    {
        int nC = trials.ChannelCount, nN = trials.TrialCount;
        decomposition.Apply(trials.Trial(n, c).Slice(skip, buffer.Length), buffer);
        for (int t = 0; t < samples.Length; t++) data[((long)t * nC + c) * nN + n] = buffer[samples[t] - skip];
    }
}
