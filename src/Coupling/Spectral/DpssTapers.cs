using System.Collections.Immutable;
using MathNet.Numerics.LinearAlgebra;

namespace Coupling.Spectral;

/// <summary>
/// The first K discrete prolate spheroidal sequences (Slepian tapers) of length N and time-half-bandwidth product NW,
/// each of unit energy, with their concentration ratios: the fraction of each taper's energy inside the band
/// |f| &lt;= W = NW / N (cycles per sample).
/// </summary>
/// <remarks>
/// <para>Slepian, D. (1978), "Prolate spheroidal wave functions, Fourier analysis, and uncertainty V: the discrete
/// case", Bell Syst. Tech. J. 57(5), 1371-1430; Thomson, D. J. (1982), "Spectrum estimation and harmonic analysis",
/// Proc. IEEE 70(9), 1055-1096. The tapers are the eigenvectors, for the K largest eigenvalues, of the symmetric
/// tridiagonal matrix that commutes with the concentration problem (Percival, D. B. and Walden, A. T. (1993),
/// Spectral Analysis for Physical Applications, Cambridge University Press, section 8.3, eq. 378): diagonal
/// ((N - 1 - 2i) / 2)^2 cos(2 pi W), i = 0..N-1, off-diagonal i (N - i) / 2, i = 1..N-1. The eigenproblem is solved by
/// MathNet.Numerics' symmetric eigenvalue decomposition (O(N^3): a few milliseconds at N = 250, about a second at
/// N = 2000).</para>
/// <para>Signs (a convention, not part of the definition): an even-order taper (symmetric) has a positive sum; an
/// odd-order taper (antisymmetric) is positive at its first sample whose square exceeds max(1e-7, 1 / N). These are
/// the conventions of scipy.signal.windows.dpss, against which the tests check the tapers.</para>
/// <para>Concentration ratio of taper v: lambda = sum_i sum_j v_i v_j sin(2 pi W (i - j)) / (pi (i - j)), with 2W on
/// the diagonal (Percival and Walden 1993, eq. 379a); the first 2NW - 1 or so are close to 1.</para>
/// </remarks>
public sealed record DpssTapers
{
    private DpssTapers(int length, double timeHalfBandwidth, ImmutableArray<ImmutableArray<double>> tapers, ImmutableArray<double> ratios)
    {
        Length = length;
        TimeHalfBandwidth = timeHalfBandwidth;
        Tapers = tapers;
        Concentrations = ratios;
    }

    /// <summary>Number of samples N of each taper.</summary>
    public int Length { get; }

    /// <summary>Time-half-bandwidth product NW.</summary>
    public double TimeHalfBandwidth { get; }

    /// <summary>Half-bandwidth W = NW / N in cycles per sample.</summary>
    public double HalfBandwidth => TimeHalfBandwidth / Length;

    /// <summary>Number of tapers K.</summary>
    public int Count => Tapers.Length;

    /// <summary>Taper k (order k = 0..K-1), N samples of unit energy.</summary>
    public ImmutableArray<ImmutableArray<double>> Tapers { get; }

    /// <summary>Concentration ratio of each taper inside |f| &lt;= W, in taper order (decreasing).</summary>
    public ImmutableArray<double> Concentrations { get; }

    /// <summary>The usual number of tapers for a time-half-bandwidth product: floor(2 NW) - 1 (Percival and Walden 1993, section 7.1), at least 1.</summary>
    /// <param name="timeHalfBandwidth">NW.</param>
    public static int DefaultCount(double timeHalfBandwidth) => Math.Max(1, (int)Math.Floor(2 * timeHalfBandwidth) - 1);

    /// <summary>Computes the first <paramref name="count"/> tapers.</summary>
    /// <param name="length">N, at least 2.</param>
    /// <param name="timeHalfBandwidth">NW, with 0 &lt; NW &lt; N / 2.</param>
    /// <param name="count">K, 1 &lt;= K &lt;= N.</param>
    /// <exception cref="InputException">A value out of range; the message names it.</exception>
    public static DpssTapers Create(int length, double timeHalfBandwidth, int count)
    {
        if (length < 2) throw new InputException($"DPSS tapers: length {length} samples must be at least 2.");
        if (!(timeHalfBandwidth > 0) || !(timeHalfBandwidth < 0.5 * length))
            throw new InputException($"DPSS tapers: time-half-bandwidth product {timeHalfBandwidth} must lie between 0 and half the length ({0.5 * length}).");
        if (count < 1 || count > length)
            throw new InputException($"DPSS tapers: {count} tapers asked; between 1 and the length {length} are possible.");

        double w = timeHalfBandwidth / length;
        double cosine = Math.Cos(2 * Math.PI * w);
        var matrix = Matrix<double>.Build.Dense(length, length);
        for (int i = 0; i < length; i++)
        {
            double half = 0.5 * (length - 1 - 2 * i);
            matrix[i, i] = half * half * cosine;
            if (i > 0) matrix[i, i - 1] = matrix[i - 1, i] = 0.5 * i * (length - i);
        }
        var evd = matrix.Evd(Symmetricity.Symmetric);
        // Eigenvalues come in ascending order: the tapers are the last K columns, taken from the largest down.
        var order = Enumerable.Range(0, length).OrderByDescending(j => evd.EigenValues[j].Real).Take(count).ToArray();
        var tapers = ImmutableArray.CreateBuilder<ImmutableArray<double>>(count);
        var ratios = ImmutableArray.CreateBuilder<double>(count);
        double threshold = Math.Max(1e-7, 1.0 / length);
        for (int k = 0; k < count; k++)
        {
            var v = evd.EigenVectors.Column(order[k]).ToArray();
            double norm = Math.Sqrt(v.Sum(x => x * x));
            for (int i = 0; i < length; i++) v[i] /= norm;
            bool flip = k % 2 == 0 ? v.Sum() < 0 : v.First(x => x * x > threshold) < 0;
            if (flip) for (int i = 0; i < length; i++) v[i] = -v[i];
            tapers.Add(v.ToImmutableArray());
            ratios.Add(Concentration(v, w));
        }
        return new DpssTapers(length, timeHalfBandwidth, tapers.MoveToImmutable(), ratios.MoveToImmutable());
    }

    /// <summary>The fraction of the energy of <paramref name="v"/> (unit energy) inside |f| &lt;= w (see remarks).</summary>
    private static double Concentration(double[] v, double w)
    {
        int n = v.Length;
        // Autocorrelation r[m] = sum_i v_i v_{i+m}, then lambda = 2W r[0] + 2 sum_{m>0} r[m] sin(2 pi W m) / (pi m).
        double total = 0;
        for (int m = 0; m < n; m++)
        {
            double r = 0;
            for (int i = 0; i + m < n; i++) r += v[i] * v[i + m];
            total += m == 0 ? 2 * w * r : 2 * r * Math.Sin(2 * Math.PI * w * m) / (Math.PI * m);
        }
        return total;
    }
}
