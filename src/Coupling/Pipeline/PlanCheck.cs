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

        var bands = new List<BandPreview>();
        var decompositions = new List<IBandDecomposition>();
        foreach (var band in plan.Bands)
        {
            IBandDecomposition d = null!;
            InPlan(plan, $"bands.{band.Name}", () => d = BandDecompositions.Create(plan.Decomposition.Method, band, input.SampleRate,
                new BandDecompositionOptions(plan.Decomposition.TransitionHz, plan.Decomposition.AttenuationDb, plan.Decomposition.Cycles)));
            int kernel = (int)(d.Info.Parameters.TryGetValue("filter_taps", out double taps) ? taps : d.Info.Parameters["support_samples"]);
            int step = plan.Decomposition.TimeStep ?? TimeStep.Default(d.Info, input.SampleRate);
            bands.Add(new BandPreview(band.Name, d.Info.Method, kernel, kernel / input.SampleRate, d.PadSamples, step, d.Info));
            decompositions.Add(d);
        }
        if (plan.UnusableData == UnusableData.DropTrials) input = input.WithoutUnusableTrials(plan.Trial, decompositions.Max(d => d.PadSamples));

        var conditions = new List<ConditionSummary>();
        foreach (var condition in plan.Conditions)
        {
            TrialChecks.CheckLabels(plan, condition, input);
            int count = 0;
            InPlan(plan, "trial", () => count = input.TrialCount(condition, plan.Trial));
            TrialChecks.CheckCount(plan, condition, input.EventLabels.Count(condition.EventLabels.Contains), count, input.UnusableTrialCount(condition));
            if (plan.Surrogates > 0) InPlan(plan, "surrogates", () => SurrogateTest.CheckFeasible(count, plan.Surrogates, condition.Name));
            conditions.Add(new ConditionSummary(condition.Name, count, []));
        }
        foreach (var contrast in plan.Contrasts.Where(_ => plan.Surrogates > 0))
            InPlan(plan, "contrasts", () => ConditionContrast.CheckFeasible(
                conditions.First(c => c.Condition == contrast.ConditionA).Trials, conditions.First(c => c.Condition == contrast.ConditionB).Trials,
                plan.Surrogates, contrast.Name));

        var units = plan.Conditions.SelectMany(c => plan.Bands.Select(b => UnfinishedRun.ConditionUnit(c.Name, b.Name)))
            .Concat(plan.Contrasts.SelectMany(c => plan.Bands.Select(b => UnfinishedRun.ContrastUnit(c.Name, b.Name))))
            .ToArray();
        int pairs = PairIndex.Count(input.Channels.Count);
        return new PlanPreview(plan.Source, plan.Recording, input.SampleRate, input.Channels.Select(c => c.Label).ToArray(), conditions, bands,
            units, kept.KeptUnits(plan), plan.Surrogates, pairs, SurrogateFloor.Of(plan.Correction, plan.Q, pairs,
                twoSidedOnly: plan.Measures.All(m => MeasureCatalog.TailOf(m) == TestTail.TwoSided)).Needed,
            plan.Contrasts.Count > 0 ? SurrogateFloor.Of(plan.Correction, plan.Q, pairs, twoSidedOnly: true).Needed : null, plan.Output,
            BandWarnings.For(plan, decompositions, input.SampleRate, input.EpochSamples)
                .Concat(SurrogateCountWarning.ForContrasts(plan, pairs) is { } contrastWarning ? [contrastWarning] : [])
                .ToArray());
    }

    private static void InPlan(Plan plan, string key, Action check)
    {
        try { check(); }
        catch (InputException e) { throw new InputException($"{plan.Source}: {key}: {e.Message}", e); }
    }
}
