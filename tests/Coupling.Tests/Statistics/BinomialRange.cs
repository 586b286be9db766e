using MathNet.Numerics.Distributions;

namespace Coupling.Tests.Statistics;

/// <summary>The central range of a binomial count, for calibration tests of false-positive rates.</summary>
internal static class BinomialRange
{
    /// <summary>
    /// The smallest range [low, high] of counts out of <paramref name="tests"/> independent tests of level
    /// <paramref name="level"/> that holds the count with probability at least <paramref name="coverage"/>, with at most
    /// (1 − coverage)/2 of the probability left out on each side. Exact binomial law (MathNet.Numerics
    /// Distributions.Binomial, a general-purpose reference library).
    /// </summary>
    public static (int Low, int High) Central(int tests, double level, double coverage)
    {
        double tail = (1 - coverage) / 2;
        int low = 0;
        while (Binomial.CDF(level, tests, low) <= tail) low++;
        int high = tests;
        while (high > 0 && 1 - Binomial.CDF(level, tests, high - 1) <= tail) high--;
        return (low, high);
    }
}
