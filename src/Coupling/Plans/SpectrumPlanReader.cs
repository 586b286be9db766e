using System.Globalization;
using Coupling.Measures;
using Coupling.TimeFrequency;
using YamlDotNet.RepresentationModel;

namespace Coupling.Plans;

/// <summary>Reads and checks the plan's <c>spectrum</c> key (docs/user-guide.md lists its keys).</summary>
internal static class SpectrumPlanReader
{
    /// <summary>Keys allowed under <c>spectrum</c>.</summary>
    public static readonly IReadOnlyList<string> Keys =
        ["frequencies", "method", "cycles", "half_bandwidth", "pairs", "measures", "time", "cluster_test", "figure_pair"];

    /// <summary>Most frequencies a spectrum may list.</summary>
    public const int MaxFrequencies = 500;

    private const double DefaultCycles = 5;
    private const double DefaultHalfBandwidth = 2;

    public static SpectrumSpec Read(PlanReader.Context ctx, YamlNode node, IReadOnlyList<ConditionSpec> conditions,
        IReadOnlyList<Measure> planMeasures, TimeRange trial, int surrogates)
    {
        var m = ctx.Keys(node, "spectrum", Keys);
        string method = m.TryGetValue("method", out var mn) ? ctx.Scalar(mn, "spectrum.method") : "morlet";
        if (method is not ("morlet" or "multitaper"))
            throw ctx.Error(mn!, "spectrum.method", $"'{method}' is not allowed; use 'morlet' or 'multitaper'");
        var frequencies = ReadFrequencies(ctx, ctx.Required(m, node, "frequencies", "spectrum"));
        if (method == "multitaper" && m.TryGetValue("cycles", out var cy0))
            throw ctx.Error(cy0, "spectrum.cycles", "'cycles' applies to method 'morlet' only");
        if (method == "morlet" && m.TryGetValue("half_bandwidth", out var hb0))
            throw ctx.Error(hb0, "spectrum.half_bandwidth", "'half_bandwidth' applies to method 'multitaper' only");
        double cycles = m.TryGetValue("cycles", out var cy) ? ctx.Positive(cy, "spectrum.cycles") : DefaultCycles;
        double halfBandwidth = m.TryGetValue("half_bandwidth", out var hb) ? ctx.Positive(hb, "spectrum.half_bandwidth") : DefaultHalfBandwidth;

        IReadOnlyList<ChannelPairSpec>? pairs = null;
        if (m.TryGetValue("pairs", out var pn) && !(pn is YamlScalarNode { Value: "all" }))
        {
            if (pn is not YamlSequenceNode seq || seq.Children.Count == 0)
                throw ctx.Error(pn, "spectrum.pairs", "expected 'all' or a list of channel pairs, e.g. [[C3, C4], [Fz, Pz]]");
            var list = new List<ChannelPairSpec>();
            foreach (var item in seq.Children)
            {
                var pair = ReadPair(ctx, item, "spectrum.pairs");
                if (list.Any(p => p.SameAs(pair))) throw ctx.Error(item, "spectrum.pairs", $"the pair {pair.A}, {pair.B} is listed twice");
                list.Add(pair);
            }
            pairs = list;
        }

        var time = m.TryGetValue("time", out var tn) ? ReadTime(ctx, tn, trial, method) : null;
        var supported = Supported(method, time);
        IReadOnlyList<Measure> measures;
        if (m.TryGetValue("measures", out var ms) && !(ms is YamlScalarNode { Value: "all" }))
        {
            var list = new List<Measure>();
            foreach (var key in ctx.StringList(ms, "spectrum.measures", unique: true))
            {
                var measure = ParseMeasure(ctx, ms, "spectrum.measures", key);
                if (!supported.Contains(measure))
                    throw ctx.Error(ms, "spectrum.measures", $"'{key}' cannot be computed here; {Why(method, time)}");
                list.Add(measure);
            }
            measures = list;
        }
        else
        {
            var source = ms is null ? planMeasures : MeasureCatalog.All;
            measures = source.Where(supported.Contains).ToArray();
            if (measures.Count == 0)
                throw ctx.Error(node, "spectrum.measures", $"none of the plan's measures can be computed here ({Why(method, time)}); list some under spectrum.measures");
        }

        ClusterTestSpec? cluster = null;
        if (m.TryGetValue("cluster_test", out var cn))
            cluster = ReadClusterTest(ctx, cn, conditions, measures, surrogates);

        ChannelPairSpec? figurePair = null;
        if (m.TryGetValue("figure_pair", out var fp))
        {
            figurePair = ReadPair(ctx, fp, "spectrum.figure_pair");
            if (pairs is not null && !pairs.Any(p => p.SameAs(figurePair)))
                throw ctx.Error(fp, "spectrum.figure_pair", $"{figurePair.A}, {figurePair.B} is not among spectrum.pairs");
        }
        return new SpectrumSpec(method, frequencies, cycles, halfBandwidth, pairs, measures, time, cluster, figurePair);
    }

    /// <summary>The measures a method can compute with the given time bins.</summary>
    public static IReadOnlyList<Measure> Supported(string method, TimeCourseSpec? time) =>
        method == "multitaper" ? MultitaperCells.Measures
        : time is { Width: 0 } ? MeasureCatalog.All.Where(x => x is not (Measure.Aec or Measure.AecOrth)).ToArray()
        : MeasureCatalog.All;

    private static string Why(string method, TimeCourseSpec? time) => method == "multitaper"
        ? $"multitaper offers {string.Join(", ", MultitaperCells.Measures.Select(MeasureCatalog.Key))} (see docs/methods.md)"
        : time is { Width: 0 } ? "envelope correlations need bins of a positive width (spectrum.time.width)"
        : "unknown reason";

    private static Measure ParseMeasure(PlanReader.Context ctx, YamlNode node, string key, string value)
    {
        try { return MeasureCatalog.Parse(value); }
        catch (InputException)
        {
            throw ctx.Error(node, key, $"'{value}' is not a known measure; allowed: {string.Join(", ", MeasureCatalog.All.Select(MeasureCatalog.Key))}");
        }
    }

    private static IReadOnlyList<double> ReadFrequencies(PlanReader.Context ctx, YamlNode node)
    {
        const string key = "spectrum.frequencies";
        List<double> list;
        if (node is YamlMappingNode)
        {
            var r = ctx.Keys(node, key, ["from", "to", "step"]);
            double from = ctx.Positive(ctx.Required(r, node, "from", key), $"{key}.from");
            double to = ctx.Positive(ctx.Required(r, node, "to", key), $"{key}.to");
            double step = ctx.Positive(ctx.Required(r, node, "step", key), $"{key}.step");
            if (!(to >= from)) throw ctx.Error(node, key, $"'to' ({Fmt(to)} Hz) must not be below 'from' ({Fmt(from)} Hz)");
            long count = (long)Math.Floor((to - from) / step + 1e-9) + 1;
            if (count > MaxFrequencies) throw ctx.Error(node, key, $"{count} frequencies; at most {MaxFrequencies}");
            // Each frequency from + i step is rounded to 1e-9 Hz so that decimal steps give the values a reader expects.
            list = Enumerable.Range(0, (int)count).Select(i => Math.Round(from + i * step, 9)).ToList();
        }
        else
        {
            if (node is not YamlSequenceNode seq || seq.Children.Count == 0)
                throw ctx.Error(node, key, "expected a list of frequencies in Hz, e.g. [4, 6, 8], or {from: 4, to: 40, step: 2}");
            list = seq.Children.Select(c => ctx.Positive(c, key)).ToList();
            if (list.Count > MaxFrequencies) throw ctx.Error(node, key, $"{list.Count} frequencies; at most {MaxFrequencies}");
            for (int i = 1; i < list.Count; i++)
                if (!(list[i] > list[i - 1]))
                    throw ctx.Error(seq.Children[i], key, $"frequencies must increase, but {Fmt(list[i])} Hz follows {Fmt(list[i - 1])} Hz");
        }
        return list;
    }

    private static ChannelPairSpec ReadPair(PlanReader.Context ctx, YamlNode node, string key)
    {
        if (node is not YamlSequenceNode pair || pair.Children.Count != 2)
            throw ctx.Error(node, key, "each pair is a list of two channel labels, e.g. [C3, C4]");
        string a = ctx.Scalar(pair.Children[0], key), b = ctx.Scalar(pair.Children[1], key);
        if (a == b) throw ctx.Error(node, key, $"'{a}' is paired with itself; a pair needs two different channels");
        return new ChannelPairSpec(a, b);
    }

    private static TimeCourseSpec ReadTime(PlanReader.Context ctx, YamlNode node, TimeRange trial, string method)
    {
        var t = ctx.Keys(node, "spectrum.time", ["width", "step", "baseline"]);
        double width = ctx.Number(ctx.Required(t, node, "width", "spectrum.time"), "spectrum.time.width");
        if (width < 0) throw ctx.Error(t["width"], "spectrum.time.width", $"expected 0 (single time points) or a positive width in s, got {Fmt(width)}");
        if (width == 0 && method == "multitaper")
            throw ctx.Error(t["width"], "spectrum.time.width", "multitaper needs bins of a positive width (a segment per bin)");
        if (width > trial.Length)
            throw ctx.Error(t["width"], "spectrum.time.width", $"{Fmt(width)} s is longer than the trial span ({Fmt(trial.Length)} s)");
        double step = ctx.Positive(ctx.Required(t, node, "step", "spectrum.time"), "spectrum.time.step");
        TimeRange? baseline = null;
        if (t.TryGetValue("baseline", out var bn))
        {
            var b = ctx.Keys(bn, "spectrum.time.baseline", ["start", "end"]);
            double start = ctx.Number(ctx.Required(b, bn, "start", "spectrum.time.baseline"), "spectrum.time.baseline.start");
            double end = ctx.Number(ctx.Required(b, bn, "end", "spectrum.time.baseline"), "spectrum.time.baseline.end");
            if (!(end > start)) throw ctx.Error(bn, "spectrum.time.baseline", $"end ({Fmt(end)} s) must be after start ({Fmt(start)} s)");
            if (start < trial.Start || end > trial.End)
                throw ctx.Error(bn, "spectrum.time.baseline", $"the baseline {Fmt(start)}..{Fmt(end)} s must lie inside the trial span {Fmt(trial.Start)}..{Fmt(trial.End)} s");
            baseline = new TimeRange(start, end);
        }
        return new TimeCourseSpec(width, step, baseline);
    }

    private static ClusterTestSpec ReadClusterTest(PlanReader.Context ctx, YamlNode node, IReadOnlyList<ConditionSpec> conditions,
        IReadOnlyList<Measure> measures, int surrogates)
    {
        const string key = "spectrum.cluster_test";
        var c = ctx.Keys(node, key, ["pair", "measure", "conditions", "threshold", "draws"]);
        var pair = ReadPair(ctx, ctx.Required(c, node, "pair", key), $"{key}.pair");
        var measureNode = ctx.Required(c, node, "measure", key);
        var measure = ParseMeasure(ctx, measureNode, $"{key}.measure", ctx.Scalar(measureNode, $"{key}.measure"));
        if (!measures.Contains(measure))
            throw ctx.Error(measureNode, $"{key}.measure", $"'{MeasureCatalog.Key(measure)}' is not among the spectrum's measures ({string.Join(", ", measures.Select(MeasureCatalog.Key))})");
        var names = ctx.StringList(ctx.Required(c, node, "conditions", key), $"{key}.conditions", unique: true);
        if (names.Count != 2) throw ctx.Error(c["conditions"], $"{key}.conditions", "expected two condition names, e.g. [cue, rest]");
        foreach (var name in names)
            if (!conditions.Any(x => x.Name == name))
                throw ctx.Error(c["conditions"], $"{key}.conditions", $"'{name}' is not a condition of the plan; conditions: {string.Join(", ", conditions.Select(x => x.Name))}");
        double threshold = 0.05;
        if (c.TryGetValue("threshold", out var th))
        {
            threshold = ctx.Number(th, $"{key}.threshold");
            if (!(threshold > 0 && threshold < 1)) throw ctx.Error(th, $"{key}.threshold", $"expected a level between 0 and 1, got {Fmt(threshold)}");
        }
        if (!c.ContainsKey("draws") && surrogates < 1)
            throw ctx.Error(node, $"{key}.draws", "the plan draws no surrogates (surrogates: 0), so give the cluster test's own number of draws");
        int draws = c.TryGetValue("draws", out var dr) ? ctx.Int(dr, $"{key}.draws", 1, 1_000_000) : surrogates;
        return new ClusterTestSpec(pair, measure, names[0], names[1], threshold, draws);
    }

    private static string Fmt(double v) => v.ToString("G6", CultureInfo.InvariantCulture);
}
