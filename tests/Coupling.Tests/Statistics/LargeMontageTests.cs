using System.Numerics;
using Coupling.Measures;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

public class LargeMontageTests
{
    [Fact]
    public void Sixty_four_channels_give_the_coupled_pairs_with_a_few_hundred_draws()
    {
        // 64 channels (2016 pairs), 30 trials, three coupled pairs (a channel plus a lagged, scaled copy of another,
        // trial by trial). Benjamini-Hochberg with counted p would need 2016/0.05 - 1 = 40319 draws before one pair can
        // pass; the maximum statistic over pairs controls the family-wise error with 199 draws (p floor 1/200 <= 0.05),
        // so every coupled pair must be found, and under family-wise control at 0.05 the chance of any other pair is at
        // most 5 % (the test allows none: the seed is fixed and the result deterministic).
        const int channels = 64, trials = 30, times = 6, draws = 199;
        var random = new Random(64);
        var set = TestSignals.Build(channels, trials, times, (t, c, n) => TestSignals.Gaussian(random));
        var coupled = new[] { (3, 17), (20, 41), (50, 63) };
        var data = set.Data;
        foreach (var (a, b) in coupled)
            for (int t = 0; t < times; t++)
                for (int n = 0; n < trials; n++)
                    data[(t * channels + b) * trials + n] += 0.8 * Complex.FromPolarCoordinates(1, 0.9) * data[(t * channels + a) * trials + n];
        Measure[] measures = [Measure.Plv, Measure.Wpli];
        var tested = FamilyCorrection.TestCondition(set, measures, draws, 5, "x", new CorrectionSpec(CorrectionMethod.MaxStatistic), 0.05);
        var expected = coupled.Select(p => PairIndex.Of(p.Item1, p.Item2, channels)).ToHashSet();
        foreach (var (test, outcome) in tested)
        {
            var found = Enumerable.Range(0, outcome.Significant.Length).Where(k => outcome.Significant[k]).ToHashSet();
            Assert.True(expected.SetEquals(found),
                $"{MeasureCatalog.Key(test.Measure)}: found {string.Join(", ", found)}, expected {string.Join(", ", expected)}");
        }
    }
}
