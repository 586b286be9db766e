using Coupling.Measures;
using Coupling.Spectral;
using Coupling.Statistics;

namespace Coupling.Plans;

/// <summary>
/// A checked analysis plan: what to read, how to cut and decompose it, what to compute and test, and where to write.
/// Paths are absolute (resolved against the plan file's folder). Built by <see cref="PlanReader"/>.
/// </summary>
public sealed record Plan
{
    /// <summary>The plan file this was read from (absolute), or a description for generated plans.</summary>
    public required string Source { get; init; }

    /// <summary>Recording file: EDF/EDF+ (.edf), CSV (.csv, a column per channel) or NPY epochs (.npy).</summary>
    public required string Recording { get; init; }

    /// <summary>BIDS-style events.tsv to use instead of the recording's own annotations; null to use those (or a sidecar found beside the recording).</summary>
    public string? Events { get; init; }

    /// <summary>Channels to analyse, in the order results list them; null for every channel at the recording's main sampling rate, in its order.</summary>
    public IReadOnlyList<string>? Channels { get; init; }

    /// <summary>Sampling rate in Hz, required for CSV and NPY input, ignored for EDF.</summary>
    public double? SampleRate { get; init; }

    /// <summary>Settings for input that is already cut into epochs; null for continuous recordings.</summary>
    public EpochsSpec? Epochs { get; init; }

    /// <summary>The conditions to compare.</summary>
    public required IReadOnlyList<ConditionSpec> Conditions { get; init; }

    /// <summary>Pairs of conditions whose connectivity is tested for a difference (label permutation); empty for none.</summary>
    public IReadOnlyList<ContrastSpec> Contrasts { get; init; } = [];

    /// <summary>The trial span around each onset.</summary>
    public required TimeRange Trial { get; init; }

    /// <summary>The analysis window (inside the trial span) over which measures are summarised.</summary>
    public required TimeRange Window { get; init; }

    /// <summary>Whether each condition's trial average is subtracted from its trials before decomposition.</summary>
    public bool SubtractEvoked { get; init; }

    /// <summary>Frequency bands.</summary>
    public required IReadOnlyList<Band> Bands { get; init; }

    /// <summary>Band isolation settings.</summary>
    public required DecompositionSpec Decomposition { get; init; }

    /// <summary>Measures to compute.</summary>
    public required IReadOnlyList<Measure> Measures { get; init; }

    /// <summary>Number of trial-shuffle surrogate draws per condition x band.</summary>
    public int Surrogates { get; init; } = 1000;

    /// <summary>Seed of every random choice in the run.</summary>
    public ulong Seed { get; init; }

    /// <summary>Level of the correction across pairs: the false discovery rate q, or the family-wise error rate alpha
    /// (see <see cref="Correction"/>); for no correction, the per-pair level.</summary>
    public double Q { get; init; } = 0.05;

    /// <summary>Whether leave-one-trial-out jackknife 95 % intervals of the values are computed (plan key <c>intervals: jackknife</c>).</summary>
    public bool JackknifeIntervals { get; init; }

    /// <summary>Random subsets per condition for values matched to the smallest condition's trial count; 0 for no matching.</summary>
    public int MatchTrials { get; init; }

    /// <summary>Whether direction (coherency phase, lag, leader, phase-slope index) is computed for significant pairs (plan key <c>direction</c>).</summary>
    public bool Direction { get; init; }

    /// <summary>The correction across pairs and its options.</summary>
    public CorrectionSpec Correction { get; init; } = CorrectionSpec.Default;

    /// <summary>Results folder (created whole when the run succeeds).</summary>
    public required string Output { get; init; }

    /// <summary>
    /// Whether an earlier results folder of this tool at <see cref="Output"/> may be replaced (plan key <c>overwrite</c>, or
    /// <c>--force</c>); a folder holding anything the tool did not write is never replaced.
    /// </summary>
    public bool Overwrite { get; init; }

    /// <summary>Whether PNG figures are drawn.</summary>
    public bool Figures { get; init; } = true;

    /// <summary>The edge whose surrogate distribution is drawn; null for the strongest significant edge.</summary>
    public SurrogateFigureSpec? SurrogateFigure { get; init; }

    /// <summary>Worker threads for surrogate draws; 0 for all cores.</summary>
    public int Threads { get; init; }

    /// <summary>For an EDF file shorter than its header promises: analyse the complete data records it holds (and say how
    /// many in the manifest and report) instead of refusing it.</summary>
    public bool KeepCompleteRecords { get; init; }

    /// <summary>What to do with NaN or infinite samples, flat channels and clipped EDF samples: "refuse" (the default),
    /// "drop-trials" or "drop-channels" (see <see cref="Pipeline.UnusableData"/>).</summary>
    public string UnusableData { get; init; } = Pipeline.UnusableData.Refuse;

    /// <summary>Line in <see cref="Source"/> of each top-level key and of each key one level below ("bands.theta"); empty for generated plans.</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public IReadOnlyDictionary<string, int> KeyLines { get; init; } = new Dictionary<string, int>();

    /// <summary>Where a key is in the plan, for messages: "plan.yaml, line 12: bands.theta", or without the line when unknown.</summary>
    public string Where(string key) =>
        KeyLines.TryGetValue(key, out int line) ? $"{Source}, line {line}: {key}" : $"{Source}: {key}";
}
