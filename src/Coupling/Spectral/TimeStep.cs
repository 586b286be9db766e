namespace Coupling.Spectral;

/// <summary>The default spacing of the time points at which narrowband signals are evaluated in the analysis window.</summary>
public static class TimeStep
{
    /// <summary>
    /// Every how many samples the narrowband signal of a band is evaluated: <c>max(1, floor(rate / (4 W)))</c>, where
    /// W is the width of the band's occupied spectrum: stop-band edge to stop-band edge for the FIR route, six
    /// frequency standard deviations (±3 σf) for a Morlet wavelet.
    /// </summary>
    /// <remarks>
    /// A product z_a(t)·conj(z_b(t)) of two analytic signals occupying a band of width W has its spectrum within
    /// [-W, W], as has an envelope; the sampling theorem (Shannon 1949) needs a rate above 2W for it. Stepping at 4W
    /// keeps a factor of two in hand, so the window mean of any measure changes little against k = 1, while
    /// cutting the work by k (see docs/methods.md for the measured change on the demo scenario).
    /// </remarks>
    public static int Default(DecompositionInfo info, double sampleRate)
    {
        var p = info.Parameters;
        double width;
        if (p.TryGetValue("stop_low_hz", out double lo) && p.TryGetValue("stop_high_hz", out double hi))
            width = hi - Math.Max(lo, 0);
        else if (p.TryGetValue("freq_sd_hz", out double sd))
            width = 6 * sd;
        else
            throw new ArgumentException($"Decomposition '{info.Method}' for band '{info.Band}' states neither stop-band edges nor a frequency width.", nameof(info));
        return Math.Max(1, (int)Math.Floor(sampleRate / (4 * width)));
    }
}
