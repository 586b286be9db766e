namespace Coupling.Spectral;

/// <summary>
/// Designs Kaiser-window windowed-sinc FIR band-pass filters. Design only: the result is an immutable
/// <see cref="FirFilter"/>, applied by <see cref="ZeroPhase"/>.
/// </summary>
/// <remarks>
/// Window method: Oppenheim, A. V. and Schafer, R. W., Discrete-Time Signal Processing, section 7.5, with the Kaiser
/// window and design formulas of Kaiser, J. F. (1974), Proc. IEEE Int. Symp. Circuits and Systems, 20-23
/// (see <see cref="KaiserDesign"/>). The taps are those of scipy.signal.firwin(N, [low, high],
/// window=('kaiser', beta), pass_zero=False, scale=True, fs=fs): the ideal band-pass impulse response with cutoffs
/// at the band edges, times the window, scaled to unit gain at the band centre.
/// </remarks>
public static class FirDesign
{
    /// <summary>
    /// Default stop-band attenuation, 60 dB: pass-band ripple and stop-band gain at most 10^-3, so a component
    /// outside the band of equal amplitude leaks in at 0.1 % and in-band amplitudes are right to 0.1 %, well below
    /// the trial-to-trial spread of phase and amplitude estimates. Each further 20 dB adds about a third to the length.
    /// </summary>
    public const double DefaultAttenuationDb = 60.0;

    /// <summary>Largest margin, dB, added to the requested attenuation while searching for a design that meets it.</summary>
    public const double MaximumMarginDb = 30.0;

    /// <summary>
    /// Default transition width in Hz: tw = min(max(0.25 low, 1 Hz), low, width / 2, fs/2 - high).
    /// A quarter of the low edge keeps the relative sharpness the same across bands, with a 1 Hz floor so that
    /// low bands do not need filters many seconds long; capping at the low edge keeps the lower stop band above
    /// 0 Hz (low - tw/2 &gt;= low/2), at half the band width keeps at least half the band as flat pass band, and at
    /// the distance to Nyquist keeps the upper stop band below fs/2 (high + tw/2 &lt; fs/2).
    /// </summary>
    /// <param name="band">The band (checked: 0 &lt; low &lt; high &lt; fs/2).</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <exception cref="InputException">The band does not fit the sampling rate.</exception>
    public static double DefaultTransitionHz(Band band, double sampleRate)
    {
        SpectralChecks.Band(band, sampleRate);
        return Math.Min(Math.Min(Math.Max(0.25 * band.Low, 1.0), band.Low),
            Math.Min(0.5 * band.Width, 0.5 * sampleRate - band.High));
    }

    /// <summary>Band-pass with the default transition (<see cref="DefaultTransitionHz"/>) and attenuation (<see cref="DefaultAttenuationDb"/>).</summary>
    /// <param name="band">The band; its edges are the cutoffs.</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <exception cref="InputException">The band does not fit the sampling rate.</exception>
    public static FirFilter BandPass(Band band, double sampleRate) =>
        BandPass(band, sampleRate, DefaultTransitionHz(band, sampleRate), DefaultAttenuationDb);

    /// <summary>
    /// Kaiser-window band-pass with cutoffs (-6 dB points) at the band edges, unit gain at the band centre, and a
    /// measured pass-band deviation and stop-band gain both at most delta = 10^(-A/20).
    /// </summary>
    /// <param name="band">The band; its edges are the cutoffs.</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <param name="transitionHz">Transition width in Hz, centred on each edge; at most the band width, with
    /// low - tw/2 &gt; 0 and high + tw/2 &lt; fs/2.</param>
    /// <param name="attenuationDb">Stop-band attenuation A in dB (at least <see cref="KaiserDesign.MinimumAttenuationDb"/>).</param>
    /// <remarks>
    /// Kaiser's formulas are empirical and were fitted for one transition. A band-pass has two, whose ripples add,
    /// and the scaling to unit gain at the centre shifts the pass band by the centre's own ripple; with the plain
    /// formulas the deviation can reach about 2.8 delta (checked over bands from 0.5 to 90 Hz). The design therefore
    /// starts from Kaiser's N and beta for A and, while the measured deviation or stop gain (see
    /// <see cref="FirFilter"/>) exceeds 0.99 delta, raises the design attenuation by 0.5 dB and designs again (at most
    /// <see cref="MaximumMarginDb"/> dB). The 1 % margin covers the grid: a ripple peak missed by at most 1/64 of a
    /// lobe is at most 1 - cos(2 pi / 64) = 0.5 % higher than the grid shows. The attenuation used is recorded as
    /// <see cref="FirFilter.DesignAttenuationDb"/>.
    /// </remarks>
    /// <exception cref="InputException">The band, transition or attenuation does not fit.</exception>
    public static FirFilter BandPass(Band band, double sampleRate, double transitionHz, double attenuationDb)
    {
        SpectralChecks.Band(band, sampleRate);
        string where = $"{SpectralChecks.Describe(band)} at sampling rate {sampleRate:G6} Hz";
        if (!(transitionHz > 0) || !double.IsFinite(transitionHz))
            throw new InputException($"{where}: transition width {transitionHz} Hz must be positive.");
        if (transitionHz > band.Width)
            throw new InputException($"{where}: transition width {transitionHz:G6} Hz must not exceed the band width {band.Width:G6} Hz.");
        if (!(band.Low - 0.5 * transitionHz > 0))
            throw new InputException($"{where}: transition width {transitionHz:G6} Hz puts the lower stop band edge at or below 0 Hz; use less than {2 * band.Low:G6} Hz.");
        if (!(band.High + 0.5 * transitionHz < 0.5 * sampleRate))
            throw new InputException($"{where}: transition width {transitionHz:G6} Hz puts the upper stop band edge at or above the Nyquist frequency {0.5 * sampleRate:G6} Hz.");
        if (!(Math.Abs(attenuationDb) >= KaiserDesign.MinimumAttenuationDb) || !double.IsFinite(attenuationDb))
            throw new InputException($"{where}: attenuation {attenuationDb} dB must be at least {KaiserDesign.MinimumAttenuationDb} dB.");
        double a = Math.Abs(attenuationDb);
        double delta = Math.Pow(10, -a / 20);
        for (double margin = 0; margin <= MaximumMarginDb; margin += 0.5)
        {
            var (taps, beta) = KaiserDesign.Order(a + margin, transitionHz, sampleRate);
            var filter = new FirFilter(WindowedSincTaps(band, sampleRate, taps, beta), sampleRate, band, transitionHz,
                a, a + margin, beta);
            if (filter.PassDeviation <= 0.99 * delta && filter.StopGain <= 0.99 * delta) return filter;
        }
        throw new InputException($"{where}: no Kaiser design within {MaximumMarginDb} dB of margin reaches {a} dB with a transition of {transitionHz:G6} Hz.");
    }

    /// <summary>
    /// The taps of a Kaiser-window band-pass of a given length: h[n] = (fh sinc(fh m) - fl sinc(fl m)) w[n] / s with
    /// m = n - (N - 1)/2, fl and fh the edges as fractions of the Nyquist frequency, sinc(x) = sin(pi x) / (pi x),
    /// w the Kaiser window (<see cref="KaiserDesign.Window"/>) and s = sum_n h[n] cos(pi m (fl + fh) / 2) so that the
    /// gain at the band centre is 1. Equal to scipy.signal.firwin(N, [low, high], window=('kaiser', beta),
    /// pass_zero=False, scale=True, fs=fs).
    /// </summary>
    /// <param name="band">The band; its edges are the cutoffs (checked against the rate).</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <param name="taps">Number of taps, odd and positive.</param>
    /// <param name="beta">Kaiser window beta.</param>
    /// <exception cref="InputException">The band does not fit the rate, or the length is not odd and positive.</exception>
    public static double[] WindowedSincTaps(Band band, double sampleRate, int taps, double beta)
    {
        SpectralChecks.Band(band, sampleRate);
        if (taps < 1 || taps % 2 == 0)
            throw new InputException($"{SpectralChecks.Describe(band)}: filter length {taps} taps must be odd and positive.");
        double nyquist = 0.5 * sampleRate;
        double left = band.Low / nyquist, right = band.High / nyquist;
        double alpha = 0.5 * (taps - 1);
        var h = new double[taps];
        KaiserDesign.Window(beta, h);
        double scaleFrequency = 0.5 * (left + right);
        double s = 0;
        for (int n = 0; n < taps; n++)
        {
            double m = n - alpha;
            double ideal = right * Sinc(right * m) - left * Sinc(left * m);
            h[n] *= ideal;
            s += h[n] * Math.Cos(Math.PI * m * scaleFrequency);
        }
        for (int n = 0; n < taps; n++) h[n] /= s;
        return h;
    }

    /// <summary>Normalised sinc, sin(pi x) / (pi x), 1 at 0.</summary>
    private static double Sinc(double x)
    {
        if (x == 0) return 1.0;
        double y = Math.PI * x;
        return Math.Sin(y) / y;
    }
}
