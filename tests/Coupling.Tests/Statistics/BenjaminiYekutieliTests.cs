using System.Globalization;
using Coupling.Statistics;

namespace Coupling.Tests.Statistics;

public class BenjaminiYekutieliTests
{
    [Fact]
    public void Adjusted_values_match_statsmodels()
    {
        // Fixture from statsmodels 0.13.5 multipletests(method="fdr_by"), see Fixtures/Statistics/README.md.
        // Tolerance: both scale the Benjamini-Hochberg values by c(m) = sum 1/i; statsmodels divides p by k/(m·c(m)) while
        // the code multiplies the BH value by c(m), a few ulps apart at most.
        var lines = File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "Fixtures", "Statistics", "fdr_by.csv"))
            .Skip(2).Select(l => l.Split(',')).ToArray();
        Assert.NotEmpty(lines);
        int rejected = 0;
        foreach (var family in lines.GroupBy(f => f[0]))
        {
            var p = family.Select(f => double.Parse(f[1], CultureInfo.InvariantCulture)).ToArray();
            var expected = family.Select(f => double.Parse(f[2], CultureInfo.InvariantCulture)).ToArray();
            var adjusted = FalseDiscoveryRate.BenjaminiYekutieli(p);
            for (int i = 0; i < p.Length; i++) Assert.Equal(expected[i], adjusted[i], 1e-14);
            Assert.Equal(family.Select(f => f[3].Trim() == "1"), adjusted.Select(a => a <= 0.05));
            rejected += family.Count(f => f[3].Trim() == "1");
        }
        Assert.True(rejected > 0, "the fixture must contain rejections for the check to mean anything");
    }

    [Fact]
    public void The_worked_example_of_benjamini_and_hochberg_loses_its_fourth_rejection_under_any_dependence()
    {
        // The 15 p-values of Benjamini & Hochberg (1995), J R Stat Soc B 57:289, table (from memory of the paper; the same
        // values as FalseDiscoveryRateTests). Benjamini & Yekutieli (2001), Ann Stat 29:1165, theorem 1.3: step-up at
        // q/c(m), c(15) = 1 + 1/2 + ... + 1/15 = 3.318228993... Worked by hand: thresholds k·0.05/(15·3.3182) =
        // 0.0010045·k: p_(1) = 0.0001 <= 0.0010, p_(2) = 0.0004 <= 0.0020, p_(3) = 0.0019 <= 0.0030, p_(4) = 0.0095 > 0.0040,
        // and no later p_(k) is below its threshold (p_(5) = 0.0201 > 0.0050, ...): 3 rejections where BH makes 4.
        double[] example =
            [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.3240, 0.4262, 0.5719, 0.6528, 0.7590, 1.000];
        var adjusted = FalseDiscoveryRate.BenjaminiYekutieli(example);
        Assert.Equal(Enumerable.Range(0, 15).Select(i => i < 3), adjusted.Select(a => a <= 0.05));
        // adj_(1) = c(15)·15·0.0001/1 (its BH value 0.0015 is the running minimum), by hand.
        double c15 = Enumerable.Range(1, 15).Sum(i => 1.0 / i);
        Assert.Equal(c15 * 0.0015, adjusted[0], 1e-15);
    }

    [Fact]
    public void Undefined_p_values_stay_undefined_and_are_not_counted()
    {
        // m counts the defined p-values only (as for Benjamini-Hochberg): with one NaN among three the family is 2,
        // c(2) = 1.5, and adj = min(1, 1.5·BH) with BH of (0.01, 0.04) = (0.02, 0.04) by hand.
        var adjusted = FalseDiscoveryRate.BenjaminiYekutieliOfDefined([0.01, double.NaN, 0.04]);
        Assert.Equal(0.03, adjusted[0], 1e-15);
        Assert.True(double.IsNaN(adjusted[1]));
        Assert.Equal(0.06, adjusted[2], 1e-15);
    }
}
