using MathNet.Numerics;

namespace Coupling.Spectral;

/// <summary>
/// Kaiser's empirical design formulas for windowed FIR filters: the window shape parameter beta and the number of
/// taps that reach a stop-band attenuation over a transition width, and the Kaiser window itself.
/// </summary>
/// <remarks>
/// Kaiser, J. F. (1974), "Nonrecursive digital filter design using the I0-sinh window function", Proc. IEEE Int.
/// Symp. Circuits and Systems, 20-23; as given in Oppenheim, A. V. and Schafer, R. W., Discrete-Time Signal
/// Processing (Prentice Hall), eq. 7.62 (beta) and 7.63 (order). The conventions (attenuation as a positive dB
/// number, transition in Hz converted to radians per sample, order + 1 taps, the strict inequalities at 21 and
/// 50 dB) are those of scipy.signal.kaiserord and scipy.signal.kaiser_beta, so the results agree with them exactly
/// apart from the forced odd length.
/// </remarks>
public static class KaiserDesign
{
    /// <summary>Smallest attenuation the order formula is defined for, dB (the formula breaks down below it).</summary>
    public const double MinimumAttenuationDb = 8.0;

    /// <summary>
    /// Number of taps and window beta for a Kaiser-window FIR whose pass-band ripple and stop-band gain are both
    /// at most delta = 10^(-A/20).
    /// </summary>
    /// <param name="rippleDb">Stop-band attenuation A in dB (positive; the sign is ignored).</param>
    /// <param name="transitionHz">Transition width in Hz (positive).</param>
    /// <param name="sampleRate">Sampling rate in Hz (positive).</param>
    /// <returns>
    /// <c>taps</c> = ceil((A - 7.95) / (2.285 dw)) + 1 with dw = 2 pi transitionHz / sampleRate rad/sample, raised by
    /// one when even so the filter is type I linear phase (odd length, symmetric) and can be applied centred with
    /// zero phase; <c>beta</c> from <see cref="Beta"/>.
    /// </returns>
    /// <exception cref="InputException">A below <see cref="MinimumAttenuationDb"/>, or a width or rate not positive.</exception>
    public static (int taps, double beta) Order(double rippleDb, double transitionHz, double sampleRate)
    {
        double a = Math.Abs(rippleDb);
        if (!(a >= MinimumAttenuationDb))
            throw new InputException($"Filter attenuation {rippleDb} dB: expected at least {MinimumAttenuationDb} dB for the Kaiser order formula.");
        if (!(transitionHz > 0) || !double.IsFinite(transitionHz))
            throw new InputException($"Filter transition width {transitionHz} Hz: expected a positive width.");
        if (!(sampleRate > 0) || !double.IsFinite(sampleRate))
            throw new InputException($"Sampling rate {sampleRate} Hz: expected a positive rate.");
        // Same order of operations as scipy.signal.kaiserord: width as a fraction of Nyquist, dw = pi * width.
        double width = transitionHz / (0.5 * sampleRate);
        double numtaps = (a - 7.95) / 2.285 / (Math.PI * width) + 1;
        double rounded = Math.Ceiling(numtaps);
        if (rounded > int.MaxValue - 2)
            throw new InputException($"Filter transition width {transitionHz} Hz at {sampleRate} Hz needs {rounded} taps: too many; widen the transition.");
        int taps = (int)rounded;
        if (taps % 2 == 0) taps++;
        return (taps, Beta(a));
    }

    /// <summary>
    /// Kaiser window beta for attenuation A dB: 0.1102 (A - 8.7) for A &gt; 50, 0.5842 (A - 21)^0.4 + 0.07886 (A - 21)
    /// for 21 &lt; A &lt;= 50, and 0 otherwise (Oppenheim and Schafer eq. 7.62; both branches give 0 at A = 21).
    /// </summary>
    /// <param name="attenuationDb">Stop-band attenuation A in dB (positive).</param>
    /// <remarks>Kaiser (1974); Oppenheim and Schafer, Discrete-Time Signal Processing, eq. 7.62.</remarks>
    public static double Beta(double attenuationDb)
    {
        double a = attenuationDb;
        if (a > 50) return 0.1102 * (a - 8.7);
        if (a > 21) return 0.5842 * Math.Pow(a - 21, 0.4) + 0.07886 * (a - 21);
        return 0.0;
    }

    /// <summary>
    /// Writes the symmetric Kaiser window of length <c>window.Length</c>:
    /// w[n] = I0(beta sqrt(1 - ((n - a) / a)^2)) / I0(beta) with a = (length - 1) / 2 (a single sample is 1).
    /// </summary>
    /// <param name="beta">Shape parameter (non-negative; 0 is the rectangular window).</param>
    /// <param name="window">Receives the window.</param>
    /// <remarks>Kaiser (1974); the symmetric form of scipy.signal.windows.kaiser (sym=True).</remarks>
    public static void Window(double beta, Span<double> window)
    {
        int n = window.Length;
        if (n == 1) { window[0] = 1.0; return; }
        double alpha = 0.5 * (n - 1);
        double denominator = SpecialFunctions.BesselI0(beta);
        for (int i = 0; i < n; i++)
        {
            double r = (i - alpha) / alpha;
            window[i] = SpecialFunctions.BesselI0(beta * Math.Sqrt(1 - r * r)) / denominator;
        }
    }
}
