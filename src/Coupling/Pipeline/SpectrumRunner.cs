using System.Globalization;
using Coupling.Measures;
using Coupling.Plans;
using Coupling.Statistics;
using Coupling.TimeFrequency;
using Coupling.Trials;

namespace Coupling.Pipeline;

/// <summary>Runs a plan's <c>spectrum</c> key: connectivity of chosen pairs per frequency (and time bin) and condition.</summary>
/// <remarks>
/// Trials are cut as for the band analysis (same trial span, same evoked handling), with the padding the widest wavelet
/// needs, and reduced to the channels of the chosen pairs before any transform. Pairs are reported with their channels
/// in the order of the analysed channels, whatever order the plan names them in, so signed measures read as channel_a
/// relative to channel_b in every table. The cluster test takes the trials as recorded and, with evoked removal, centres
/// each group of every labelling itself (<see cref="TimeFrequencyClusterTest"/>).
/// </remarks>
public static class SpectrumRunner
{
    /// <summary>Most channels for which <c>pairs: all</c> is accepted (120 pairs).</summary>
    public const int MaxChannelsForAllPairs = 16;

    /// <summary>Computes everything of <c>plan.Spectrum</c>; null when the plan has no <c>spectrum</c> key.</summary>
    /// <exception cref="InputException">A channel of a pair is not analysed, a frequency is out of range, or a setting
    /// does not fit the data; the message names the plan and key.</exception>
    public static SpectrumAnalysis? Analyse(Plan plan, LoadedInput input, IProgress<RunProgress>? progress, int workers,
        CancellationToken cancellationToken = default)
    {
        var spec = plan.Spectrum;
        if (spec is null) return null;
        var labels = input.Channels.Select(c => c.Label).ToList();
        double rate = input.SampleRate;
        foreach (double f in spec.Frequencies)
        {
            double top = spec.Method == "morlet" ? f : f + spec.HalfBandwidthHz;
            if (!(top < 0.5 * rate))
                throw new InputException(string.Create(CultureInfo.InvariantCulture,
                    $"{plan.Source}: spectrum.frequencies: {f:G6} Hz{(spec.Method == "morlet" ? "" : $" + half-bandwidth {spec.HalfBandwidthHz:G6} Hz")} must lie below the Nyquist frequency {0.5 * rate:G6} Hz."));
        }

        var pairs = ResolvePairs(plan, spec, labels);
        var figurePair = spec.FigurePair is null ? pairs[0] : Resolve(plan, "spectrum.figure_pair", spec.FigurePair, labels);
        var used = pairs.SelectMany(p => new[] { p.A, p.B }).Distinct().Order().ToArray();
        var local = pairs.Select(p => (Array.IndexOf(used, p.A), Array.IndexOf(used, p.B))).ToArray();
        int pad = spec.Method == "morlet" ? MorletCells.PadSamples(spec.Frequencies, spec.Cycles, rate) : 0;

        var windowBins = new[] { new TimeBin(plan.Window.Start, plan.Window.End) };
        var timeBins = spec.Time is null ? null
            : InPlan(plan, "spectrum.time", () => TimeBin.Sliding(plan.Trial.Start, plan.Trial.End, spec.Time.Width, spec.Time.Step));
        var spectrum = new List<TimeFrequencyValues>();
        var course = new List<TimeFrequencyValues>();
        var tapers = new List<int>();
        foreach (var condition in plan.Conditions)
        {
            cancellationToken.ThrowIfCancellationRequested();
            progress?.Report(new RunProgress($"{condition.Name}: spectrum", 0, 0));
            var trials = SelectChannels(input.TrialsWithoutEvoked(condition, plan.Trial, pad, plan.SubtractEvoked).Trials, used);
            var cells = InPlan(plan, "spectrum", () => Build(spec, trials, windowBins, workers));
            if (tapers.Count == 0 && spec.Method == "multitaper") tapers.Add(cells.ObservationsPerTrial);
            spectrum.AddRange(TimeFrequencyConnectivity.Compute(cells, condition.Name, local, spec.Measures, null));
            if (timeBins is not null)
            {
                progress?.Report(new RunProgress($"{condition.Name}: time course", 0, 0));
                var binned = InPlan(plan, "spectrum.time", () => Build(spec, trials, timeBins, workers));
                if (tapers.Count == 1 && spec.Method == "multitaper") tapers.Add(binned.ObservationsPerTrial);
                course.AddRange(InPlan(plan, "spectrum.time.baseline",
                    () => TimeFrequencyConnectivity.Compute(binned, condition.Name, local, spec.Measures, spec.Time!.Baseline)));
            }
        }

        ClusterTestResult? cluster = null;
        ulong clusterSeed = ClusterSeed(plan.Seed);
        if (spec.ClusterTest is { } test)
        {
            var pair = Resolve(plan, "spectrum.cluster_test.pair", test.Pair, labels);
            int[] two = [pair.A, pair.B];
            TrialSet Recorded(string condition) =>
                SelectChannels(input.Trials(plan.Conditions.First(c => c.Name == condition), plan.Trial, pad), two);
            cluster = InPlan(plan, "spectrum.cluster_test", () => TestClusters(spec, test, timeBins ?? windowBins,
                Recorded(test.ConditionA), Recorded(test.ConditionB), plan.SubtractEvoked, clusterSeed, workers, progress, cancellationToken));
        }
        return new SpectrumAnalysis(spec, spectrum, course, cluster, new ChannelPairSpec(labels[figurePair.A], labels[figurePair.B]),
            pad, spec.Method == "multitaper" ? tapers : null, clusterSeed);
    }

    /// <summary>
    /// The seed of the cluster test's permutations: the SplitMix64 finaliser of the plan seed plus (2^41 + 1) times the
    /// SplitMix64 increment, the same derivation as <see cref="Seeds"/> with an index no condition, band or contrast
    /// seed uses.
    /// </summary>
    public static ulong ClusterSeed(ulong seed) => SplitMix64.Mix(unchecked(seed + SplitMix64.Gamma * ((1UL << 41) + 1)));

    /// <summary>
    /// The cluster test of <paramref name="test"/> on the two conditions' trials as recorded (the pair's two channels,
    /// padded). With <paramref name="subtractEvoked"/> the test removes the evoked response inside, from each group of
    /// every labelling, observed and permuted alike (the transforms are linear, so centring the cells equals centring
    /// the trials); removing each condition's mean here would leave the labellings not exchangeable at unequal counts.
    /// </summary>
    internal static ClusterTestResult TestClusters(SpectrumSpec spec, ClusterTestSpec test, IReadOnlyList<TimeBin> bins,
        TrialSet a, TrialSet b, bool subtractEvoked, ulong seed, int workers, IProgress<RunProgress>? progress,
        CancellationToken cancellationToken)
    {
        var cellsA = Build(spec, a, bins, workers);
        var cellsB = Build(spec, b, bins, workers);
        string stage = $"{test.ConditionA} vs {test.ConditionB}: cluster test, cells through {test.Draws} permutations";
        var cellProgress = progress is null ? null : new Progress<int>(done => progress.Report(new RunProgress(stage, done, cellsA.CellCount)));
        return TimeFrequencyClusterTest.Run(cellsA, cellsB, test.Measure, test.ConditionA, test.ConditionB, test.Draws, seed,
            test.Threshold, workers > 0 ? workers : null, cancellationToken, cellProgress, subtractEvoked);
    }

    private static TimeFrequencyCells Build(SpectrumSpec spec, TrialSet trials, IReadOnlyList<TimeBin> bins, int workers) =>
        spec.Method == "morlet"
            ? MorletCells.Build(trials, spec.Frequencies, spec.Cycles, bins, workers)
            : MultitaperCells.Build(trials, spec.Frequencies, spec.HalfBandwidthHz, bins);

    /// <summary>The trials of channels <paramref name="channels"/> only (indices into the set's channels, in that order).</summary>
    private static TrialSet SelectChannels(TrialSet trials, IReadOnlyList<int> channels)
    {
        int samples = trials.SampleCount;
        var data = new double[(long)trials.TrialCount * channels.Count * samples];
        for (int n = 0; n < trials.TrialCount; n++)
            for (int i = 0; i < channels.Count; i++)
                trials.Trial(n, channels[i]).CopyTo(data.AsSpan((n * channels.Count + i) * samples, samples));
        return new TrialSet(trials.Condition, channels.Select(c => trials.Channels[c]).ToArray(), trials.SampleRate, trials.TrialCount,
            samples, trials.PadSamples, trials.SpanStart, data, trials.Onsets, trials.DroppedTrials);
    }

    private static IReadOnlyList<(int A, int B)> ResolvePairs(Plan plan, SpectrumSpec spec, List<string> labels)
    {
        if (spec.Pairs is not null) return spec.Pairs.Select(p => Resolve(plan, "spectrum.pairs", p, labels)).ToArray();
        if (labels.Count > MaxChannelsForAllPairs)
            throw new InputException($"{plan.Source}: spectrum.pairs: 'all' covers {PairIndex.Count(labels.Count)} pairs of {labels.Count} channels; it is accepted up to {MaxChannelsForAllPairs} channels. List the pairs wanted.");
        return Enumerable.Range(0, PairIndex.Count(labels.Count)).Select(k => PairIndex.Channels(k, labels.Count)).ToArray();
    }

    private static (int A, int B) Resolve(Plan plan, string key, ChannelPairSpec pair, List<string> labels)
    {
        int Index(string label)
        {
            int i = labels.IndexOf(label);
            return i >= 0 ? i : throw new InputException(
                $"{plan.Source}: {key}: channel '{label}' is not among the analysed channels ({string.Join(", ", labels)}).");
        }
        int a = Index(pair.A), b = Index(pair.B);
        return (Math.Min(a, b), Math.Max(a, b));
    }

    private static T InPlan<T>(Plan plan, string key, Func<T> run)
    {
        try { return run(); }
        catch (InputException e) { throw new InputException($"{plan.Source}: {key}: {e.Message}", e); }
    }
}
