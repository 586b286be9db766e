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
        return new RunOutcome(written, analysis.Results, analysis.Conditions, analysis.Warnings, clock.Elapsed, analysis.Contrasts, units.Resumed);
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
            foreach (var label in condition.EventLabels)
                if (!input.EventLabels.Contains(label))
                {
                    var known = input.EventLabels.Distinct().Order(StringComparer.Ordinal).ToArray();
                    throw new InputException($"{plan.Where($"conditions.{condition.Name}")}: event label '{label}' does not occur in {input.Source}{Plans.Spelling.Hint(label, known)}; labels there: {string.Join(", ", known)}.");
                }
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

        var warnings = new List<string>(BandWarnings.For(plan, decompositions, input.SampleRate, input.EpochSamples));
        int pairs = Measures.PairIndex.Count(input.Channels.Count);
        int needed = (int)Math.Ceiling(pairs / plan.Q) - 1;
        if (plan.Surrogates > 0 && plan.Surrogates < needed)
        {
            int k = (int)Math.Ceiling(pairs / (plan.Q * (plan.Surrogates + 1)));
            string reach = k > pairs
                ? $"no pair can pass the correction whatever the data (that would take {k} pairs at that p, and only {pairs} are tested)"
                : $"a pair can pass the correction only if at least {k} pairs reach that p";
            warnings.Add(string.Create(CultureInfo.InvariantCulture,
                $"With {plan.Surrogates} surrogates the smallest attainable p is 1/{plan.Surrogates + 1}; across {pairs} pairs at q = {plan.Q:G3} {reach}. " +
                $"Use at least {needed} surrogates for a single coupled pair to be detectable."));
        }
        foreach (var w in warnings) onWarning?.Invoke(w);

        var results = new List<PairResult>();
        var summaries = new List<ConditionSummary>();
        // A condition with a unit kept by an interrupted run is isolated band by band, so kept bands are not isolated again.
        var kept = units?.KeptUnits(plan) ?? [];
        for (int ci = 0; ci < plan.Conditions.Count; ci++)
        {
            TrialSet? trials = input.Trials(plan.Conditions[ci], plan.Trial, pad);
            if (plan.SubtractEvoked) EvokedRemoval.SubtractInPlace(trials);
            summaries.Add(new ConditionSummary(trials.Condition, trials.TrialCount, trials.DroppedTrials));
            string conditionName = trials.Condition;
            var channels = trials.Channels;
            // Memory: when every band's narrowband set together is smaller than the padded trials, isolate them all
            // first and let the trials go before the surrogate tests (BandOrder).
            var sets = new NarrowbandSet?[decompositions.Length];
            bool resuming = plan.Bands.Any(b => kept.Contains(UnfinishedRun.ConditionUnit(conditionName, b.Name)));
            if (!resuming && BandOrder.IsolateAllFirst(trials, plan.Window, steps))
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
                IReadOnlyList<SurrogateResult> Compute()
                {
                    if (sets[bi] is null) progress?.Report(new RunProgress($"{stage}: band isolation", 0, 0));
                    var narrowband = sets[bi] ?? NarrowbandExtractor.Extract(trials!, decompositions[bi], plan.Window, steps[bi], workers);
                    sets[bi] = null;
                    var stageProgress = progress is null ? null
                        : new Progress<int>(done => progress.Report(new RunProgress($"{stage}: surrogates", done, plan.Surrogates)));
                    return plan.Surrogates == 0 ? ValuesOnly.Compute(narrowband, plan.Measures)
                        : SurrogateTest.Run(narrowband, plan.Measures, plan.Surrogates, Seeds.For(plan.Seed, ci, bi), conditionName,
                            workers > 0 ? workers : null, stageProgress, cancellationToken);
                }
                var tested = units?.Condition(ci, bi, UnfinishedRun.ConditionUnit(conditionName, plan.Bands[bi].Name), Compute) ?? Compute();
                sets[bi] = null;
                foreach (var m in tested)
                {
                    var corrected = FalseDiscoveryRate.BenjaminiHochbergOfDefined(m.P);
                    var significant = corrected.Select(q => q <= plan.Q).ToArray();
                    results.Add(new PairResult(conditionName, plan.Bands[bi].Name, MeasureCatalog.Key(m.Measure), channels,
                        m.Observed, m.Z, m.P, corrected, significant, input.Channels.Select(c => c.Position).ToArray()));
                }
            }
        }
        var contrasts = Contrast(plan, input, decompositions, steps, pad, progress, workers, cancellationToken, units);
        return new Analysis(results, summaries, decompositions.Select(d => d.Info).ToArray(), steps, pad, warnings, contrasts);
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
                IReadOnlyList<ContrastResult> Compute()
                {
                    progress?.Report(new RunProgress($"{stage}: band isolation", 0, 0));
                    var a = NarrowbandExtractor.Extract(trialsA, decompositions[bi], plan.Window, steps[bi], workers);
                    var b = NarrowbandExtractor.Extract(trialsB, decompositions[bi], plan.Window, steps[bi], workers);
                    var stageProgress = progress is null ? null
                        : new Progress<int>(done => progress.Report(new RunProgress($"{stage}: label permutations", done, plan.Surrogates)));
                    return plan.Surrogates == 0 ? ValuesOnly.Compare(a, b, plan.Measures)
                        : ConditionContrast.Run(a, b, plan.Measures, plan.Surrogates, Seeds.ForContrast(plan.Seed, ki, bi), contrast.Name,
                            workers > 0 ? workers : null, stageProgress, cancellationToken);
                }
                var tested = units?.Contrast(ki, bi, UnfinishedRun.ContrastUnit(contrast.Name, plan.Bands[bi].Name), Compute) ?? Compute();
                foreach (var m in tested)
                {
                    var corrected = FalseDiscoveryRate.BenjaminiHochbergOfDefined(m.P);
                    var significant = corrected.Select(q => q <= plan.Q).ToArray();
                    results.Add(new ContrastPairResult(contrast.Name, contrast.ConditionA, contrast.ConditionB, plan.Bands[bi].Name,
                        MeasureCatalog.Key(m.Measure), trialsA.Channels, m.ValueA, m.ValueB, m.Difference, m.Z, m.P, corrected, significant, positions));
                }
            }
        }
        return results;
    }

    private static TrialSet Cut(Plan plan, LoadedInput input, string condition, int pad)
    {
        var trials = input.Trials(plan.Conditions.First(c => c.Name == condition), plan.Trial, pad);
        if (plan.SubtractEvoked) EvokedRemoval.SubtractInPlace(trials);
        return trials;
    }

    /// <summary>Runs a check whose message names no file, prefixing its InputException with the plan and the key it concerns.</summary>
    private static T InPlan<T>(Plan plan, string key, Func<T> check)
    {
        try { return check(); }
        catch (InputException e) { throw new InputException($"{plan.Where(key)}: {e.Message}", e); }
    }
}
