using System.Globalization;
using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Artefacts;

/// <summary>
/// Warnings computed from a run's tested tables and signal summaries: findings that may come from volume conduction or
/// a common reference, a shared stimulus-locked response, amplitude rather than phase, or a channel whose power is far
/// from the others'. A flag is a reason to look again, not a verdict.
/// </summary>
/// <remarks>
/// <para><b>Zero lag.</b> Per condition x band x pair: significant for <c>plv</c> or <c>coherence</c>, at least one of the
/// lag-insensitive phase measures <c>wpli</c>, <c>wpli-debiased</c>, <c>pli</c>, <c>imag-coherency</c> computed, and none
/// of those significant. A zero-lag component (one source seen by two channels, a common reference) enters PLV and
/// coherence fully and the lag-insensitive measures not at all (Stam et al. 2007, Hum Brain Mapp 28:1178; Nolte et al.
/// 2004, Clin Neurophysiol 115:2292; Vinck et al. 2011, NeuroImage 55:1548).</para>
/// <para><b>Shared evoked response.</b> Only when the evoked response was kept. Per condition x band: every pair of
/// channels whose stimulus locking (<see cref="SignalSummaries"/>) is at least <see cref="StrongLocking"/> and at least
/// sqrt(−ln α / N) with α = <see cref="LockingLevel"/>, the large-sample critical value of the Rayleigh test for N trials
/// (P(R ≥ r) ≈ exp(−N r²); Fisher 1993, <i>Statistical Analysis of Circular Data</i>; from memory). Trial shuffling keeps
/// such a response in the null (docs/methods.md, section 5), so it does not by itself make a pair significant, but the
/// values include it.</para>
/// <para><b>Amplitude-driven.</b> Per condition x band x pair: significant for an amplitude-weighted measure
/// (<c>coherence</c>, <c>imag-coherency</c>, <c>wpli</c>, <c>wpli-debiased</c>), <c>aec</c> computed, significant and
/// positive, at least one of <c>plv</c>, <c>ppc</c> computed and none of them significant. The trial-shuffle null tests
/// only the independence of the trials' pairing, so trial-to-trial covariation of amplitude alone can reject it for a
/// measure that weighs trials by amplitude.</para>
/// <para><b>Power outlier.</b> Per condition x band with at least 3 channels: the modified z-score of log10 power,
/// M = 0.6745 (x − median) / MAD, flagged when |M| &gt; <see cref="OutlierScore"/> and the power is at least <see cref="OutlierFactor"/> times or at most
/// 1/<see cref="OutlierFactor"/> of the median power (Iglewicz &amp; Hoaglin 1993, <i>How to
/// Detect and Handle Outliers</i>, ASQC). When the MAD is 0 the mean absolute deviation is used instead,
/// M = (x − median) / (1.253314 · mean |x − median|) (from memory, the same authors' fallback); when that is 0 too
/// nothing is flagged.</para>
/// </remarks>
public static class ArtefactFlags
{
    /// <summary>Stimulus locking at or above which a channel's response counts as strong (a choice made here: a shared
    /// locking of 0.3 in both channels adds about 0.3·0.3 ≈ 0.09 to their PLV).</summary>
    public const double StrongLocking = 0.3;

    /// <summary>Level of the Rayleigh test that the stimulus locking must also pass.</summary>
    public const double LockingLevel = 0.001;

    /// <summary>Modified z-score beyond which a channel's power is an outlier (Iglewicz &amp; Hoaglin 1993).</summary>
    public const double OutlierScore = 3.5;

    /// <summary>Factor by which a flagged channel's power must also lie above or below the median power (a choice made
    /// here: a channel carrying a genuine oscillation of the band is often 3 to 5 times the median, a bridged, noisy or
    /// disconnected one an order of magnitude or more away).</summary>
    public const double OutlierFactor = 10;

    private static readonly string[] ZeroLagSensitive = ["plv", "coherence"];
    private static readonly string[] LagInsensitive = ["wpli", "wpli-debiased", "pli", "imag-coherency"];
    private static readonly string[] AmplitudeWeighted = ["coherence", "imag-coherency", "wpli", "wpli-debiased"];
    private static readonly string[] AmplitudeFree = ["plv", "ppc"];

    /// <summary>The key of <paramref name="kind"/> in tables.</summary>
    public static string Key(ArtefactKind kind) => kind switch
    {
        ArtefactKind.ZeroLag => "zero-lag",
        ArtefactKind.SharedEvoked => "shared-evoked",
        ArtefactKind.AmplitudeDriven => "amplitude-driven",
        ArtefactKind.PowerOutlier => "power-outlier",
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown kind."),
    };

    /// <summary>
    /// Every flag the results raise, in the order: per condition and band (in the order the results list them) zero lag,
    /// amplitude-driven, shared evoked response, power outliers; pairs in pair order, channels in channel order.
    /// </summary>
    /// <param name="results">The tested tables of the run.</param>
    /// <param name="signals">Signal summaries per condition x band (may be empty: then only the pair-measure flags are raised).</param>
    /// <param name="evokedSubtracted">Whether the condition's trial mean was subtracted before band isolation.</param>
    public static IReadOnlyList<ArtefactFlag> Find(IReadOnlyList<PairResult> results, IReadOnlyList<BandSignalSummary> signals,
        bool evokedSubtracted)
    {
        ArgumentNullException.ThrowIfNull(results);
        ArgumentNullException.ThrowIfNull(signals);
        var flags = new List<ArtefactFlag>();
        var groups = results.GroupBy(r => (r.Condition, r.Band)).Select(g => g.ToArray());
        var seen = new HashSet<(string, string)>();
        foreach (var group in groups)
        {
            string condition = group[0].Condition, band = group[0].Band;
            seen.Add((condition, band));
            var summary = signals.FirstOrDefault(s => s.Condition == condition && s.Band == band);
            flags.AddRange(PairFlags(group, summary));
            if (summary is not null) flags.AddRange(SignalFlags(summary, evokedSubtracted));
        }
        foreach (var s in signals.Where(s => !seen.Contains((s.Condition, s.Band))))
            flags.AddRange(SignalFlags(s, evokedSubtracted));
        return flags;
    }

    /// <summary>
    /// The checks the measures of a run leave impossible, one sentence each (e.g. the zero-lag check without any of
    /// plv and coherence); empty when every check could be made.
    /// </summary>
    public static IReadOnlyList<string> Unchecked(IReadOnlyCollection<string> measures, bool evokedSubtracted)
    {
        var notes = new List<string>();
        if (!measures.Any(ZeroLagSensitive.Contains) || !measures.Any(LagInsensitive.Contains))
            notes.Add("Zero lag: needs one of plv, coherence and one of wpli, wpli-debiased, pli, imag-coherency; not checked.");
        if (!measures.Any(AmplitudeWeighted.Contains) || !measures.Contains("aec") || !measures.Any(AmplitudeFree.Contains))
            notes.Add("Amplitude-driven: needs one of coherence, imag-coherency, wpli, wpli-debiased, and aec, and one of plv, ppc; not checked.");
        if (evokedSubtracted)
            notes.Add("Shared evoked response: the evoked response was subtracted; not checked.");
        return notes;
    }

    private static IEnumerable<ArtefactFlag> PairFlags(PairResult[] group, BandSignalSummary? summary)
    {
        var byMeasure = group.ToDictionary(r => r.Measure, StringComparer.Ordinal);
        var channels = group[0].Channels;
        int pairs = PairIndex.Count(channels.Count);
        foreach (var r in group)
            if (r.Significant.Length != pairs || !r.Channels.SequenceEqual(channels))
                throw new ArgumentException($"Results of {r.Condition}/{r.Band} do not share one channel list.", nameof(group));
        var sensitive = ZeroLagSensitive.Where(byMeasure.ContainsKey).ToArray();
        var insensitive = LagInsensitive.Where(byMeasure.ContainsKey).ToArray();
        var weighted = AmplitudeWeighted.Where(byMeasure.ContainsKey).ToArray();
        var free = AmplitudeFree.Where(byMeasure.ContainsKey).ToArray();
        byMeasure.TryGetValue("aec", out var aec);
        var flags = new List<ArtefactFlag>();
        for (int k = 0; k < pairs; k++)
        {
            var (a, b) = PairIndex.Channels(k, channels.Count);
            var hits = sensitive.Where(m => byMeasure[m].Significant[k]).ToArray();
            if (hits.Length > 0 && insensitive.Length > 0 && !insensitive.Any(m => byMeasure[m].Significant[k]))
            {
                double degrees = summary is null ? double.NaN : summary.CoherencyPhase[k] * 180 / Math.PI;
                string phase = double.IsNaN(degrees) ? "" : string.Create(CultureInfo.InvariantCulture,
                    $" Coherency phase {degrees:0.#}° ({summary!.LagMs[k]:0.#} ms at {summary.CentreHz:0.##} Hz).");
                flags.Add(new ArtefactFlag(ArtefactKind.ZeroLag, group[0].Condition, group[0].Band, channels[a], channels[b],
                    string.Join(",", hits), degrees,
                    $"Significant for {string.Join(", ", hits)} but not for {string.Join(", ", insensitive)}: possibly a zero-lag " +
                    $"component (volume conduction or a common reference).{phase}"));
            }
            var weightedHits = weighted.Where(m => byMeasure[m].Significant[k]).ToArray();
            if (weightedHits.Length > 0 && aec is not null && aec.Significant[k] && aec.Value[k] > 0 && free.Length > 0
                && !free.Any(m => byMeasure[m].Significant[k]))
            {
                flags.Add(new ArtefactFlag(ArtefactKind.AmplitudeDriven, group[0].Condition, group[0].Band, channels[a], channels[b],
                    string.Join(",", weightedHits), aec.Value[k],
                    string.Create(CultureInfo.InvariantCulture,
                        $"Significant for {string.Join(", ", weightedHits)} with correlated envelopes (aec {aec.Value[k]:0.###}, significant) " +
                        $"but not for {string.Join(", ", free)}: possibly driven by amplitude rather than phase.")));
            }
        }
        return flags;
    }

    private static IEnumerable<ArtefactFlag> SignalFlags(BandSignalSummary s, bool evokedSubtracted)
    {
        var flags = new List<ArtefactFlag>();
        int n = s.Channels.Count;
        if (!evokedSubtracted && s.Trials > 0)
        {
            double threshold = Math.Max(StrongLocking, Math.Sqrt(-Math.Log(LockingLevel) / s.Trials));
            for (int a = 0; a < n; a++)
                for (int b = a + 1; b < n; b++)
                {
                    double ra = s.StimulusLocking[a], rb = s.StimulusLocking[b];
                    if (!(ra >= threshold && rb >= threshold)) continue;
                    flags.Add(new ArtefactFlag(ArtefactKind.SharedEvoked, s.Condition, s.Band, s.Channels[a], s.Channels[b], "",
                        Math.Min(ra, rb), string.Create(CultureInfo.InvariantCulture,
                            $"Both channels are locked to the stimulus (stimulus locking {ra:0.##} and {rb:0.##}, threshold {threshold:0.##}) ") +
                            "and the evoked response was kept: their values include the shared response. Trial shuffling keeps it in the " +
                            "null, so it alone is not called significant; subtract it (evoked: subtract) to measure coupling beyond it."));
                }
        }
        foreach (var (channel, score, ratio) in PowerOutliers(s.Power))
            flags.Add(new ArtefactFlag(ArtefactKind.PowerOutlier, s.Condition, s.Band, s.Channels[channel], null, "", score,
                string.Create(CultureInfo.InvariantCulture,
                    $"Band power {ratio:G3} times the median of the channels (modified z-score of log power {score:0.#}): " +
                    $"{(score > 0 ? "a noisy, bridged or badly referenced channel" : "a flat or disconnected channel")}? Its pairs may not be comparable with the rest.")));
        return flags;
    }

    /// <summary>
    /// Channels whose log10 power has a modified z-score beyond <see cref="OutlierScore"/> and lies at least
    /// <see cref="OutlierFactor"/> times away from the median (see the type's remarks):
    /// (channel index, score, power / median power). Non-positive or non-finite powers are left out of the statistics
    /// and never flagged.
    /// </summary>
    public static IReadOnlyList<(int Channel, double Score, double Ratio)> PowerOutliers(IReadOnlyList<double> power)
    {
        ArgumentNullException.ThrowIfNull(power);
        var usable = Enumerable.Range(0, power.Count).Where(c => power[c] > 0 && double.IsFinite(power[c])).ToArray();
        if (usable.Length < 3) return [];
        var logs = usable.Select(c => Math.Log10(power[c])).ToArray();
        double median = Median(logs);
        var deviations = logs.Select(x => Math.Abs(x - median)).ToArray();
        double mad = Median(deviations);
        double scale;
        if (mad > 0) scale = mad / 0.6745;
        else
        {
            double meanDeviation = deviations.Average();
            if (!(meanDeviation > 0)) return [];
            scale = 1.253314 * meanDeviation;
        }
        var found = new List<(int, double, double)>();
        for (int i = 0; i < usable.Length; i++)
        {
            double score = (logs[i] - median) / scale;
            if (Math.Abs(score) > OutlierScore && Math.Abs(logs[i] - median) >= Math.Log10(OutlierFactor))
                found.Add((usable[i], score, Math.Pow(10, logs[i] - median)));
        }
        return found;
    }

    private static double Median(double[] values)
    {
        var sorted = values.Order().ToArray();
        int m = sorted.Length / 2;
        return sorted.Length % 2 == 1 ? sorted[m] : 0.5 * (sorted[m - 1] + sorted[m]);
    }
}
