using System.Globalization;
using System.Text.Json.Nodes;
using Coupling.Outputs;

namespace Coupling.Reports;

/// <summary>
/// The sentences of the methods paragraph (<see cref="MethodsText"/>) on the plan's <c>spectrum</c> key: what was
/// computed per frequency and time bin, and the cluster-based permutation test over the map (docs/methods.md,
/// sections 11 to 13), from the plan and the <c>extra.spectrum</c> node the manifest records.
/// </summary>
internal static class SpectrumMethodsText
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The sentences; none when the manifest's plan has no <c>spectrum</c> key.</summary>
    /// <param name="manifest">The run's manifest.</param>
    /// <param name="plan">The manifest's plan (snake_case keys, kebab-case measure keys).</param>
    /// <param name="cite">Returns the in-text citation of a <see cref="MethodSources"/> key and records it as cited.</param>
    public static IReadOnlyList<string> Sentences(Manifest manifest, JsonObject plan, Func<string, string> cite)
    {
        if (plan["spectrum"] is not JsonObject spec) return [];
        var recorded = manifest.Extra?["spectrum"];
        var parts = new List<string>();
        // Pairs are named as the tables name them: the channel that comes first in the recording first.
        var order = (manifest.Extra?["channels"] as JsonArray ?? []).Select(c => c?.GetValue<string>() ?? "").ToList();
        string PairName(JsonNode? pair)
        {
            string a = pair?["a"]?.ToString() ?? "", b = pair?["b"]?.ToString() ?? "";
            int ia = order.IndexOf(a), ib = order.IndexOf(b);
            return ia >= 0 && ib >= 0 && ib < ia ? $"{b}-{a}" : $"{a}-{b}";
        }

        var pairs = spec["pairs"] is JsonArray listed
            ? $"the channel pair{(listed.Count == 1 ? "" : "s")} {string.Join(", ", listed.Select(PairName))}"
            : "every channel pair";
        var measures = (spec["measures"] as JsonArray ?? []).Select(m => MethodsText.MeasureName(m!.GetValue<string>())).ToArray();
        var frequencies = (spec["frequencies"] as JsonArray ?? []).Select(f => f!.GetValue<double>()).ToArray();
        string method = spec["method"]?.GetValue<string>() ?? "morlet";
        string how = method == "morlet"
            ? $"by convolution with a unit-energy complex Morlet wavelet of {N(Num(spec, "cycles"))} cycles at each frequency ({cite("morlet")})"
            : $"from the Fourier coefficients of each trial's mean-removed segment under discrete prolate spheroidal (DPSS) tapers ({cite("slepian")}) " +
              $"of half-bandwidth {N(Num(spec, "half_bandwidth_hz"))} Hz{Tapers(recorded)}, each trial and taper counting as one observation " +
              $"(the multitaper method; {cite("thomson")})";
        parts.Add($"For {pairs}, {MethodsText.Join(measures)} {(measures.Length == 1 ? "was" : "were")} also computed at {Frequencies(frequencies)}, {how}, " +
                  $"over the analysis window{TimeBins(spec["time"], recorded)}.");
        if (spec["time"]?["baseline"] is JsonObject baseline)
            parts.Add($"Time-resolved values were expressed as their change from the baseline {N(Num(baseline, "start"))} to {N(Num(baseline, "end"))} s: " +
                      "the value less the mean of the bins centred in the baseline, per frequency.");

        if (spec["cluster_test"] is JsonObject test) parts.Add(ClusterTest(test, recorded?["cluster_test"], plan, spec["time"] is not null, cite, PairName));
        return parts;
    }

    private static string ClusterTest(JsonObject test, JsonNode? recorded, JsonObject plan, bool timeResolved, Func<string, string> cite,
        Func<JsonNode?, string> pairName)
    {
        string a = test["condition_a"]?.GetValue<string>() ?? "A", b = test["condition_b"]?.GetValue<string>() ?? "B";
        string trials = recorded?["trials"] is JsonArray { Count: 2 } t ? $" ({t[0]} and {t[1]} trials)" : "";
        int draws = recorded?["draws"]?.GetValue<int>() ?? test["draws"]?.GetValue<int>() ?? 0;
        string seed = recorded?["seed"] is JsonValue s ? $"; seed {s.GetValue<ulong>().ToString(Inv)}" : "";
        double threshold = recorded?["threshold"]?.GetValue<double>() ?? Num(test, "threshold");
        string z = recorded?["z_threshold"] is JsonValue zv ? $"|z| > {zv.GetValue<double>().ToString("0.###", Inv)}, " : "";
        string map = timeResolved ? "frequency-by-time map" : "map over frequencies";
        // What the test recorded it did; a manifest without that field falls back on the plan, which decided it.
        bool removed = recorded?["evoked"] is JsonValue e
            ? e.GetValue<string>() == Pipeline.SpectrumWriter.EvokedRemovedPerGroup
            : plan["subtract_evoked"]?.GetValue<bool>() == true;
        string evoked = removed
            ? "; in every labelling, the observed one included, each group's mean over its trials (the evoked response) was removed from its trials"
            : "";
        return $"The difference {a} minus {b} in {MethodsText.MeasureName(test["measure"]?.GetValue<string>() ?? "")} of the pair " +
               $"{pairName(test["pair"])}{trials} was tested over the {map} by a cluster-based permutation test ({cite("cluster-permutation")}): " +
               $"{draws.ToString(Inv)} random permutations of the condition labels of the pooled trials keeping both group sizes{seed}{evoked}. " +
               $"At each cell the difference was standardised by its mean and standard deviation over all {(draws + 1).ToString(Inv)} labellings; " +
               $"cells beyond the threshold ({z}two-sided pointwise level {N(threshold)}) that share an edge and a sign formed clusters, " +
               "a cluster's mass was the sum of its standardised differences and each labelling's statistic the largest absolute mass among its clusters; " +
               "a cluster's p = (1 + b)/(M + 1), b the permutations whose largest absolute mass reached its own, " +
               $"controls the family-wise error over the whole map ({cite("permutation-p")}).";
    }

    private static string Tapers(JsonNode? recorded) => recorded?["tapers_per_window"] is JsonArray { Count: > 0 } k
        ? $" ({k[0]} tapers over the analysis window{(k.Count > 1 ? $", {k[1]} per time bin" : "")})"
        : "";

    private static string TimeBins(JsonNode? time, JsonNode? recorded)
    {
        if (time is null) return "";
        double width = Num(time, "width"), step = Num(time, "step");
        var centres = (recorded?["time_bins_s"] as JsonArray ?? []).Select(c => c!.GetValue<double>()).ToArray();
        string span = centres.Length > 0 ? $" (centres {N(centres[0])} to {N(centres[^1])} s)" : "";
        string count = centres.Length > 0 ? $"{centres.Length} " : "";
        return width == 0
            ? $" and at {count}single time points every {N(step)} s{span}"
            : $" and in {count}time bins {N(width)} s wide every {N(step)} s{span}";
    }

    private static string Frequencies(IReadOnlyList<double> f) => f.Count switch
    {
        0 => "no frequency",
        1 => $"{N(f[0])} Hz",
        <= 12 => $"{f.Count} frequencies ({string.Join(", ", f.Select(N))} Hz)",
        _ => $"{f.Count} frequencies from {N(f[0])} to {N(f[^1])} Hz",
    };

    private static double Num(JsonNode? node, string key) => node?[key]?.GetValue<double>() ?? double.NaN;

    private static string N(double v) => v.ToString("0.###", Inv);
}
