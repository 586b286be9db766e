using System.Globalization;
using Coupling.Plans;
using Coupling.Spectral;

namespace Coupling.Pipeline;

/// <summary>Warnings about bands the plan's trial span and window are too short for.</summary>
public static class BandWarnings
{
    /// <summary>Cycles of a band's lowest frequency the analysis window should hold at least (common practice: phase
    /// and envelope estimates over fewer than about 3 cycles are dominated by the filter's own response).</summary>
    public const double MinimumCycles = 3;

    /// <summary>
    /// One warning per band whose lowest frequency completes fewer than <see cref="MinimumCycles"/> cycles in the analysis
    /// window, and, for input cut into epochs, one per band whose filter (FIR taps or wavelet support) is longer than an
    /// epoch (the trial plus the padding it holds): the band signal is then shaped mostly by the padding past the epochs, which holds zeros.
    /// Continuous recordings have real data around every trial, so the second warning does not apply to them.
    /// </summary>
    /// <param name="plan">The plan (window, trial span, bands in order).</param>
    /// <param name="decompositions">The decomposition of each band, in the plan's band order.</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <param name="epochSamples">Samples per epoch for input cut into epochs; null for a continuous recording.</param>
    public static IReadOnlyList<string> For(Plan plan, IReadOnlyList<IBandDecomposition> decompositions, double sampleRate, int? epochSamples)
    {
        var inv = CultureInfo.InvariantCulture;
        var warnings = new List<string>();
        for (int i = 0; i < plan.Bands.Count; i++)
        {
            var band = plan.Bands[i];
            double cycles = plan.Window.Length * band.Low;
            if (cycles < MinimumCycles)
                warnings.Add(
                    $"Band '{band.Name}' ({F(band.Low)}-{F(band.High)} Hz): the {F(plan.Window.Length)} s analysis window holds only {cycles.ToString("0.##", inv)} cycles of {F(band.Low)} Hz, " +
                    $"fewer than {F(MinimumCycles)}; its phase and envelope there are dominated by the filter's own response. Use a longer window or a higher band.");
            var p = decompositions[i].Info.Parameters;
            double length = p.TryGetValue("filter_taps", out double taps) ? taps : p.TryGetValue("support_samples", out double support) ? support : 0;
            if (epochSamples is { } epoch && length > epoch)
                warnings.Add(
                    $"Band '{band.Name}' ({F(band.Low)}-{F(band.High)} Hz): the filter is {length.ToString("0", inv)} samples ({(length / sampleRate).ToString("0.###", inv)} s) long, longer than the " +
                    $"{epoch}-sample epochs (trial plus padding); the band signal inside each trial then depends mostly on the padding past the epochs, which holds zeros. " +
                    "Use longer epochs, a wider transition or a higher band.");
        }
        return warnings;
    }

    private static string F(double v) => v.ToString("G6", CultureInfo.InvariantCulture);
}
