using Coupling.Statistics;

namespace Coupling.Tests.Statistics;

public class FalseDiscoveryRateTests
{
    // The 15 p-values of the worked example in Benjamini & Hochberg (1995), J R Stat Soc B 57:289-300 (a study of
    // myocardial infarction treatment with 15 hypotheses; values and counts from memory of the paper). The paper
    // reports that the Bonferroni procedure at 0.05 rejects 3 of them and the step-up procedure at q = 0.05 rejects 4,
    // which the rule reproduces by hand: the thresholds k·0.05/15 are
    // 0.0033, 0.0067, 0.0100, 0.0133, 0.0167, ...; p_(4) = 0.0095 <= 0.0133 and no later p_(k) is below its threshold.
    private static readonly double[] Example =
        [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.3240, 0.4262, 0.5719, 0.6528, 0.7590, 1.000];

    [Fact]
    public void The_worked_example_of_benjamini_and_hochberg_rejects_the_first_four()
    {
        var reject = FalseDiscoveryRate.Reject(Example, 0.05);
        Assert.Equal(Enumerable.Range(0, 15).Select(i => i < 4), reject);
        // Bonferroni for contrast: p <= 0.05/15 rejects the first 3 (same paper).
        Assert.Equal(3, Example.Count(p => p <= 0.05 / 15));
    }

    [Fact]
    public void Adjusted_values_of_the_worked_example_follow_the_step_up_definition()
    {
        // adj_(i) = min over j >= i of m·p_(j)/j, capped at 1 (Benjamini & Hochberg 1995, written as adjusted
        // p-values as in Yekutieli & Benjamini 1999, J Stat Plan Inference 82:171). Worked by hand from the 15 values:
        // m·p_(k)/k = 0.0015, 0.003, 0.0095, 0.035625, 0.0603, 0.0695, 0.06386, 0.0645, 0.0765, 0.486, 0.58118,
        // 0.71488, 0.75323, 0.81321, 1; the running minimum from the top replaces 0.0695 by 0.06386.
        double[] expected =
            [0.0015, 0.003, 0.0095, 0.035625, 0.0603, 15 * 0.0298 / 7, 15 * 0.0298 / 7, 0.0645, 0.0765,
             0.486, 15 * 0.4262 / 11, 15 * 0.5719 / 12, 15 * 0.6528 / 13, 15 * 0.7590 / 14, 1];
        var adjusted = FalseDiscoveryRate.BenjaminiHochberg(Example);
        // Tolerance: a few ulps of values below 1 (one multiplication and one division each).
        for (int i = 0; i < 15; i++) Assert.Equal(expected[i], adjusted[i], 1e-15);
    }

    [Fact]
    public void Rejections_match_the_largest_k_rule_on_shuffled_random_p_values()
    {
        // Direct statement of the step-up rule (Benjamini & Hochberg 1995, section 3): reject H_(1..k) for the largest
        // k with p_(k) <= k·q/m. Checked on unsorted inputs with ties, several levels.
        var random = new Random(7);
        for (int trial = 0; trial < 50; trial++)
        {
            int m = 1 + random.Next(40);
            var p = Enumerable.Range(0, m).Select(_ => random.NextDouble() < 0.3 ? Math.Round(random.NextDouble() * 0.05, 3) : random.NextDouble()).ToArray();
            foreach (double q in new[] { 0.01, 0.05, 0.2 })
            {
                var sorted = p.OrderBy(v => v).ToArray();
                int k = 0;
                for (int i = 1; i <= m; i++) if (sorted[i - 1] <= i * q / m) k = i;
                double cut = k == 0 ? double.NegativeInfinity : sorted[k - 1];
                Assert.Equal(p.Select(v => v <= cut), FalseDiscoveryRate.Reject(p, q));
            }
            var adjusted = FalseDiscoveryRate.BenjaminiHochberg(p);
            var order = Enumerable.Range(0, m).OrderBy(i => p[i]).ToArray();
            for (int i = 1; i < m; i++) Assert.True(adjusted[order[i]] >= adjusted[order[i - 1]]);
            Assert.All(adjusted, a => Assert.InRange(a, 0, 1));
            // adj >= p up to the rounding of m·p/m.
            Assert.All(Enumerable.Range(0, m), i => Assert.True(adjusted[i] >= p[i] * (1 - 1e-15)));
        }
    }

    [Fact]
    public void Adjusted_values_and_rejections_match_statsmodels()
    {
        // Fixture from statsmodels 0.13.5 multipletests(method="fdr_bh"), see Fixtures/Statistics/README.md.
        // Tolerance: both compute m·p/k and a running minimum, a few ulps apart at most.
        var lines = File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "Fixtures", "Statistics", "fdr_bh.csv"))
            .Skip(2).Select(l => l.Split(',')).ToArray();
        Assert.NotEmpty(lines);
        foreach (var family in lines.GroupBy(f => f[0]))
        {
            var p = family.Select(f => double.Parse(f[1], System.Globalization.CultureInfo.InvariantCulture)).ToArray();
            var expected = family.Select(f => double.Parse(f[2], System.Globalization.CultureInfo.InvariantCulture)).ToArray();
            var adjusted = FalseDiscoveryRate.BenjaminiHochberg(p);
            for (int i = 0; i < p.Length; i++) Assert.Equal(expected[i], adjusted[i], 1e-14);
            Assert.Equal(family.Select(f => f[3] == "1"), FalseDiscoveryRate.Reject(p, 0.05));
        }
    }

    [Fact]
    public void A_nan_or_out_of_range_p_value_is_refused()
    {
        Assert.Throws<ArgumentException>(() => FalseDiscoveryRate.BenjaminiHochberg([0.1, double.NaN]));
        Assert.Throws<ArgumentException>(() => FalseDiscoveryRate.BenjaminiHochberg([1.2]));
        Assert.Throws<ArgumentException>(() => FalseDiscoveryRate.Reject([0.1, double.NaN], 0.05));
        Assert.Throws<ArgumentOutOfRangeException>(() => FalseDiscoveryRate.Reject([0.1], 0));
        Assert.Empty(FalseDiscoveryRate.BenjaminiHochberg([]));
    }

    [Fact]
    public void Undefined_p_values_stay_undefined_and_are_not_counted_in_the_family()
    {
        // Step-up over the three defined values (Benjamini & Hochberg 1995), by hand: sorted 0.01, 0.03, 0.04 with
        // m = 3 give 3·0.01/1 = 0.03, 3·0.03/2 = 0.045 and 3·0.04/3 = 0.04; the running minimum from the top makes
        // them 0.03, 0.04, 0.04.
        var adjusted = FalseDiscoveryRate.BenjaminiHochbergOfDefined([0.01, double.NaN, 0.04, 0.03]);
        Assert.Equal(0.03, adjusted[0], 15);
        Assert.True(double.IsNaN(adjusted[1]));
        Assert.Equal(0.04, adjusted[2], 15);
        Assert.Equal(0.04, adjusted[3], 15);
    }
}
