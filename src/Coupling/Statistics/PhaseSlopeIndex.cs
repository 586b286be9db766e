using System.Numerics;
using Coupling.Measures;

namespace Coupling.Statistics;

/// <summary>
/// The phase-slope index between two channels and its trial-shuffle surrogate test.
/// </summary>
/// <remarks>
/// <para>Nolte, Ziehe, Nikulin, Schlögl, Krämer, Brismar and Müller (2008), "Robustly estimating the flow direction of
/// information in complex physical systems", Phys Rev Lett 100:234101, eq. 3: Ψ_ab = Im( Σ_{f ∈ F} C_ab*(f) C_ab(f + δf) ),
/// with C_ab(f) = S_ab(f)/sqrt(S_aa(f) S_bb(f)) the complex coherency, S_ab(f) = (1/N) Σ_n X_a,n(f) X_b,n(f)*, δf the
/// frequency resolution and F the frequencies of the band. Ψ_ab &gt; 0 means the phase difference grows with frequency, as
/// for a delay, with a ahead of b: a leads. For instantaneous (zero-lag) mixing of sources the coherency's imaginary
/// part, and so Ψ, is exactly 0 (the index is insensitive to volume conduction).</para>
/// <para>Spectra: per trial and channel, the analysis window's samples times a periodic Hann taper (a standard taper; common
/// practice), Fourier-transformed directly at the frequencies f_k = k/T (T the window length, k integer) that lie in the
/// band: X(f) = Σ_s w_s x_s exp(−2πi f s/f_s).</para>
/// <para>Test: draw d pairs trial n of channel a with trial π_d(n) of channel b (<see cref="TrialShuffle.Generate"/>), which
/// keeps each channel's spectra and destroys the trial-by-trial relation; two-sided p = (1 + #{d : |Ψ_d| ≥ |Ψ|})/(M + 1).
/// Under no coupling Ψ's null is symmetric about 0 (swapping which trial of b meets which of a does not favour a sign).</para>
/// </remarks>
public static class PhaseSlopeIndex
{
    /// <summary>
    /// Tapered spectra of every trial and channel at the band's frequencies k/T: laid out [channel][trial][frequency].
    /// </summary>
    /// <param name="samples">Trials x channels x window samples, trial-major: sample s of channel c in trial n at (n·C + c)·S + s.</param>
    /// <param name="channels">C.</param>
    /// <param name="trials">N.</param>
    /// <param name="sampleRate">f_s in Hz.</param>
    /// <param name="low">Band's lower edge in Hz.</param>
    /// <param name="high">Band's upper edge in Hz.</param>
    /// <returns>The spectra and the frequencies; fewer than 2 frequencies means Ψ is undefined (the window is too short for the band).</returns>
    public static (Complex[] Spectra, double[] Frequencies) Spectra(ReadOnlySpan<double> samples, int channels, int trials,
        double sampleRate, double low, double high)
    {
        if (channels < 1 || trials < 1 || samples.Length % (channels * trials) != 0)
            throw new ArgumentException("The samples must hold trials x channels x window samples.", nameof(samples));
        int s = samples.Length / (channels * trials);
        double resolution = sampleRate / s;
        var frequencies = Enumerable.Range((int)Math.Ceiling(low / resolution - 1e-9), int.MaxValue / 2)
            .Select(k => k * resolution).TakeWhile(f => f <= high + 1e-9).Where(f => f >= low - 1e-9).ToArray();
        var taper = new double[s];
        for (int i = 0; i < s; i++) taper[i] = 0.5 - 0.5 * Math.Cos(2 * Math.PI * i / s);
        var spectra = new Complex[channels * trials * frequencies.Length];
        for (int c = 0; c < channels; c++)
            for (int n = 0; n < trials; n++)
            {
                var x = samples.Slice((n * channels + c) * s, s);
                for (int k = 0; k < frequencies.Length; k++)
                {
                    double omega = -2 * Math.PI * frequencies[k] / sampleRate;
                    double re = 0, im = 0;
                    for (int i = 0; i < s; i++)
                    {
                        double v = taper[i] * x[i];
                        re += v * Math.Cos(omega * i);
                        im += v * Math.Sin(omega * i);
                    }
                    spectra[(c * trials + n) * frequencies.Length + k] = new Complex(re, im);
                }
            }
        return (spectra, frequencies);
    }

    /// <summary>Ψ_ab with trial n of a meeting trial <paramref name="permutation"/>[n] of b; NaN with fewer than 2 frequencies or a zero spectrum.</summary>
    public static double Compute(ReadOnlySpan<Complex> spectra, int trials, int frequencies, int a, int b, ReadOnlySpan<int> permutation)
    {
        if (frequencies < 2) return double.NaN;
        Complex previous = 0, sum = 0;
        for (int k = 0; k < frequencies; k++)
        {
            Complex cross = 0;
            double powerA = 0, powerB = 0;
            for (int n = 0; n < trials; n++)
            {
                var xa = spectra[(a * trials + n) * frequencies + k];
                var xb = spectra[(b * trials + permutation[n]) * frequencies + k];
                cross += xa * Complex.Conjugate(xb);
                powerA += xa.Real * xa.Real + xa.Imaginary * xa.Imaginary;
                powerB += xb.Real * xb.Real + xb.Imaginary * xb.Imaginary;
            }
            double norm = Math.Sqrt(powerA * powerB);
            if (!(norm > 0)) return double.NaN;
            var coherency = cross / norm;
            if (k > 0) sum += Complex.Conjugate(previous) * coherency;
            previous = coherency;
        }
        return sum.Imaginary;
    }

    /// <summary>
    /// Ψ of each listed pair and its two-sided trial-shuffle p from <paramref name="draws"/> draws (draw d uses
    /// <see cref="TrialShuffle.Generate"/>(seed, d)); NaN where Ψ is undefined.
    /// </summary>
    public static (double[] Psi, double[] P) Test(ReadOnlySpan<Complex> spectra, int trials, int frequencies,
        IReadOnlyList<(int A, int B)> pairs, int draws, ulong seed)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(draws, 1);
        var identity = Enumerable.Range(0, trials).ToArray();
        var psi = new double[pairs.Count];
        var exceed = new int[pairs.Count];
        for (int i = 0; i < pairs.Count; i++) psi[i] = Compute(spectra, trials, frequencies, pairs[i].A, pairs[i].B, identity);
        var permutation = new int[trials];
        for (int d = 0; d < draws; d++)
        {
            TrialShuffle.Generate(seed, d, permutation);
            for (int i = 0; i < pairs.Count; i++)
                if (Math.Abs(Compute(spectra, trials, frequencies, pairs[i].A, pairs[i].B, permutation)) >= Math.Abs(psi[i])) exceed[i]++;
        }
        var p = new double[pairs.Count];
        for (int i = 0; i < pairs.Count; i++) p[i] = double.IsNaN(psi[i]) ? double.NaN : (exceed[i] + 1.0) / (draws + 1.0);
        return (psi, p);
    }
}
