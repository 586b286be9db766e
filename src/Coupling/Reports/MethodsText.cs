using System.Globalization;
using System.Text.Json.Nodes;
using Coupling.Outputs;

namespace Coupling.Reports;

/// <summary>
/// A methods paragraph a paper can quote, generated from a run's manifest (the plan as parsed, the decomposition
/// parameters actually used, trial counts, time steps, tool version), with the published source of every measure and test
/// it names (<see cref="MethodSources"/>).
/// </summary>
public static class MethodsText
{
    /// <summary>The paragraph and the references it cites, in order of first citation.</summary>
    /// <param name="Paragraph">The methods text, plain (no markup).</param>
    /// <param name="References">Full references of the sources cited.</param>
    public sealed record Methods(string Paragraph, IReadOnlyList<string> References);

    /// <summary>Composes the methods of the run that <paramref name="manifest"/> describes.</summary>
    /// <exception cref="ArgumentException">The manifest holds no plan.</exception>
    public static Methods From(Manifest manifest)
    {
        ArgumentNullException.ThrowIfNull(manifest);
        var plan = manifest.Plan as JsonObject ?? throw new ArgumentException("The manifest holds no plan.", nameof(manifest));
        var inv = CultureInfo.InvariantCulture;
        var cited = new List<MethodSources.Source>();
        string Cite(string key)
        {
            var s = MethodSources.Of(key);
            if (!cited.Contains(s)) cited.Add(s);
            return s.Citation;
        }
        string N(double v) => v.ToString("0.###", inv);

        var parts = new List<string>();
        int channels = manifest.Extra?["channels"] is JsonArray ch ? ch.Count : 0;
        double rate = manifest.Extra?["sample_rate_hz"]?.GetValue<double>() ?? double.NaN;
        string recording = Path.GetFileName(plan["recording"]?.GetValue<string>() ?? "the recording");
        parts.Add($"Connectivity was computed with {manifest.Tool.Name} {ShortVersion(manifest.Tool.Version)} ({manifest.Tool.Runtime}).");
        var conditions = manifest.Conditions.Select(c =>
            $"{c.Condition} ({c.Trials} trials{(c.Dropped.Count > 0 ? $", {c.Dropped.Count} dropped at the recording's edges" : "")})");
        var trial = plan["trial"];
        parts.Add(
            $"The recording ({recording}{(channels > 0 ? $", {channels} channels" : "")}{(double.IsFinite(rate) ? $", sampled at {N(rate)} Hz" : "")}) " +
            $"was cut into trials from {N(Num(trial, "start"))} to {N(Num(trial, "end"))} s around each event onset: {string.Join("; ", conditions)}.");
        parts.Add(plan["subtract_evoked"]?.GetValue<bool>() == true
            ? "Each condition's mean over trials (the evoked response) was subtracted from its trials before band isolation."
            : "The evoked response was kept (not subtracted).");

        var bands = (plan["bands"] as JsonArray ?? []).Select(b => $"{b?["name"]} {N(Num(b, "low"))}-{N(Num(b, "high"))} Hz").ToArray();
        string method = plan["decomposition"]?["method"]?.GetValue<string>() ?? "fir-hilbert";
        if (method == "morlet")
        {
            var cycles = manifest.Decompositions.Select(d => d.Parameters.TryGetValue("cycles", out var c) ? N(c) : "?").Distinct();
            parts.Add($"Each band ({string.Join(", ", bands)}) was isolated by convolution with a unit-energy complex Morlet wavelet at the band " +
                      $"centre ({string.Join(" / ", cycles)} cycles; {Cite("morlet")}).");
        }
        else
        {
            var specs = manifest.Decompositions.Select(d => string.Create(inv,
                $"{d.Band}: {Get(d, "filter_taps"):0} taps, transition {Get(d, "transition_hz"):0.##} Hz, stop-band attenuation {Get(d, "attenuation_db"):0} dB"));
            parts.Add($"Each band ({string.Join(", ", bands)}) was isolated by a zero-phase FIR band-pass filter designed with the Kaiser window " +
                      $"method ({Cite("kaiser")}; {string.Join("; ", specs)}) and the analytic signal computed by the Hilbert transform ({Cite("hilbert")}).");
        }
        var window = plan["window"];
        var steps = manifest.TimeSteps.Select(s => s.Samples).Distinct().ToArray();
        string stepText = steps.Length == 1 ? $"every {steps[0]} sample{(steps[0] == 1 ? "" : "s")}"
            : $"every k samples (k = {string.Join(", ", manifest.TimeSteps.Select(t => $"{t.Samples} for {t.Band}"))})";
        var measures = (plan["measures"] as JsonArray ?? []).Select(m => m!.GetValue<string>()).ToArray();
        var named = measures.Select(m => $"{MeasureName(m)} ({Cite(m)})").ToArray();
        parts.Add(
            $"For every channel pair, {Join(named)} were computed across trials {stepText} of the analysis window {N(Num(window, "start"))} to {N(Num(window, "end"))} s " +
            "and averaged over it" + (measures.Any(m => m.StartsWith("aec", StringComparison.Ordinal))
            ? $"; envelope correlations were computed over the window in each trial and combined across trials with Fisher's z ({Cite("fisher-z")})."
            : "."));
        int surrogates = plan["surrogates"]?.GetValue<int>() ?? 0;
        double q = plan["q"]?.GetValue<double>() ?? 0.05;
        if (surrogates == 0)
        {
            parts.Add("No significance test was made (values only).");
            if (plan["contrasts"] is JsonArray { Count: > 0 } untested)
                parts.Add($"Differences between conditions ({string.Join(", ", untested.Select(c => $"{c?["condition_a"]} vs {c?["condition_b"]}"))}) were computed without a test.");
            return Done();
        }
        parts.Add(
            $"Each value was tested against {surrogates} trial-shuffle surrogates, in which the trials of the second channel were put in a random order " +
            $"(one order per draw shared by all pairs and measures; seed {manifest.Seed}), with p = (b + 1)/(M + 1) ({Cite("permutation-p")}); " +
            "imaginary coherency and the envelope correlations were tested two-sided on their absolute value, the other measures one-sided. " +
            Correction(manifest.Extra?["correction"], q, Cite));
        if (plan["contrasts"] is JsonArray { Count: > 0 } contrasts)
        {
            var names = contrasts.Select(c => $"{c?["condition_a"]} vs {c?["condition_b"]}");
            parts.Add($"Differences between conditions ({string.Join(", ", names)}) were tested by {surrogates} random reassignments of the condition " +
                      $"labels of the pooled trials keeping both group sizes, two-sided ({Cite("label-permutation")}), and corrected in the same way.");
        }
        return Done();

        Methods Done()
        {
            parts.AddRange(SpectrumMethodsText.Sentences(manifest, plan, Cite));
            return new Methods(string.Join(" ", parts), cited.Select(s => s.Reference).ToArray());
        }
    }

    /// <summary>The sentence naming the correction across pairs recorded in the manifest (Benjamini-Hochberg when none is recorded).</summary>
    private static string Correction(JsonNode? correction, double q, Func<string, string> cite)
    {
        string method = correction?["method"]?.GetValue<string>() ?? "benjamini-hochberg";
        double level = correction?["q"]?.GetValue<double>() ?? correction?["alpha"]?.GetValue<double>() ?? q;
        string l = level.ToString("0.###", CultureInfo.InvariantCulture);
        string family = "the channel pairs of each condition, band and measure";
        string text = method switch
        {
            "benjamini-yekutieli" => $"p-values were corrected across {family} with the Benjamini-Yekutieli procedure, valid under any dependence, at a false discovery rate of {l} ({cite("benjamini-yekutieli")}).",
            "max-statistic" => $"Family-wise error across {family} was controlled at {l} by the distribution of the maximum over pairs of the studentised statistic in the same surrogate draws ({cite("max-statistic")}).",
            "network-based" => $"Family-wise error across {family} was controlled at {l} on the extent of connected components of supra-threshold edges, with the null distribution of the largest component from the same surrogate draws ({cite("network-based")}).",
            "none" => $"No correction across pairs was applied; each pair was tested at {l}.",
            _ => $"p-values were corrected across {family} with the Benjamini-Hochberg procedure at a false discovery rate of {l} ({cite("fdr-bh")}).",
        };
        if (correction?["p_values"]?.GetValue<string>() is { } pv && pv.Contains("Pareto", StringComparison.Ordinal))
            text += $" p-values in the far tail were refined by a generalised Pareto fit to the surrogate tail ({cite("pareto-tail")}).";
        return text;
    }

    /// <summary>The measure's name as a methods section writes it.</summary>
    public static string MeasureName(string key) => key switch
    {
        "plv" => "the phase-locking value",
        "ppc" => "the pairwise phase consistency",
        "pli" => "the phase-lag index",
        "wpli" => "the weighted phase-lag index",
        "wpli-debiased" => "the debiased squared weighted phase-lag index",
        "coherence" => "magnitude-squared coherence",
        "imag-coherency" => "the imaginary part of coherency",
        "aec" => "the amplitude-envelope correlation",
        "aec-orth" => "the amplitude-envelope correlation of orthogonalized signals",
        _ => key,
    };

    private static double Num(JsonNode? node, string key) => node?[key]?.GetValue<double>() ?? double.NaN;

    private static double Get(Spectral.DecompositionInfo d, string key) => d.Parameters.TryGetValue(key, out var v) ? v : double.NaN;

    private static string ShortVersion(string version) => version.Split('+')[0];

    /// <summary>"a", "a and b", "a, b and c".</summary>
    internal static string Join(IReadOnlyList<string> items) => items.Count switch
    {
        0 => "no measure",
        1 => items[0],
        _ => string.Join(", ", items.Take(items.Count - 1)) + " and " + items[^1],
    };
}
