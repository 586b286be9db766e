using System.Text.Json;
using Coupling.Measures;
using Coupling.Results;
using Coupling.Simulation;

namespace Coupling.Pipeline;

/// <summary>Holds a run's results against the simulated scenario's ground truth.</summary>
public static class TruthCheck
{
    /// <summary>
    /// For every built-in pair: in each condition where it is present, every measure the truth lists as detecting it
    /// must be significant, and every measure it lists as not detecting it must not be; in conditions where the pair
    /// is absent, no measure may call it significant. Measures the truth states nothing about are not checked.
    /// Results for measures or bands the run did not compute are skipped.
    /// </summary>
    public static IReadOnlyList<TruthCheckLine> Compare(GroundTruth truth, IReadOnlyList<PairResult> results)
    {
        var lines = new List<TruthCheckLine>();
        foreach (var pair in truth.Pairs)
        {
            string kind = JsonNamingPolicy.KebabCaseLower.ConvertName(pair.Kind.ToString());
            foreach (var condition in truth.Conditions.Select(c => c.Name))
            {
                bool present = pair.Conditions.Contains(condition);
                foreach (var r in results.Where(r => r.Condition == condition && r.Band == pair.Band))
                {
                    var measure = MeasureCatalog.Parse(r.Measure);
                    bool? expect = !present ? false
                        : pair.DetectedBy.Contains(measure) ? true
                        : pair.NotDetectedBy.Contains(measure) ? false
                        : null;
                    if (expect is null) continue;
                    int a = IndexOf(r, pair.ChannelA), b = IndexOf(r, pair.ChannelB);
                    if (a < 0 || b < 0) continue;
                    int k = PairIndex.Of(Math.Min(a, b), Math.Max(a, b), r.Channels.Count);
                    lines.Add(new TruthCheckLine(pair.ChannelA, pair.ChannelB, kind, condition, pair.Band, r.Measure,
                        expect.Value, r.Significant[k], r.PCorrected[k]));
                }
            }
        }
        return lines;
    }

    /// <summary>
    /// For every built-in pair and every contrast of two of the scenario's conditions, in the pair's band: where the pair
    /// is present in exactly one of the two conditions, every measure the truth lists as detecting it must show a
    /// significant difference; where it is present in both, no measure may (the scenario builds each relation at the
    /// same strength in every condition it occurs in, so there is no difference to find). Pairs absent from both are
    /// left to <see cref="UnexpectedDiscoveries"/>. The line's condition is "A vs B".
    /// </summary>
    public static IReadOnlyList<TruthCheckLine> CompareContrasts(GroundTruth truth, IReadOnlyList<ContrastPairResult> contrasts)
    {
        var lines = new List<TruthCheckLine>();
        var conditions = truth.Conditions.Select(c => c.Name).ToHashSet(StringComparer.Ordinal);
        foreach (var pair in truth.Pairs)
        {
            string kind = JsonNamingPolicy.KebabCaseLower.ConvertName(pair.Kind.ToString());
            foreach (var r in contrasts.Where(r => r.Band == pair.Band && conditions.Contains(r.ConditionA) && conditions.Contains(r.ConditionB)))
            {
                bool inA = pair.Conditions.Contains(r.ConditionA), inB = pair.Conditions.Contains(r.ConditionB);
                if (!inA && !inB) continue;
                var measure = MeasureCatalog.Parse(r.Measure);
                bool? expect = inA && inB ? false : pair.DetectedBy.Contains(measure) ? true : null;
                if (expect is null) continue;
                var d = r.AsDifference();
                int a = IndexOf(d, pair.ChannelA), b = IndexOf(d, pair.ChannelB);
                if (a < 0 || b < 0) continue;
                int k = PairIndex.Of(Math.Min(a, b), Math.Max(a, b), r.Channels.Count);
                lines.Add(new TruthCheckLine(pair.ChannelA, pair.ChannelB, kind, d.Condition, pair.Band, r.Measure,
                    expect.Value, r.Significant[k], r.PCorrected[k]));
            }
        }
        return lines;
    }

    /// <summary>
    /// Significant pairs that the truth does not build in at all (in any band): the false discoveries of the run,
    /// per condition x band x measure, as (result, count of such pairs, count of pairs tested).
    /// </summary>
    public static IReadOnlyList<(PairResult Result, int Unexpected, int Tested)> UnexpectedDiscoveries(GroundTruth truth, IReadOnlyList<PairResult> results)
    {
        var built = truth.Pairs.Select(p => Key(p.ChannelA, p.ChannelB)).ToHashSet();
        var list = new List<(PairResult, int, int)>();
        foreach (var r in results)
        {
            int unexpected = 0, tested = 0, c = r.Channels.Count;
            for (int k = 0; k < r.Value.Length; k++)
            {
                var (a, b) = PairIndex.Channels(k, c);
                if (built.Contains(Key(r.Channels[a], r.Channels[b]))) continue;
                tested++;
                if (r.Significant[k]) unexpected++;
            }
            list.Add((r, unexpected, tested));
        }
        return list;
    }

    private static string Key(string a, string b) => string.CompareOrdinal(a, b) < 0 ? $"{a}|{b}" : $"{b}|{a}";

    private static int IndexOf(PairResult r, string label)
    {
        for (int i = 0; i < r.Channels.Count; i++) if (r.Channels[i] == label) return i;
        return -1;
    }
}
