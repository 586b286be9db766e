using Coupling.Spectral;

namespace Coupling.Simulation;

/// <summary>
/// What the simulated scenario truly contains, in the terms a connectivity analysis of it needs: the conditions
/// and their event labels, the trial span and analysis window, the bands, and every channel pair with a built-in
/// relation. Written to truth.json by <see cref="TruthFile"/>.
/// </summary>
/// <param name="Description">Plain-language description of the scenario.</param>
/// <param name="Seed">The seed the recording was generated with.</param>
/// <param name="SampleRate">Sampling rate in Hz.</param>
/// <param name="DurationSeconds">Length of the recording in seconds.</param>
/// <param name="Channels">Channel labels in recording order.</param>
/// <param name="Conditions">The task's conditions.</param>
/// <param name="TrialStart">Start of the trial span, seconds relative to each event onset.</param>
/// <param name="TrialEnd">End of the trial span, seconds relative to each event onset.</param>
/// <param name="WindowStart">Start of the analysis window, seconds relative to each event onset.</param>
/// <param name="WindowEnd">End of the analysis window, seconds relative to each event onset.</param>
/// <param name="Bands">Analysis bands (edges in Hz).</param>
/// <param name="BackgroundExponent">Exponent alpha of every channel's 1/f^alpha background power spectrum.</param>
/// <param name="BackgroundRms">Root-mean-square amplitude of every channel's background, microvolts.</param>
/// <param name="Pairs">Channel pairs with a built-in relation; all other pairs are independent.</param>
public sealed record GroundTruth(
    string Description,
    int Seed,
    double SampleRate,
    double DurationSeconds,
    IReadOnlyList<string> Channels,
    IReadOnlyList<ConditionTruth> Conditions,
    double TrialStart,
    double TrialEnd,
    double WindowStart,
    double WindowEnd,
    IReadOnlyList<Band> Bands,
    double BackgroundExponent,
    double BackgroundRms,
    IReadOnlyList<TruthPair> Pairs);
