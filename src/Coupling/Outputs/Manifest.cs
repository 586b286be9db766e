using System.Text.Json.Nodes;
using Coupling.Spectral;

namespace Coupling.Outputs;

/// <summary>
/// Everything a run's results depend on: program and library versions, platform, times, command line, input
/// files with hashes, the plan as parsed, the seed, the decomposition parameters per band, the trials per
/// condition and the analysis time step. Written by <see cref="ManifestWriter"/>, read by <see cref="ManifestReader"/>.
/// </summary>
public sealed record Manifest
{
    /// <summary>The <see cref="Format"/> of a results folder written by this tool's <c>run</c> command.</summary>
    public const string ResultsFormat = "coupling-results-1";

    /// <summary>
    /// What the folder holding this manifest is: <see cref="ResultsFormat"/> for a results folder written by this tool, whose
    /// <see cref="Outputs"/> then lists every file of it; null for manifests written before the field existed, which are not
    /// recognised as results folders (such a folder is never replaced).
    /// </summary>
    public string? Format { get; init; }

    /// <summary>Program, runtime, OS and library versions.</summary>
    public required ToolInfo Tool { get; init; }

    /// <summary>When the run started.</summary>
    public required DateTimeOffset Started { get; init; }

    /// <summary>When the run finished.</summary>
    public required DateTimeOffset Finished { get; init; }

    /// <summary>Wall-clock run time in seconds, <see cref="Finished"/> minus <see cref="Started"/> (derived; not read back).</summary>
    public double RunSeconds => (Finished - Started).TotalSeconds;

    /// <summary>The command-line arguments as received, program name first when known.</summary>
    public IReadOnlyList<string> CommandLine { get; init; } = [];

    /// <summary>Input files with sizes and SHA-256 hashes.</summary>
    public IReadOnlyList<InputFileRecord> Inputs { get; init; } = [];

    /// <summary>The whole plan as parsed (defaults filled in), or null when the run had no plan.</summary>
    public JsonNode? Plan { get; init; }

    /// <summary>The seed all randomness of the run came from, or null when nothing random was drawn.</summary>
    public ulong? Seed { get; init; }

    /// <summary>The parameters each band decomposition actually used.</summary>
    public IReadOnlyList<DecompositionInfo> Decompositions { get; init; } = [];

    /// <summary>Kept trial counts and dropped trials, per condition.</summary>
    public IReadOnlyList<ConditionTrials> Conditions { get; init; } = [];

    /// <summary>Time step between analysed time points, per band.</summary>
    public IReadOnlyList<BandTimeStep> TimeSteps { get; init; } = [];

    /// <summary>Output files written by the run, relative to the results folder ('/' separated, manifest.json included).</summary>
    public IReadOnlyList<string> Outputs { get; init; } = [];

    /// <summary>
    /// Work units (e.g. <c>condition go / band alpha</c>) whose results were loaded from an interrupted earlier run of the same
    /// plan and inputs rather than computed again; empty for a run computed whole. Like <see cref="Started"/> and
    /// <see cref="Finished"/> it describes the run, not the results.
    /// </summary>
    public IReadOnlyList<string> ResumedUnits { get; init; } = [];

    /// <summary>Further named values a stage wants recorded (e.g. shard number, merge sources); null when none.</summary>
    public JsonObject? Extra { get; init; }
}
