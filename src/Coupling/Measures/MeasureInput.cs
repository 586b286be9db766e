namespace Coupling.Measures;

/// <summary>
/// What a measure reads from the narrowband signals. Measures that share an input are computed in one pass over it.
/// </summary>
[Flags]
public enum MeasureInput
{
    /// <summary>Nothing (not a valid input of any measure; the zero value of the flags).</summary>
    None = 0,
    /// <summary>Unit phasors z/|z| only (PLV, PPC).</summary>
    Phase = 1,
    /// <summary>The raw complex values and their cross products z_a·conj(z_b) (coherence, imaginary coherency, PLI, wPLI, debiased wPLI²).</summary>
    CrossSpectrum = 2,
    /// <summary>Amplitude envelopes |z| over the time points of each trial (AEC; AEC-orth also reads the raw values).</summary>
    Envelope = 4,
}
