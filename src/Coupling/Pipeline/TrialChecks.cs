using System.Globalization;
using Coupling.Plans;

namespace Coupling.Pipeline;

/// <summary>Checks on a condition's trial count that name the real cause: trials outside the recording, or too few trials.</summary>
public static class TrialChecks
{
    /// <summary>
    /// Fewest trials a condition needs: 4 when surrogates are drawn (3 trials allow only 3! = 6 orders, so no p could be
    /// below 1/7), 2 for values only (some measures, e.g. ppc, average over pairs of trials).
    /// </summary>
    public static int Minimum(int surrogates) => surrogates > 0 ? 4 : 2;

    /// <summary>
    /// Refuses a condition with fewer trials than <see cref="Minimum"/>, naming the condition's line in the plan and why
    /// the trials are missing: none of the events fit in the recording, some ran past an end of it, or there are too few events.
    /// </summary>
    /// <param name="plan">The plan (for the condition's line, the trial span and the surrogate count).</param>
    /// <param name="condition">The condition.</param>
    /// <param name="events">Events with the condition's labels in the input.</param>
    /// <param name="kept">Trials that fit inside the recording and hold no unusable sample.</param>
    /// <param name="unusable">Trials left out for unusable samples (unusable_data: drop-trials).</param>
    /// <exception cref="InputException">Too few trials.</exception>
    public static void CheckCount(Plan plan, ConditionSpec condition, int events, int kept, int unusable = 0)
    {
        int minimum = Minimum(plan.Surrogates);
        if (kept >= minimum) return;
        string where = plan.Where($"conditions.{condition.Name}");
        string span = string.Create(CultureInfo.InvariantCulture, $"{plan.Trial.Start:G6}..{plan.Trial.End:G6} s");
        if (kept == 0 && events > 0 && unusable == 0)
            throw new InputException($"{where}: all {events} trials run past an end of the recording (trial span {span} around each onset); " +
                "check that the events belong to this recording and that the trial span fits around them.");
        int past = events - kept - unusable;
        string outside = (past, unusable) switch
        {
            ( > 0, > 0) => $" ({unusable} of its {events} trials hold unusable samples, {past} run past an end of the recording with the trial span {span})",
            ( > 0, _) => $" ({past} of its {events} events run past an end of the recording with the trial span {span})",
            (_, > 0) => $" ({unusable} of its {events} trials hold unusable samples and were left out)",
            _ => "",
        };
        string need = plan.Surrogates > 0
            ? $"trial-shuffle surrogates need at least {minimum} trials per condition ({kept} trial{(kept == 1 ? "" : "s")} allow at most {Factorial(kept)} trial order{(kept < 2 ? "" : "s")}); give more trials, or 'surrogates: 0' for values without a test"
            : $"connectivity across trials needs at least {minimum} trials per condition";
        throw new InputException($"{where}: only {kept} trial{(kept == 1 ? "" : "s")}{outside}; {need}.");
    }

    /// <summary>Refuses a condition whose event labels do not all occur in the input, suggesting the closest label.</summary>
    /// <exception cref="InputException">A label does not occur; the message names the condition's line and the labels there.</exception>
    public static void CheckLabels(Plan plan, ConditionSpec condition, LoadedInput input)
    {
        foreach (var label in condition.EventLabels)
            if (!input.EventLabels.Contains(label))
            {
                var known = input.EventLabels.Distinct().Order(StringComparer.Ordinal).ToArray();
                throw new InputException($"{plan.Where($"conditions.{condition.Name}")}: event label '{label}' does not occur in {input.Source}{Spelling.Hint(label, known)}; labels there: {string.Join(", ", known)}.");
            }
    }

    private static int Factorial(int n) => n <= 1 ? 1 : n * Factorial(n - 1);
}
