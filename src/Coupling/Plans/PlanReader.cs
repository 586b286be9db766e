using System.Globalization;
using Coupling.Measures;
using Coupling.Spectral;
using Coupling.Statistics;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace Coupling.Plans;

/// <summary>
/// Reads and checks a YAML plan file. Every key is checked: an unknown key, a missing required key or a value of the
/// wrong kind raises an <see cref="InputException"/> naming the file, the line, the key and what is allowed.
/// </summary>
/// <remarks>The plan keys are listed in docs/user-guide.md.</remarks>
public static class PlanReader
{
    /// <summary>Top-level keys a plan may hold.</summary>
    public static readonly IReadOnlyList<string> TopLevelKeys =
    [
        "recording", "events", "channels", "sample_rate", "epochs", "conditions", "trial", "window", "evoked",
        "bands", "decomposition", "measures", "surrogates", "seed", "correction", "output", "figures", "threads",
        "contrasts", "overwrite", "truncated_recording", "unusable_data", "intervals", "match_trials", "direction", "surrogate_figure", "spectrum",
    ];

    /// <summary>Fewest surrogate draws the <c>surrogates</c> key allows (0: values without a test).</summary>
    public const int MinSurrogates = 0;

    /// <summary>Most surrogate draws the <c>surrogates</c> key allows.</summary>
    public const int MaxSurrogates = 1_000_000;

    /// <summary>Reads the plan at <paramref name="path"/>; relative paths inside it are taken from the plan's folder.</summary>
    public static Plan Read(string path)
    {
        if (Directory.Exists(path)) throw new InputException($"{path}: is a folder; expected a plan file (YAML).");
        if (!File.Exists(path)) throw new InputException($"{path}: plan file not found.");
        string text;
        try { text = File.ReadAllText(path); }
        catch (Exception e) when (FileErrors.IsFileError(e)) { throw FileErrors.Reading(path, "plan file", e); }
        return Parse(new StringReader(text), Path.GetFullPath(path));
    }

    /// <summary>Parses plan text; <paramref name="source"/> names it in errors and anchors relative paths.</summary>
    public static Plan Parse(TextReader text, string source)
    {
        string all = text.ReadToEnd();
        var stream = new YamlStream();
        try { stream.Load(new StringReader(all)); }
        catch (YamlException e)
        {
            throw new InputException($"{source}, line {e.Start.Line}: not valid YAML ({e.Message.Trim().TrimEnd('.')}).", e);
        }
        catch (InvalidOperationException e)
        {
            // YamlDotNet's scanner gives up this way when the text ends inside an open flow collection or quote.
            int last = all.TrimEnd().Split('\n').Length;
            throw new InputException($"{source}, line {last}: not valid YAML (the text ends inside an unclosed '[', '{{' or quote).", e);
        }
        if (stream.Documents.Count == 0 || stream.Documents[0].RootNode is not YamlMappingNode root)
            throw new InputException($"{source}: the plan must be a YAML mapping of keys to values (e.g. 'recording: data.edf').");
        var ctx = new Context(source, Path.GetDirectoryName(source) ?? ".");
        var map = ctx.Keys(root, "the plan", TopLevelKeys);

        string recording = ctx.Path(ctx.Required(map, root, "recording", "the plan"), "recording");
        string ext = System.IO.Path.GetExtension(recording).ToLowerInvariant();
        if (ext is not (".edf" or ".bdf" or ".csv" or ".npy"))
            throw ctx.Error(map["recording"], "recording", $"'{recording}' has extension '{ext}'; expected .edf (EDF/EDF+), .bdf (BDF/BDF+), .csv or .npy");

        double? sampleRate = map.TryGetValue("sample_rate", out var sr) ? ctx.Positive(sr, "sample_rate") : null;
        if (ext is ".csv" or ".npy" && sampleRate is null)
            throw ctx.Error(root, "sample_rate", $"a {ext} recording carries no sampling rate; give 'sample_rate' in Hz");

        EpochsSpec? epochs = null;
        if (map.TryGetValue("epochs", out var ep)) epochs = ReadEpochs(ctx, ep);
        if (ext == ".npy" && epochs is null)
            throw ctx.Error(root, "epochs", "an .npy recording holds epochs (trials x channels x samples); give 'epochs' with first_sample_time, labels and channel_labels");
        if (ext != ".npy" && epochs is not null)
            throw ctx.Error(ep!, "epochs", "'epochs' applies only to .npy recordings");

        var conditions = ReadConditions(ctx, ctx.Required(map, root, "conditions", "the plan"));
        var contrasts = map.TryGetValue("contrasts", out var cn) ? ReadContrasts(ctx, cn, conditions) : [];
        var trial = ReadRange(ctx, ctx.Required(map, root, "trial", "the plan"), "trial");
        var window = ReadRange(ctx, ctx.Required(map, root, "window", "the plan"), "window");
        if (window.Start < trial.Start || window.End > trial.End)
            throw ctx.Error(map["window"], "window",
                $"the window {Fmt(window.Start)}..{Fmt(window.End)} s must lie inside the trial span {Fmt(trial.Start)}..{Fmt(trial.End)} s");

        bool subtract = false;
        if (map.TryGetValue("evoked", out var ev))
        {
            string v = ctx.Scalar(ev, "evoked");
            subtract = v switch
            {
                "keep" => false,
                "subtract" => true,
                _ => throw ctx.Error(ev, "evoked", $"'{v}' is not allowed; use 'keep' or 'subtract'"),
            };
        }

        var bands = ReadBands(ctx, ctx.Required(map, root, "bands", "the plan"));
        var decomposition = map.TryGetValue("decomposition", out var dn)
            ? ReadDecomposition(ctx, dn)
            : new DecompositionSpec("fir-hilbert", null, null, null, null);
        var measures = ReadMeasures(ctx, ctx.Required(map, root, "measures", "the plan"));

        int surrogates = map.TryGetValue("surrogates", out var su) ? ctx.Int(su, "surrogates", MinSurrogates, MaxSurrogates) : 1000;
        ulong seed = 0;
        if (map.TryGetValue("seed", out var se))
        {
            string s = ctx.Scalar(se, "seed");
            if (!ulong.TryParse(s, NumberStyles.None, CultureInfo.InvariantCulture, out seed))
                throw ctx.Error(se, "seed", $"'{s}' is not a non-negative whole number");
        }
        else throw ctx.Error(root, "seed", "give a 'seed' (a non-negative whole number) so the surrogates can be reproduced");

        var (correction, q) = map.TryGetValue("correction", out var co) ? ReadCorrection(ctx, co) : (CorrectionSpec.Default, 0.05);

        bool jackknife = false;
        if (map.TryGetValue("intervals", out var iv))
        {
            string v = ctx.Scalar(iv, "intervals");
            jackknife = v switch
            {
                "none" => false,
                "jackknife" => true,
                _ => throw ctx.Error(iv, "intervals", $"'{v}' is not allowed; use 'none' or 'jackknife' (leave-one-trial-out 95 % intervals)"),
            };
        }
        int matchTrials = map.TryGetValue("match_trials", out var mt) ? ctx.Int(mt, "match_trials", 0, 100_000) : 0;

        string output = ctx.Path(ctx.Required(map, root, "output", "the plan"), "output");
        bool figures = !map.TryGetValue("figures", out var fi) || ctx.Bool(fi, "figures");
        bool overwrite = map.TryGetValue("overwrite", out var ow) && ctx.Bool(ow, "overwrite");
        int threads = map.TryGetValue("threads", out var th) ? ctx.Int(th, "threads", 0, 4096) : 0;
        var surrogateFigure = map.TryGetValue("surrogate_figure", out var sf) ? ReadSurrogateFigure(ctx, sf, conditions, bands, measures) : null;
        bool keepComplete = map.TryGetValue("truncated_recording", out var tr)
            && ctx.Choice(tr, "truncated_recording", ["refuse", "keep-complete-records"]) == "keep-complete-records";
        var spectrum = map.TryGetValue("spectrum", out var sp) ? SpectrumPlanReader.Read(ctx, sp, conditions, measures, trial, surrogates) : null;

        return new Plan
        {
            Source = source,
            Recording = recording,
            Events = map.TryGetValue("events", out var evf) ? ctx.Path(evf, "events") : null,
            Channels = map.TryGetValue("channels", out var ch) ? ctx.StringList(ch, "channels", unique: true) : null,
            SampleRate = sampleRate,
            Epochs = epochs,
            Conditions = conditions,
            Contrasts = contrasts,
            Trial = trial,
            Window = window,
            SubtractEvoked = subtract,
            Bands = bands,
            Decomposition = decomposition,
            Measures = measures,
            Surrogates = surrogates,
            Seed = seed,
            Q = q,
            Correction = correction,
            JackknifeIntervals = jackknife,
            MatchTrials = matchTrials,
            Direction = map.TryGetValue("direction", out var dr) && ctx.Bool(dr, "direction"),
            Output = output,
            Figures = figures,
            Overwrite = overwrite,
            Threads = threads,
            SurrogateFigure = surrogateFigure,
            KeepCompleteRecords = keepComplete,
            UnusableData = map.TryGetValue("unusable_data", out var ud) ? ctx.Choice(ud, "unusable_data", Pipeline.UnusableData.Policies) : Pipeline.UnusableData.Refuse,
            KeyLines = KeyLines(root),
            Spectrum = spectrum,
        };
    }

    /// <summary>The line of every top-level key and of every key one level below it ("bands.theta").</summary>
    private static Dictionary<string, int> KeyLines(YamlMappingNode root)
    {
        var lines = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var (k, v) in root.Children)
        {
            if (k is not YamlScalarNode { Value: { } key }) continue;
            lines.TryAdd(key, (int)k.Start.Line);
            if (v is YamlMappingNode inner)
                foreach (var (ik, _) in inner.Children)
                    if (ik is YamlScalarNode { Value: { } name }) lines.TryAdd($"{key}.{name}", (int)ik.Start.Line);
        }
        return lines;
    }

    private static SurrogateFigureSpec ReadSurrogateFigure(Context ctx, YamlNode node, IReadOnlyList<ConditionSpec> conditions,
        IReadOnlyList<Band> bands, IReadOnlyList<Measure> measures)
    {
        const string key = "surrogate_figure";
        var m = ctx.Keys(node, key, ["condition", "band", "measure", "channels"]);
        string condition = ctx.Scalar(ctx.Required(m, node, "condition", key), $"{key}.condition");
        if (!conditions.Any(c => c.Name == condition))
            throw ctx.Error(m["condition"], $"{key}.condition", $"'{condition}' is not a condition of the plan; conditions: {string.Join(", ", conditions.Select(c => c.Name))}");
        string band = ctx.Scalar(ctx.Required(m, node, "band", key), $"{key}.band");
        if (!bands.Any(b => b.Name == band))
            throw ctx.Error(m["band"], $"{key}.band", $"'{band}' is not a band of the plan; bands: {string.Join(", ", bands.Select(b => b.Name))}");
        string measure = ctx.Scalar(ctx.Required(m, node, "measure", key), $"{key}.measure");
        if (!measures.Any(x => MeasureCatalog.Key(x) == measure))
            throw ctx.Error(m["measure"], $"{key}.measure", $"'{measure}' is not a measure of the plan; measures: {string.Join(", ", measures.Select(MeasureCatalog.Key))}");
        var channels = ctx.StringList(ctx.Required(m, node, "channels", key), $"{key}.channels", unique: true);
        if (channels.Count != 2)
            throw ctx.Error(m["channels"], $"{key}.channels", $"expected two channel labels, e.g. [C3, C4], got {channels.Count}");
        return new SurrogateFigureSpec(condition, band, measure, channels[0], channels[1]);
    }

    private static IReadOnlyList<ContrastSpec> ReadContrasts(Context ctx, YamlNode node, IReadOnlyList<ConditionSpec> conditions)
    {
        if (node is not YamlSequenceNode seq || seq.Children.Count == 0)
            throw ctx.Error(node, "contrasts", "expected a non-empty list of condition pairs, e.g. [[cue, rest]]");
        var names = conditions.Select(c => c.Name).ToArray();
        var list = new List<ContrastSpec>();
        foreach (var item in seq.Children)
        {
            if (item is not YamlSequenceNode pair || pair.Children.Count != 2)
                throw ctx.Error(item, "contrasts", "each contrast is a list of two condition names, e.g. [cue, rest]");
            string a = ctx.Scalar(pair.Children[0], "contrasts"), b = ctx.Scalar(pair.Children[1], "contrasts");
            foreach (var name in new[] { a, b })
                if (!names.Contains(name, StringComparer.Ordinal))
                    throw ctx.Error(item, "contrasts", $"'{name}' is not a condition of the plan; conditions: {string.Join(", ", names)}");
            if (a == b) throw ctx.Error(item, "contrasts", $"'{a}' is contrasted with itself; a contrast needs two different conditions");
            var spec = new ContrastSpec(a, b);
            if (list.Any(c => c.Covers(spec)))
                throw ctx.Error(item, "contrasts", $"the contrast of '{a}' and '{b}' is listed twice");
            list.Add(spec);
        }
        return list;
    }

    private static EpochsSpec ReadEpochs(Context ctx, YamlNode node)
    {
        var m = ctx.Keys(node, "epochs", ["first_sample_time", "labels", "channel_labels"]);
        double first = ctx.Number(ctx.Required(m, node, "first_sample_time", "epochs"), "epochs.first_sample_time");
        string labels = ctx.Path(ctx.Required(m, node, "labels", "epochs"), "epochs.labels");
        var channels = ctx.StringList(ctx.Required(m, node, "channel_labels", "epochs"), "epochs.channel_labels", unique: true);
        return new EpochsSpec(first, labels, channels);
    }

    private static IReadOnlyList<ConditionSpec> ReadConditions(Context ctx, YamlNode node)
    {
        if (node is not YamlMappingNode map || map.Children.Count == 0)
            throw ctx.Error(node, "conditions", "expected a mapping of condition names to event labels, e.g. 'cue: [cue-left, cue-right]'");
        var list = new List<ConditionSpec>();
        var seenLabels = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (k, v) in map.Children)
        {
            string name = ctx.Scalar(k, "conditions");
            CheckName(ctx, k, "conditions", name);
            var labels = v is YamlScalarNode ? [ctx.Scalar(v, $"conditions.{name}")] : ctx.StringList(v, $"conditions.{name}", unique: true);
            foreach (var l in labels)
                if (!seenLabels.TryAdd(l, name))
                    throw ctx.Error(v, $"conditions.{name}", $"event label '{l}' already belongs to condition '{seenLabels[l]}'; a trial can belong to one condition only");
            list.Add(new ConditionSpec(name, labels));
        }
        return list;
    }

    private static TimeRange ReadRange(Context ctx, YamlNode node, string key)
    {
        var m = ctx.Keys(node, key, ["start", "end"]);
        double start = ctx.Number(ctx.Required(m, node, "start", key), $"{key}.start");
        double end = ctx.Number(ctx.Required(m, node, "end", key), $"{key}.end");
        if (!(end > start)) throw ctx.Error(node, key, $"end ({Fmt(end)} s) must be after start ({Fmt(start)} s)");
        return new TimeRange(start, end);
    }

    private static IReadOnlyList<Band> ReadBands(Context ctx, YamlNode node)
    {
        if (node is not YamlMappingNode map || map.Children.Count == 0)
            throw ctx.Error(node, "bands", "expected a mapping of band names to [low, high] in Hz, e.g. 'theta: [4, 8]'");
        var bands = new List<Band>();
        foreach (var (k, v) in map.Children)
        {
            string name = ctx.Scalar(k, "bands");
            CheckName(ctx, k, "bands", name);
            if (v is not YamlSequenceNode seq || seq.Children.Count != 2)
                throw ctx.Error(v, $"bands.{name}", "expected [low, high] in Hz");
            double lo = ctx.Number(seq.Children[0], $"bands.{name}"), hi = ctx.Number(seq.Children[1], $"bands.{name}");
            if (!(lo > 0) || !(hi > lo))
                throw ctx.Error(v, $"bands.{name}", $"expected 0 < low < high, got [{Fmt(lo)}, {Fmt(hi)}]");
            bands.Add(new Band(name, lo, hi));
        }
        return bands;
    }

    private static DecompositionSpec ReadDecomposition(Context ctx, YamlNode node)
    {
        var m = ctx.Keys(node, "decomposition", ["method", "transition", "attenuation", "cycles", "time_step", "edge_effects"]);
        string method = m.TryGetValue("method", out var mn) ? ctx.Scalar(mn, "decomposition.method") : "fir-hilbert";
        if (method is not ("fir-hilbert" or "morlet"))
            throw ctx.Error(mn!, "decomposition.method", $"'{method}' is not allowed; use 'fir-hilbert' or 'morlet'");
        double? transition = m.TryGetValue("transition", out var tr) ? ctx.Positive(tr, "decomposition.transition") : null;
        double? attenuation = m.TryGetValue("attenuation", out var at) ? ctx.Positive(at, "decomposition.attenuation") : null;
        double? cycles = m.TryGetValue("cycles", out var cy) ? ctx.Positive(cy, "decomposition.cycles") : null;
        if (method == "fir-hilbert" && cycles is not null)
            throw ctx.Error(cy!, "decomposition.cycles", "'cycles' applies to method 'morlet' only");
        if (method == "morlet" && (transition is not null || attenuation is not null))
            throw ctx.Error(node, "decomposition", "'transition' and 'attenuation' apply to method 'fir-hilbert' only");
        int? step = null;
        if (m.TryGetValue("time_step", out var ts) && ctx.Scalar(ts, "decomposition.time_step") != "auto")
            step = ctx.Int(ts, "decomposition.time_step", 1, 100_000);
        bool acceptEdges = false;
        if (m.TryGetValue("edge_effects", out var ee))
        {
            string v = ctx.Scalar(ee, "decomposition.edge_effects");
            if (v is not ("refuse" or "accept"))
                throw ctx.Error(ee, "decomposition.edge_effects", $"'{v}' is not allowed{Spelling.Hint(v, ["refuse", "accept"])}; use 'refuse' or 'accept'");
            acceptEdges = v == "accept";
        }
        return new DecompositionSpec(method, transition, attenuation, cycles, step, acceptEdges);
    }

    private static IReadOnlyList<Measure> ReadMeasures(Context ctx, YamlNode node)
    {
        if (node is YamlScalarNode s && s.Value == "all") return MeasureCatalog.All;
        var keys = ctx.StringList(node, "measures", unique: true);
        var list = new List<Measure>();
        foreach (var k in keys)
        {
            try { list.Add(MeasureCatalog.Parse(k)); }
            catch (InputException)
            {
                throw ctx.Error(node, "measures", $"'{k}' is not a known measure{Spelling.Hint(k, MeasureCatalog.All.Select(MeasureCatalog.Key))}; allowed: all, {string.Join(", ", MeasureCatalog.All.Select(MeasureCatalog.Key))}");
            }
        }
        return list;
    }

    private static (CorrectionSpec Spec, double Level) ReadCorrection(Context ctx, YamlNode node)
    {
        var m = ctx.Keys(node, "correction", ["method", "q", "alpha", "tail", "threshold"]);
        var method = CorrectionMethod.BenjaminiHochberg;
        if (m.TryGetValue("method", out var mn))
        {
            string v = ctx.Scalar(mn, "correction.method");
            var known = Enum.GetValues<CorrectionMethod>().Where(c => CorrectionSpec.Key(c) == v).ToArray();
            if (known.Length == 1) method = known[0];
            else if (v == "fdr-bh")
                throw ctx.Error(mn, "correction.method", "'fdr-bh' is no longer a method name; write 'benjamini-hochberg' (the same false discovery rate procedure)");
            else
                throw ctx.Error(mn, "correction.method", $"'{v}' is not allowed; use {string.Join(", ", Enum.GetValues<CorrectionMethod>().Select(CorrectionSpec.Key))}");
        }
        bool fdr = CorrectionSpec.ControlsFalseDiscoveries(method);
        string levelKey = fdr ? "q" : "alpha", otherKey = fdr ? "alpha" : "q";
        if (m.TryGetValue(otherKey, out var wrong))
            throw ctx.Error(wrong, $"correction.{otherKey}", fdr
                ? $"method '{CorrectionSpec.Key(method)}' controls the false discovery rate; give its level as 'q'"
                : $"method '{CorrectionSpec.Key(method)}' controls the family-wise error rate (or none); give its level as 'alpha'");
        double level = 0.05;
        if (m.TryGetValue(levelKey, out var ln))
        {
            level = ctx.Number(ln, $"correction.{levelKey}");
            if (!(level > 0 && level < 1)) throw ctx.Error(ln, $"correction.{levelKey}", $"expected a level between 0 and 1, got {Fmt(level)}");
        }
        bool pareto = false;
        if (m.TryGetValue("tail", out var tn))
        {
            string v = ctx.Scalar(tn, "correction.tail");
            pareto = v switch
            {
                "counted" => false,
                "pareto" => true,
                _ => throw ctx.Error(tn, "correction.tail", $"'{v}' is not allowed; use 'counted' (p from exceedance counts) or 'pareto' (generalised Pareto tail beyond the counts)"),
            };
            if (pareto && method is CorrectionMethod.MaxStatistic or CorrectionMethod.NetworkBased)
                throw ctx.Error(tn, "correction.tail", $"'pareto' refines per-pair p-values; method '{CorrectionSpec.Key(method)}' takes its p-values from the maxima over pairs instead");
        }
        double? threshold = null;
        if (m.TryGetValue("threshold", out var th))
        {
            if (method != CorrectionMethod.NetworkBased)
                throw ctx.Error(th, "correction.threshold", "'threshold' applies to method 'network-based' only");
            threshold = ctx.Positive(th, "correction.threshold");
        }
        else if (method == CorrectionMethod.NetworkBased) threshold = CorrectionSpec.DefaultThreshold;
        return (new CorrectionSpec(method, pareto, threshold), level);
    }

    private static void CheckName(Context ctx, YamlNode node, string key, string name)
    {
        if (name.Length == 0 || name.Any(c => !(char.IsAsciiLetterOrDigit(c) || c is '-' or '.')))
            throw ctx.Error(node, key, $"name '{name}' may hold only letters, digits, '-' and '.' (it becomes part of file names)");
    }

    private static string Fmt(double v) => v.ToString("G6", CultureInfo.InvariantCulture);

    internal sealed class Context(string source, string folder)
    {
        public InputException Error(YamlNode node, string key, string what) =>
            new($"{source}, line {node.Start.Line}: {key}: {what}.");

        public Dictionary<string, YamlNode> Keys(YamlNode node, string where, IReadOnlyList<string> allowed)
        {
            if (node is not YamlMappingNode map)
                throw Error(node, where, $"expected a mapping with keys {string.Join(", ", allowed)}");
            var result = new Dictionary<string, YamlNode>(StringComparer.Ordinal);
            foreach (var (k, v) in map.Children)
            {
                string key = Scalar(k, where);
                if (!allowed.Contains(key))
                    throw Error(k, where == "the plan" ? key : $"{where}.{key}", $"unknown key{Spelling.Hint(key, allowed)}; allowed here: {string.Join(", ", allowed)}");
                if (!result.TryAdd(key, v)) throw Error(k, key, "given twice");
            }
            return result;
        }

        public YamlNode Required(Dictionary<string, YamlNode> map, YamlNode parent, string key, string where) =>
            map.TryGetValue(key, out var v) ? v : throw Error(parent, where == "the plan" ? key : $"{where}.{key}", "required key is missing");

        public string Scalar(YamlNode node, string key) =>
            node is YamlScalarNode { Value: { } v } ? v.Trim() : throw Error(node, key, "expected a single value");

        public double Number(YamlNode node, string key)
        {
            string s = Scalar(node, key);
            return double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) && double.IsFinite(v)
                ? v : throw Error(node, key, $"'{s}' is not a number");
        }

        public double Positive(YamlNode node, string key)
        {
            double v = Number(node, key);
            return v > 0 ? v : throw Error(node, key, $"expected a positive number, got {Fmt(v)}");
        }

        public int Int(YamlNode node, string key, int min, int max)
        {
            string s = Scalar(node, key);
            return int.TryParse(s, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out int v) && v >= min && v <= max
                ? v : throw Error(node, key, $"'{s}' is not a whole number from {min} to {max}");
        }

        public string Choice(YamlNode node, string key, IReadOnlyList<string> allowed)
        {
            string v = Scalar(node, key);
            return allowed.Contains(v) ? v
                : throw Error(node, key, $"'{v}' is not allowed{Spelling.Hint(v, allowed)}; use {string.Join(", ", allowed.SkipLast(1).Select(a => $"'{a}'"))} or '{allowed[^1]}'");
        }

        public bool Bool(YamlNode node, string key) => Scalar(node, key) switch
        {
            "true" or "yes" => true,
            "false" or "no" => false,
            var s => throw Error(node, key, $"'{s}' is not allowed; use true or false"),
        };

        public IReadOnlyList<string> StringList(YamlNode node, string key, bool unique)
        {
            if (node is not YamlSequenceNode seq || seq.Children.Count == 0)
                throw Error(node, key, "expected a non-empty list, e.g. [a, b]");
            var list = seq.Children.Select(c => Scalar(c, key)).ToList();
            if (unique)
            {
                var dup = list.GroupBy(x => x, StringComparer.Ordinal).FirstOrDefault(g => g.Count() > 1);
                if (dup is not null) throw Error(node, key, $"'{dup.Key}' is listed twice");
            }
            return list;
        }

        public string Path(YamlNode node, string key)
        {
            string s = Scalar(node, key);
            if (s.Length == 0) throw Error(node, key, "expected a file or folder path");
            return System.IO.Path.GetFullPath(System.IO.Path.Combine(folder, s));
        }
    }
}
