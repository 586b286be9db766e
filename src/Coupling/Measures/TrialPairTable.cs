using System.Runtime.InteropServices;

namespace Coupling.Measures;

/// <summary>
/// The Fisher-transformed per-trial envelope correlations (AEC, AEC-orth) of every pair of channels for every pair of
/// trials (n of the first channel, m of the second), computed once for a set so that a surrogate draw only adds up N
/// rows of it instead of computing N trial pairs again. A draw uses N of the N² trial pairs, so the table pays for
/// itself once a test has more draws than trials; its size is N² x pairs x envelope measures doubles.
/// </summary>
/// <remarks>
/// A draw's sum Σ_n atanh r(n, π(n)) adds the same numbers in the same order (n = 0, 1, ...) whether they come from
/// the table or are computed on the spot, so the values are the same bits either way. The table lives in native memory
/// and is freed by <see cref="Dispose"/> when its test ends, so that a run's peak memory holds one table at a time
/// rather than whatever the garbage collector has not yet reclaimed.
/// </remarks>
internal sealed unsafe class TrialPairTable : IDisposable
{
    /// <summary>Doubles the table may hold (512 MiB); beyond it the draws compute their trial pairs as they go.</summary>
    public const long DefaultBudget = 64L << 20;

    public TrialPairTable(int trials, int slots, int pairs)
    {
        Trials = trials;
        Slots = slots;
        Pairs = pairs;
        _length = checked((long)trials * trials * slots * pairs);
        _values = (double*)NativeMemory.AlignedAlloc((nuint)(_length * sizeof(double)), 64);
    }

    private readonly long _length;
    private double* _values;

    /// <summary>Number of trials N.</summary>
    public int Trials { get; }

    /// <summary>Number of envelope measures held, in the workspace's slot order.</summary>
    public int Slots { get; }

    /// <summary>Number of channel pairs.</summary>
    public int Pairs { get; }

    /// <summary>
    /// The row of atanh r for trial <paramref name="n"/> of the first channel and <paramref name="m"/> of the second,
    /// envelope measure <paramref name="slot"/>: one value per pair.
    /// </summary>
    public Span<double> Row(int n, int m, int slot)
    {
        ObjectDisposedException.ThrowIf(_values == null, this);
        if ((uint)n >= (uint)Trials || (uint)m >= (uint)Trials || (uint)slot >= (uint)Slots)
            throw new ArgumentOutOfRangeException(nameof(n));
        return new Span<double>(_values + (((long)n * Trials + m) * Slots + slot) * Pairs, Pairs);
    }

    /// <summary>Frees the table's memory.</summary>
    public void Dispose()
    {
        Free();
        GC.SuppressFinalize(this);
    }

    ~TrialPairTable() => Free();

    private void Free()
    {
        if (_values == null) return;
        NativeMemory.AlignedFree(_values);
        _values = null;
    }

    /// <summary>
    /// Whether a table pays for <paramref name="draws"/> draws and fits <paramref name="budget"/> doubles: it costs as
    /// much as N draws to build, and saves every draw that much work.
    /// </summary>
    public static bool Pays(int trials, int slots, int pairs, int draws, long budget = DefaultBudget) =>
        slots > 0 && draws > trials && (long)trials * trials * slots * pairs <= budget;
}
