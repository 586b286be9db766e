using Coupling.Spectral;

namespace Coupling.Measures;

/// <summary>
/// Scratch memory for <see cref="PairwiseKernels.Compute(PairwiseWorkspace, ReadOnlySpan{int}, Span{double})"/>, sized
/// once for one <see cref="NarrowbandSet"/> and one list of measures, so that repeated computations (surrogate draws)
/// allocate nothing. A workspace is used by one thread at a time; <see cref="CreateSibling"/> gives another thread
/// its own scratch while sharing the per-set tables (see PairTables), which are built once and only read afterwards.
/// </summary>
public sealed class PairwiseWorkspace
{
    /// <summary>Sizes the workspace for <paramref name="set"/> and <paramref name="measures"/>.</summary>
    /// <param name="set">The narrowband signals; at least one time point, one trial and two channels.</param>
    /// <param name="measures">The measures to compute, each at most once; output slot k holds measures[k].</param>
    /// <exception cref="ArgumentException">No measures, a measure listed twice, or a set too small.</exception>
    public PairwiseWorkspace(NarrowbandSet set, IReadOnlyList<Measure> measures)
        : this(set, measures, tables: null)
    {
    }

    private PairwiseWorkspace(NarrowbandSet set, IReadOnlyList<Measure> measures, PairTables? tables)
    {
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(measures);
        if (measures.Count == 0) throw new ArgumentException("At least one measure is needed.", nameof(measures));
        if (set.ChannelCount < 2) throw new ArgumentException("At least two channels are needed.", nameof(set));
        if (set.TrialCount < 1) throw new ArgumentException("At least one trial is needed.", nameof(set));
        if (set.TimeCount < 1) throw new ArgumentException("At least one time point is needed.", nameof(set));

        Set = set;
        Measures = Array.AsReadOnly(measures.ToArray());
        PairCount = PairIndex.Count(set.ChannelCount);
        Slot = new int[Enum.GetValues<Measure>().Length];
        Array.Fill(Slot, -1);
        for (int k = 0; k < Measures.Count; k++)
        {
            int m = (int)Measures[k];
            if (Slot[m] >= 0)
                throw new ArgumentException($"Measure '{MeasureCatalog.Key(Measures[k])}' is listed twice.", nameof(measures));
            Slot[m] = k;
        }

        NeedsPhase = Has(Measure.Plv) || Has(Measure.Ppc);
        NeedsLag = Has(Measure.Pli) || Has(Measure.Wpli) || Has(Measure.WpliDebiased);
        NeedsCross = NeedsLag || Has(Measure.Coherence) || Has(Measure.ImagCoherency);
        NeedsEnvelope = Has(Measure.Aec) || Has(Measure.AecOrth);

        Tables = tables ?? new PairTables(set, NeedsPhase, NeedsCross, NeedsEnvelope, Has(Measure.AecOrth));
        Dense = new AlignedArray?[Measures.Count];
        long square = (long)Tables.Stride * Tables.Stride;
        for (int k = 0; k < Measures.Count; k++) Dense[k] = new AlignedArray(square);
        Seen = new bool[set.TrialCount];
    }

    /// <summary>The set this workspace is sized for.</summary>
    public NarrowbandSet Set { get; }

    /// <summary>The measures computed, in output-slot order.</summary>
    public IReadOnlyList<Measure> Measures { get; }

    /// <summary>Number of channel pairs (<see cref="PairIndex.Count"/>).</summary>
    public int PairCount { get; }

    /// <summary>Length of the output span: measures x pairs.</summary>
    public int OutputLength => Measures.Count * PairCount;

    /// <summary>
    /// A new workspace for the same set and measures with its own scratch memory, sharing this one's envelope tables.
    /// </summary>
    public PairwiseWorkspace CreateSibling() => new(Set, Measures, Tables);

    /// <summary>
    /// Re-reads <see cref="Set"/>'s values into the tables after the caller changed them in place (same shape), so
    /// repeated computations on changing data of one shape allocate nothing. Only for a workspace whose tables no
    /// sibling shares.
    /// </summary>
    internal void Reload() => Tables.Fill(Set);

    internal int[] Slot { get; }
    internal bool NeedsPhase { get; }
    internal bool NeedsCross { get; }
    internal bool NeedsLag { get; }
    internal bool NeedsEnvelope { get; }
    /// <summary>Per output slot, the sums of every pair (a, b) at [a * stride + b], stride = the tables' padded channel count.</summary>
    internal AlignedArray?[] Dense { get; }
    internal bool[] Seen { get; }
    internal PairTables Tables { get; }

    /// <summary>The dense sums of <paramref name="measure"/>, or null when it is not computed.</summary>
    internal AlignedArray? DenseOf(Measure measure) => Slot[(int)measure] is int k and >= 0 ? Dense[k] : null;

    private bool Has(Measure measure) => Slot[(int)measure] >= 0;
}
