using Coupling.Measures;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Statistics;
using Coupling.Tests.Statistics;
using Coupling.Tests.TimeFrequency;
using Coupling.TimeFrequency;
using Coupling.Trials;
using TfTrials = Coupling.Tests.TimeFrequency.TimeFrequencyTrials;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// The spectrum's cluster test with <c>evoked: subtract</c>: the route the runner takes from the trials as recorded to
/// the cluster p-values (Maris and Oostenveld 2007, J Neurosci Methods 164:177-190, for the test).
/// </summary>
public class SpectrumClusterEvokedTests
{
    private const double Rate = 200;
    private static readonly double[] Frequencies = [8, 12, 16];
    private static readonly IReadOnlyList<TimeBin> Bins = TimeBin.Sliding(0, 0.8, 0.2, 0.2);
    private static readonly int Pad = MorletCells.PadSamples(Frequencies, 4, Rate);

    // Multitaper half-bandwidth 10 Hz: NW = 10 Hz x 0.2 s = 2 on the 0.2 s bins, K = 3 tapers.
    private static SpectrumSpec Spec(string method, Measure measure, int draws) =>
        new(method, Frequencies, 4, 10, null, [measure], new TimeCourseSpec(0.2, 0.2, null),
            new ClusterTestSpec(new ChannelPairSpec("ch1", "ch2"), measure, "a", "b", 0.05, draws), null);

    /// <summary>
    /// Two channels over 0..0.8 s (padded for the widest wavelet): both carry the same stimulus-locked 10 Hz burst
    /// around 0.3 s (its amplitude varying from trial to trial by a factor 1 ± 0.3) and their own white noise. The same
    /// distribution for every trial, so two conditions drawn from it differ only by chance.
    /// </summary>
    internal static TrialSet Trials(int count, Random random)
    {
        var amplitude = Enumerable.Range(0, count).Select(_ => 1 + 0.3 * TfTrials.Normal(random)).ToArray();
        return TfTrials.Make(count, 2, Rate, 0, 160, Pad, (n, c, t) =>
            amplitude[n] * 2 * Math.Exp(-Math.Pow((t - 0.3) / 0.1, 2)) * Math.Sin(2 * Math.PI * 10 * t + 0.6 * c)
            + TfTrials.Normal(random));
    }

    [Theory]
    [InlineData("morlet", Measure.Coherence, 30)]
    [InlineData("morlet", Measure.Plv, 31)]
    [InlineData("multitaper", Measure.Coherence, 32)]
    public void Family_wise_error_rate_is_nominal_under_the_null_with_evoked_removal_at_unequal_trial_counts(string method,
        Measure measure, int dataSeed)
    {
        // Both conditions from one distribution, 4 against 28 trials, evoked response subtracted. 200 null data sets,
        // each tested with M = 19 label permutations: the smallest p is 1/20, and under exchangeability of all 20
        // labellings P(some cluster has p <= 0.05) = 0.05 up to ties. The count of rejections must lie in the central
        // 99% range of Binomial(200, 0.05), [3, 19] (exact binomial law, MathNet.Numerics; the 0.005 and 0.995 quantiles,
        // as scipy.stats.binom.interval(0.99, 200, 0.05) defines them, summed exactly with Python's math.comb give the
        // same). Before each group of every labelling was centred alike (each condition's mean removed before pooling),
        // this test rejected 49 (Morlet coherence), 22 (Morlet PLV) and 25 (multitaper coherence) of the 200.
        var range = BinomialRange.Central(200, 0.05, 0.99);
        Assert.Equal((3, 19), range);
        var spec = Spec(method, measure, 19);
        var random = new Random(dataSeed);
        int rejections = 0;
        for (int run = 0; run < 200; run++)
        {
            var result = SpectrumRunner.TestClusters(spec, spec.ClusterTest!, Bins, Trials(4, random), Trials(28, random),
                subtractEvoked: true, (ulong)run, 1, null, default);
            if (result.Clusters.Any(c => c.P <= 0.05)) rejections++;
        }
        Assert.True(rejections >= range.Low && rejections <= range.High, $"{rejections} of 200 data sets rejected");
    }

    [Theory]
    [InlineData("morlet", Measure.Coherence)]
    [InlineData("morlet", Measure.Plv)]
    [InlineData("multitaper", Measure.Wpli)]
    public void Every_labelling_equals_its_groups_centred_before_the_transform_and_measured_from_scratch(string method, Measure measure)
    {
        // The test centres the transformed cells of each group; the definition centres each group's recorded trials
        // (padding included) before the transform. Both transforms are linear and the same for every trial (wavelet
        // convolution of the segment less its mean; tapered Fourier sums of the segment less its mean), so the two agree
        // to rounding. Slow reference: for the observed labelling and each permutation, split the recorded trials, remove
        // each group's mean, transform, measure, difference; then z per cell over all M + 1 maps.
        var random = new Random(17);
        var a = Trials(5, random);
        var b = Trials(7, random);
        var spec = Spec(method, measure, 9);
        const ulong seed = 3;
        var result = SpectrumRunner.TestClusters(spec, spec.ClusterTest!, Bins, Copy(a), Copy(b), subtractEvoked: true, seed, 1, null, default);
        Assert.True(result.EvokedRemoved);

        int total = a.TrialCount + b.TrialCount, cells = Frequencies.Length * Bins.Count;
        var maps = new double[10][];
        for (int r = 0; r < 10; r++)
        {
            var order = Enumerable.Range(0, total).ToArray();
            if (r > 0) TrialShuffle.Generate(seed, r - 1, order);
            var groupA = Select(a, b, order[..a.TrialCount]);
            var groupB = Select(a, b, order[a.TrialCount..]);
            EvokedRemoval.SubtractInPlace(groupA);
            EvokedRemoval.SubtractInPlace(groupB);
            var cellsA = Build(method, groupA);
            var cellsB = Build(method, groupB);
            maps[r] = Enumerable.Range(0, cells).Select(i =>
                PairwiseKernels.ComputeObserved(cellsA.Cell(i), [measure])[0][0] - PairwiseKernels.ComputeObserved(cellsB.Cell(i), [measure])[0][0])
                .ToArray();
        }
        // Rounding: the transforms' sums of a few hundred products (relative error ~1e-13) change a measure by ~1e-13;
        // dividing by a per-cell spread of at least ~1e-2 leaves z within 1e-9.
        for (int i = 0; i < cells; i++)
        {
            Assert.Equal(maps[0][i], result.Difference[i], 1e-11);
            double mean = maps.Average(m => m[i]);
            double sd = Math.Sqrt(maps.Sum(m => (m[i] - mean) * (m[i] - mean)) / 9);
            Assert.Equal((maps[0][i] - mean) / sd, result.Z[i], 1e-9);
        }
    }

    [Theory]
    [InlineData("morlet")]
    [InlineData("multitaper")]
    public void With_the_evoked_response_kept_the_test_runs_on_the_recorded_trials_unchanged(string method)
    {
        // Kept: nothing is centred, so the result is the test on the cells of the recorded trials, byte for byte.
        var random = new Random(23);
        var a = Trials(6, random);
        var b = Trials(9, random);
        var spec = Spec(method, Measure.Coherence, 19);
        var kept = SpectrumRunner.TestClusters(spec, spec.ClusterTest!, Bins, Copy(a), Copy(b), subtractEvoked: false, 5, 1, null, default);
        var direct = TimeFrequencyClusterTest.Run(Build(method, a), Build(method, b), Measure.Coherence, "a", "b", 19, 5, 0.05, maxThreads: 1);
        Assert.False(kept.EvokedRemoved);
        Assert.Equal(Bytes(direct), Bytes(kept));
    }

    [Fact]
    public void At_equal_trial_counts_the_observed_map_is_that_of_each_condition_less_its_own_mean()
    {
        // The observed labelling's groups are the conditions, so its map is the one each condition's trials give with
        // their own mean removed before the transform, as before the removal moved inside the test (to rounding, as above).
        var random = new Random(29);
        var a = Trials(8, random);
        var b = Trials(8, random);
        var spec = Spec("morlet", Measure.Plv, 19);
        var inside = SpectrumRunner.TestClusters(spec, spec.ClusterTest!, Bins, Copy(a), Copy(b), subtractEvoked: true, 5, 1, null, default);
        EvokedRemoval.SubtractInPlace(a);
        EvokedRemoval.SubtractInPlace(b);
        var before = TimeFrequencyClusterTest.Run(Build("morlet", a), Build("morlet", b), Measure.Plv, "a", "b", 19, 5, 0.05, maxThreads: 1);
        for (int i = 0; i < before.Difference.Length; i++) Assert.Equal(before.Difference[i], inside.Difference[i], 1e-11);
    }

    private static byte[] Bytes(ClusterTestResult r) =>
        r.Difference.Concat(r.Z).Concat(r.Clusters.SelectMany(c => new[] { c.Mass, c.P }))
            .SelectMany(BitConverter.GetBytes).Concat(r.Labels.SelectMany(BitConverter.GetBytes)).ToArray();

    private static TimeFrequencyCells Build(string method, TrialSet trials) => method == "morlet"
        ? MorletCells.Build(trials, Frequencies, 4, Bins, 1)
        : MultitaperCells.Build(trials, Frequencies, 10, Bins);

    private static TrialSet Copy(TrialSet t) => Select(t, t, Enumerable.Range(0, t.TrialCount).ToArray());

    /// <summary>The trials numbered <paramref name="pick"/> of <paramref name="a"/>'s trials followed by <paramref name="b"/>'s.</summary>
    private static TrialSet Select(TrialSet a, TrialSet b, IReadOnlyList<int> pick)
    {
        int channels = a.ChannelCount, samples = a.SampleCount;
        var data = new double[pick.Count * channels * samples];
        for (int j = 0; j < pick.Count; j++)
        {
            var (source, n) = pick[j] < a.TrialCount ? (a, pick[j]) : (b, pick[j] - a.TrialCount);
            for (int c = 0; c < channels; c++) source.Trial(n, c).CopyTo(data.AsSpan((j * channels + c) * samples, samples));
        }
        return new TrialSet("group", a.Channels, a.SampleRate, pick.Count, samples, a.PadSamples, a.SpanStart, data,
            Enumerable.Repeat(double.NaN, pick.Count).ToArray(), []);
    }
}
