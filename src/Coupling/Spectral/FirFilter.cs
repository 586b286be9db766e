using System.Collections.Immutable;

namespace Coupling.Spectral;

/// <summary>
/// An odd-length, symmetric (type I linear-phase) FIR band-pass filter with what its design asked for and what its
/// taps actually deliver. Immutable; built by <see cref="FirDesign"/> and applied by <see cref="ZeroPhase"/>.
/// </summary>
/// <remarks>
/// The realised band edges follow the windowed-sinc picture of Oppenheim and Schafer, Discrete-Time Signal
/// Processing, section 7.5 (window method): each cutoff sits in the middle of a transition of width
/// <see cref="TransitionHz"/>, so the pass band is [low + tw/2, high - tw/2] and the stop bands are below
/// low - tw/2 and above high + tw/2. The measured values come from the taps' own zero-phase amplitude response on a
/// grid of at least 32 points per fs/N (N taps; the width of one ripple lobe is about fs/N), obtained from a
/// zero-padded FFT, together with the exact values at the four edges.
/// </remarks>
public sealed record FirFilter
{
    /// <summary>Points of the measuring grid per fs/N, the approximate width of one ripple lobe.</summary>
    internal const int GridPointsPerLobe = 32;

    /// <summary>
    /// Wraps designed taps and measures their response.
    /// </summary>
    /// <param name="taps">Filter taps, odd length, symmetric (h[k] = h[N - 1 - k]).</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <param name="band">The band whose edges are the cutoffs.</param>
    /// <param name="transitionHz">Transition width in Hz, centred on each cutoff.</param>
    /// <param name="attenuationDb">The attenuation the filter was asked to reach, dB.</param>
    /// <param name="designAttenuationDb">The attenuation put into Kaiser's formulas to reach it, dB.</param>
    /// <param name="beta">Kaiser window beta used.</param>
    /// <exception cref="ArgumentException">Taps of even length or not symmetric.</exception>
    public FirFilter(ReadOnlySpan<double> taps, double sampleRate, Band band, double transitionHz,
        double attenuationDb, double designAttenuationDb, double beta)
    {
        if (taps.Length % 2 == 0)
            throw new ArgumentException($"Expected an odd number of taps, got {taps.Length}.", nameof(taps));
        for (int k = 0; k < taps.Length / 2; k++)
            if (taps[k] != taps[taps.Length - 1 - k])
                throw new ArgumentException($"Taps are not symmetric at {k}.", nameof(taps));
        Taps = taps.ToImmutableArray();
        SampleRate = sampleRate;
        Band = band;
        TransitionHz = transitionHz;
        AttenuationDb = attenuationDb;
        DesignAttenuationDb = designAttenuationDb;
        Beta = beta;
        PassLowHz = band.Low + 0.5 * transitionHz;
        PassHighHz = band.High - 0.5 * transitionHz;
        StopLowHz = band.Low - 0.5 * transitionHz;
        StopHighHz = band.High + 0.5 * transitionHz;
        (PassDeviation, StopGain) = Measure();
    }

    /// <summary>The taps h[0..N-1], symmetric.</summary>
    public ImmutableArray<double> Taps { get; }

    /// <summary>Number of taps N (odd).</summary>
    public int Length => Taps.Length;

    /// <summary>Delay of the causal filter, (N - 1) / 2 samples; <see cref="ZeroPhase"/> compensates it.</summary>
    public int DelaySamples => (Taps.Length - 1) / 2;

    /// <summary>Duration of the impulse response, N / fs seconds.</summary>
    public double LengthSeconds => Taps.Length / SampleRate;

    /// <summary>Sampling rate in Hz.</summary>
    public double SampleRate { get; }

    /// <summary>The band whose edges are the cutoffs (the -6 dB points).</summary>
    public Band Band { get; }

    /// <summary>Transition width in Hz, centred on each band edge.</summary>
    public double TransitionHz { get; }

    /// <summary>Attenuation asked for, dB: ripple and stop gain at most delta = 10^(-A/20).</summary>
    public double AttenuationDb { get; }

    /// <summary>Attenuation put into Kaiser's formulas, dB (at least <see cref="AttenuationDb"/>; see <see cref="FirDesign"/>).</summary>
    public double DesignAttenuationDb { get; }

    /// <summary>Kaiser window beta.</summary>
    public double Beta { get; }

    /// <summary>Lower edge of the realised pass band, low + tw/2, Hz.</summary>
    public double PassLowHz { get; }

    /// <summary>Upper edge of the realised pass band, high - tw/2, Hz.</summary>
    public double PassHighHz { get; }

    /// <summary>The lower stop band is [0, low - tw/2] Hz.</summary>
    public double StopLowHz { get; }

    /// <summary>The upper stop band is [high + tw/2, fs/2] Hz.</summary>
    public double StopHighHz { get; }

    /// <summary>Measured largest |A(f) - 1| over the pass band (A the zero-phase amplitude).</summary>
    public double PassDeviation { get; }

    /// <summary>Measured largest |A(f)| over both stop bands.</summary>
    public double StopGain { get; }

    /// <summary>Measured peak-to-peak pass-band ripple, 20 log10((1 + d) / (1 - d)) dB with d = <see cref="PassDeviation"/>.</summary>
    public double MeasuredRippleDb => 20 * Math.Log10((1 + PassDeviation) / (1 - PassDeviation));

    /// <summary>Measured stop-band attenuation, -20 log10(<see cref="StopGain"/>) dB.</summary>
    public double MeasuredStopbandDb => -20 * Math.Log10(StopGain);

    /// <summary>
    /// Zero-phase amplitude response at <paramref name="hz"/>: A(f) = h[c] + 2 sum_{m=1..c} h[c + m] cos(2 pi f m / fs),
    /// c = (N - 1) / 2. Real and signed; the causal filter's response is A(f) exp(-2 pi i f c / fs).
    /// </summary>
    /// <param name="hz">Frequency in Hz.</param>
    public double Response(double hz)
    {
        int c = DelaySamples;
        double w = 2 * Math.PI * hz / SampleRate;
        double sum = Taps[c];
        for (int m = 1; m <= c; m++)
            sum += 2 * Taps[c + m] * Math.Cos(w * m);
        return sum;
    }

    private (double passDeviation, double stopGain) Measure()
    {
        int n = Taps.Length;
        int size = SpectralChecks.PowerOfTwoAtLeast(Math.Max(4096, GridPointsPerLobe * n));
        var re = new double[size];
        var im = new double[size];
        PowerOfTwoFft.Of(size).ForwardReal(Taps.AsSpan(), re, im);
        double pass = 0, stop = 0;
        int c = DelaySamples;
        for (int k = 0; k <= size / 2; k++)
        {
            double hz = k * SampleRate / size;
            bool inPass = hz >= PassLowHz && hz <= PassHighHz;
            bool inStop = hz <= StopLowHz || hz >= StopHighHz;
            if (!inPass && !inStop) continue;
            // Undo the causal delay: A(f) = Re(H(f) exp(+2 pi i f c / fs)); k c mod size keeps the angle exact.
            double angle = 2 * Math.PI * ((long)k * c % size) / size;
            double a = re[k] * Math.Cos(angle) - im[k] * Math.Sin(angle);
            if (inPass) pass = Math.Max(pass, Math.Abs(a - 1));
            else stop = Math.Max(stop, Math.Abs(a));
        }
        pass = Math.Max(pass, Math.Max(Math.Abs(Response(PassLowHz) - 1), Math.Abs(Response(PassHighHz) - 1)));
        if (StopLowHz >= 0) stop = Math.Max(stop, Math.Abs(Response(StopLowHz)));
        if (StopHighHz <= 0.5 * SampleRate) stop = Math.Max(stop, Math.Abs(Response(StopHighHz)));
        return (pass, stop);
    }
}
