namespace Coupling.Measures;

/// <summary>
/// The Fisher-transformed per-trial envelope correlations (AEC, AEC-orth) of every pair of channels for every pair of
/// trials (n of the first channel, m of the second), computed once for a set so that a surrogate draw only adds up N
/// rows of it instead of computing N trial pairs again. A draw uses N of the N² trial pairs, so the table pays for
/// itself once a test has more draws than trials; its size is N² x pairs x envelope measures doubles.
/// </summary>
/// <remarks>
/// A draw's sum Σ_n atanh r(n, π(n)) adds the same numbers in the same order (n = 0, 1, ...) whether they come from
/// the table or are computed on the spot, so the values are the same bits either way.
/// </remarks>
internal sealed class TrialPairTable
{
    /// <summary>Doubles the table may hold (512 MiB); beyond it the draws compute their trial pairs as they go.</summary>
    public const long DefaultBudget = 64L << 20;

    public TrialPairTable(int trials, int slots, int pairs)
    {
        Trials = trials;
        Slots = slots;
        Pairs = pairs;
        Values = new double[checked((long)trials * trials * slots * pairs)];
    }

    /// <summary>Number of trials N.</summary>
    public int Trials { get; }

    /// <summary>Number of envelope measures held, in the workspace's slot order.</summary>
    public int Slots { get; }

    /// <summary>Number of channel pairs.</summary>
    public int Pairs { get; }

    /// <summary>atanh r for trial n of the first channel and m of the second, envelope measure e, pair p, at
    /// ((n·N + m)·slots + e)·pairs + p.</summary>
    public double[] Values { get; }

    /// <summary>Offset of the row of (<paramref name="n"/>, <paramref name="m"/>, <paramref name="slot"/>).</summary>
    public long Row(int n, int m, int slot) => (((long)n * Trials + m) * Slots + slot) * Pairs;

    /// <summary>
    /// Whether a table pays for <paramref name="draws"/> draws and fits <paramref name="budget"/> doubles: it costs as
    /// much as N draws to build, and saves every draw that much work.
    /// </summary>
    public static bool Pays(int trials, int slots, int pairs, int draws, long budget = DefaultBudget) =>
        slots > 0 && draws > trials && (long)trials * trials * slots * pairs <= budget;
}
