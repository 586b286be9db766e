using System.Numerics;
using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Trials;

namespace Coupling.TimeFrequency;

/// <summary>Time-frequency cells from a family of complex Morlet wavelets, one per frequency, of a fixed number of cycles.</summary>
/// <remarks>
/// Each frequency f is isolated by <see cref="MorletDecomposition"/> with the wavelet of <c>cycles</c> cycles at f
/// (spectral standard deviation f / cycles, so the frequency resolution widens with f and the time resolution narrows;
/// Tallon-Baudry et al. 1996, J. Neurosci. 16(13):4240-4249). The wavelet outputs are kept every k samples, k the
/// default time step of <see cref="TimeStep"/> for that wavelet, limited so that a bin holds at least three time points;
/// a point bin takes the sample nearest its time.
/// </remarks>
public static class MorletCells
{
    /// <summary>The band a wavelet at <paramref name="frequency"/> with <paramref name="cycles"/> stands for: f ± f / cycles.</summary>
    public static Band BandOf(double frequency, double cycles) =>
        new(FrequencyName(frequency), frequency * (1 - 1 / cycles), frequency * (1 + 1 / cycles));

    /// <summary>A frequency as written in band names and file names, e.g. "12.5Hz".</summary>
    public static string FrequencyName(double frequency) =>
        frequency.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture) + "Hz";

    /// <summary>Samples of padding the trials need at each end so that the widest wavelet (the lowest frequency) fits.</summary>
    public static int PadSamples(IReadOnlyList<double> frequencies, double cycles, double sampleRate) =>
        frequencies.Max(f => MorletWavelet.Create(f, cycles, sampleRate).HalfLength);

    /// <summary>Builds the cells.</summary>
    /// <param name="trials">Padded trials of one condition (the channels to analyse only).</param>
    /// <param name="frequencies">Frequencies, Hz, below the Nyquist frequency.</param>
    /// <param name="cycles">Wavelet cycles (positive).</param>
    /// <param name="bins">Time bins inside the trial span.</param>
    /// <param name="maxThreads">Worker threads for the convolutions; 0 for all cores.</param>
    /// <exception cref="InputException">A frequency out of range, or a bin that holds no time point.</exception>
    public static TimeFrequencyCells Build(TrialSet trials, IReadOnlyList<double> frequencies, double cycles,
        IReadOnlyList<TimeBin> bins, int maxThreads = 0)
    {
        double rate = trials.SampleRate;
        double first = bins.Min(b => b.Start), last = bins.Max(b => b.IsPoint ? b.End + 1 / rate : b.End);
        var span = new TimeRange(first, Math.Min(last, trials.SpanStart + (trials.SampleCount - 2 * trials.PadSamples) / rate));
        var sets = new NarrowbandSet[frequencies.Count * bins.Count];
        for (int fi = 0; fi < frequencies.Count; fi++)
        {
            var decomposition = new MorletDecomposition(BandOf(frequencies[fi], cycles), MorletWavelet.Create(frequencies[fi], cycles, rate));
            int step = bins.Any(b => b.IsPoint) ? 1 : StepFor(decomposition, bins, rate);
            var all = NarrowbandExtractor.Extract(trials, decomposition, span, step, maxThreads);
            for (int bi = 0; bi < bins.Count; bi++)
                sets[fi * bins.Count + bi] = Slice(all, PointsOf(all.Times, bins[bi], step / rate));
        }
        return new TimeFrequencyCells(frequencies, bins, trials.TrialCount, 1, sets);
    }

    private static int StepFor(MorletDecomposition decomposition, IReadOnlyList<TimeBin> bins, double rate)
    {
        int narrowest = (int)Math.Floor(bins.Min(b => b.End - b.Start) * rate);
        return Math.Max(1, Math.Min(TimeStep.Default(decomposition.Info, rate), narrowest / 3));
    }

    /// <summary>The range [from, to) of time points inside <paramref name="bin"/>.</summary>
    private static (int From, int To) PointsOf(IReadOnlyList<double> times, TimeBin bin, double spacing)
    {
        const double slack = 1e-9;
        if (bin.IsPoint)
        {
            int nearest = 0;
            for (int t = 1; t < times.Count; t++)
                if (Math.Abs(times[t] - bin.Start) < Math.Abs(times[nearest] - bin.Start)) nearest = t;
            if (Math.Abs(times[nearest] - bin.Start) > spacing)
                throw new InputException($"time point {bin.Start:G6} s lies outside the trial span.");
            return (nearest, nearest + 1);
        }
        int from = 0;
        while (from < times.Count && times[from] < bin.Start - slack) from++;
        int to = from;
        while (to < times.Count && times[to] < bin.End - slack) to++;
        if (to == from)
            throw new InputException($"time bin {bin.Start:G6}..{bin.End:G6} s holds no time point; widen it.");
        return (from, to);
    }

    /// <summary>A copy of time points [from, to) of <paramref name="set"/> (contiguous in the time-major layout).</summary>
    private static NarrowbandSet Slice(NarrowbandSet set, (int From, int To) range)
    {
        int block = set.ChannelCount * set.TrialCount;
        var data = new Complex[(range.To - range.From) * block];
        Array.Copy(set.Data, range.From * block, data, 0, data.Length);
        var times = set.Times.Skip(range.From).Take(range.To - range.From).ToArray();
        return new NarrowbandSet(set.Band, set.Channels, set.TrialCount, times, data);
    }
}
