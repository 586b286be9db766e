using System.Numerics;

namespace Coupling.Spectral;

/// <summary>
/// Band isolation by a zero-phase FIR band-pass (<see cref="FirFilter"/>) followed by the analytic signal
/// (<see cref="Analytic.Hilbert(ReadOnlySpan{double}, Span{Complex})"/>).
/// </summary>
/// <remarks>
/// Both steps are done in one FFT of length L, the smallest power of two at least n + N - 1 (n samples, N taps):
/// the zero-padded segment's spectrum is multiplied by the taps' spectrum and by Marple's one-sided weights for
/// length L, transformed back, and samples c .. c + n - 1 (c = (N - 1) / 2) are kept. This is exactly the two-step
/// route applied to the zero-extended segment: <see cref="ZeroPhase.Apply(FirFilter, ReadOnlySpan{double}, Span{double})"/>
/// on [c zeros, x, zeros up to L], then the analytic signal of that whole length-L result. It differs from taking the
/// analytic signal of the n filtered samples alone (a circular transform of the truncated filter output) only through
/// the filtered signal's spill beyond the segment ends: large within the padding, and beyond it a remainder that
/// falls off like the discrete Hilbert kernel, 2 / (pi d) (about 2e-3 of the rms for white noise in a 4-8 Hz band at
/// 250 Hz). The zero extension is the same convention as <see cref="ZeroPhase"/>, and nothing wraps around. Marple, S. L. (1999), IEEE Trans. Signal Processing 47(9), 2600-2603; for the
/// equivalence of filter-Hilbert and wavelet routes, Bruns, A. (2004), J. Neurosci. Methods 137, 321-332.
/// The spectrum of the combined kernel is computed once per transform length and kept (thread-safe).
/// </remarks>
public sealed class FirHilbertDecomposition : IBandDecomposition
{
    private readonly CentredConvolution _convolution;

    /// <summary>Uses a designed filter.</summary>
    /// <param name="filter">The band-pass filter.</param>
    public FirHilbertDecomposition(FirFilter filter)
    {
        Filter = filter;
        _convolution = new CentredConvolution(filter.Taps.Select(t => new Complex(t, 0)).ToArray(), filter.DelaySamples, k => Analytic.ApplyMask(k));
        Info = new DecompositionInfo("fir-hilbert", filter.Band.Name, new Dictionary<string, double>
        {
            ["pass_low_hz"] = filter.PassLowHz,
            ["pass_high_hz"] = filter.PassHighHz,
            ["stop_low_hz"] = filter.StopLowHz,
            ["stop_high_hz"] = filter.StopHighHz,
            ["transition_hz"] = filter.TransitionHz,
            ["attenuation_db"] = filter.AttenuationDb,
            ["design_attenuation_db"] = filter.DesignAttenuationDb,
            ["kaiser_beta"] = filter.Beta,
            ["filter_taps"] = filter.Length,
            ["filter_length_s"] = filter.LengthSeconds,
            ["measured_ripple_db"] = filter.MeasuredRippleDb,
            ["measured_stopband_db"] = filter.MeasuredStopbandDb,
            ["edge_reach_s"] = filter.DelaySamples / filter.SampleRate,
        });
    }

    /// <summary>The band-pass filter.</summary>
    public FirFilter Filter { get; }

    /// <inheritdoc/>
    public Band Band => Filter.Band;

    /// <summary>
    /// The filter length N. A sample within c = (N - 1) / 2 of an end is filtered partly from the zero extension; the
    /// analytic-signal step spreads the end transients over about as far again, because the band-limited Hilbert
    /// kernel of the pass band has the filter's own transitions as its spectral edges. 2c + 1 = N covers both.
    /// </summary>
    public int PadSamples => Filter.Length;

    /// <inheritdoc/>
    public DecompositionInfo Info { get; }

    /// <inheritdoc/>
    public void Apply(ReadOnlySpan<double> input, Span<Complex> output) => _convolution.Apply(input, output);
}
