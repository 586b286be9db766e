using System.Collections.Immutable;
using System.Numerics;

namespace Coupling.Spectral;

/// <summary>
/// A sampled, zero-mean complex Morlet wavelet psi(t) = A (exp(2 pi i f t) - kappa) exp(-t^2 / (2 st^2)) at t = k / fs,
/// k = -K..K, with time standard deviation st = cycles / (2 pi f), spectral standard deviation sf = 1 / (2 pi st) =
/// f / cycles, kappa chosen so that the samples sum to exactly zero (up to rounding), and A chosen for unit energy
/// (sum_k |psi[k]|^2 = 1 over the samples kept).
/// </summary>
/// <remarks>
/// Tallon-Baudry, C., Bertrand, O., Delpuech, C. and Pernier, J. (1996), "Stimulus specificity of phase-locked and
/// non-phase-locked 40 Hz visual responses in human", J. Neurosci. 16(13), 4240-4249 (wavelet family, f / sf as the
/// number of cycles, unit energy); Bruns, A. (2004), "Fourier-, Hilbert- and wavelet-based signal analysis: are they
/// really different approaches?", J. Neurosci. Methods 137, 321-332. The support is cut at +-5 st
/// (K = ceil(5 st fs)): the envelope there is exp(-12.5) = 3.7e-6 of its peak, so the cut changes the energy by
/// about 1e-11 and the spectrum by a few parts per million of its peak.
/// Zero mean (admissibility): without kappa the Gaussian spectrum keeps exp(-cycles^2 / 2) of its peak at 0 Hz (0.011
/// at 3 cycles), so a constant offset leaks into the band. The continuous correction term is
/// kappa = exp(-cycles^2 / 2), which makes the spectrum
/// Psi(f') = A st sqrt(2 pi) [exp(-(f' - f)^2 / (2 sf^2)) - kappa exp(-f'^2 / (2 sf^2))], zero at f' = 0 (the complete
/// Morlet wavelet; Addison, P. S. (2002), The Illustrated Wavelet Transform Handbook, IOP Publishing, section 2.3,
/// from memory). Here kappa is the sampled version, kappa = sum_k g[k] exp(2 pi i f k / fs) / sum_k g[k] with g the
/// Gaussian envelope (real, because g is even), which removes the DC component of the samples exactly; it differs from
/// exp(-cycles^2 / 2) only by the cut and the sampling (parts per million of it).
/// </remarks>
public sealed record MorletWavelet
{
    /// <summary>Half-width of the support in time standard deviations.</summary>
    public const double SupportSd = 5.0;

    private MorletWavelet(double centreHz, double cycles, double sampleRate)
    {
        CentreHz = centreHz;
        Cycles = cycles;
        SampleRate = sampleRate;
        TimeSd = cycles / (2 * Math.PI * centreHz);
        FrequencySd = 1 / (2 * Math.PI * TimeSd);
        HalfLength = (int)Math.Ceiling(SupportSd * TimeSd * sampleRate);
        var samples = new Complex[2 * HalfLength + 1];
        var envelope = new double[samples.Length];
        double envelopeSum = 0, carrierSum = 0;
        for (int k = -HalfLength; k <= HalfLength; k++)
        {
            double t = k / sampleRate;
            double g = Math.Exp(-t * t / (2 * TimeSd * TimeSd));
            envelope[k + HalfLength] = g;
            envelopeSum += g;
            carrierSum += g * Math.Cos(2 * Math.PI * centreHz * t);
        }
        DcCorrection = carrierSum / envelopeSum;
        double energy = 0;
        for (int k = -HalfLength; k <= HalfLength; k++)
        {
            double t = k / sampleRate, g = envelope[k + HalfLength];
            var value = g * (Complex.FromPolarCoordinates(1, 2 * Math.PI * centreHz * t) - DcCorrection);
            samples[k + HalfLength] = value;
            energy += value.Real * value.Real + value.Imaginary * value.Imaginary;
        }
        double scale = 1 / Math.Sqrt(energy);
        for (int i = 0; i < samples.Length; i++) samples[i] *= scale;
        Samples = samples.ToImmutableArray();
    }

    /// <summary>Builds the wavelet from its number of cycles.</summary>
    /// <param name="centreHz">Centre frequency f in Hz, 0 &lt; f &lt; fs/2.</param>
    /// <param name="cycles">Number of cycles f / sf (positive), e.g. 7.</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <exception cref="InputException">A value out of range.</exception>
    public static MorletWavelet Create(double centreHz, double cycles, double sampleRate)
    {
        Check(centreHz, sampleRate);
        if (!(cycles > 0) || !double.IsFinite(cycles))
            throw new InputException($"Morlet wavelet at {centreHz:G6} Hz: number of cycles {cycles} must be positive.");
        return new MorletWavelet(centreHz, cycles, sampleRate);
    }

    /// <summary>Builds the wavelet from its time standard deviation: cycles = 2 pi f st.</summary>
    /// <param name="centreHz">Centre frequency f in Hz, 0 &lt; f &lt; fs/2.</param>
    /// <param name="timeSdSeconds">Time standard deviation st in seconds (positive).</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <exception cref="InputException">A value out of range.</exception>
    public static MorletWavelet FromTimeSd(double centreHz, double timeSdSeconds, double sampleRate)
    {
        Check(centreHz, sampleRate);
        if (!(timeSdSeconds > 0) || !double.IsFinite(timeSdSeconds))
            throw new InputException($"Morlet wavelet at {centreHz:G6} Hz: time standard deviation {timeSdSeconds} s must be positive.");
        return new MorletWavelet(centreHz, 2 * Math.PI * centreHz * timeSdSeconds, sampleRate);
    }

    /// <summary>Centre frequency f, Hz.</summary>
    public double CentreHz { get; }

    /// <summary>Number of cycles, f / sf = 2 pi f st.</summary>
    public double Cycles { get; }

    /// <summary>Sampling rate, Hz.</summary>
    public double SampleRate { get; }

    /// <summary>Time standard deviation st of the Gaussian envelope, seconds.</summary>
    public double TimeSd { get; }

    /// <summary>Spectral standard deviation sf = 1 / (2 pi st) of the Gaussian spectrum, Hz.</summary>
    public double FrequencySd { get; }

    /// <summary>
    /// kappa, the term subtracted from the carrier so that the samples sum to zero: sum_k g[k] cos(2 pi f k / fs) /
    /// sum_k g[k], close to exp(-cycles^2 / 2).
    /// </summary>
    public double DcCorrection { get; }

    /// <summary>K: samples on each side of the centre, ceil(5 st fs).</summary>
    public int HalfLength { get; }

    /// <summary>Number of samples, 2K + 1.</summary>
    public int Length => 2 * HalfLength + 1;

    /// <summary>psi at t = k / fs for k = -K..K (index k + K).</summary>
    public ImmutableArray<Complex> Samples { get; }

    private static void Check(double centreHz, double sampleRate)
    {
        if (!(sampleRate > 0) || !double.IsFinite(sampleRate))
            throw new InputException($"Morlet wavelet: sampling rate {sampleRate} Hz must be positive.");
        if (!(centreHz > 0) || !(centreHz < 0.5 * sampleRate))
            throw new InputException(
                $"Morlet wavelet: centre frequency {centreHz} Hz must lie between 0 Hz and the Nyquist frequency {0.5 * sampleRate:G6} Hz of the sampling rate {sampleRate:G6} Hz.");
    }
}
