using System.Collections.Concurrent;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace Coupling.Spectral;

/// <summary>
/// The discrete Fourier transform X[k] = Σ_j x[j]·exp(−2πi·jk/n) of a power-of-two length n, on split real and
/// imaginary arrays, in place, unnormalised: the iterative radix-2 decimation-in-time algorithm of Cooley and Tukey
/// (1965, "An algorithm for the machine calculation of complex Fourier series", Math. Comp. 19:297-301) after a
/// bit-reversal permutation, vectorised over the butterflies of one group. The twiddle factors are computed directly
/// (cos and sin of each angle, no recurrence), so the rounding error grows like ε·log2(n).
/// </summary>
/// <remarks>
/// <see cref="ForwardReal"/> transforms a real sequence of length n through one complex transform of length n/2 of its
/// even and odd samples (Cooley, Lewis, Welch 1970, "The fast Fourier transform algorithm: programming considerations in
/// the calculation of sine, cosine and Laplace transforms", J. Sound Vib. 12:315-337), about half the work of a complex
/// transform. The inverse is the forward transform with real and imaginary parts exchanged (n·x = swap(DFT(swap(X)))).
/// </remarks>
internal sealed class PowerOfTwoFft
{
    private static readonly ConcurrentDictionary<int, PowerOfTwoFft> Plans = new();

    private readonly int[] _reverse;
    // Twiddles of the stage whose groups have half-length h start at index h − 1: cos and −sin of π·j/h, j < h.
    private readonly double[] _cos, _sin;

    private PowerOfTwoFft(int size)
    {
        Size = size;
        int bits = System.Numerics.BitOperations.Log2((uint)size);
        _reverse = new int[size];
        for (int i = 0; i < size; i++)
            _reverse[i] = bits == 0 ? 0 : (int)(ReverseBits((uint)i) >> (32 - bits));
        _cos = new double[Math.Max(1, size - 1)];
        _sin = new double[Math.Max(1, size - 1)];
        for (int h = 1; h < size; h *= 2)
            for (int j = 0; j < h; j++)
            {
                (double s, double c) = Math.SinCos(Math.PI * j / h);
                _cos[h - 1 + j] = c;
                _sin[h - 1 + j] = -s;
            }
    }

    /// <summary>The transform length n.</summary>
    public int Size { get; }

    /// <summary>The plan for length <paramref name="size"/> (a power of two), built once and shared.</summary>
    public static PowerOfTwoFft Of(int size)
    {
        if (size < 1 || (size & (size - 1)) != 0)
            throw new ArgumentOutOfRangeException(nameof(size), size, "The length must be a power of two.");
        return Plans.GetOrAdd(size, s => new PowerOfTwoFft(s));
    }

    /// <summary>In place: (re, im) ← DFT(re + i·im), unnormalised.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Forward(Span<double> re, Span<double> im)
    {
        int n = Size;
        if (re.Length != n || im.Length != n) throw new ArgumentException($"Expected {n} values.", nameof(re));
        ref double r = ref MemoryMarshal.GetReference(re);
        ref double m = ref MemoryMarshal.GetReference(im);
        for (int i = 0; i < n; i++)
        {
            int j = _reverse[i];
            if (j > i)
            {
                (Unsafe.Add(ref r, i), Unsafe.Add(ref r, j)) = (Unsafe.Add(ref r, j), Unsafe.Add(ref r, i));
                (Unsafe.Add(ref m, i), Unsafe.Add(ref m, j)) = (Unsafe.Add(ref m, j), Unsafe.Add(ref m, i));
            }
        }
        if (n >= 4)
        {
            // The first two stages together: groups of four with twiddles 1, 1, 1 and −i.
            for (int a = 0; a < n; a += 4)
            {
                double r0 = Unsafe.Add(ref r, a), r1 = Unsafe.Add(ref r, a + 1), r2 = Unsafe.Add(ref r, a + 2), r3 = Unsafe.Add(ref r, a + 3);
                double i0 = Unsafe.Add(ref m, a), i1 = Unsafe.Add(ref m, a + 1), i2 = Unsafe.Add(ref m, a + 2), i3 = Unsafe.Add(ref m, a + 3);
                double sr0 = r0 + r1, si0 = i0 + i1, dr0 = r0 - r1, di0 = i0 - i1;
                double sr1 = r2 + r3, si1 = i2 + i3, dr1 = r2 - r3, di1 = i2 - i3;
                Unsafe.Add(ref r, a) = sr0 + sr1;
                Unsafe.Add(ref m, a) = si0 + si1;
                Unsafe.Add(ref r, a + 2) = sr0 - sr1;
                Unsafe.Add(ref m, a + 2) = si0 - si1;
                // (dr1 + i·di1)·(−i) = di1 − i·dr1
                Unsafe.Add(ref r, a + 1) = dr0 + di1;
                Unsafe.Add(ref m, a + 1) = di0 - dr1;
                Unsafe.Add(ref r, a + 3) = dr0 - di1;
                Unsafe.Add(ref m, a + 3) = di0 + dr1;
            }
        }
        else if (n == 2)
        {
            double r0 = r, i0 = m;
            r = r0 + Unsafe.Add(ref r, 1);
            m = i0 + Unsafe.Add(ref m, 1);
            Unsafe.Add(ref r, 1) = r0 - Unsafe.Add(ref r, 1);
            Unsafe.Add(ref m, 1) = i0 - Unsafe.Add(ref m, 1);
        }
        ref double wc = ref MemoryMarshal.GetArrayDataReference(_cos);
        ref double ws = ref MemoryMarshal.GetArrayDataReference(_sin);
        for (int h = 4; h < n; h *= 2)
        {
            for (int start = 0; start < n; start += 2 * h)
            {
                for (int j = 0; j < h; j += 4)
                {
                    nuint a = (nuint)(start + j), b = a + (nuint)h, w = (nuint)(h - 1 + j);
                    var c = Vector256.LoadUnsafe(ref wc, w);
                    var s = Vector256.LoadUnsafe(ref ws, w);
                    var br = Vector256.LoadUnsafe(ref r, b);
                    var bi = Vector256.LoadUnsafe(ref m, b);
                    var tr = c * br - s * bi;
                    var ti = c * bi + s * br;
                    var ar = Vector256.LoadUnsafe(ref r, a);
                    var ai = Vector256.LoadUnsafe(ref m, a);
                    (ar - tr).StoreUnsafe(ref r, b);
                    (ai - ti).StoreUnsafe(ref m, b);
                    (ar + tr).StoreUnsafe(ref r, a);
                    (ai + ti).StoreUnsafe(ref m, a);
                }
            }
        }
    }

    /// <summary>In place: (re, im) ← n·IDFT(re + i·im) = Σ_k X[k]·exp(+2πi·jk/n), unnormalised.</summary>
    public void Inverse(Span<double> re, Span<double> im) => Forward(im, re);

    /// <summary>
    /// The spectrum X[0..n/2] of the real sequence <paramref name="x"/> (its length at most n, zero-extended to n),
    /// written to <paramref name="re"/>[0..n/2] and <paramref name="im"/>[0..n/2] (both of length n; the rest is
    /// scratch). X[n − k] = conj(X[k]) gives the other half.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ForwardReal(ReadOnlySpan<double> x, Span<double> re, Span<double> im)
    {
        int n = Size;
        if (n < 8) throw new InvalidOperationException("The real transform needs a length of at least 8.");
        if (x.Length > n || re.Length != n || im.Length != n) throw new ArgumentException($"Expected at most {n} samples and {n} outputs.", nameof(x));
        int half = n / 2;
        // z[j] = x[2j] + i·x[2j+1] in the upper halves of the buffers, transformed there.
        var zr = re.Slice(half, half);
        var zi = im.Slice(half, half);
        int pairs = x.Length / 2;
        for (int j = 0; j < pairs; j++)
        {
            zr[j] = x[2 * j];
            zi[j] = x[2 * j + 1];
        }
        int next = pairs;
        if ((x.Length & 1) != 0)
        {
            zr[next] = x[x.Length - 1];
            zi[next] = 0;
            next++;
        }
        zr[next..].Clear();
        zi[next..].Clear();
        Of(half).Forward(zr, zi);
        // E[k] = (Z[k] + conj Z[h−k]) / 2, O[k] = (Z[k] − conj Z[h−k]) / (2i), X[k] = E[k] + w^k O[k], w = exp(−2πi/n);
        // the twiddles w^k, k < n/2, are those of this plan's last stage. Outputs k and h − k come from the same two
        // inputs, so both are formed together before either is overwritten (the inputs sit in the upper halves).
        int tw = half - 1;
        for (int k = 0; k <= half / 2; k++)
        {
            int q = k == 0 ? 0 : half - k;
            double zkr = zr[k], zki = zi[k], zqr = zr[q], zqi = zi[q];
            Combine(zkr, zki, zqr, zqi, k, tw, out double xr, out double xi);
            Combine(zqr, zqi, zkr, zki, half - k, tw, out double yr, out double yi);
            re[k] = xr; im[k] = xi;
            re[half - k] = yr; im[half - k] = yi;
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void Combine(double zkr, double zki, double zqr, double zqi, int k, int tw, out double xr, out double xi)
    {
        double er = 0.5 * (zkr + zqr), ei = 0.5 * (zki - zqi);
        double or = 0.5 * (zki + zqi), oi = -0.5 * (zkr - zqr);
        double c, s;
        if (k < Size / 2) { c = _cos[tw + k]; s = _sin[tw + k]; }
        else { c = -1; s = 0; }
        xr = er + (c * or - s * oi);
        xi = ei + (c * oi + s * or);
    }

    private static uint ReverseBits(uint v)
    {
        v = ((v >> 1) & 0x55555555u) | ((v & 0x55555555u) << 1);
        v = ((v >> 2) & 0x33333333u) | ((v & 0x33333333u) << 2);
        v = ((v >> 4) & 0x0F0F0F0Fu) | ((v & 0x0F0F0F0Fu) << 4);
        v = ((v >> 8) & 0x00FF00FFu) | ((v & 0x00FF00FFu) << 8);
        return (v >> 16) | (v << 16);
    }
}
