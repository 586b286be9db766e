using System.Collections.Concurrent;
using System.Numerics;
using System.Runtime.CompilerServices;
using MathNet.Numerics.IntegralTransforms;

namespace Coupling.Spectral;

/// <summary>
/// Linear convolution of a real segment with a fixed complex kernel by FFT, returned centred: output sample i is
/// linear-convolution sample i + <c>delay</c>. The segment is zero-extended to a power-of-two length of at least
/// n + L - 1 (and at least 8), so nothing wraps around. The kernel's spectrum is computed once per transform length and
/// kept (thread-safe), optionally with a spectral mask applied (the analytic-signal mask for the FIR route). The segment
/// is transformed as a real sequence and both transforms run on split real/imaginary arrays (<see cref="PowerOfTwoFft"/>).
/// </summary>
internal sealed class CentredConvolution
{
    private readonly Complex[] _taps;
    private readonly int _delay;
    private readonly Action<Complex[]>? _mask;
    private readonly ConcurrentDictionary<int, SplitSpectrum> _spectra = new();
    private readonly ThreadLocal<Buffers?> _scratch = new();

    /// <param name="taps">The kernel, first tap first.</param>
    /// <param name="delay">Samples of the linear convolution before the centred output starts.</param>
    /// <param name="mask">Applied in place to each kernel spectrum after its FFT, or null.</param>
    public CentredConvolution(Complex[] taps, int delay, Action<Complex[]>? mask = null)
    {
        _taps = taps;
        _delay = delay;
        _mask = mask;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Apply(ReadOnlySpan<double> input, Span<Complex> output)
    {
        if (input.Length != output.Length)
            throw new ArgumentException($"Output length {output.Length} differs from input length {input.Length}.", nameof(output));
        int n = input.Length;
        if (n == 0) return;
        int size = Math.Max(8, SpectralChecks.PowerOfTwoAtLeast(n + _taps.Length - 1));
        var kernel = _spectra.GetOrAdd(size, Spectrum);
        // One pair of transform buffers per thread, reused while the segment length stays the same (the usual case: every
        // trial of a condition has one length), so band isolation does not allocate per trial and channel.
        var buffer = _scratch.Value;
        if (buffer is null || buffer.Re.Length != size) _scratch.Value = buffer = new Buffers(new double[size], new double[size]);
        var fft = PowerOfTwoFft.Of(size);
        double[] re = buffer.Re, im = buffer.Im, kr = kernel.Re, ki = kernel.Im;
        // The input is real: half a complex transform gives X[0..size/2], and X[size − k] = conj X[k] the rest.
        fft.ForwardReal(input, re, im);
        int half = size / 2;
        Multiply(re, im, 0, re[0], im[0], kr, ki);
        Multiply(re, im, half, re[half], im[half], kr, ki);
        for (int k = 1; k < half; k++)
        {
            double xr = re[k], xi = im[k];
            Multiply(re, im, k, xr, xi, kr, ki);
            Multiply(re, im, size - k, xr, -xi, kr, ki);
        }
        fft.Inverse(re, im); // the kernel spectrum carries the 1/size of the inverse transform
        for (int i = 0; i < n; i++) output[i] = new Complex(re[_delay + i], im[_delay + i]);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Multiply(double[] re, double[] im, int k, double xr, double xi, double[] kr, double[] ki)
    {
        re[k] = xr * kr[k] - xi * ki[k];
        im[k] = xr * ki[k] + xi * kr[k];
    }

    private sealed record Buffers(double[] Re, double[] Im);

    private sealed record SplitSpectrum(double[] Re, double[] Im);

    private SplitSpectrum Spectrum(int size)
    {
        var kernel = new Complex[size];
        _taps.CopyTo(kernel, 0);
        Fourier.Forward(kernel, FourierOptions.Matlab);
        _mask?.Invoke(kernel);
        var spectrum = new SplitSpectrum(new double[size], new double[size]);
        for (int k = 0; k < size; k++)
        {
            spectrum.Re[k] = kernel[k].Real / size;
            spectrum.Im[k] = kernel[k].Imaginary / size;
        }
        return spectrum;
    }
}
