using System.Globalization;
using Coupling.Measures;
using Coupling.Plans;

namespace Coupling.Pipeline;

/// <summary>
/// The warnings a run gives before its long computation when the plan's surrogate count cannot let a single pair pass the
/// correction (<see cref="SurrogateFloor"/>): one for the per-condition tests, whose floor is 1/(M + 1) unless every
/// measure is tested two-sided, and one for the condition contrasts, which are always two-sided (the statistic is a
/// difference; docs/methods.md, section 7), so their counted p cannot go below 2/(M + 1) (the family-wise maxima's p,
/// 1/(M + 1)).
/// </summary>
internal static class SurrogateCountWarning
{
    /// <summary>The warning for the per-condition tests of <paramref name="pairs"/> pairs; null when the count suffices.</summary>
    public static string? ForConditions(Plan plan, int pairs)
    {
        var floor = SurrogateFloor.Of(plan.Correction, plan.Q, pairs,
            twoSidedOnly: plan.Measures.All(m => MeasureCatalog.TailOf(m) == TestTail.TwoSided));
        return Text(plan, pairs, floor,
            $"With {plan.Surrogates} surrogates the smallest attainable p is {floor.Sides}/{plan.Surrogates + 1}{(floor.Sides == 2 ? " (two-sided tests)" : "")}",
            "a single coupled pair");
    }

    /// <summary>The warning for the condition contrasts; null when the plan has none or the count suffices.</summary>
    public static string? ForContrasts(Plan plan, int pairs)
    {
        if (plan.Contrasts.Count == 0) return null;
        var floor = SurrogateFloor.Of(plan.Correction, plan.Q, pairs, twoSidedOnly: true);
        return Text(plan, pairs, floor,
            $"Condition contrasts ({string.Join(", ", plan.Contrasts.Select(c => c.Name))}){(floor.Sides == 2 ? " are tested two-sided" : "")}: " +
            $"with {plan.Surrogates} surrogates the smallest attainable p of a difference is {floor.Sides}/{plan.Surrogates + 1}",
            "a single pair that differs between the conditions");
    }

    private static string? Text(Plan plan, int pairs, SurrogateFloor floor, string smallest, string single)
    {
        int m = plan.Surrogates, needed = floor.Needed;
        if (m == 0 || m >= needed) return null;
        if (floor.Applies)
        {
            int k = (int)Math.Ceiling(floor.Multiplier * pairs / (plan.Q * (m + 1)));
            string reach = k > pairs
                ? $"no pair can pass the correction whatever the data (that would take {k} pairs at that p, and only {pairs} are tested)"
                : $"a pair can pass the correction only if at least {k} pairs reach that p";
            return string.Create(CultureInfo.InvariantCulture,
                $"{smallest}; across {pairs} pairs at q = {plan.Q:G3} {reach}. " +
                $"Use at least {needed} surrogates for {single} to be detectable, or a family-wise correction (max-statistic) or the Pareto tail.");
        }
        if (plan.Correction.ParetoTail) return null;
        return string.Create(CultureInfo.InvariantCulture,
            $"{smallest}, above alpha = {plan.Q:G3}: no pair can be significant. Use at least {needed} surrogates.");
    }
}
