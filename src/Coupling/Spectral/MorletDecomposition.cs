using System.Numerics;

namespace Coupling.Spectral;

/// <summary>
/// Band isolation by convolution with one complex Morlet wavelet (<see cref="MorletWavelet"/>) centred on the band:
/// w[i] = sum_{k=-K..K} psi[k] y[i - k] with y = x - mean(x) the segment less its mean, same length as the input, y taken
/// as 0 outside the segment.
/// </summary>
/// <remarks>
/// Tallon-Baudry, C. et al. (1996), J. Neurosci. 16(13), 4240-4249; Bruns, A. (2004), J. Neurosci. Methods 137,
/// 321-332, on its equivalence with band-pass plus Hilbert. Default width: cycles = 2 fc / (high - low), so that the
/// wavelet's spectral standard deviation sf = fc / cycles equals the band's half-width and fc +- sf are the band edges
/// (the Gaussian is at exp(-1/2) = 0.61 of its peak there). Because psi has unit energy, the gain at fc is
/// sum_k |psi[k]| ~ sqrt(2 sqrt(pi) st fs) and grows with the wavelet's length, so amplitudes differ between bands;
/// the connectivity measures are normalised by the amplitudes (or use phase only), so this scale cancels.
/// Applied by FFT (MathNet.Numerics Fourier) of power-of-two length at least n + 2K; the wavelet's spectrum is
/// kept per length (thread-safe).
/// Each segment's mean is subtracted before the convolution (recorded in the manifest as <c>segment_mean_removed</c>):
/// the wavelet has zero mean, but near the segment's ends it meets the zero extension, where a constant offset would
/// still leak in; with both, a constant offset gives no response anywhere.
/// </remarks>
public sealed class MorletDecomposition : IBandDecomposition
{
    private readonly CentredConvolution _convolution;
    private readonly ThreadLocal<double[]?> _demeaned = new();

    /// <summary>Uses a built wavelet for a band.</summary>
    /// <param name="band">The band the wavelet stands for.</param>
    /// <param name="wavelet">The wavelet, normally centred at the band centre.</param>
    public MorletDecomposition(Band band, MorletWavelet wavelet)
    {
        Band = band;
        Wavelet = wavelet;
        _convolution = new CentredConvolution(wavelet.Samples.ToArray(), wavelet.HalfLength);
        Info = new DecompositionInfo("morlet", band.Name, new Dictionary<string, double>
        {
            ["centre_hz"] = wavelet.CentreHz,
            ["cycles"] = wavelet.Cycles,
            ["time_sd_s"] = wavelet.TimeSd,
            ["freq_sd_hz"] = wavelet.FrequencySd,
            ["support_samples"] = wavelet.Length,
            ["dc_correction"] = wavelet.DcCorrection,
            ["segment_mean_removed"] = 1,
            ["edge_reach_s"] = wavelet.HalfLength / wavelet.SampleRate,
        });
    }

    /// <summary>
    /// Wavelet at the band centre with the given cycles, or by default 2 fc / (high - low) cycles (see remarks).
    /// </summary>
    /// <param name="band">The band (0 &lt; low &lt; high &lt; fs/2).</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <param name="cycles">Number of cycles, or null for the default rule.</param>
    /// <exception cref="InputException">The band does not fit the rate, or cycles not positive.</exception>
    public static MorletDecomposition Create(Band band, double sampleRate, double? cycles = null)
    {
        SpectralChecks.Band(band, sampleRate);
        double c = cycles ?? DefaultCycles(band);
        if (!(c > 0) || !double.IsFinite(c))
            throw new InputException($"{SpectralChecks.Describe(band)}: number of cycles {c} must be positive.");
        return new MorletDecomposition(band, MorletWavelet.Create(band.Centre, c, sampleRate));
    }

    /// <summary>Default number of cycles for a band: 2 fc / (high - low), so that sf is the band half-width.</summary>
    /// <param name="band">The band.</param>
    public static double DefaultCycles(Band band) => 2 * band.Centre / band.Width;

    /// <inheritdoc/>
    public Band Band { get; }

    /// <summary>The wavelet.</summary>
    public MorletWavelet Wavelet { get; }

    /// <summary>K, half the wavelet's support: samples within K of an end see the zero extension.</summary>
    public int PadSamples => Wavelet.HalfLength;

    /// <inheritdoc/>
    public DecompositionInfo Info { get; }

    /// <summary>
    /// Writes the wavelet transform of <paramref name="input"/> minus its own mean (the mean over the whole segment
    /// given, padding included) to <paramref name="output"/>.
    /// </summary>
    public void Apply(ReadOnlySpan<double> input, Span<Complex> output)
    {
        var buffer = _demeaned.Value;
        if (buffer is null || buffer.Length < input.Length) _demeaned.Value = buffer = new double[input.Length];
        var centred = buffer.AsSpan(0, input.Length);
        double sum = 0;
        foreach (double v in input) sum += v;
        double mean = input.Length > 0 ? sum / input.Length : 0;
        for (int i = 0; i < input.Length; i++) centred[i] = input[i] - mean;
        _convolution.Apply(centred, output);
    }
}
