using System.Numerics;

namespace Coupling.Spectral;

/// <summary>
/// A band isolation method configured for one band and one sampling rate (a designed FIR filter followed by the
/// Hilbert transform, or one complex Morlet wavelet). Built once, applied to many trials.
/// </summary>
public interface IBandDecomposition
{
    /// <summary>The band it isolates.</summary>
    Band Band { get; }

    /// <summary>Samples of padding needed at each end of a segment so that edge effects stay out of the rest.</summary>
    int PadSamples { get; }

    /// <summary>
    /// Writes the complex narrowband signal of <paramref name="input"/> to <paramref name="output"/> (same length):
    /// its real part is the band-limited signal, its argument the instantaneous phase and its modulus the envelope.
    /// </summary>
    void Apply(ReadOnlySpan<double> input, Span<Complex> output);

    /// <summary>What was actually used (real pass band, transition, filter length, wavelet widths...), for the manifest.</summary>
    DecompositionInfo Info { get; }
}
