namespace Coupling.Statistics;

/// <summary>
/// p-values beyond the reach of counting: a generalised Pareto distribution fitted to the upper tail of the surrogate
/// distribution estimates how rarely the null reaches an observed value that few or no draws reached.
/// </summary>
/// <remarks>
/// <para>Knijnenburg, Wessels, Reinders and Shmulevich (2009), "Fewer permutations, more accurate P-values",
/// Bioinformatics 25:i161-i168; Winkler, Ridgway, Douaud, Nichols and Smith (2016), "Faster permutation inference in brain
/// imaging", NeuroImage 141:502-516. With the M draws sorted descending, y₁ ≥ y₂ ≥ ..., and b the number at or above the
/// observed x: if b ≥ <see cref="MinimumExceedances"/> the counted p = (b+1)/(M+1) is kept (Knijnenburg et al.: the
/// empirical p is then accurate enough). Otherwise, starting with N_exc = min(250, M/20) (the top 5 % of the draws, at
/// most the 250 Knijnenburg et al. start with), the threshold is t = (y_{N_exc} + y_{N_exc+1})/2, the excesses y_j − t (j ≤ N_exc) are fitted by probability-weighted
/// moments (<see cref="GeneralizedPareto.FitProbabilityWeightedMoments"/>), and the fit is checked with the
/// Anderson-Darling statistic; if it fails, N_exc is lowered by 10 and the fit repeated, down to
/// <see cref="MinimumFitted"/>. The p-value is p = (N_exc/M) · S(x − t) with S the fitted survival function.</para>
/// <para>Shape: the connectivity statistics are sums over trials, whose tails lie in the domain of attraction of the
/// Gumbel law (Gaussian-like and chi-like tails), where the limiting shape is ξ = 0 (Pickands 1975, Ann Stat 3:119). A
/// negative fitted shape is then an artefact of a tail not yet in its limit and extrapolates to a false end point: in
/// simulations of the trial-shuffle null of a PLV (40 trials, M = 2000) unconstrained fits gave p-values 100 times too
/// small in 5 % of runs. A negative fit is therefore replaced by the exponential tail (ξ = 0, σ = mean excess, the
/// maximum-likelihood fit of that family), whose tail is heavier than any with ξ &lt; 0: the p is conservative (in the
/// same simulations a median of 1.6 times the long-run p at 1e-3, 2.5 times at 2e-4), never zero, and still far below
/// the counting floor 1/(M+1). Positive shapes (heavier tails) are kept as fitted.</para>
/// <para>Goodness of fit: the fit is accepted when A² ≤ <see cref="AndersonDarlingLimit"/> = 2.492, the 5 % point of the
/// asymptotic distribution of A² for a fully specified distribution (Anderson and Darling 1954, J Am Stat Assoc
/// 49:765-769; Stephens 1974, J Am Stat Assoc 69:730-737, table 1, case 0). With the two parameters estimated from the
/// same data the true 5 % points are smaller (Choulakian and Stephens 2001, Technometrics 43:478-484), so this check is
/// lenient: it rejects only fits that are clearly wrong. Fits with a non-positive scale, or an x beyond the end point of a
/// fitted bounded tail (S = 0), fall back to the counted p, which is never zero.</para>
/// </remarks>
public static class ParetoTail
{
    /// <summary>Below this many exceedances the counted p is refined (Knijnenburg et al. 2009: 10).</summary>
    public const int MinimumExceedances = 10;

    /// <summary>Largest number of tail values used for the fit (Knijnenburg et al. 2009 start at 250).</summary>
    public const int MaximumFitted = 250;

    /// <summary>The fit starts with at most the top 1/<see cref="TailFraction"/> of the draws.</summary>
    public const int TailFraction = 20;

    /// <summary>Smallest number of tail values a fit may use.</summary>
    public const int MinimumFitted = 20;

    /// <summary>Step by which the tail is shortened after a failed goodness-of-fit check (Knijnenburg et al. 2009: 10).</summary>
    public const int Step = 10;

    /// <summary>Acceptance limit of the Anderson-Darling statistic (see remarks).</summary>
    public const double AndersonDarlingLimit = 2.492;

    /// <summary>
    /// The upper-tail p-value of <paramref name="observed"/> against <paramref name="draws"/> draws whose largest values are
    /// <paramref name="tail"/> (descending; at least N_exc + 1 of them for a fit of N_exc).
    /// </summary>
    /// <returns>The p, and whether it came from the fitted tail (false: the counted (b+1)/(M+1), b counted in the tail
    /// when the tail holds more than b values).</returns>
    /// <exception cref="ArgumentException"><paramref name="tail"/> is longer than the number of draws.</exception>
    public static (double P, bool Fitted) UpperP(double observed, ReadOnlySpan<double> tail, int draws)
    {
        if (tail.Length > draws) throw new ArgumentException("The tail cannot hold more values than there were draws.", nameof(tail));
        int b = 0;
        while (b < tail.Length && tail[b] >= observed) b++;
        double counted = (b + 1.0) / (draws + 1.0);
        if (double.IsNaN(observed) || b >= MinimumExceedances) return (counted, false);
        var excesses = new double[tail.Length];
        for (int n = Math.Min(Math.Min(MaximumFitted, draws / TailFraction), tail.Length - 1); n >= MinimumFitted; n -= Step)
        {
            double threshold = (tail[n - 1] + tail[n]) / 2;
            for (int j = 0; j < n; j++) excesses[j] = tail[j] - threshold;
            var z = excesses.AsSpan(0, n);
            var (shape, scale) = GeneralizedPareto.FitProbabilityWeightedMoments(z);
            if (shape < 0)
            {
                double mean = 0;
                foreach (double v in z) mean += v;
                (shape, scale) = (0, mean / n);
            }
            if (!(scale > 0) || GeneralizedPareto.AndersonDarling(z, shape, scale) > AndersonDarlingLimit) continue;
            double survival = GeneralizedPareto.Survival(observed - threshold, shape, scale);
            if (!(survival > 0)) return (counted, false);
            return ((double)n / draws * survival, true);
        }
        return (counted, false);
    }
}
