using Coupling.Artefacts;
using Coupling.Outputs;
using Coupling.Pipeline;
using Coupling.Plans;

namespace Coupling.Reports;

/// <summary>Everything the HTML report shows, as plain records: the plan, the manifest, the computed results and the flags.</summary>
/// <param name="Plan">The checked plan.</param>
/// <param name="Manifest">The run's manifest (methods, versions, decomposition parameters, trial counts).</param>
/// <param name="Analysis">The computed results of the run.</param>
/// <param name="Recording">The recording's path.</param>
/// <param name="SampleRate">Sampling rate in Hz.</param>
/// <param name="Channels">The analysed channel labels.</param>
/// <param name="InputNotes">Notes from reading the input.</param>
/// <param name="Flags">Artefact flags raised from the results.</param>
/// <param name="UncheckedFlags">Flag checks the run's measures or settings left impossible.</param>
public sealed record ReportContent(
    Plan Plan,
    Manifest Manifest,
    Analysis Analysis,
    string Recording,
    double SampleRate,
    IReadOnlyList<string> Channels,
    IReadOnlyList<string> InputNotes,
    IReadOnlyList<ArtefactFlag> Flags,
    IReadOnlyList<string> UncheckedFlags);
