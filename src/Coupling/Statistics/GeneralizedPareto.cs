namespace Coupling.Statistics;

/// <summary>
/// The generalised Pareto distribution of excesses z ≥ 0 over a threshold, with shape ξ and scale σ &gt; 0:
/// F(z) = 1 − (1 + ξz/σ)^(−1/ξ), and F(z) = 1 − exp(−z/σ) at ξ = 0 (the exponential). For ξ &lt; 0 the support ends at
/// z = −σ/ξ. This is scipy.stats.genpareto with c = ξ, loc = 0, scale = σ; Hosking and Wallis write k = −ξ.
/// </summary>
/// <remarks>
/// Pickands (1975), "Statistical inference using extreme order statistics", Ann Stat 3:119-131; Hosking and Wallis (1987),
/// "Parameter and quantile estimation for the generalized Pareto distribution", Technometrics 29:339-349.
/// </remarks>
public static class GeneralizedPareto
{
    /// <summary>Shapes closer to 0 than this are treated as the exponential limit (the two forms agree to ~1e-12 there).</summary>
    private const double ExponentialShape = 1e-12;

    /// <summary>The survival function 1 − F(z): 1 for z ≤ 0, 0 beyond the end point when ξ &lt; 0.</summary>
    public static double Survival(double z, double shape, double scale)
    {
        if (!(scale > 0)) throw new ArgumentOutOfRangeException(nameof(scale), scale, "The scale must be positive.");
        if (z <= 0) return 1;
        double u = shape * z / scale;
        if (Math.Abs(shape) < ExponentialShape) return Math.Exp(-z / scale);
        if (u <= -1) return 0;
        return Math.Exp(-double.LogP1(u) / shape);
    }

    /// <summary>The distribution function F(z) = 1 − <see cref="Survival"/>(z).</summary>
    public static double Cdf(double z, double shape, double scale) => 1 - Survival(z, shape, scale);

    /// <summary>
    /// Probability-weighted-moment estimates of (ξ, σ) from excesses (Hosking and Wallis 1987, section 3): with
    /// a₀ = mean and a₁ = (1/n) Σ_j (n − j)/(n − 1) · z_(j) over the ascending order statistics (the unbiased estimator
    /// of E[Z(1 − F(Z))]), k = a₀/(a₀ − 2a₁) − 2, σ = 2a₀a₁/(a₀ − 2a₁), ξ = −k. Defined for ξ &lt; 1/2 (finite variance);
    /// returns NaNs when a₀ − 2a₁ is not positive.
    /// </summary>
    /// <exception cref="ArgumentException">Fewer than 2 excesses, or a negative or non-finite excess.</exception>
    public static (double Shape, double Scale) FitProbabilityWeightedMoments(ReadOnlySpan<double> excesses)
    {
        int n = excesses.Length;
        if (n < 2) throw new ArgumentException("At least 2 excesses are needed.", nameof(excesses));
        var z = excesses.ToArray();
        foreach (double v in z)
            if (!(v >= 0) || double.IsInfinity(v)) throw new ArgumentException($"Excesses must be finite and non-negative; got {v}.", nameof(excesses));
        Array.Sort(z);
        double a0 = 0, a1 = 0;
        for (int j = 1; j <= n; j++)
        {
            a0 += z[j - 1];
            a1 += (n - j) / (n - 1.0) * z[j - 1];
        }
        a0 /= n;
        a1 /= n;
        double d = a0 - 2 * a1;
        if (!(d > 0)) return (double.NaN, double.NaN);
        double k = a0 / d - 2;
        return (-k, 2 * a0 * a1 / d);
    }

    /// <summary>
    /// The Anderson-Darling statistic of the excesses against the distribution with the given parameters:
    /// A² = −n − (1/n) Σ_{i=1..n} (2i − 1)[ln F(z_(i)) + ln(1 − F(z_(n+1−i)))] (Anderson and Darling 1954, J Am Stat Assoc
    /// 49:765-769; Stephens 1974, J Am Stat Assoc 69:730-737). F is clamped to [1e-300, 1 − 1e-16] so that a value at or
    /// beyond the end of the support gives a large, finite statistic.
    /// </summary>
    public static double AndersonDarling(ReadOnlySpan<double> excesses, double shape, double scale)
    {
        int n = excesses.Length;
        var f = new double[n];
        for (int i = 0; i < n; i++) f[i] = Math.Clamp(Cdf(excesses[i], shape, scale), 1e-300, 1 - 1e-16);
        Array.Sort(f);
        double sum = 0;
        for (int i = 1; i <= n; i++) sum += (2 * i - 1) * (Math.Log(f[i - 1]) + Math.Log(1 - f[n - i]));
        return -n - sum / n;
    }
}
