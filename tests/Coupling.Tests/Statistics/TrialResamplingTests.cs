using Coupling.Measures;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

public class TrialResamplingTests
{
    [Fact]
    public void The_jackknife_standard_error_of_a_mean_is_the_usual_standard_error()
    {
        // Efron & Tibshirani (1993), An Introduction to the Bootstrap, section 11.2: for the sample mean the leave-one-out
        // means give se_jack = s/sqrt(n) exactly (s with divisor n - 1). Tolerance: rounding of sums of 9 values.
        double[] x = [2.1, -0.4, 3.3, 1.7, 0.0, 5.2, -1.9, 2.8, 0.6];
        int n = x.Length;
        var leaveOut = Enumerable.Range(0, n).Select(i => (x.Sum() - x[i]) / (n - 1)).ToArray();
        double mean = x.Average(), s = Math.Sqrt(x.Sum(v => (v - mean) * (v - mean)) / (n - 1));
        Assert.Equal(s / Math.Sqrt(n), TrialResampling.JackknifeStandardError(leaveOut), 1e-14);
    }

    [Fact]
    public void Jackknife_intervals_equal_the_leave_one_out_values_of_the_reference_measures()
    {
        // The slow per-pair definitions (ReferenceMeasures) on every leave-one-out set, combined by Efron & Tibshirani
        // (1993) eq. 11.5 and the 1.96 normal quantile; tolerance 1e-9 absolute (the kernels agree with the reference to
        // 1e-12 relative, and the interval scales differences by at most sqrt(N)·1.96).
        var set = TestSignals.Random(3, 8, 5, seed: 9);
        Measure[] measures = [Measure.Plv, Measure.ImagCoherency, Measure.Ppc];
        var (low, high) = TrialResampling.Jackknife(set, measures);
        int pairs = PairIndex.Count(3);
        for (int k = 0; k < measures.Length; k++)
            for (int p = 0; p < pairs; p++)
            {
                var (a, b) = PairIndex.Channels(p, 3);
                double full = ReferenceMeasures.Value(measures[k], set, a, b, TestSignals.Identity(8));
                var leaveOut = Enumerable.Range(0, 8).Select(i =>
                    ReferenceMeasures.Value(measures[k], Without(set, i), a, b, TestSignals.Identity(7))).ToArray();
                double se = TrialResampling.JackknifeStandardError(leaveOut);
                Assert.Equal(full - 1.959963984540054 * se, low[k * pairs + p], 1e-9);
                Assert.Equal(full + 1.959963984540054 * se, high[k * pairs + p], 1e-9);
            }
    }

    private static Coupling.Spectral.NarrowbandSet Without(Coupling.Spectral.NarrowbandSet set, int trial) =>
        TestSignals.Build(set.ChannelCount, set.TrialCount - 1, set.TimeCount,
            (t, c, n) => set.Row(t, c)[n < trial ? n : n + 1]);

    [Fact]
    public void Matching_removes_the_trial_count_bias_of_plv_and_leaves_ppc_unbiased()
    {
        // Independent channels: the PLV's expected square is 1/N (E|mean of N independent unit phasors|^2 = 1/N, the cross
        // terms vanish; textbook), so 40 trials give a smaller PLV than 10. Matched to 10 trials, the 40-trial condition's
        // mean PLV over pairs must equal the 10-trial condition's within 4 standard errors of the difference of the two
        // means (standard errors from the spread over pairs), and unmatched it must not. PPC is unbiased in N (Vinck et al.
        // 2010): its mean over pairs is near 0 for both.
        var small = TestSignals.Random(12, 10, 6, seed: 1);
        var large = TestSignals.Random(12, 40, 6, seed: 2);
        Measure[] measures = [Measure.Plv, Measure.Ppc];
        int pairs = PairIndex.Count(12);
        var reference = TrialResampling.Matched(small, measures, 10, 1, 0);
        var matched = TrialResampling.Matched(large, measures, 10, 50, 3);
        var unmatched = TrialResampling.Matched(large, measures, 40, 1, 0);
        static (double Mean, double Se) Summary(double[] v) =>
            (v.Average(), Math.Sqrt(v.Sum(x => (x - v.Average()) * (x - v.Average())) / (v.Length - 1) / v.Length));
        var r = Summary(reference[..pairs]);
        var m = Summary(matched[..pairs]);
        var u = Summary(unmatched[..pairs]);
        double se = Math.Sqrt(r.Se * r.Se + m.Se * m.Se);
        Assert.True(Math.Abs(m.Mean - r.Mean) < 4 * se, $"matched {m.Mean:F4} vs 10-trial {r.Mean:F4} (se {se:F4})");
        Assert.True(r.Mean - u.Mean > 4 * Math.Sqrt(r.Se * r.Se + u.Se * u.Se), $"unmatched {u.Mean:F4} vs 10-trial {r.Mean:F4}");
        Assert.True(TrialResampling.IsUnbiasedInTrials(Measure.Ppc));
        Assert.True(TrialResampling.IsUnbiasedInTrials(Measure.WpliDebiased));
        Assert.False(TrialResampling.IsUnbiasedInTrials(Measure.Plv));
    }
}
