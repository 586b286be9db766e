namespace Coupling.Tests.Statistics;

/// <summary>
/// The acceptance region of a count X ~ Binomial(n, p): [lo, hi] with P(X &lt; lo) ≤ a/2 and P(X &gt; hi) ≤ a/2, from the
/// exact binomial probabilities (textbook definition; pmf by the log-gamma-free recurrence P(k+1) = P(k)·(n−k)/(k+1)·p/(1−p)).
/// </summary>
internal static class BinomialInterval
{
    public static (int Lo, int Hi) Of(int n, double p, double a = 0.01)
    {
        var pmf = new double[n + 1];
        pmf[0] = Math.Pow(1 - p, n);
        for (int k = 0; k < n; k++) pmf[k + 1] = pmf[k] * (n - k) / (k + 1) * p / (1 - p);
        int lo = 0;
        double below = 0;
        while (lo < n && below + pmf[lo] <= a / 2) below += pmf[lo++];
        int hi = n;
        double above = 0;
        while (hi > 0 && above + pmf[hi] <= a / 2) above += pmf[hi--];
        return (lo, hi);
    }
}
