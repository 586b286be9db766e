using System.Globalization;
using System.Numerics;
using Coupling.Measures;
using Coupling.Statistics;
using Coupling.Tests.Measures;

namespace Coupling.Tests.Statistics;

public class ParetoTailTests
{
    [Fact]
    public void Survival_matches_scipy()
    {
        // scipy.stats.genpareto.sf, see Fixtures/Statistics/README.md. Tolerance: log1p and exp each within a few ulps,
        // relative 1e-13 (absolute for values below 1e-300).
        var rows = File.ReadAllLines(Path.Combine(AppContext.BaseDirectory, "Fixtures", "Statistics", "genpareto.csv"))
            .Skip(2).Select(l => l.Split(',').Select(v => double.Parse(v, CultureInfo.InvariantCulture)).ToArray()).ToArray();
        Assert.True(rows.Length > 100);
        foreach (var r in rows)
        {
            double s = GeneralizedPareto.Survival(r[2], r[0], r[1]);
            Assert.True(Math.Abs(s - r[3]) <= 1e-13 * Math.Max(r[3], 1e-300), $"shape {r[0]}, scale {r[1]}, z {r[2]}: {s} vs {r[3]}");
        }
    }

    private static double Quantile(double u, double shape, double scale) =>
        shape == 0 ? -scale * Math.Log(1 - u) : scale / shape * (Math.Pow(1 - u, -shape) - 1);

    [Theory]
    [InlineData(-0.2, 1.0)]
    [InlineData(0.0, 2.0)]
    [InlineData(0.2, 0.5)]
    public void Probability_weighted_moments_recover_the_parameters_of_a_known_distribution(double shape, double scale)
    {
        // Hosking & Wallis (1987), Technometrics 29:339, section 3: the estimators are consistent, so on the n = 20000
        // quantiles F^-1((j - 0.5)/n) of a known GPD (a sample with no randomness) they give back its parameters up to
        // the plotting-position error, which is of order 1/n for shape <= 0 and somewhat larger for a heavy tail;
        // tolerance 0.01 (shape) and 1 % (scale) covers it.
        const int n = 20000;
        var z = Enumerable.Range(0, n).Select(j => Quantile((j + 0.5) / n, shape, scale)).ToArray();
        var (xi, sigma) = GeneralizedPareto.FitProbabilityWeightedMoments(z);
        Assert.Equal(shape, xi, 0.01);
        Assert.Equal(scale, sigma, scale * 0.01);
        // The fitted distribution passes its own goodness-of-fit check there.
        Assert.True(GeneralizedPareto.AndersonDarling(z, xi, sigma) < ParetoTail.AndersonDarlingLimit);
    }

    [Fact]
    public void An_exponential_sample_gives_a_shape_near_zero_and_a_misfit_is_rejected()
    {
        // Exponential excesses are the GPD with shape 0. Asymptotic standard deviation of the PWM shape estimate at shape
        // 0 is sqrt(4/(3n)) (Hosking & Wallis 1987, var(k) = (1+k)^2(2+k)^2(1+k+2k^2)/((1+2k)(3+2k)n) at k = 0; from
        // memory); 4 standard deviations allowed. The Anderson-Darling check (Stephens 1974, 5 % point 2.492) must accept
        // the fit and reject the same data against a scale three times too large.
        const int n = 2000;
        var random = new Random(3);
        var z = Enumerable.Range(0, n).Select(_ => -Math.Log(1 - random.NextDouble()) * 1.7).ToArray();
        var (xi, sigma) = GeneralizedPareto.FitProbabilityWeightedMoments(z);
        Assert.InRange(xi, -4 * Math.Sqrt(4.0 / (3 * n)), 4 * Math.Sqrt(4.0 / (3 * n)));
        Assert.True(GeneralizedPareto.AndersonDarling(z, xi, sigma) < ParetoTail.AndersonDarlingLimit);
        Assert.True(GeneralizedPareto.AndersonDarling(z, 0, 3 * 1.7) > ParetoTail.AndersonDarlingLimit);
    }

    [Fact]
    public void Anderson_darling_of_one_value_at_the_median_is_two_ln_two_minus_one()
    {
        // A^2 = -n - (1/n) sum (2i-1)[ln F_i + ln(1 - F_{n+1-i})] with n = 1, F = 1/2: -1 + 2 ln 2 (by hand).
        double median = Math.Log(2); // exponential, scale 1
        Assert.Equal(2 * Math.Log(2) - 1, GeneralizedPareto.AndersonDarling([median], 0, 1), 1e-15);
    }

    [Fact]
    public void The_tail_p_agrees_with_a_long_permutation_run()
    {
        // The tail approximation from M = 2000 draws against the counts of a run 100 times longer (Knijnenburg et al. 2009,
        // Bioinformatics 25:i161, figure 3 makes the same comparison). The observed values are the long run's upper
        // quantiles at p = 1e-3 and 2e-4 (200 and 40 exceedances: counting error 7-16 %), where 2000 draws give fewer
        // than 10 exceedances. The tail is fitted conservatively (a negative shape is replaced by the exponential tail,
        // see ParetoTail), so over 12 independent short runs the median must lie between 0.67 and 4 times the long-run
        // p and every run between 0.4 and 12 times (bounds from 60 runs of the same algorithm in numpy: 5-95 % range
        // 1.0-2.3 at 1e-3 and 1.4-4.5 at 2e-4, widened for 12 runs).
        var random = new Random(17);
        const int longDraws = 200_000, shortDraws = 2000;
        var longRun = new double[longDraws];
        for (int i = 0; i < longDraws; i++) longRun[i] = NullPlvSampler.Draw(random, 40);
        Array.Sort(longRun);
        foreach (double target in new[] { 1e-3, 2e-4 })
        {
            double x = longRun[longDraws - (int)(target * longDraws)];
            double longP = (longRun.Count(v => v >= x) + 1.0) / (longDraws + 1.0);
            var estimates = new List<double>();
            for (int r = 0; r < 12; r++)
            {
                var draws = Enumerable.Range(0, shortDraws).Select(_ => NullPlvSampler.Draw(random, 40)).OrderDescending().ToArray();
                int b = draws.Count(v => v >= x);
                var (p, fitted) = ParetoTail.UpperP(x, draws.AsSpan(0, ParetoTail.MaximumFitted + 1), shortDraws);
                if (fitted) estimates.Add(p);
                else Assert.Equal((b + 1.0) / (shortDraws + 1.0), p);
            }
            Assert.True(estimates.Count >= 8, $"only {estimates.Count} of 12 runs fitted the tail at p = {target}");
            double median = estimates.Order().ElementAt(estimates.Count / 2);
            Assert.InRange(median / longP, 0.67, 4);
            Assert.All(estimates, e => Assert.InRange(e / longP, 0.4, 12));
        }
    }

    [Fact]
    public void A_p_with_enough_exceedances_is_the_counted_one()
    {
        // Knijnenburg et al. (2009): with at least 10 exceedances the counted p is kept.
        var tail = Enumerable.Range(0, 100).Select(i => 100.0 - i).ToArray();
        var (p, fitted) = ParetoTail.UpperP(90.5, tail, 1000);
        Assert.False(fitted);
        Assert.Equal(11 / 1001.0, p);
    }

    [Fact]
    public void Pareto_tail_p_values_are_labelled_and_go_below_the_counting_floor()
    {
        // A coupled pair whose observed PLV lies beyond every one of 499 draws: the counted p is the floor 1/500; the
        // tail p is smaller and labelled pareto-tail; an uncoupled pair keeps a counted p.
        var random = new Random(8);
        const int trials = 40, times = 4;
        var set = TestSignals.Build(3, trials, times, (t, c, n) => TestSignals.Gaussian(random));
        var data = set.Data;
        for (int t = 0; t < times; t++)
            for (int n = 0; n < trials; n++)
                data[(t * 3 + 1) * trials + n] += 0.6 * data[(t * 3 + 0) * trials + n];
        var spec = new CorrectionSpec(CorrectionMethod.BenjaminiHochberg, ParetoTail: true);
        var (test, outcome) = FamilyCorrection.TestCondition(set, [Measure.Plv], 499, 1, "x", spec, 0.05)[0];
        int coupled = PairIndex.Of(0, 1, 3), other = PairIndex.Of(1, 2, 3);
        Assert.Equal(1 / 500.0, test.P[coupled]);
        Assert.Equal(FamilyCorrection.PSourcePareto, outcome.PSource[coupled]);
        Assert.True(outcome.P[coupled] < 1 / 500.0);
        if (test.Exceedances[other] >= ParetoTail.MinimumExceedances)
        {
            Assert.Equal(FamilyCorrection.PSourceCounted, outcome.PSource[other]);
            Assert.Equal(test.P[other], outcome.P[other]);
        }
    }
}
