using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

namespace Coupling.Measures;

/// <summary>
/// The register-tiled inner loops of <see cref="PairwiseKernels"/>: each computes the sums of one small block of
/// channel pairs (rows a, columns b, b read through the trial permutation) from the channel-contiguous tables of
/// <see cref="PairTables"/>, four doubles per vector, fused multiply-adds where the result allows it.
/// </summary>
/// <remarks>
/// Exact zeros for zero-lag copies: when b = c·a with c a power of two, Im x_a·Re x_b and Re x_a·Im x_b are the same
/// real number. <see cref="ComplexTile"/> therefore accumulates Σ Im x·Re y and Σ Re x·Im y in two separate sums, in
/// the same order with the same fused operations, so that both come out bitwise equal and Im S = their difference is
/// exactly 0 (a single fused accumulator would keep the rounding error of one product). The per-trial imaginary part
/// in <see cref="LagTile{TSums}"/> and <see cref="OrthogonalTile"/> is formed from two rounded products and one subtraction,
/// never fused, for the same reason; the JIT does not contract a multiplication and an addition into a fused one.
/// </remarks>
internal static class TileKernels
{
    public const int ComplexRows = 4, ComplexColumns = 8;
    public const int LagRows = 2, LagColumns = 8;
    public const int DotRows = 4, DotColumns = 8;
    public const int OrthogonalRows = 4, OrthogonalColumns = 4;

    /// <summary>
    /// One 4 x 8 tile of S_ab = Σ_n x_a,n · conj(y_b,π(n)) at one time point: for rows a0..a0+3 and columns b0..b0+7,
    /// writes Re S into <paramref name="sums"/>[0..7], Σ Im x·Re y into [8..15] and Σ Re x·Im y into [16..23]
    /// (row-major, two vectors per row). Im S is the difference of the last two: see the type's remarks.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void ComplexTile(ref double re, ref double im, long timeBase, int stride, ReadOnlySpan<int> permutation,
        int a0, int b0, ref Vectors24 sums)
    {
        Vector256<double> s00 = default, p00 = default, q00 = default;
        Vector256<double> s01 = default, p01 = default, q01 = default;
        Vector256<double> s10 = default, p10 = default, q10 = default;
        Vector256<double> s11 = default, p11 = default, q11 = default;
        Vector256<double> s20 = default, p20 = default, q20 = default;
        Vector256<double> s21 = default, p21 = default, q21 = default;
        Vector256<double> s30 = default, p30 = default, q30 = default;
        Vector256<double> s31 = default, p31 = default, q31 = default;
        nint x = (nint)(timeBase + a0), yBase = (nint)(timeBase + b0);
        for (int n = 0; n < permutation.Length; n++, x += stride)
        {
            nint y = yBase + (nint)permutation[n] * stride;
            var yr0 = Vector256.LoadUnsafe(ref re, (nuint)y);
            var yr1 = Vector256.LoadUnsafe(ref re, (nuint)(y + 4));
            var yi0 = Vector256.LoadUnsafe(ref im, (nuint)y);
            var yi1 = Vector256.LoadUnsafe(ref im, (nuint)(y + 4));
            var xr0 = Vector256.Create(Unsafe.Add(ref re, x + 0));
            var xi0 = Vector256.Create(Unsafe.Add(ref im, x + 0));
            s00 = Vector256.FusedMultiplyAdd(xr0, yr0, s00);
            s00 = Vector256.FusedMultiplyAdd(xi0, yi0, s00);
            p00 = Vector256.FusedMultiplyAdd(xi0, yr0, p00);
            q00 = Vector256.FusedMultiplyAdd(xr0, yi0, q00);
            s01 = Vector256.FusedMultiplyAdd(xr0, yr1, s01);
            s01 = Vector256.FusedMultiplyAdd(xi0, yi1, s01);
            p01 = Vector256.FusedMultiplyAdd(xi0, yr1, p01);
            q01 = Vector256.FusedMultiplyAdd(xr0, yi1, q01);
            var xr1 = Vector256.Create(Unsafe.Add(ref re, x + 1));
            var xi1 = Vector256.Create(Unsafe.Add(ref im, x + 1));
            s10 = Vector256.FusedMultiplyAdd(xr1, yr0, s10);
            s10 = Vector256.FusedMultiplyAdd(xi1, yi0, s10);
            p10 = Vector256.FusedMultiplyAdd(xi1, yr0, p10);
            q10 = Vector256.FusedMultiplyAdd(xr1, yi0, q10);
            s11 = Vector256.FusedMultiplyAdd(xr1, yr1, s11);
            s11 = Vector256.FusedMultiplyAdd(xi1, yi1, s11);
            p11 = Vector256.FusedMultiplyAdd(xi1, yr1, p11);
            q11 = Vector256.FusedMultiplyAdd(xr1, yi1, q11);
            var xr2 = Vector256.Create(Unsafe.Add(ref re, x + 2));
            var xi2 = Vector256.Create(Unsafe.Add(ref im, x + 2));
            s20 = Vector256.FusedMultiplyAdd(xr2, yr0, s20);
            s20 = Vector256.FusedMultiplyAdd(xi2, yi0, s20);
            p20 = Vector256.FusedMultiplyAdd(xi2, yr0, p20);
            q20 = Vector256.FusedMultiplyAdd(xr2, yi0, q20);
            s21 = Vector256.FusedMultiplyAdd(xr2, yr1, s21);
            s21 = Vector256.FusedMultiplyAdd(xi2, yi1, s21);
            p21 = Vector256.FusedMultiplyAdd(xi2, yr1, p21);
            q21 = Vector256.FusedMultiplyAdd(xr2, yi1, q21);
            var xr3 = Vector256.Create(Unsafe.Add(ref re, x + 3));
            var xi3 = Vector256.Create(Unsafe.Add(ref im, x + 3));
            s30 = Vector256.FusedMultiplyAdd(xr3, yr0, s30);
            s30 = Vector256.FusedMultiplyAdd(xi3, yi0, s30);
            p30 = Vector256.FusedMultiplyAdd(xi3, yr0, p30);
            q30 = Vector256.FusedMultiplyAdd(xr3, yi0, q30);
            s31 = Vector256.FusedMultiplyAdd(xr3, yr1, s31);
            s31 = Vector256.FusedMultiplyAdd(xi3, yi1, s31);
            p31 = Vector256.FusedMultiplyAdd(xi3, yr1, p31);
            q31 = Vector256.FusedMultiplyAdd(xr3, yi1, q31);
        }
        sums[0] = s00; sums[8] = p00; sums[16] = q00;
        sums[1] = s01; sums[9] = p01; sums[17] = q01;
        sums[2] = s10; sums[10] = p10; sums[18] = q10;
        sums[3] = s11; sums[11] = p11; sums[19] = q11;
        sums[4] = s20; sums[12] = p20; sums[20] = q20;
        sums[5] = s21; sums[13] = p21; sums[21] = q21;
        sums[6] = s30; sums[14] = p30; sums[22] = q30;
        sums[7] = s31; sums[15] = p31; sums[23] = q31;
    }

    /// <summary>
    /// One 4 x 8 tile of S_ab = Σ_n x_a,n · conj(y_b,π(n)) at one time point for measures that use |S_ab| only (PLV, PPC,
    /// coherence): writes Re S into <paramref name="sums"/>[0..7] and Im S into [8..15] (row-major, two vectors per
    /// row), with three real multiply-adds per complex term instead of four (Gauss's form of the complex product,
    /// Knuth 1997, The Art of Computer Programming vol. 2, section 4.6.4): with g = Re x + Im x, f = Re y + Im y and
    /// e = Re y − Im y, Re S = Σ Re y·g − Σ Im x·e and Im S = Σ Re y·g − Σ Re x·f. The cancellation in these
    /// differences costs a few units of rounding of Σ |x|·|y|, not of |S|; a zero-lag copy therefore gets an Im S of
    /// rounding size, not exactly 0, which is why measures that read Im S itself use <see cref="ComplexTile"/>.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void ComplexMagnitudeTile(ref double re, ref double im, long timeBase, int stride, ReadOnlySpan<int> permutation,
        int a0, int b0, ref Vectors24 sums)
    {
        Vector256<double> k00 = default, m00 = default, h00 = default;
        Vector256<double> k01 = default, m01 = default, h01 = default;
        Vector256<double> k10 = default, m10 = default, h10 = default;
        Vector256<double> k11 = default, m11 = default, h11 = default;
        Vector256<double> k20 = default, m20 = default, h20 = default;
        Vector256<double> k21 = default, m21 = default, h21 = default;
        Vector256<double> k30 = default, m30 = default, h30 = default;
        Vector256<double> k31 = default, m31 = default, h31 = default;
        nint x = (nint)(timeBase + a0), yBase = (nint)(timeBase + b0);
        for (int n = 0; n < permutation.Length; n++, x += stride)
        {
            nint y = yBase + (nint)permutation[n] * stride;
            var yr0 = Vector256.LoadUnsafe(ref re, (nuint)y);
            var yr1 = Vector256.LoadUnsafe(ref re, (nuint)(y + 4));
            var yi0 = Vector256.LoadUnsafe(ref im, (nuint)y);
            var yi1 = Vector256.LoadUnsafe(ref im, (nuint)(y + 4));
            var f0 = yr0 + yi0;
            var e0 = yr0 - yi0;
            var f1 = yr1 + yi1;
            var e1 = yr1 - yi1;
            var xr0 = Vector256.Create(Unsafe.Add(ref re, x + 0));
            var xi0 = Vector256.Create(Unsafe.Add(ref im, x + 0));
            var g0 = xr0 + xi0;
            k00 = Vector256.FusedMultiplyAdd(yr0, g0, k00);
            m00 = Vector256.FusedMultiplyAdd(xr0, f0, m00);
            h00 = Vector256.FusedMultiplyAdd(xi0, e0, h00);
            k01 = Vector256.FusedMultiplyAdd(yr1, g0, k01);
            m01 = Vector256.FusedMultiplyAdd(xr0, f1, m01);
            h01 = Vector256.FusedMultiplyAdd(xi0, e1, h01);
            var xr1 = Vector256.Create(Unsafe.Add(ref re, x + 1));
            var xi1 = Vector256.Create(Unsafe.Add(ref im, x + 1));
            var g1 = xr1 + xi1;
            k10 = Vector256.FusedMultiplyAdd(yr0, g1, k10);
            m10 = Vector256.FusedMultiplyAdd(xr1, f0, m10);
            h10 = Vector256.FusedMultiplyAdd(xi1, e0, h10);
            k11 = Vector256.FusedMultiplyAdd(yr1, g1, k11);
            m11 = Vector256.FusedMultiplyAdd(xr1, f1, m11);
            h11 = Vector256.FusedMultiplyAdd(xi1, e1, h11);
            var xr2 = Vector256.Create(Unsafe.Add(ref re, x + 2));
            var xi2 = Vector256.Create(Unsafe.Add(ref im, x + 2));
            var g2 = xr2 + xi2;
            k20 = Vector256.FusedMultiplyAdd(yr0, g2, k20);
            m20 = Vector256.FusedMultiplyAdd(xr2, f0, m20);
            h20 = Vector256.FusedMultiplyAdd(xi2, e0, h20);
            k21 = Vector256.FusedMultiplyAdd(yr1, g2, k21);
            m21 = Vector256.FusedMultiplyAdd(xr2, f1, m21);
            h21 = Vector256.FusedMultiplyAdd(xi2, e1, h21);
            var xr3 = Vector256.Create(Unsafe.Add(ref re, x + 3));
            var xi3 = Vector256.Create(Unsafe.Add(ref im, x + 3));
            var g3 = xr3 + xi3;
            k30 = Vector256.FusedMultiplyAdd(yr0, g3, k30);
            m30 = Vector256.FusedMultiplyAdd(xr3, f0, m30);
            h30 = Vector256.FusedMultiplyAdd(xi3, e0, h30);
            k31 = Vector256.FusedMultiplyAdd(yr1, g3, k31);
            m31 = Vector256.FusedMultiplyAdd(xr3, f1, m31);
            h31 = Vector256.FusedMultiplyAdd(xi3, e1, h31);
        }
        sums[0] = k00 - h00; sums[8] = k00 - m00;
        sums[1] = k01 - h01; sums[9] = k01 - m01;
        sums[2] = k10 - h10; sums[10] = k10 - m10;
        sums[3] = k11 - h11; sums[11] = k11 - m11;
        sums[4] = k20 - h20; sums[12] = k20 - m20;
        sums[5] = k21 - h21; sums[13] = k21 - m21;
        sums[6] = k30 - h30; sums[14] = k30 - m30;
        sums[7] = k31 - h31; sums[15] = k31 - m31;
    }

    /// <summary>
    /// One 2 x 8 tile of the lag sums at one time point, with Im X_n = Im x_a,n · Re y_b,π(n) − Re x_a,n · Im y_b,π(n)
    /// formed from two separately rounded products: Σ Im X_n into <paramref name="sums"/>[0..3], Σ |Im X_n| into
    /// [4..7], Σ (Im X_n)² into [8..11] and Σ sign(Im X_n) into [12..15] (row-major, two vectors per row). Only the sums
    /// <typeparamref name="TSums"/> asks for are formed (the others are left 0); Σ |Im X_n| always is (it carries NaN).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void LagTile<TSums>(ref double re, ref double im, long timeBase, int stride, ReadOnlySpan<int> permutation,
        int a0, int b0, ref Vectors16 sums)
        where TSums : struct, ILagSums
    {
        Vector256<double> s00 = default, a00 = default, q00 = default;
        Vector256<long> c00 = default;
        Vector256<double> s01 = default, a01 = default, q01 = default;
        Vector256<long> c01 = default;
        Vector256<double> s10 = default, a10 = default, q10 = default;
        Vector256<long> c10 = default;
        Vector256<double> s11 = default, a11 = default, q11 = default;
        Vector256<long> c11 = default;
        nint x = (nint)(timeBase + a0), yBase = (nint)(timeBase + b0);
        for (int n = 0; n < permutation.Length; n++, x += stride)
        {
            nint y = yBase + (nint)permutation[n] * stride;
            var yr0 = Vector256.LoadUnsafe(ref re, (nuint)y);
            var yr1 = Vector256.LoadUnsafe(ref re, (nuint)(y + 4));
            var yi0 = Vector256.LoadUnsafe(ref im, (nuint)y);
            var yi1 = Vector256.LoadUnsafe(ref im, (nuint)(y + 4));
            var xr0 = Vector256.Create(Unsafe.Add(ref re, x + 0));
            var xi0 = Vector256.Create(Unsafe.Add(ref im, x + 0));
            var d00 = xi0 * yr0 - xr0 * yi0;
            if (TSums.Sum) s00 += d00;
            a00 += Vector256.Abs(d00);
            if (TSums.Squares) q00 = Vector256.FusedMultiplyAdd(d00, d00, q00);
            if (TSums.Signs) c00 = c00 - Vector256.GreaterThan(d00, Vector256<double>.Zero).AsInt64() + Vector256.LessThan(d00, Vector256<double>.Zero).AsInt64();
            var d01 = xi0 * yr1 - xr0 * yi1;
            if (TSums.Sum) s01 += d01;
            a01 += Vector256.Abs(d01);
            if (TSums.Squares) q01 = Vector256.FusedMultiplyAdd(d01, d01, q01);
            if (TSums.Signs) c01 = c01 - Vector256.GreaterThan(d01, Vector256<double>.Zero).AsInt64() + Vector256.LessThan(d01, Vector256<double>.Zero).AsInt64();
            var xr1 = Vector256.Create(Unsafe.Add(ref re, x + 1));
            var xi1 = Vector256.Create(Unsafe.Add(ref im, x + 1));
            var d10 = xi1 * yr0 - xr1 * yi0;
            if (TSums.Sum) s10 += d10;
            a10 += Vector256.Abs(d10);
            if (TSums.Squares) q10 = Vector256.FusedMultiplyAdd(d10, d10, q10);
            if (TSums.Signs) c10 = c10 - Vector256.GreaterThan(d10, Vector256<double>.Zero).AsInt64() + Vector256.LessThan(d10, Vector256<double>.Zero).AsInt64();
            var d11 = xi1 * yr1 - xr1 * yi1;
            if (TSums.Sum) s11 += d11;
            a11 += Vector256.Abs(d11);
            if (TSums.Squares) q11 = Vector256.FusedMultiplyAdd(d11, d11, q11);
            if (TSums.Signs) c11 = c11 - Vector256.GreaterThan(d11, Vector256<double>.Zero).AsInt64() + Vector256.LessThan(d11, Vector256<double>.Zero).AsInt64();
        }
        sums[0] = s00; sums[4] = a00; sums[8] = q00; sums[12] = Vector256.ConvertToDouble(c00);
        sums[1] = s01; sums[5] = a01; sums[9] = q01; sums[13] = Vector256.ConvertToDouble(c01);
        sums[2] = s10; sums[6] = a10; sums[10] = q10; sums[14] = Vector256.ConvertToDouble(c10);
        sums[3] = s11; sums[7] = a11; sums[11] = q11; sums[15] = Vector256.ConvertToDouble(c11);
    }

    /// <summary>
    /// One 4 x 8 tile of Σ_t u_a(t) · w_b(t) over <paramref name="times"/> rows: u from the rows starting at
    /// <paramref name="xBase"/>, w from those starting at <paramref name="yBase"/>, consecutive rows
    /// <paramref name="stride"/> apart; results row-major into <paramref name="sums"/>[0..7].
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void DotTile(ref double u, nint xBase, nint yBase, int stride, int times, ref Vectors24 sums)
    {
        Vector256<double> s00 = default;
        Vector256<double> s01 = default;
        Vector256<double> s10 = default;
        Vector256<double> s11 = default;
        Vector256<double> s20 = default;
        Vector256<double> s21 = default;
        Vector256<double> s30 = default;
        Vector256<double> s31 = default;
        nint x = xBase, y = yBase;
        for (int t = 0; t < times; t++, x += stride, y += stride)
        {
            var w0 = Vector256.LoadUnsafe(ref u, (nuint)y);
            var w1 = Vector256.LoadUnsafe(ref u, (nuint)(y + 4));
            var u0 = Vector256.Create(Unsafe.Add(ref u, x + 0));
            s00 = Vector256.FusedMultiplyAdd(u0, w0, s00);
            s01 = Vector256.FusedMultiplyAdd(u0, w1, s01);
            var u1 = Vector256.Create(Unsafe.Add(ref u, x + 1));
            s10 = Vector256.FusedMultiplyAdd(u1, w0, s10);
            s11 = Vector256.FusedMultiplyAdd(u1, w1, s11);
            var u2 = Vector256.Create(Unsafe.Add(ref u, x + 2));
            s20 = Vector256.FusedMultiplyAdd(u2, w0, s20);
            s21 = Vector256.FusedMultiplyAdd(u2, w1, s21);
            var u3 = Vector256.Create(Unsafe.Add(ref u, x + 3));
            s30 = Vector256.FusedMultiplyAdd(u3, w0, s30);
            s31 = Vector256.FusedMultiplyAdd(u3, w1, s31);
        }
        sums[0] = s00;
        sums[1] = s01;
        sums[2] = s10;
        sums[3] = s11;
        sums[4] = s20;
        sums[5] = s21;
        sums[6] = s30;
        sums[7] = s31;
    }

    /// <summary>
    /// One 4 x 4 tile of the orthogonalised-envelope sums of one trial pair over <paramref name="times"/> rows:
    /// with q = |Im z_b · Re z_a − Re z_b · Im z_a| (two separately rounded products), y = q/|z_a| and x = q/|z_b|, writes
    /// per row Σy, Σy², Σy·u_a, Σx, Σx², Σx·u_b into <paramref name="sums"/>[6r..6r+5].
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void OrthogonalTile(ref double re, ref double im, ref double inverse, ref double u, nint xBase, nint yBase,
        int stride, int times, ref Vectors24 sums)
    {
        Vector256<double> sy0 = default, syy0 = default, syu0 = default, sx0 = default, sxx0 = default, sxu0 = default;
        Vector256<double> sy1 = default, syy1 = default, syu1 = default, sx1 = default, sxx1 = default, sxu1 = default;
        Vector256<double> sy2 = default, syy2 = default, syu2 = default, sx2 = default, sxx2 = default, sxu2 = default;
        Vector256<double> sy3 = default, syy3 = default, syu3 = default, sx3 = default, sxx3 = default, sxu3 = default;
        nint x = xBase, y = yBase;
        for (int t = 0; t < times; t++, x += stride, y += stride)
        {
            var br = Vector256.LoadUnsafe(ref re, (nuint)y);
            var bi = Vector256.LoadUnsafe(ref im, (nuint)y);
            var bv = Vector256.LoadUnsafe(ref inverse, (nuint)y);
            var bu = Vector256.LoadUnsafe(ref u, (nuint)y);
            var ar0 = Vector256.Create(Unsafe.Add(ref re, x + 0));
            var ai0 = Vector256.Create(Unsafe.Add(ref im, x + 0));
            var q0 = Vector256.Abs(bi * ar0 - br * ai0);
            var y0 = q0 * Vector256.Create(Unsafe.Add(ref inverse, x + 0));
            var x0 = q0 * bv;
            sy0 += y0;
            syy0 = Vector256.FusedMultiplyAdd(y0, y0, syy0);
            syu0 = Vector256.FusedMultiplyAdd(y0, Vector256.Create(Unsafe.Add(ref u, x + 0)), syu0);
            sx0 += x0;
            sxx0 = Vector256.FusedMultiplyAdd(x0, x0, sxx0);
            sxu0 = Vector256.FusedMultiplyAdd(x0, bu, sxu0);
            var ar1 = Vector256.Create(Unsafe.Add(ref re, x + 1));
            var ai1 = Vector256.Create(Unsafe.Add(ref im, x + 1));
            var q1 = Vector256.Abs(bi * ar1 - br * ai1);
            var y1 = q1 * Vector256.Create(Unsafe.Add(ref inverse, x + 1));
            var x1 = q1 * bv;
            sy1 += y1;
            syy1 = Vector256.FusedMultiplyAdd(y1, y1, syy1);
            syu1 = Vector256.FusedMultiplyAdd(y1, Vector256.Create(Unsafe.Add(ref u, x + 1)), syu1);
            sx1 += x1;
            sxx1 = Vector256.FusedMultiplyAdd(x1, x1, sxx1);
            sxu1 = Vector256.FusedMultiplyAdd(x1, bu, sxu1);
            var ar2 = Vector256.Create(Unsafe.Add(ref re, x + 2));
            var ai2 = Vector256.Create(Unsafe.Add(ref im, x + 2));
            var q2 = Vector256.Abs(bi * ar2 - br * ai2);
            var y2 = q2 * Vector256.Create(Unsafe.Add(ref inverse, x + 2));
            var x2 = q2 * bv;
            sy2 += y2;
            syy2 = Vector256.FusedMultiplyAdd(y2, y2, syy2);
            syu2 = Vector256.FusedMultiplyAdd(y2, Vector256.Create(Unsafe.Add(ref u, x + 2)), syu2);
            sx2 += x2;
            sxx2 = Vector256.FusedMultiplyAdd(x2, x2, sxx2);
            sxu2 = Vector256.FusedMultiplyAdd(x2, bu, sxu2);
            var ar3 = Vector256.Create(Unsafe.Add(ref re, x + 3));
            var ai3 = Vector256.Create(Unsafe.Add(ref im, x + 3));
            var q3 = Vector256.Abs(bi * ar3 - br * ai3);
            var y3 = q3 * Vector256.Create(Unsafe.Add(ref inverse, x + 3));
            var x3 = q3 * bv;
            sy3 += y3;
            syy3 = Vector256.FusedMultiplyAdd(y3, y3, syy3);
            syu3 = Vector256.FusedMultiplyAdd(y3, Vector256.Create(Unsafe.Add(ref u, x + 3)), syu3);
            sx3 += x3;
            sxx3 = Vector256.FusedMultiplyAdd(x3, x3, sxx3);
            sxu3 = Vector256.FusedMultiplyAdd(x3, bu, sxu3);
        }
        sums[0] = sy0; sums[1] = syy0; sums[2] = syu0; sums[3] = sx0; sums[4] = sxx0; sums[5] = sxu0;
        sums[6] = sy1; sums[7] = syy1; sums[8] = syu1; sums[9] = sx1; sums[10] = sxx1; sums[11] = sxu1;
        sums[12] = sy2; sums[13] = syy2; sums[14] = syu2; sums[15] = sx2; sums[16] = sxx2; sums[17] = sxu2;
        sums[18] = sy3; sums[19] = syy3; sums[20] = syu3; sums[21] = sx3; sums[22] = sxx3; sums[23] = sxu3;
    }
}

/// <summary>Which of the optional lag sums a <see cref="TileKernels.LagTile{TSums}"/> forms; the JIT compiles one loop per choice.</summary>
internal interface ILagSums
{
    /// <summary>Σ Im X_n (wPLI and debiased wPLI²).</summary>
    static abstract bool Sum { get; }

    /// <summary>Σ (Im X_n)² (debiased wPLI²).</summary>
    static abstract bool Squares { get; }

    /// <summary>Σ sign(Im X_n) (PLI).</summary>
    static abstract bool Signs { get; }
}

/// <summary>PLI only.</summary>
internal struct LagSigns : ILagSums
{
    public static bool Sum => false;
    public static bool Squares => false;
    public static bool Signs => true;
}

/// <summary>wPLI without PLI.</summary>
internal struct LagSum : ILagSums
{
    public static bool Sum => true;
    public static bool Squares => false;
    public static bool Signs => false;
}

/// <summary>wPLI and PLI.</summary>
internal struct LagSumSigns : ILagSums
{
    public static bool Sum => true;
    public static bool Squares => false;
    public static bool Signs => true;
}

/// <summary>Debiased wPLI² (with or without wPLI), without PLI.</summary>
internal struct LagSumSquares : ILagSums
{
    public static bool Sum => true;
    public static bool Squares => true;
    public static bool Signs => false;
}

/// <summary>Every lag sum.</summary>
internal struct LagAll : ILagSums
{
    public static bool Sum => true;
    public static bool Squares => true;
    public static bool Signs => true;
}

/// <summary>Twenty-four vectors on the stack: the sums of one tile.</summary>
[InlineArray(24)]
internal struct Vectors24
{
    private Vector256<double> _element;
}

/// <summary>Sixteen vectors on the stack: the sums of one tile.</summary>
[InlineArray(16)]
internal struct Vectors16
{
    private Vector256<double> _element;
}
