using System.Diagnostics;
using Coupling.Measures;
using Coupling.Statistics;
using Coupling.TimeFrequency;
using Coupling.Trials;

namespace Coupling.Benchmarks;

/// <summary>
/// Times the frequency x time cluster test of one pair (Morlet cells, coherence) with the evoked response kept, with it
/// removed inside the test from each group of every labelling (centring the transformed cells), and, for comparison,
/// the direct route that removes each group's mean from the recorded trials and transforms them again per labelling.
/// </summary>
public static class ClusterTiming
{
    public static void Run(int frequencies, int trialsA, int trialsB, int draws, int threads, int repeats, TextWriter output)
    {
        const double rate = 250, cycles = 5;
        var freqs = Enumerable.Range(0, frequencies).Select(i => 4.0 + 2 * i).ToArray();
        var bins = TimeBin.Sliding(0, 1.0, 0.1, 0.05);
        int pad = MorletCells.PadSamples(freqs, cycles, rate), samples = (int)rate;
        var random = new SplitMix64(11);
        TrialSet Trials(int count)
        {
            int total = samples + 2 * pad;
            var data = new double[count * 2 * total];
            for (int i = 0; i < data.Length; i++)
            {
                double u1 = 1 - (random.Next() >> 11) * (1.0 / (1UL << 53)), u2 = (random.Next() >> 11) * (1.0 / (1UL << 53));
                data[i] = Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
            }
            return new TrialSet("x", ["E1", "E2"], rate, count, total, pad, 0, data, Enumerable.Repeat(double.NaN, count).ToArray(), []);
        }
        var a = Trials(trialsA);
        var b = Trials(trialsB);
        int? workers = threads > 0 ? threads : null;
        var cellsA = MorletCells.Build(a, freqs, cycles, bins, threads);
        var cellsB = MorletCells.Build(b, freqs, cycles, bins, threads);
        output.WriteLine($"clusters: {frequencies} frequencies x {bins.Count} bins, {trialsA} + {trialsB} trials, {draws} draws, coherence, " +
                         $"{(threads > 0 ? threads.ToString(System.Globalization.CultureInfo.InvariantCulture) : "all")} threads, median of {repeats}");

        double Median(Action run)
        {
            run();
            var seconds = new double[repeats];
            for (int r = 0; r < repeats; r++)
            {
                long t0 = Stopwatch.GetTimestamp();
                run();
                seconds[r] = Stopwatch.GetElapsedTime(t0).TotalSeconds;
            }
            Array.Sort(seconds);
            return seconds[repeats / 2];
        }
        double kept = Median(() => TimeFrequencyClusterTest.Run(cellsA, cellsB, Measure.Coherence, "a", "b", draws, 3, 0.05, workers));
        double inside = Median(() => TimeFrequencyClusterTest.Run(cellsA, cellsB, Measure.Coherence, "a", "b", draws, 3, 0.05, workers,
            subtractEvoked: true));
        // One labelling by the direct route: split the recorded trials, centre each group, transform both groups again.
        var order = new int[trialsA + trialsB];
        TrialShuffle.Generate(3, 0, order);
        double transform = Median(() =>
        {
            var groupA = Select(a, b, order[..trialsA]);
            var groupB = Select(a, b, order[trialsA..]);
            EvokedRemoval.SubtractInPlace(groupA);
            EvokedRemoval.SubtractInPlace(groupB);
            MorletCells.Build(groupA, freqs, cycles, bins, threads);
            MorletCells.Build(groupB, freqs, cycles, bins, threads);
        });
        output.WriteLine($"  evoked kept                          {kept,8:F2} s");
        output.WriteLine($"  evoked removed, cells centred         {inside,8:F2} s  ({inside / kept:F2} x kept)");
        output.WriteLine($"  transforms of one labelling, direct   {transform,8:F3} s  (x {draws + 1} labellings = {transform * (draws + 1):F1} s added)");
    }

    private static TrialSet Select(TrialSet a, TrialSet b, int[] pick)
    {
        int samples = a.SampleCount;
        var data = new double[pick.Length * 2 * samples];
        for (int j = 0; j < pick.Length; j++)
        {
            var (source, n) = pick[j] < a.TrialCount ? (a, pick[j]) : (b, pick[j] - a.TrialCount);
            for (int c = 0; c < 2; c++) source.Trial(n, c).CopyTo(data.AsSpan((j * 2 + c) * samples, samples));
        }
        return new TrialSet("x", a.Channels, a.SampleRate, pick.Length, samples, a.PadSamples, a.SpanStart, data,
            Enumerable.Repeat(double.NaN, pick.Length).ToArray(), []);
    }
}
