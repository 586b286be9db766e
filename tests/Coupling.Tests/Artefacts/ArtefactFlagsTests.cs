using Coupling.Artefacts;
using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Tests.Artefacts;

/// <summary>
/// Flags raised from constructed results. The rules are those of the measures' definitions: zero-lag mixing enters PLV
/// and coherence fully and wPLI, PLI and imaginary coherency not at all (Stam et al. 2007, Hum Brain Mapp 28:1178; Vinck
/// et al. 2011, NeuroImage 55:1548; Nolte et al. 2004, Clin Neurophysiol 115:2292); outlying power by the modified
/// z-score (Iglewicz and Hoaglin 1993, How to Detect and Handle Outliers).
/// </summary>
public class ArtefactFlagsTests
{
    private static readonly string[] Channels = ["A", "B", "C", "D"];
    private static readonly int Pairs = PairIndex.Count(Channels.Length);

    /// <summary>A table of <paramref name="measure"/> in which the pairs <paramref name="significant"/> are significant with <paramref name="value"/>.</summary>
    private static PairResult Table(string measure, double value = 0.5, string condition = "go", string band = "alpha", params (int A, int B)[] significant)
    {
        var values = new double[Pairs];
        var flags = new bool[Pairs];
        foreach (var (a, b) in significant)
        {
            int k = PairIndex.Of(a, b, Channels.Length);
            values[k] = value;
            flags[k] = true;
        }
        var z = flags.Select(f => f ? 5.0 : 0.1).ToArray();
        var p = flags.Select(f => f ? 0.001 : 0.6).ToArray();
        return new PairResult(condition, band, measure, Channels, values, z, p, p, flags);
    }

    private static BandSignalSummary Signals(double[]? power = null, double[]? locking = null, int trials = 50, string condition = "go") =>
        new(condition, "alpha", 10, trials, Channels, power ?? [1, 1.1, 0.9, 1.05], locking ?? [0.1, 0.1, 0.1, 0.1],
            new double[Pairs], new double[Pairs]);

    [Fact]
    public void A_pair_significant_for_plv_and_not_for_wpli_is_flagged_zero_lag()
    {
        var results = new[] { Table("plv", significant: [(0, 1), (2, 3)]), Table("wpli", significant: [(2, 3)]), Table("coherence", significant: [(0, 1)]) };
        var flags = ArtefactFlags.Find(results, [Signals()], evokedSubtracted: true);
        var flag = Assert.Single(flags);
        Assert.Equal(ArtefactKind.ZeroLag, flag.Kind);
        Assert.Equal(("A", "B"), (flag.ChannelA, flag.ChannelB));
        Assert.Equal("plv,coherence", flag.Measures);
        Assert.Equal("zero-lag", flag.Key);
    }

    [Fact]
    public void Without_a_lag_insensitive_measure_no_zero_lag_flag_can_be_raised()
    {
        var results = new[] { Table("plv", significant: [(0, 1)]), Table("aec") };
        Assert.Empty(ArtefactFlags.Find(results, [], evokedSubtracted: true));
        Assert.Contains(ArtefactFlags.Unchecked(["plv", "aec"], true), n => n.StartsWith("Zero lag", StringComparison.Ordinal));
        Assert.Empty(ArtefactFlags.Unchecked(["plv", "wpli", "aec", "coherence"], false));
    }

    [Fact]
    public void Coherence_with_correlated_envelopes_but_no_phase_locking_is_flagged_amplitude_driven()
    {
        var results = new[]
        {
            Table("coherence", significant: [(0, 2), (1, 3)]),
            Table("aec", value: 0.6, significant: [(0, 2), (1, 3)]),
            Table("plv", significant: [(1, 3)]),
            Table("imag-coherency", significant: [(0, 2), (1, 3)]),
        };
        var flag = Assert.Single(ArtefactFlags.Find(results, [], evokedSubtracted: true));
        Assert.Equal(ArtefactKind.AmplitudeDriven, flag.Kind);
        Assert.Equal(("A", "C"), (flag.ChannelA, flag.ChannelB));
        Assert.Equal("coherence,imag-coherency", flag.Measures);
        Assert.Equal(0.6, flag.Value);
    }

    [Fact]
    public void Anticorrelated_envelopes_do_not_make_a_pair_amplitude_driven()
    {
        var results = new[] { Table("coherence", significant: [(0, 2)]), Table("aec", value: -0.6, significant: [(0, 2)]), Table("ppc") };
        Assert.Empty(ArtefactFlags.Find(results, [], evokedSubtracted: true));
    }

    [Fact]
    public void Two_strongly_stimulus_locked_channels_are_flagged_only_while_the_evoked_response_is_kept()
    {
        // Threshold: max(0.3, sqrt(ln(1000)/N)) = max(0.3, 0.372) at N = 50 (Rayleigh test at 0.001, P ≈ exp(−N R²)).
        var s = Signals(locking: [0.8, 0.1, 0.75, 0.36]);
        var kept = ArtefactFlags.Find([Table("plv")], [s], evokedSubtracted: false);
        var flag = Assert.Single(kept);
        Assert.Equal(ArtefactKind.SharedEvoked, flag.Kind);
        Assert.Equal(("A", "C"), (flag.ChannelA, flag.ChannelB));
        Assert.Equal(0.75, flag.Value);
        Assert.Empty(ArtefactFlags.Find([Table("plv")], [s], evokedSubtracted: true));
        // With 500 trials the Rayleigh bound drops to 0.118 and the 0.3 floor decides: 0.36 now counts.
        Assert.Equal(3, ArtefactFlags.Find([Table("plv")], [Signals(locking: [0.8, 0.1, 0.75, 0.36], trials: 500)], false).Count);
    }

    [Fact]
    public void A_channel_with_a_hundred_times_the_power_is_flagged_and_one_with_three_times_is_not()
    {
        // log10 powers 0, 0.02, −0.02, 0.01, 2 and 0.477: median 0.015; absolute deviations 0.015, 0.005, 0.035, 0.005, 1.985,
        // 0.462, so MAD 0.025. M = 0.6745·(2 − 0.015)/0.025 ≈ 53.6 for the 100-fold channel (beyond 3.5 and 10 times the
        // median); the 3-fold one has M ≈ 12.5 but lies within the factor of 10.
        var outliers = ArtefactFlags.PowerOutliers([1, Math.Pow(10, 0.02), Math.Pow(10, -0.02), Math.Pow(10, 0.01), 100, 3]);
        var (channel, score, ratio) = Assert.Single(outliers);
        Assert.Equal(4, channel);
        // 1e-9: logs of powers of ten round to a few ulps.
        Assert.Equal(0.6745 * (2 - 0.015) / 0.025, score, 9);
        Assert.Equal(Math.Pow(10, 2 - 0.015), ratio, 9);
    }

    [Fact]
    public void A_nearly_flat_channel_is_flagged_below_the_rest()
    {
        var s = Signals(power: [1, 1.2, 0.001, 0.9]);
        var flag = Assert.Single(ArtefactFlags.Find([Table("plv")], [s], evokedSubtracted: true));
        Assert.Equal(ArtefactKind.PowerOutlier, flag.Kind);
        Assert.Equal("C", flag.ChannelA);
        Assert.Null(flag.ChannelB);
        Assert.True(flag.Value < -3.5);
    }

    [Fact]
    public void Equal_powers_give_no_outlier_and_three_channels_are_the_least_that_are_judged()
    {
        Assert.Empty(ArtefactFlags.PowerOutliers([2, 2, 2, 2]));
        Assert.Empty(ArtefactFlags.PowerOutliers([1, 1000]));
        // MAD 0 but one channel differs: the mean absolute deviation takes over (1.253314·mean|x − median|).
        var (channel, score, _) = Assert.Single(ArtefactFlags.PowerOutliers([1, 1, 1, 1, 1000]));
        Assert.Equal(4, channel);
        Assert.Equal(3 / (1.253314 * 3 / 5.0), score, 9);
    }

    [Fact]
    public void The_flag_table_has_a_row_per_flag_with_NA_for_a_missing_second_channel()
    {
        using var folder = new Coupling.Tests.Formats.TempFolder();
        string path = Path.Combine(folder.Path, "flags.tsv");
        var flags = ArtefactFlags.Find([Table("plv")], [Signals(power: [1, 1.2, 0.001, 0.9])], evokedSubtracted: true);
        Assert.Equal(1, Coupling.Outputs.FlagTableWriter.Write(flags, path));
        var lines = File.ReadAllLines(path);
        Assert.Equal(string.Join('\t', Coupling.Outputs.FlagTableWriter.Columns), lines[0]);
        var cells = lines[1].Split('\t');
        Assert.Equal(["power-outlier", "go", "alpha", "C", "NA", ""], cells[..6]);
    }
}
