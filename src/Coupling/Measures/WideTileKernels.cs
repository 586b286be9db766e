using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

namespace Coupling.Measures;

/// <summary>
/// The tiles of <see cref="TileKernels"/> with eight doubles per vector, for processors that execute 512-bit vectors
/// natively (<see cref="Vector512.IsHardwareAccelerated"/>). Every lane computes its pair's sums with the same
/// operations in the same order as the four-wide tiles, so the two give the same bits; the wider tiles only need half
/// the instructions (and, where the processor has two 512-bit multiply-add units, half the time).
/// </summary>
internal static class WideTileKernels
{
    public const int ComplexRows = 8, Columns = 8, LagRows = 4;

    /// <summary>
    /// Whether the kernels use these tiles: by default when the processor executes 512-bit vectors natively. Tests
    /// switch it to compare the two forms bit for bit.
    /// </summary>
    public static bool Enabled { get; set; } = Vector512.IsHardwareAccelerated;

    /// <summary>
    /// The 8 x 8 form of <see cref="TileKernels.ComplexMagnitudeTile"/> (rows a0..a0+7, columns b0..b0+7, one vector
    /// per row): Re S into <paramref name="sums"/>[0..7], Im S into [8..15], one vector per row. Each lane does the
    /// same operations in the same order as the four-wide form, so both give the same bits. Each trial also asks for the
    /// rows <paramref name="ahead"/> elements further on to be brought into the second-level cache (see
    /// <see cref="AlignedArray.Prefetch"/>; 0 asks for the rows in use, which costs next to nothing).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static unsafe void ComplexMagnitudeTile(ref double re, ref double im, long timeBase, int stride, ReadOnlySpan<int> permutation,
        int a0, int b0, nint ahead, ref Wide16 sums)
    {
        Vector512<double> k0 = default, m0 = default, h0 = default;
        Vector512<double> k1 = default, m1 = default, h1 = default;
        Vector512<double> k2 = default, m2 = default, h2 = default;
        Vector512<double> k3 = default, m3 = default, h3 = default;
        Vector512<double> k4 = default, m4 = default, h4 = default;
        Vector512<double> k5 = default, m5 = default, h5 = default;
        Vector512<double> k6 = default, m6 = default, h6 = default;
        Vector512<double> k7 = default, m7 = default, h7 = default;
        nint x = (nint)(timeBase + a0), yBase = (nint)(timeBase + b0);
        for (int n = 0; n < permutation.Length; n++, x += stride)
        {
            nint y = yBase + (nint)permutation[n] * stride;
            var yr = Vector512.LoadUnsafe(ref re, (nuint)y);
            var yi = Vector512.LoadUnsafe(ref im, (nuint)y);
            if (Sse.IsSupported)
            {
                Sse.Prefetch1(Unsafe.AsPointer(ref Unsafe.Add(ref re, x + ahead)));
                Sse.Prefetch1(Unsafe.AsPointer(ref Unsafe.Add(ref im, x + ahead)));
            }
            var f = yr + yi;
            var e = yr - yi;
            var xr0 = Vector512.Create(Unsafe.Add(ref re, x + 0));
            var xi0 = Vector512.Create(Unsafe.Add(ref im, x + 0));
            k0 = Vector512.FusedMultiplyAdd(yr, xr0 + xi0, k0);
            m0 = Vector512.FusedMultiplyAdd(xr0, f, m0);
            h0 = Vector512.FusedMultiplyAdd(xi0, e, h0);
            var xr1 = Vector512.Create(Unsafe.Add(ref re, x + 1));
            var xi1 = Vector512.Create(Unsafe.Add(ref im, x + 1));
            k1 = Vector512.FusedMultiplyAdd(yr, xr1 + xi1, k1);
            m1 = Vector512.FusedMultiplyAdd(xr1, f, m1);
            h1 = Vector512.FusedMultiplyAdd(xi1, e, h1);
            var xr2 = Vector512.Create(Unsafe.Add(ref re, x + 2));
            var xi2 = Vector512.Create(Unsafe.Add(ref im, x + 2));
            k2 = Vector512.FusedMultiplyAdd(yr, xr2 + xi2, k2);
            m2 = Vector512.FusedMultiplyAdd(xr2, f, m2);
            h2 = Vector512.FusedMultiplyAdd(xi2, e, h2);
            var xr3 = Vector512.Create(Unsafe.Add(ref re, x + 3));
            var xi3 = Vector512.Create(Unsafe.Add(ref im, x + 3));
            k3 = Vector512.FusedMultiplyAdd(yr, xr3 + xi3, k3);
            m3 = Vector512.FusedMultiplyAdd(xr3, f, m3);
            h3 = Vector512.FusedMultiplyAdd(xi3, e, h3);
            var xr4 = Vector512.Create(Unsafe.Add(ref re, x + 4));
            var xi4 = Vector512.Create(Unsafe.Add(ref im, x + 4));
            k4 = Vector512.FusedMultiplyAdd(yr, xr4 + xi4, k4);
            m4 = Vector512.FusedMultiplyAdd(xr4, f, m4);
            h4 = Vector512.FusedMultiplyAdd(xi4, e, h4);
            var xr5 = Vector512.Create(Unsafe.Add(ref re, x + 5));
            var xi5 = Vector512.Create(Unsafe.Add(ref im, x + 5));
            k5 = Vector512.FusedMultiplyAdd(yr, xr5 + xi5, k5);
            m5 = Vector512.FusedMultiplyAdd(xr5, f, m5);
            h5 = Vector512.FusedMultiplyAdd(xi5, e, h5);
            var xr6 = Vector512.Create(Unsafe.Add(ref re, x + 6));
            var xi6 = Vector512.Create(Unsafe.Add(ref im, x + 6));
            k6 = Vector512.FusedMultiplyAdd(yr, xr6 + xi6, k6);
            m6 = Vector512.FusedMultiplyAdd(xr6, f, m6);
            h6 = Vector512.FusedMultiplyAdd(xi6, e, h6);
            var xr7 = Vector512.Create(Unsafe.Add(ref re, x + 7));
            var xi7 = Vector512.Create(Unsafe.Add(ref im, x + 7));
            k7 = Vector512.FusedMultiplyAdd(yr, xr7 + xi7, k7);
            m7 = Vector512.FusedMultiplyAdd(xr7, f, m7);
            h7 = Vector512.FusedMultiplyAdd(xi7, e, h7);
        }
        sums[0] = k0 - h0; sums[8] = k0 - m0;
        sums[1] = k1 - h1; sums[9] = k1 - m1;
        sums[2] = k2 - h2; sums[10] = k2 - m2;
        sums[3] = k3 - h3; sums[11] = k3 - m3;
        sums[4] = k4 - h4; sums[12] = k4 - m4;
        sums[5] = k5 - h5; sums[13] = k5 - m5;
        sums[6] = k6 - h6; sums[14] = k6 - m6;
        sums[7] = k7 - h7; sums[15] = k7 - m7;
    }

    /// <summary>
    /// The 8 x 8 form of <see cref="TileKernels.ComplexTile"/>: Re S into <paramref name="sums"/>[0..7], Σ Im x·Re y
    /// into [8..15] and Σ Re x·Im y into [16..23], one vector per row; Im S is the difference of the last two, exactly
    /// 0 for zero-lag copies (see <see cref="TileKernels"/>). Same bits as the four-wide form. Prefetches as
    /// <see cref="ComplexMagnitudeTile"/> does.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static unsafe void ComplexTile(ref double re, ref double im, long timeBase, int stride, ReadOnlySpan<int> permutation,
        int a0, int b0, nint ahead, ref Wide24 sums)
    {
        Vector512<double> s0 = default, p0 = default, q0 = default;
        Vector512<double> s1 = default, p1 = default, q1 = default;
        Vector512<double> s2 = default, p2 = default, q2 = default;
        Vector512<double> s3 = default, p3 = default, q3 = default;
        Vector512<double> s4 = default, p4 = default, q4 = default;
        Vector512<double> s5 = default, p5 = default, q5 = default;
        Vector512<double> s6 = default, p6 = default, q6 = default;
        Vector512<double> s7 = default, p7 = default, q7 = default;
        nint x = (nint)(timeBase + a0), yBase = (nint)(timeBase + b0);
        for (int n = 0; n < permutation.Length; n++, x += stride)
        {
            nint y = yBase + (nint)permutation[n] * stride;
            var yr = Vector512.LoadUnsafe(ref re, (nuint)y);
            var yi = Vector512.LoadUnsafe(ref im, (nuint)y);
            if (Sse.IsSupported)
            {
                Sse.Prefetch1(Unsafe.AsPointer(ref Unsafe.Add(ref re, x + ahead)));
                Sse.Prefetch1(Unsafe.AsPointer(ref Unsafe.Add(ref im, x + ahead)));
            }
            var xr0 = Vector512.Create(Unsafe.Add(ref re, x + 0));
            var xi0 = Vector512.Create(Unsafe.Add(ref im, x + 0));
            s0 = Vector512.FusedMultiplyAdd(xr0, yr, s0);
            s0 = Vector512.FusedMultiplyAdd(xi0, yi, s0);
            p0 = Vector512.FusedMultiplyAdd(xi0, yr, p0);
            q0 = Vector512.FusedMultiplyAdd(xr0, yi, q0);
            var xr1 = Vector512.Create(Unsafe.Add(ref re, x + 1));
            var xi1 = Vector512.Create(Unsafe.Add(ref im, x + 1));
            s1 = Vector512.FusedMultiplyAdd(xr1, yr, s1);
            s1 = Vector512.FusedMultiplyAdd(xi1, yi, s1);
            p1 = Vector512.FusedMultiplyAdd(xi1, yr, p1);
            q1 = Vector512.FusedMultiplyAdd(xr1, yi, q1);
            var xr2 = Vector512.Create(Unsafe.Add(ref re, x + 2));
            var xi2 = Vector512.Create(Unsafe.Add(ref im, x + 2));
            s2 = Vector512.FusedMultiplyAdd(xr2, yr, s2);
            s2 = Vector512.FusedMultiplyAdd(xi2, yi, s2);
            p2 = Vector512.FusedMultiplyAdd(xi2, yr, p2);
            q2 = Vector512.FusedMultiplyAdd(xr2, yi, q2);
            var xr3 = Vector512.Create(Unsafe.Add(ref re, x + 3));
            var xi3 = Vector512.Create(Unsafe.Add(ref im, x + 3));
            s3 = Vector512.FusedMultiplyAdd(xr3, yr, s3);
            s3 = Vector512.FusedMultiplyAdd(xi3, yi, s3);
            p3 = Vector512.FusedMultiplyAdd(xi3, yr, p3);
            q3 = Vector512.FusedMultiplyAdd(xr3, yi, q3);
            var xr4 = Vector512.Create(Unsafe.Add(ref re, x + 4));
            var xi4 = Vector512.Create(Unsafe.Add(ref im, x + 4));
            s4 = Vector512.FusedMultiplyAdd(xr4, yr, s4);
            s4 = Vector512.FusedMultiplyAdd(xi4, yi, s4);
            p4 = Vector512.FusedMultiplyAdd(xi4, yr, p4);
            q4 = Vector512.FusedMultiplyAdd(xr4, yi, q4);
            var xr5 = Vector512.Create(Unsafe.Add(ref re, x + 5));
            var xi5 = Vector512.Create(Unsafe.Add(ref im, x + 5));
            s5 = Vector512.FusedMultiplyAdd(xr5, yr, s5);
            s5 = Vector512.FusedMultiplyAdd(xi5, yi, s5);
            p5 = Vector512.FusedMultiplyAdd(xi5, yr, p5);
            q5 = Vector512.FusedMultiplyAdd(xr5, yi, q5);
            var xr6 = Vector512.Create(Unsafe.Add(ref re, x + 6));
            var xi6 = Vector512.Create(Unsafe.Add(ref im, x + 6));
            s6 = Vector512.FusedMultiplyAdd(xr6, yr, s6);
            s6 = Vector512.FusedMultiplyAdd(xi6, yi, s6);
            p6 = Vector512.FusedMultiplyAdd(xi6, yr, p6);
            q6 = Vector512.FusedMultiplyAdd(xr6, yi, q6);
            var xr7 = Vector512.Create(Unsafe.Add(ref re, x + 7));
            var xi7 = Vector512.Create(Unsafe.Add(ref im, x + 7));
            s7 = Vector512.FusedMultiplyAdd(xr7, yr, s7);
            s7 = Vector512.FusedMultiplyAdd(xi7, yi, s7);
            p7 = Vector512.FusedMultiplyAdd(xi7, yr, p7);
            q7 = Vector512.FusedMultiplyAdd(xr7, yi, q7);
        }
        sums[0] = s0; sums[8] = p0; sums[16] = q0;
        sums[1] = s1; sums[9] = p1; sums[17] = q1;
        sums[2] = s2; sums[10] = p2; sums[18] = q2;
        sums[3] = s3; sums[11] = p3; sums[19] = q3;
        sums[4] = s4; sums[12] = p4; sums[20] = q4;
        sums[5] = s5; sums[13] = p5; sums[21] = q5;
        sums[6] = s6; sums[14] = p6; sums[22] = q6;
        sums[7] = s7; sums[15] = p7; sums[23] = q7;
    }

    /// <summary>
    /// The 4 x 8 form of <see cref="TileKernels.LagTile{TSums}"/>, one vector per row: Σ Im X_n into
    /// <paramref name="sums"/>[0..3], Σ |Im X_n| into [4..7], Σ (Im X_n)² into [8..11] and Σ sign(Im X_n) into [12..15].
    /// Same bits as the four-wide form. Prefetches as <see cref="ComplexMagnitudeTile"/> does.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static unsafe void LagTile<TSums>(ref double re, ref double im, long timeBase, int stride, ReadOnlySpan<int> permutation,
        int a0, int b0, nint ahead, ref Wide16 sums)
        where TSums : struct, ILagSums
    {
        Vector512<double> s0 = default, t0 = default, q0 = default;
        Vector512<long> c0 = default;
        Vector512<double> s1 = default, t1 = default, q1 = default;
        Vector512<long> c1 = default;
        Vector512<double> s2 = default, t2 = default, q2 = default;
        Vector512<long> c2 = default;
        Vector512<double> s3 = default, t3 = default, q3 = default;
        Vector512<long> c3 = default;
        nint x = (nint)(timeBase + a0), yBase = (nint)(timeBase + b0);
        for (int n = 0; n < permutation.Length; n++, x += stride)
        {
            nint y = yBase + (nint)permutation[n] * stride;
            var yr = Vector512.LoadUnsafe(ref re, (nuint)y);
            var yi = Vector512.LoadUnsafe(ref im, (nuint)y);
            if (Sse.IsSupported)
            {
                Sse.Prefetch1(Unsafe.AsPointer(ref Unsafe.Add(ref re, x + ahead)));
                Sse.Prefetch1(Unsafe.AsPointer(ref Unsafe.Add(ref im, x + ahead)));
            }
            var xr0 = Vector512.Create(Unsafe.Add(ref re, x + 0));
            var xi0 = Vector512.Create(Unsafe.Add(ref im, x + 0));
            var d0 = xi0 * yr - xr0 * yi;
            if (TSums.Sum) s0 += d0;
            t0 += Vector512.Abs(d0);
            if (TSums.Squares) q0 = Vector512.FusedMultiplyAdd(d0, d0, q0);
            if (TSums.Signs) c0 = c0 - Vector512.GreaterThan(d0, Vector512<double>.Zero).AsInt64() + Vector512.LessThan(d0, Vector512<double>.Zero).AsInt64();
            var xr1 = Vector512.Create(Unsafe.Add(ref re, x + 1));
            var xi1 = Vector512.Create(Unsafe.Add(ref im, x + 1));
            var d1 = xi1 * yr - xr1 * yi;
            if (TSums.Sum) s1 += d1;
            t1 += Vector512.Abs(d1);
            if (TSums.Squares) q1 = Vector512.FusedMultiplyAdd(d1, d1, q1);
            if (TSums.Signs) c1 = c1 - Vector512.GreaterThan(d1, Vector512<double>.Zero).AsInt64() + Vector512.LessThan(d1, Vector512<double>.Zero).AsInt64();
            var xr2 = Vector512.Create(Unsafe.Add(ref re, x + 2));
            var xi2 = Vector512.Create(Unsafe.Add(ref im, x + 2));
            var d2 = xi2 * yr - xr2 * yi;
            if (TSums.Sum) s2 += d2;
            t2 += Vector512.Abs(d2);
            if (TSums.Squares) q2 = Vector512.FusedMultiplyAdd(d2, d2, q2);
            if (TSums.Signs) c2 = c2 - Vector512.GreaterThan(d2, Vector512<double>.Zero).AsInt64() + Vector512.LessThan(d2, Vector512<double>.Zero).AsInt64();
            var xr3 = Vector512.Create(Unsafe.Add(ref re, x + 3));
            var xi3 = Vector512.Create(Unsafe.Add(ref im, x + 3));
            var d3 = xi3 * yr - xr3 * yi;
            if (TSums.Sum) s3 += d3;
            t3 += Vector512.Abs(d3);
            if (TSums.Squares) q3 = Vector512.FusedMultiplyAdd(d3, d3, q3);
            if (TSums.Signs) c3 = c3 - Vector512.GreaterThan(d3, Vector512<double>.Zero).AsInt64() + Vector512.LessThan(d3, Vector512<double>.Zero).AsInt64();
        }
        sums[0] = s0; sums[4] = t0; sums[8] = q0; sums[12] = Vector512.ConvertToDouble(c0);
        sums[1] = s1; sums[5] = t1; sums[9] = q1; sums[13] = Vector512.ConvertToDouble(c1);
        sums[2] = s2; sums[6] = t2; sums[10] = q2; sums[14] = Vector512.ConvertToDouble(c2);
        sums[3] = s3; sums[7] = t3; sums[11] = q3; sums[15] = Vector512.ConvertToDouble(c3);
    }
}

/// <summary>Sixteen 512-bit vectors on the stack: the sums of one wide tile.</summary>
[InlineArray(16)]
internal struct Wide16
{
    private Vector512<double> _element;
}

/// <summary>Twenty-four 512-bit vectors on the stack: the sums of one wide tile.</summary>
[InlineArray(24)]
internal struct Wide24
{
    private Vector512<double> _element;
}
