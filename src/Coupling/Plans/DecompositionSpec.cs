namespace Coupling.Plans;

/// <summary>How each band is isolated in each trial.</summary>
/// <param name="Method">"fir-hilbert" (zero-phase Kaiser-window FIR band-pass, then the analytic signal) or "morlet".</param>
/// <param name="TransitionHz">FIR transition width in Hz; null for the per-band default.</param>
/// <param name="AttenuationDb">FIR stop-band attenuation (and pass-band ripple) in dB; null for the default.</param>
/// <param name="Cycles">Morlet cycles; null for the default derived from the band width.</param>
/// <param name="TimeStep">Evaluate the narrowband signal every this many samples in the analysis window; null for the per-band default.</param>
/// <param name="AcceptEdgeEffects">Plan value <c>edge_effects: accept</c>: analyse a window that band isolation reaches from
/// zero padding (with a warning saying how far) instead of refusing it (<c>refuse</c>, the default; see
/// <see cref="Spectral.EdgeReach"/>).</param>
public sealed record DecompositionSpec(string Method, double? TransitionHz, double? AttenuationDb, double? Cycles, int? TimeStep,
    bool AcceptEdgeEffects = false);
