using System.Numerics;
using Coupling.Spectral;

namespace Coupling.Statistics;

/// <summary>
/// The phase of the complex coherency of a channel pair in a narrowband set, and the time lag it means at the band's
/// centre frequency.
/// </summary>
/// <remarks>
/// Coherency (Nolte et al. 2004, "Identifying true brain interaction from EEG data using the imaginary part of coherency",
/// Clin Neurophysiol 115:2292-2307): S_ab = Σ_{t,n} z_a(t, n) z_b(t, n)*, over the window's time points and the trials;
/// φ = arg S_ab in (−π, π]. For z_b(t) = z_a(t − τ) at frequency f, z_a z_b* = |z|² e^{2πifτ}, so φ = 2πfτ: φ &gt; 0
/// means a is ahead of b (a leads) by τ = φ/(2πf) (taken at the band centre f_c = (low + high)/2). A phase is defined
/// only modulo 2π, so lags are reported in (−1/(2f_c), 1/(2f_c)]; a phase near 0 or ±π carries no direction (zero-lag
/// or anti-phase coupling, which volume conduction also produces).
/// </remarks>
public static class CoherencyPhase
{
    /// <summary>φ = arg Σ_{t,n} z_a z_b* for the pair (a, b); NaN when the sum is 0 or not finite.</summary>
    public static double Of(NarrowbandSet set, int a, int b)
    {
        ArgumentNullException.ThrowIfNull(set);
        Complex sum = 0;
        for (int t = 0; t < set.TimeCount; t++)
        {
            var ra = set.Row(t, a);
            var rb = set.Row(t, b);
            for (int n = 0; n < ra.Length; n++) sum += ra[n] * Complex.Conjugate(rb[n]);
        }
        return sum == Complex.Zero || !double.IsFinite(sum.Real) || !double.IsFinite(sum.Imaginary) ? double.NaN : sum.Phase;
    }

    /// <summary>The lag τ = φ/(2π f) in milliseconds of phase <paramref name="phase"/> at <paramref name="frequency"/> Hz.</summary>
    public static double LagMilliseconds(double phase, double frequency) => 1000 * phase / (2 * Math.PI * frequency);
}
