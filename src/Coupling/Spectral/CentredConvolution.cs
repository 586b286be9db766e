using System.Collections.Concurrent;
using System.Numerics;
using MathNet.Numerics.IntegralTransforms;

namespace Coupling.Spectral;

/// <summary>
/// Linear convolution of a real segment with a fixed complex kernel by FFT, returned centred: output sample i is
/// linear-convolution sample i + <c>delay</c>. The segment is zero-extended to a power-of-two length of at least
/// n + L - 1, so nothing wraps around. The kernel's spectrum is computed once per transform length and kept
/// (thread-safe), optionally with a spectral mask applied (the analytic-signal mask for the FIR route).
/// </summary>
internal sealed class CentredConvolution
{
    private readonly Complex[] _taps;
    private readonly int _delay;
    private readonly Action<Complex[]>? _mask;
    private readonly ConcurrentDictionary<int, Complex[]> _spectra = new();
    private readonly ThreadLocal<Complex[]?> _scratch = new();

    /// <param name="taps">The kernel, first tap first.</param>
    /// <param name="delay">Samples of the linear convolution before the centred output starts.</param>
    /// <param name="mask">Applied in place to each kernel spectrum after its FFT, or null.</param>
    public CentredConvolution(Complex[] taps, int delay, Action<Complex[]>? mask = null)
    {
        _taps = taps;
        _delay = delay;
        _mask = mask;
    }

    public void Apply(ReadOnlySpan<double> input, Span<Complex> output)
    {
        if (input.Length != output.Length)
            throw new ArgumentException($"Output length {output.Length} differs from input length {input.Length}.", nameof(output));
        int n = input.Length;
        if (n == 0) return;
        int size = SpectralChecks.PowerOfTwoAtLeast(n + _taps.Length - 1);
        Complex[] kernel = _spectra.GetOrAdd(size, Spectrum);
        // One transform buffer per thread, reused while the segment length stays the same (the usual case: every trial
        // of a condition has one length), so band isolation does not allocate per trial and channel.
        var buffer = _scratch.Value;
        if (buffer is null || buffer.Length != size) _scratch.Value = buffer = new Complex[size];
        for (int i = 0; i < n; i++) buffer[i] = input[i];
        Array.Clear(buffer, n, size - n);
        Fourier.Forward(buffer, FourierOptions.Matlab);
        for (int k = 0; k < size; k++) buffer[k] *= kernel[k];
        Fourier.Inverse(buffer, FourierOptions.Matlab);
        buffer.AsSpan(_delay, n).CopyTo(output);
    }

    private Complex[] Spectrum(int size)
    {
        var kernel = new Complex[size];
        _taps.CopyTo(kernel, 0);
        Fourier.Forward(kernel, FourierOptions.Matlab);
        _mask?.Invoke(kernel);
        return kernel;
    }
}
