using Coupling.Measures;
using Coupling.Plans;
using Coupling.Results;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Trials;

namespace Coupling.Pipeline;

/// <summary>
/// Picks the edge whose surrogate distribution the report draws and recomputes its draws (<see cref="SurrogateDraws"/>):
/// the plan's <c>surrogate_figure</c>, or else the significant edge with the largest |z| over every condition x band x
/// measure (ties: the first in result and pair order).
/// </summary>
public static class SurrogateExample
{
    /// <summary>The chosen edge as (result index, pair index, how chosen), or null when the plan names none and no edge is significant.</summary>
    /// <exception cref="InputException">A channel of the plan's <c>surrogate_figure</c> is not among the analysed channels.</exception>
    public static (int Result, int Pair, string Chosen)? Choose(Plan plan, IReadOnlyList<PairResult> results)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(results);
        if (plan.SurrogateFigure is { } spec)
        {
            int r = Enumerable.Range(0, results.Count).First(i =>
                results[i].Condition == spec.Condition && results[i].Band == spec.Band && results[i].Measure == spec.Measure);
            var channels = results[r].Channels;
            int a = IndexOf(plan, channels, spec.ChannelA), b = IndexOf(plan, channels, spec.ChannelB);
            return (r, PairIndex.Of(Math.Min(a, b), Math.Max(a, b), channels.Count), "plan");
        }
        (int, int, string)? best = null;
        double strongest = double.NegativeInfinity;
        for (int r = 0; r < results.Count; r++)
            for (int k = 0; k < results[r].Significant.Length; k++)
            {
                double z = Math.Abs(results[r].Z[k]);
                if (!results[r].Significant[k] || double.IsNaN(z) || z <= strongest) continue;
                strongest = z;
                best = (r, k, "strongest significant edge");
            }
        return best;
    }

    /// <summary>Checks, before the long steps of a run, that the plan's <c>surrogate_figure</c> names analysed channels.</summary>
    /// <exception cref="InputException">A channel is not among <paramref name="channels"/>.</exception>
    public static void CheckChannels(Plan plan, IReadOnlyList<string> channels)
    {
        ArgumentNullException.ThrowIfNull(plan);
        if (plan.SurrogateFigure is not { } spec) return;
        IndexOf(plan, channels, spec.ChannelA);
        IndexOf(plan, channels, spec.ChannelB);
    }

    /// <summary>
    /// Cuts the chosen edge's condition again, isolates its band and recomputes the draws with the seed the test used.
    /// </summary>
    public static SurrogateDistribution Compute(Plan plan, LoadedInput input, PairResult result, int pair, string chosen,
        IBandDecomposition decomposition, int step, int pad, int workers)
    {
        int ci = Enumerable.Range(0, plan.Conditions.Count).First(i => plan.Conditions[i].Name == result.Condition);
        int bi = Enumerable.Range(0, plan.Bands.Count).First(i => plan.Bands[i].Name == result.Band);
        var (trials, _) = input.TrialsWithoutEvoked(plan.Conditions[ci], plan.Trial, pad, plan.SubtractEvoked);
        var narrowband = NarrowbandExtractor.Extract(trials, decomposition, plan.Window, step, workers);
        var (a, b) = PairIndex.Channels(pair, result.Channels.Count);
        return SurrogateDraws.ForPair(narrowband, MeasureCatalog.Parse(result.Measure), a, b, plan.Surrogates, Seeds.For(plan.Seed, ci, bi),
            result.Condition, chosen);
    }

    private static int IndexOf(Plan plan, IReadOnlyList<string> channels, string label)
    {
        for (int i = 0; i < channels.Count; i++) if (channels[i] == label) return i;
        throw new InputException($"{plan.Source}: surrogate_figure.channels: '{label}' is not an analysed channel; channels: {string.Join(", ", channels)}.");
    }
}
