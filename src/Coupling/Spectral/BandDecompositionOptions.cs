namespace Coupling.Spectral;

/// <summary>Optional settings of a band decomposition; null means the documented default.</summary>
/// <param name="TransitionHz">FIR transition width in Hz; default <see cref="FirDesign.DefaultTransitionHz"/>.</param>
/// <param name="AttenuationDb">FIR stop-band attenuation in dB; default <see cref="FirDesign.DefaultAttenuationDb"/> (60 dB).</param>
/// <param name="Cycles">Morlet number of cycles; default <see cref="MorletDecomposition.DefaultCycles"/>.</param>
public sealed record BandDecompositionOptions(double? TransitionHz = null, double? AttenuationDb = null, double? Cycles = null)
{
    /// <summary>All defaults.</summary>
    public static BandDecompositionOptions Defaults { get; } = new();
}
