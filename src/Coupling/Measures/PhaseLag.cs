namespace Coupling.Measures;

/// <summary>Turns a phase difference at a frequency into the time lag it stands for.</summary>
public static class PhaseLag
{
    /// <summary>
    /// The lag in milliseconds of a phase difference <paramref name="phaseRadians"/> at <paramref name="frequencyHz"/>:
    /// τ = φ / (2π f) · 1000. A pure delay τ gives a cross-spectrum phase of 2π f τ (the Fourier shift theorem: delaying a
    /// signal by τ multiplies its spectrum at f by e^(−i2πfτ)); the phase is only known modulo 2π, so the lag is only known modulo one
    /// period 1000/f ms, and a phase in (−π, π] gives a lag within half a period of 0. NaN stays NaN.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The frequency is not positive.</exception>
    public static double Milliseconds(double phaseRadians, double frequencyHz)
    {
        if (!(frequencyHz > 0)) throw new ArgumentOutOfRangeException(nameof(frequencyHz), frequencyHz, "The frequency must be positive.");
        return phaseRadians / (2 * Math.PI * frequencyHz) * 1000.0;
    }
}
