using System.Globalization;
using System.Diagnostics;
using Coupling.Measures;
using Coupling.Plans;
using Coupling.Results;
using Coupling.Spectral;
using Coupling.Statistics;
using Coupling.Trials;

namespace Coupling.Pipeline;

/// <summary>Runs a plan from recording to tested connectivity tables and writes the results folder.</summary>
public static class AnalysisRunner
{
    /// <summary>
    /// Reads the input, cuts and decomposes the trials, computes every measure for every pair, tests it against
    /// trial-shuffle surrogates, corrects across pairs and writes the results folder (atomically: a failed run
    /// leaves no partial folder and keeps an older one).
    /// </summary>
    /// <param name="plan">The checked plan.</param>
    /// <param name="progress">Receives progress; may be null.</param>
    /// <param name="threads">Worker threads, overriding the plan's when above 0.</param>
    /// <param name="commandLine">The command line that started the run, for the manifest.</param>
    /// <param name="cancellationToken">Stops the run (with <see cref="OperationCanceledException"/>) before anything is committed.</param>
    /// <param name="restart">Discard the units kept by an interrupted earlier run instead of resuming it (see <see cref="UnfinishedRun"/>).</param>
    /// <param name="onWarning">Receives each warning as soon as it is known (before the long computation); may be null.
    /// The same warnings are in <see cref="RunOutcome.Warnings"/> and the report.</param>
    public static RunOutcome Run(Plan plan, IProgress<RunProgress>? progress = null, int threads = 0, string? commandLine = null,
        CancellationToken cancellationToken = default, bool restart = false, Action<string>? onWarning = null)
    {
        var started = DateTimeOffset.UtcNow;
        var clock = Stopwatch.StartNew();
        int workers = threads > 0 ? threads : plan.Threads;

        Outputs.OutputFolder.RemoveLeftovers(plan.Output);
        PlanInputs.CheckOutput(plan);
        var units = UnfinishedRun.Open(plan, restart);
        progress?.Report(new RunProgress("reading input", 0, 0));
        var input = InputLoader.Load(plan);
        var analysis = Analyse(plan, input, progress, workers, cancellationToken, units, onWarning);
        cancellationToken.ThrowIfCancellationRequested();

        progress?.Report(new RunProgress("writing results", 0, 0));
        string written;
        try { written = ResultsWriter.Write(plan, input, analysis, new RunContext(started, clock.Elapsed, commandLine, workers, units.Resumed), progress); }
        catch (Exception e) when (FileErrors.IsFileError(e) && e is not FileAccessException) { throw FileErrors.Writing(plan.Output, "results folder", e); }
        units.Remove();
        return new RunOutcome(written, analysis.Results, analysis.Conditions, analysis.Warnings, clock.Elapsed, analysis.Contrasts, units.Resumed,
            analysis.Signals, analysis.SurrogateExample);
    }

    /// <summary>
    /// Everything computed by a run, before it is written. With <paramref name="units"/> each condition x band and
    /// contrast x band is loaded when an interrupted earlier run kept it, and kept once computed; without, every unit is
    /// computed. <paramref name="onWarning"/> receives each warning once every input check has passed, before any long step.
    /// </summary>
    public static Analysis Analyse(Plan plan, LoadedInput input, IProgress<RunProgress>? progress, int workers,
        CancellationToken cancellationToken = default, UnfinishedRun? units = null, Action<string>? onWarning = null)
    {
        var decompositions = plan.Bands
            .Select(b => InPlan(plan, $"bands.{b.Name}", () => BandDecompositions.Create(plan.Decomposition.Method, b, input.SampleRate,
                new BandDecompositionOptions(plan.Decomposition.TransitionHz, plan.Decomposition.AttenuationDb, plan.Decomposition.Cycles))))
            .ToArray();
        var steps = decompositions.Select(d => plan.Decomposition.TimeStep ?? TimeStep.Default(d.Info, input.SampleRate)).ToArray();
        int pad = decompositions.Max(d => d.PadSamples);
        if (plan.UnusableData == UnusableData.DropTrials) input = input.WithoutUnusableTrials(plan.Trial, pad);

        // Check every condition first, so that input problems (unknown labels, too few trials) surface before any long
        // step. Trials are only counted here; each condition is cut when its turn comes, so only one condition's trials
        // are in memory.
        var trialCounts = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var condition in plan.Conditions)
        {
            TrialChecks.CheckLabels(plan, condition, input);
            int count = InPlan(plan, "trial", () => input.TrialCount(condition, plan.Trial));
            TrialChecks.CheckCount(plan, condition, input.EventLabels.Count(condition.EventLabels.Contains), count, input.UnusableTrialCount(condition));
            if (plan.Surrogates > 0)
                InPlan(plan, "surrogates", () => { SurrogateTest.CheckFeasible(count, plan.Surrogates, condition.Name); return 0; });
            trialCounts[condition.Name] = count;
        }
        foreach (var contrast in plan.Contrasts.Where(_ => plan.Surrogates > 0))
            InPlan(plan, "contrasts", () =>
            {
                ConditionContrast.CheckFeasible(trialCounts[contrast.ConditionA], trialCounts[contrast.ConditionB], plan.Surrogates, contrast.Name);
                return 0;
            });

        SurrogateExample.CheckChannels(plan, input.Channels.Select(c => c.Label).ToArray());

        var warnings = new List<string>(BandWarnings.For(plan, decompositions, input.SampleRate, input.EpochSamples));
        int pairs = Measures.PairIndex.Count(input.Channels.Count);
        foreach (var floorWarning in new[] { SurrogateCountWarning.ForConditions(plan, pairs), SurrogateCountWarning.ForContrasts(plan, pairs) })
            if (floorWarning is not null) warnings.Add(floorWarning);
        foreach (var w in warnings) onWarning?.Invoke(w);

        // Corrections that need the draws themselves (maxima, tails) are decided within the unit, so a unit keeps its
        // corrected outcomes with its tests; without surrogates (values only) there is nothing to correct.
        bool draws = FamilyCorrection.NeedsDraws(plan.Correction) && plan.Surrogates > 0;
        var pValueCorrection = FamilyCorrection.NeedsDraws(plan.Correction) ? new CorrectionSpec(CorrectionMethod.None) : plan.Correction;
        var results = new List<PairResult>();
        var directions = plan.Direction ? new List<PairDirection>() : null;
        var summaries = new List<ConditionSummary>();
        var signals = new List<BandSignalSummary>();
        // A condition with a unit kept by an interrupted run is isolated band by band, so kept bands are not isolated again.
        var kept = units?.KeptUnits(plan) ?? [];
        for (int ci = 0; ci < plan.Conditions.Count; ci++)
        {
            var (cutTrials, removedMean) = input.TrialsWithoutEvoked(plan.Conditions[ci], plan.Trial, pad, plan.SubtractEvoked);
            TrialSet? trials = cutTrials;
            summaries.Add(new ConditionSummary(trials.Condition, trials.TrialCount, trials.DroppedTrials));
            string conditionName = trials.Condition;
            var channels = trials.Channels;
            // Memory: when every band's narrowband set together is smaller than the padded trials, isolate them all
            // first and let the trials go before the surrogate tests (BandOrder); the direction step needs the trials.
            for (int bi = 0; bi < decompositions.Length; bi++)
            {
                var decomposition = decompositions[bi];
                var cut = trials;
                if (!plan.Decomposition.AcceptEdgeEffects)
                    InPlan(plan, "window", () => { EdgeReach.Check(cut, decomposition, plan.Window); return 0; });
                else if (EdgeReach.Warning(cut, decomposition, plan.Window) is { } edgeWarning)
                {
                    warnings.Add(edgeWarning);
                    onWarning?.Invoke(edgeWarning);
                }
            }
            var sets = new NarrowbandSet?[decompositions.Length];
            bool resuming = plan.Bands.Any(b => kept.Contains(UnfinishedRun.ConditionUnit(conditionName, b.Name)));
            if (!resuming && directions is null && BandOrder.IsolateAllFirst(trials, plan.Window, steps))
            {
                for (int bi = 0; bi < decompositions.Length; bi++)
                {
                    progress?.Report(new RunProgress($"{conditionName} / {plan.Bands[bi].Name}: band isolation", 0, 0));
                    sets[bi] = NarrowbandExtractor.Extract(trials, decompositions[bi], plan.Window, steps[bi], workers);
                }
                trials = null;
            }
            for (int bi = 0; bi < decompositions.Length; bi++)
            {
                string stage = $"{conditionName} / {plan.Bands[bi].Name}";
                NarrowbandSet? extracted = sets[bi];
                sets[bi] = null;
                NarrowbandSet Narrowband()
                {
                    if (extracted is not null) return extracted;
                    progress?.Report(new RunProgress($"{stage}: band isolation", 0, 0));
                    return extracted = NarrowbandExtractor.Extract(trials!, decompositions[bi], plan.Window, steps[bi], workers);
                }
                // Computed even when a finished unit is taken from an interrupted run, so that the evoked-share warning is
                // the same in a resumed run as in an uninterrupted one.
                var removedBand = removedMean is null ? null
                    : NarrowbandExtractor.Extract(removedMean, decompositions[bi], plan.Window, steps[bi], workers);
                if (EvokedShare.Warning(conditionName, plan.Bands[bi].Name, channels,
                        EvokedShare.Compute(Narrowband(), removedBand)) is { } evokedWarning)
                {
                    warnings.Add(evokedWarning);
                    onWarning?.Invoke(evokedWarning);
                }
                var stageProgress = progress is null ? null
                    : new Progress<int>(done => progress.Report(new RunProgress($"{stage}: surrogates", done, plan.Surrogates)));
                IReadOnlyList<SurrogateResult> Compute() => plan.Surrogates == 0 ? ValuesOnly.Compute(Narrowband(), plan.Measures)
                    : SurrogateTest.Run(Narrowband(), plan.Measures, plan.Surrogates, Seeds.For(plan.Seed, ci, bi), conditionName,
                        workers > 0 ? workers : null, stageProgress, cancellationToken);
                IReadOnlyList<(SurrogateResult Test, FamilyOutcome Outcome)> Corrected() =>
                    FamilyCorrection.TestCondition(Narrowband(), plan.Measures, plan.Surrogates, Seeds.For(plan.Seed, ci, bi),
                        conditionName, plan.Correction, plan.Q, workers > 0 ? workers : null, stageProgress, cancellationToken);
                string unit = UnfinishedRun.ConditionUnit(conditionName, plan.Bands[bi].Name);
                var tested = draws
                    ? units?.CorrectedCondition(ci, bi, unit, Corrected) ?? Corrected()
                    : (units?.Condition(ci, bi, unit, Compute) ?? Compute())
                        .Select(t => (t, FamilyCorrection.FromPValues(pValueCorrection, plan.Q, t.P))).ToArray();
                var (low, high) = plan.JackknifeIntervals ? TrialResampling.Jackknife(Narrowband(), plan.Measures) : (null, null);
                var matched = plan.MatchTrials > 0
                    ? TrialResampling.Matched(Narrowband(), plan.Measures, trialCounts.Values.Min(), plan.MatchTrials, Seeds.ForMatching(plan.Seed, ci, bi))
                    : null;
                signals.Add(SignalSummaries.Summarise(Narrowband(), conditionName, workers > 0 ? workers : null));
                double[]? Slice(double[]? all, int k) => all?.AsSpan(k * pairs, pairs).ToArray();
                for (int k = 0; k < tested.Count; k++)
                {
                    var (m, o) = tested[k];
                    results.Add(new PairResult(conditionName, plan.Bands[bi].Name, MeasureCatalog.Key(m.Measure), channels,
                        m.Observed, m.Z, o.P, o.PCorrected, o.Significant, input.Channels.Select(c => c.Position).ToArray(), o,
                        Slice(low, k), Slice(high, k), Slice(matched, k)));
                }
                if (directions is not null)
                    directions.AddRange(DirectionStep.Run(trials!, Narrowband(), plan.Bands[bi], plan.Window,
                    results.Skip(results.Count - tested.Count).ToArray(), plan.Surrogates, Seeds.ForDirection(plan.Seed, ci, bi)));
            }
        }
        var contrasts = Contrast(plan, input, decompositions, steps, pad, progress, workers, cancellationToken, units);
        SurrogateDistribution? example = null;
        if (plan.Figures && plan.Surrogates > 0 && SurrogateExample.Choose(plan, results) is var (r, pair, chosen))
        {
            int bi = plan.Bands.ToList().FindIndex(b => b.Name == results[r].Band);
            progress?.Report(new RunProgress($"{results[r].Condition} / {results[r].Band}: surrogate draws of one edge", 0, 0));
            example = SurrogateExample.Compute(plan, input, results[r], pair, chosen, decompositions[bi], steps[bi], pad, workers);
        }
        return new Analysis(results, summaries, decompositions.Select(d => d.Info).ToArray(), steps, pad, warnings, contrasts, directions, signals, example)
        {
            Spectrum = SpectrumRunner.Analyse(plan, input, progress, workers, cancellationToken),
        };
    }

    /// <summary>
    /// Tests each contrast of the plan by condition-label permutation, band by band. The two conditions' trials are cut
    /// again for each contrast (after the per-condition loop, which holds one condition at a time); in memory at once:
    /// the raw trials of both conditions, and for one band their two narrowband sets, the pooled set (the same size
    /// again) and per worker thread one split's data and kernel tables.
    /// </summary>
    private static List<ContrastPairResult> Contrast(Plan plan, LoadedInput input, IBandDecomposition[] decompositions, int[] steps,
        int pad, IProgress<RunProgress>? progress, int workers, CancellationToken cancellationToken, UnfinishedRun? units)
    {
        bool draws = FamilyCorrection.NeedsDraws(plan.Correction) && plan.Surrogates > 0;
        var pValueCorrection = FamilyCorrection.NeedsDraws(plan.Correction) ? new CorrectionSpec(CorrectionMethod.None) : plan.Correction;
        var results = new List<ContrastPairResult>();
        var positions = input.Channels.Select(c => c.Position).ToArray();
        for (int ki = 0; ki < plan.Contrasts.Count; ki++)
        {
            var contrast = plan.Contrasts[ki];
            var trialsA = Cut(plan, input, contrast.ConditionA, pad);
            var trialsB = Cut(plan, input, contrast.ConditionB, pad);
            for (int bi = 0; bi < decompositions.Length; bi++)
            {
                cancellationToken.ThrowIfCancellationRequested();
                string stage = $"{contrast.ConditionA} vs {contrast.ConditionB} / {plan.Bands[bi].Name}";
                NarrowbandSet? extractedA = null, extractedB = null;
                (NarrowbandSet A, NarrowbandSet B) Narrowband()
                {
                    if (extractedA is null || extractedB is null)
                    {
                        progress?.Report(new RunProgress($"{stage}: band isolation", 0, 0));
                        extractedA = NarrowbandExtractor.Extract(trialsA, decompositions[bi], plan.Window, steps[bi], workers);
                        extractedB = NarrowbandExtractor.Extract(trialsB, decompositions[bi], plan.Window, steps[bi], workers);
                    }
                    return (extractedA, extractedB);
                }
                var stageProgress = progress is null ? null
                    : new Progress<int>(done => progress.Report(new RunProgress($"{stage}: label permutations", done, plan.Surrogates)));
                IReadOnlyList<ContrastResult> Compute()
                {
                    var (a, b) = Narrowband();
                    return plan.Surrogates == 0 ? ValuesOnly.Compare(a, b, plan.Measures)
                        : ConditionContrast.Run(a, b, plan.Measures, plan.Surrogates, Seeds.ForContrast(plan.Seed, ki, bi), contrast.Name,
                            plan.SubtractEvoked, workers > 0 ? workers : null, stageProgress, cancellationToken);
                }
                IReadOnlyList<(ContrastResult Test, FamilyOutcome Outcome)> Corrected()
                {
                    var (a, b) = Narrowband();
                    return FamilyCorrection.TestContrast(a, b, plan.Measures, plan.Surrogates, Seeds.ForContrast(plan.Seed, ki, bi),
                        contrast.Name, plan.Correction, plan.Q, workers > 0 ? workers : null, stageProgress, cancellationToken, plan.SubtractEvoked);
                }
                string unit = UnfinishedRun.ContrastUnit(contrast.Name, plan.Bands[bi].Name);
                var tested = draws
                    ? units?.CorrectedContrast(ki, bi, unit, Corrected) ?? Corrected()
                    : (units?.Contrast(ki, bi, unit, Compute) ?? Compute())
                        .Select(t => (t, FamilyCorrection.FromPValues(pValueCorrection, plan.Q, t.P))).ToArray();
                foreach (var (m, o) in tested)
                    results.Add(new ContrastPairResult(contrast.Name, contrast.ConditionA, contrast.ConditionB, plan.Bands[bi].Name,
                        MeasureCatalog.Key(m.Measure), trialsA.Channels, m.ValueA, m.ValueB, m.Difference, m.Z, o.P, o.PCorrected,
                        o.Significant, positions, o));
            }
        }
        return results;
    }

    /// <summary>
    /// The trials of a condition for a contrast: as recorded when the contrast is tested, because the test removes the
    /// evoked response inside, from each group of every split (band isolation is linear, so removing it from the
    /// narrowband signals is the same); with the condition's own mean removed here when only values are computed.
    /// </summary>
    private static TrialSet Cut(Plan plan, LoadedInput input, string condition, int pad)
    {
        var trials = input.Trials(plan.Conditions.First(c => c.Name == condition), plan.Trial, pad);
        if (plan.SubtractEvoked && plan.Surrogates == 0) EvokedRemoval.SubtractInPlace(trials);
        return trials;
    }

    /// <summary>Runs a check whose message names no file, prefixing its InputException with the plan and the key it concerns.</summary>
    private static T InPlan<T>(Plan plan, string key, Func<T> check)
    {
        try { return check(); }
        catch (InputException e) { throw new InputException($"{plan.Where(key)}: {e.Message}", e); }
    }
}
