using System.Globalization;
using Coupling.Plans;
using Coupling.Trials;

namespace Coupling.Spectral;

/// <summary>
/// How far the edge effects of band isolation reach into the analysis window from padding that holds zeros for want of
/// data (<see cref="TrialSet.ZerosBefore"/>, <see cref="TrialSet.ZerosAfter"/>), and the check that refuses a window
/// they reach.
/// </summary>
/// <remarks>
/// A decomposition's output at sample i is computed from the input within its reach R of i (<see cref="ReachSamples"/>:
/// the Morlet wavelet's half-support K, or the FIR filter's half-length c = (N − 1)/2; the FIR route's analytic-signal
/// step adds a remainder beyond c that falls off like 2/(π d), about 2e-3 of the rms, see
/// <see cref="FirHilbertDecomposition"/>). Window samples within R of a zero-filled sample are therefore filtered partly from zeros:
/// their amplitude falls towards the data's end, which every channel shares, so envelope measures would see a common
/// ramp. Padding with zeros rather than reflected data keeps time running one way (a reflected copy reverses it and
/// flips the sign of any lag between channels), and refusing such windows keeps the zeros out of every value: the
/// window then starts at least R samples after the first recorded sample of every trial and ends at least R before
/// the last. Common practice for edge effects of filters and wavelets (the cone of influence of Torrence and Compo
/// 1998, Bull Am Meteorol Soc 79:61-78).
/// </remarks>
public static class EdgeReach
{
    /// <summary>
    /// R, in samples: the Morlet wavelet's half-support K, the FIR filter's half-length (N − 1)/2, or for any other
    /// decomposition its <see cref="IBandDecomposition.PadSamples"/>.
    /// </summary>
    public static int ReachSamples(IBandDecomposition decomposition) => decomposition switch
    {
        null => throw new ArgumentNullException(nameof(decomposition)),
        MorletDecomposition morlet => morlet.Wavelet.HalfLength,
        FirHilbertDecomposition fir => fir.Filter.DelaySamples,
        _ => decomposition.PadSamples,
    };

    /// <summary>Window samples (at full rate) within reach of zero padding at the start and at the end of the trials.</summary>
    /// <param name="trials">The padded trials.</param>
    /// <param name="decomposition">The band's decomposition.</param>
    /// <param name="window">Analysis window in seconds relative to onset.</param>
    public static (int Before, int After) IntoWindow(TrialSet trials, IBandDecomposition decomposition, TimeRange window)
    {
        ArgumentNullException.ThrowIfNull(trials);
        ArgumentNullException.ThrowIfNull(decomposition);
        var samples = NarrowbandExtractor.WindowSamples(trials, window, 1);
        int first = samples[0], last = samples[^1], reach = ReachSamples(decomposition), count = samples.Length;
        int before = trials.ZerosBefore == 0 ? 0 : Math.Clamp(trials.ZerosBefore + reach - first, 0, count);
        int after = trials.ZerosAfter == 0 ? 0 : Math.Clamp(last - (trials.SampleCount - trials.ZerosAfter - reach) + 1, 0, count);
        return (before, after);
    }

    /// <summary>Refuses a window that the band's edge effects reach from zero padding (see remarks).</summary>
    /// <param name="trials">The padded trials of one condition.</param>
    /// <param name="decomposition">The band's decomposition.</param>
    /// <param name="window">Analysis window in seconds relative to onset.</param>
    /// <exception cref="InputException">The message names the condition and band, the reach, the recorded data around
    /// the window and what to change.</exception>
    public static void Check(TrialSet trials, IBandDecomposition decomposition, TimeRange window)
    {
        if (Reached(trials, decomposition, window) is not { } reached) return;
        throw new InputException(reached + " would be computed partly from padding that holds no data. " +
            "Start the window later or end it earlier, use epochs or events with more data around the window, or a band setting with a shorter reach (a wider transition or fewer cycles); " +
            "or accept the edge effects with 'edge_effects: accept' under 'decomposition'.");
    }

    /// <summary>
    /// The warning for a window that the band's edge effects reach from zero padding when the plan accepts that
    /// (<c>decomposition.edge_effects: accept</c>); null when they do not reach it.
    /// </summary>
    /// <param name="trials">The padded trials of one condition.</param>
    /// <param name="decomposition">The band's decomposition.</param>
    /// <param name="window">Analysis window in seconds relative to onset.</param>
    public static string? Warning(TrialSet trials, IBandDecomposition decomposition, TimeRange window) =>
        Reached(trials, decomposition, window) is { } reached
            ? char.ToUpperInvariant(reached[0]) + reached[1..] + " are computed partly from zero padding (accepted by 'edge_effects: accept'): amplitudes fall towards the data's ends in every channel alike there, which envelope measures read as shared envelope."
            : null;

    private static string? Reached(TrialSet trials, IBandDecomposition decomposition, TimeRange window)
    {
        var (before, after) = IntoWindow(trials, decomposition, window);
        if (before == 0 && after == 0) return null;
        var inv = CultureInfo.InvariantCulture;
        double rate = trials.SampleRate, reach = ReachSamples(decomposition) / rate;
        var samples = NarrowbandExtractor.WindowSamples(trials, window, 1);
        double dataBefore = (samples[0] - trials.ZerosBefore) / rate;
        double dataAfter = (trials.SampleCount - trials.ZerosAfter - 1 - samples[^1]) / rate;
        string where = (before, after) switch
        {
            ( > 0, > 0) => string.Create(inv, $"its first {before / rate:0.###} s and last {after / rate:0.###} s"),
            ( > 0, _) => string.Create(inv, $"its first {before / rate:0.###} s"),
            _ => string.Create(inv, $"its last {after / rate:0.###} s"),
        };
        return string.Create(inv, $"condition '{trials.Condition}', band '{decomposition.Band.Name}': band isolation reaches {reach:0.###} s from the ends of the recorded data, ") +
            string.Create(inv, $"but some trials have only {dataBefore:0.###} s of data before the analysis window and {dataAfter:0.###} s after it (the recording or the epochs end there), ") +
            $"so {where} of the window";
    }
}
