using Coupling.Measures;
using Coupling.Plans;
using Coupling.Spectral;
using Coupling.Statistics;

namespace Coupling.Pipeline;

/// <summary>Checks a plan against its input and tells what a run would do, without computing anything.</summary>
public static class PlanCheck
{
    /// <summary>
    /// Checks that the output may be written and that an interrupted earlier run (if any) can be resumed, reads the input
    /// (headers, events, and for CSV the samples), checks every condition's event labels and trial count against the
    /// surrogates asked, designs every band's filter or wavelet, and lists the work units. Nothing is written or deleted.
    /// </summary>
    /// <exception cref="InputException">Whatever a run would refuse before computing (the message names the file and key).</exception>
    public static PlanPreview Preview(Plan plan)
    {
        ArgumentNullException.ThrowIfNull(plan);
        PlanInputs.CheckOutput(plan);
        var kept = UnfinishedRun.Open(plan);
        var input = InputLoader.Load(plan);

        var conditions = new List<ConditionSummary>();
        foreach (var condition in plan.Conditions)
        {
            foreach (var label in condition.EventLabels)
                if (!input.EventLabels.Contains(label))
                    throw new InputException($"{plan.Source}: conditions.{condition.Name}: event label '{label}' does not occur in {input.Source}; labels there: {string.Join(", ", input.EventLabels.Distinct().Order(StringComparer.Ordinal))}.");
            int count = input.TrialCount(condition, plan.Trial);
            InPlan(plan, "surrogates", () => SurrogateTest.CheckFeasible(count, plan.Surrogates, condition.Name));
            conditions.Add(new ConditionSummary(condition.Name, count, []));
        }
        foreach (var contrast in plan.Contrasts)
            InPlan(plan, "contrasts", () => ConditionContrast.CheckFeasible(
                conditions.First(c => c.Condition == contrast.ConditionA).Trials, conditions.First(c => c.Condition == contrast.ConditionB).Trials,
                plan.Surrogates, contrast.Name));

        var bands = new List<BandPreview>();
        foreach (var band in plan.Bands)
        {
            IBandDecomposition d = null!;
            InPlan(plan, $"bands.{band.Name}", () => d = BandDecompositions.Create(plan.Decomposition.Method, band, input.SampleRate,
                new BandDecompositionOptions(plan.Decomposition.TransitionHz, plan.Decomposition.AttenuationDb, plan.Decomposition.Cycles)));
            int kernel = (int)(d.Info.Parameters.TryGetValue("filter_taps", out double taps) ? taps : d.Info.Parameters["support_samples"]);
            int step = plan.Decomposition.TimeStep ?? TimeStep.Default(d.Info, input.SampleRate);
            bands.Add(new BandPreview(band.Name, d.Info.Method, kernel, kernel / input.SampleRate, d.PadSamples, step, d.Info));
        }

        var units = plan.Conditions.SelectMany(c => plan.Bands.Select(b => UnfinishedRun.ConditionUnit(c.Name, b.Name)))
            .Concat(plan.Contrasts.SelectMany(c => plan.Bands.Select(b => UnfinishedRun.ContrastUnit(c.Name, b.Name))))
            .ToArray();
        int pairs = PairIndex.Count(input.Channels.Count);
        return new PlanPreview(plan.Source, plan.Recording, input.SampleRate, input.Channels.Select(c => c.Label).ToArray(), conditions, bands,
            units, kept.KeptUnits(plan), plan.Surrogates, pairs, (int)Math.Ceiling(pairs / plan.Q) - 1, plan.Output);
    }

    private static void InPlan(Plan plan, string key, Action check)
    {
        try { check(); }
        catch (InputException e) { throw new InputException($"{plan.Source}: {key}: {e.Message}", e); }
    }
}
