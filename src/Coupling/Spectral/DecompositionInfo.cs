namespace Coupling.Spectral;

/// <summary>The parameters a band decomposition actually used, as recorded in the run manifest.</summary>
/// <param name="Method">"fir-hilbert" or "morlet".</param>
/// <param name="Band">Band name.</param>
/// <param name="Parameters">Named values with units in the name (e.g. "pass_low_hz", "filter_taps", "time_sd_s").</param>
public sealed record DecompositionInfo(string Method, string Band, IReadOnlyDictionary<string, double> Parameters);
