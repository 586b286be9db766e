using System.Text.Json.Serialization;

namespace Coupling.Simulation;

/// <summary>What relation a simulated channel pair truly has; written to truth.json as the quoted lowercase key.</summary>
[JsonConverter(typeof(JsonStringEnumConverter<TruthKind>))]
public enum TruthKind
{
    /// <summary>"phase-coupled": one narrowband source seen by both channels, the second a delayed copy of the first.</summary>
    [JsonStringEnumMemberName("phase-coupled")]
    PhaseCoupled,

    /// <summary>"zero-lag-mixing": one source seen by both channels with different real gains and no delay (volume conduction).</summary>
    [JsonStringEnumMemberName("zero-lag-mixing")]
    ZeroLagMixing,

    /// <summary>"envelope-only": independent carriers whose amplitudes follow one shared slow envelope.</summary>
    [JsonStringEnumMemberName("envelope-only")]
    EnvelopeOnly,

    /// <summary>"stimulus-locked": the same evoked response at every onset in both channels; not coupling.</summary>
    [JsonStringEnumMemberName("stimulus-locked")]
    StimulusLocked,
}
