using System.Globalization;
using Coupling.Formats;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Simulation;
using Coupling.Statistics;

namespace Coupling.Cli;

/// <summary>The actions behind the commands: each calls the library and prints through the given writers.</summary>
internal static class Commands
{
    public static int Demo(string folder, int? surrogates, int threads, bool force, Verbosity verbosity, TextWriter output, TextWriter error)
    {
        if (surrogates is { } n && (n < PlanReader.MinSurrogates || n > PlanReader.MaxSurrogates))
            throw new InputException($"--surrogates: {n} is not a whole number from {PlanReader.MinSurrogates} to {PlanReader.MaxSurrogates} (0: values without a test).");
        ScenarioFolder.Check(folder, force);
        if (verbosity != Verbosity.Quiet) output.WriteLine($"Simulating the demo scenario into {folder} ...");
        var paths = ScenarioFiles.Write(folder, new ScenarioOptions { Seed = ScenarioFiles.DefaultSeed },
            surrogates ?? ScenarioFiles.DefaultSurrogates);
        var plan = PlanReader.Read(paths.Plan) with { Overwrite = force };
        var outcome = Execute(plan, threads, $"coupling demo --output {folder}", error, restart: false, verbosity);
        PrintOutcome(outcome, plan, verbosity, output);
        if (plan.Surrogates == 0)
        {
            output.WriteLine();
            output.WriteLine($"Values only (--surrogates 0): nothing was tested, so nothing is compared with the ground truth ({paths.Truth}).");
            return 0;
        }

        var truth = TruthFile.Read(paths.Truth);
        var lines = TruthCheck.Compare(truth, outcome.Results).Concat(TruthCheck.CompareContrasts(truth, outcome.Contrasts)).ToArray();
        output.WriteLine();
        output.WriteLine($"Ground truth ({paths.Truth}): {lines.Count(l => l.Agrees)} of {lines.Length} expectations met.");
        foreach (var group in lines.GroupBy(l => (l.ChannelA, l.ChannelB, l.Kind, l.Band, Contrast: l.Condition.Contains(" vs ", StringComparison.Ordinal))))
        {
            var bad = group.Where(l => !l.Agrees).ToArray();
            string verdict = bad.Length == 0 ? "as expected" : "NOT as expected: " + string.Join("; ", bad.Select(l =>
                $"{l.Condition}/{l.Measure} {(l.Significant ? "significant" : "not significant")} (corrected p {l.PCorrected.ToString("G3", CultureInfo.InvariantCulture)})"));
            string what = group.Key.Contrast ? $"difference {group.First().Condition}" : "per condition";
            output.WriteLine($"  {group.Key.ChannelA}-{group.Key.ChannelB} {group.Key.Kind} ({group.Key.Band}), {what}: {verdict}");
        }
        var unexpected = TruthCheck.UnexpectedDiscoveries(truth, outcome.Results);
        int found = unexpected.Sum(u => u.Unexpected), tested = unexpected.Sum(u => u.Tested);
        output.WriteLine($"  pairs with nothing built in: {found} of {tested} tests significant (false discovery rate controlled per table at q = {plan.Q.ToString("G3", CultureInfo.InvariantCulture)})");
        if (outcome.Contrasts.Count > 0)
        {
            var differences = TruthCheck.UnexpectedDiscoveries(truth, outcome.Contrasts.Select(c => c.AsDifference()).ToArray());
            output.WriteLine($"  pairs with nothing built in, condition differences: {differences.Sum(u => u.Unexpected)} of {differences.Sum(u => u.Tested)} tests significant");
        }
        return 0;
    }

    public static int RunPlan(PlanOverrides options, int threads, bool restart, Verbosity verbosity, TextWriter output, TextWriter error)
    {
        var plan = options.Read();
        if (verbosity == Verbosity.Verbose && !restart) PrintPreview(PlanCheck.Preview(plan), plan, output);
        var outcome = Execute(plan, threads, $"coupling run {options.PlanPath}", error, restart, verbosity);
        PrintOutcome(outcome, plan, verbosity, output);
        return 0;
    }

    public static int Check(PlanOverrides options, TextWriter output)
    {
        var plan = options.Read();
        PrintPreview(PlanCheck.Preview(plan), plan, output);
        output.WriteLine("The plan is valid; nothing was computed or written.");
        return 0;
    }

    public static int Simulate(string folder, int seed, int? trials, bool force, TextWriter output)
    {
        if (trials is < 2) throw new InputException($"--trials: {trials} is too few; expected at least 2 trials per condition.");
        ScenarioFolder.Check(folder, force);
        var options = new ScenarioOptions { Seed = seed };
        if (trials is { } n) options = options with { TrialsPerCondition = n };
        var paths = ScenarioFiles.Write(folder, options);
        output.WriteLine($"Recording:    {paths.Recording}");
        output.WriteLine($"Ground truth: {paths.Truth}");
        output.WriteLine($"Plan:         {paths.Plan}   (coupling run {paths.Plan})");
        return 0;
    }

    public static int Inspect(string file, double? rate, TextWriter output)
    {
        if (!File.Exists(file)) throw new InputException($"{file}: file not found.");
        if (rate is { } r && !(r > 0 && double.IsFinite(r))) throw new InputException($"--rate: {r} is not a positive number of Hz.");
        string ext = Path.GetExtension(file).ToLowerInvariant();
        RecordingSummary? summary = ext switch
        {
            ".edf" or ".bdf" => DescribeEdf(file).WithSidecars(RecordingSidecars.FindBesides(file)),
            ".csv" => RecordingSummary.Describe(CsvRecording.Read(file, rate ?? throw new InputException($"{file}: a CSV file carries no sampling rate; give --rate in Hz.")), "CSV")
                .WithSidecars(RecordingSidecars.FindBesides(file)),
            ".npy" => null,
            _ => throw new InputException($"{file}: unknown extension '{ext}'; expected .edf, .bdf, .csv or .npy."),
        };
        if (summary is null)
        {
            var (shape, dtype, fortran) = NpyArray.ReadHeader(file);
            output.WriteLine($"file: {file}");
            output.WriteLine($"format: NPY array, dtype {dtype}, {(fortran ? "Fortran" : "C")} order");
            output.WriteLine($"shape: ({string.Join(", ", shape)})");
            output.WriteLine(shape.Count == 3
                ? $"as epochs: {shape[0]} trials x {shape[1]} channels x {shape[2]} samples; analyse it through a plan with 'sample_rate' and 'epochs' (first_sample_time, labels, channel_labels)."
                : $"an epochs array needs 3 dimensions (trials x channels x samples); this one has {shape.Count}.");
            return 0;
        }
        foreach (var line in summary.Format()) output.WriteLine(line);
        return 0;
    }

    /// <summary>
    /// An EDF or BDF file's summary; for a discontinuous file with the gaps between its records (placed as a run places
    /// them), and for a BDF file with a Status signal with what its trigger codes give.
    /// </summary>
    private static RecordingSummary DescribeEdf(string file)
    {
        var header = EdfReader.ReadHeader(file);
        var summary = RecordingSummary.Describe(header, EdfReader.ReadEvents(file));
        if (!header.IsDiscontinuous && EdfReader.StatusSignal(header) < 0) return summary;
        var placed = EdfSegmentReader.Open(file);
        return summary with
        {
            Notes = summary.Notes.Concat(placed.Notes.Where(n => n.StartsWith(header.FormatName + ":", StringComparison.Ordinal)
                || n.Contains($"'{EdfReader.StatusLabel}' signal", StringComparison.Ordinal))).ToArray(),
        };
    }

    private static RunOutcome Execute(Plan plan, int threads, string commandLine, TextWriter error, bool restart, Verbosity verbosity)
    {
        using var stop = new CancellationTokenSource();
        ConsoleCancelEventHandler onCancel = (_, e) => { e.Cancel = true; stop.Cancel(); };
        Console.CancelKeyPress += onCancel;
        try
        {
            // Warnings arrive once the input is checked, before the long computation; --quiet leaves them for the summary.
            if (verbosity == Verbosity.Quiet)
                return AnalysisRunner.Run(plan, null, threads, commandLine, stop.Token, restart);
            void Warn(string warning) => error.WriteLine($"coupling: warning: {warning}");
            bool terminal = ReferenceEquals(error, Console.Error) && !Console.IsErrorRedirected;
            return terminal
                ? BarProgress.Show(error, bars => AnalysisRunner.Run(plan, bars, threads, commandLine, stop.Token, restart,
                    w => bars.WriteLine($"coupling: warning: {w}")))
                : AnalysisRunner.Run(plan, new PlainProgress(error, verbosity == Verbosity.Verbose), threads, commandLine, stop.Token, restart, Warn);
        }
        finally
        {
            Console.CancelKeyPress -= onCancel;
        }
    }

    private static void PrintPreview(PlanPreview p, Plan plan, TextWriter output)
    {
        var inv = CultureInfo.InvariantCulture;
        output.WriteLine($"Plan: {p.Plan}");
        output.WriteLine(string.Create(inv, $"Recording: {p.Recording}, {p.SampleRate:G6} Hz, {p.Channels.Count} channels ({string.Join(", ", p.Channels)}), {p.Pairs} pairs"));
        output.WriteLine("Trials per condition:");
        foreach (var c in p.Conditions) output.WriteLine($"  {c.Condition}: {c.Trials}");
        output.WriteLine("Bands:");
        foreach (var b in p.Bands)
        {
            string kernel = b.Method == "morlet" ? "wavelet support" : "filter";
            output.WriteLine(string.Create(inv,
                $"  {b.Band}: {b.Method}, {kernel} {b.KernelSamples} samples ({b.KernelSeconds:G4} s), padding {b.PadSamples} samples per trial end, time step {b.TimeStep} samples"));
        }
        output.WriteLine($"Work units: {p.WorkUnits.Count} ({plan.Conditions.Count} condition(s) x {plan.Bands.Count} band(s)" +
            (plan.Contrasts.Count > 0 ? $", {plan.Contrasts.Count} contrast(s) x {plan.Bands.Count} band(s)" : "") + $"), {p.Surrogates} surrogates each");
        foreach (var u in p.WorkUnits) output.WriteLine($"  {u}{(p.KeptUnits.Contains(u) ? "   (kept by an interrupted run: loaded, not computed)" : "")}");
        string verdict = p.Surrogates == 0 ? " (values only, no test)."
            : p.Surrogates < p.SurrogatesForOneDiscovery ? " (too few for a lone coupled pair to pass the correction)." : ".";
        output.WriteLine(string.Create(inv,
            $"Surrogates needed for a single discovery among {p.Pairs} pairs at {(CorrectionSpec.ControlsFalseDiscoveries(plan.Correction.Method) ? "q" : "alpha")} = {plan.Q:G3} ({CorrectionSpec.Key(plan.Correction.Method)}): at least {p.SurrogatesForOneDiscovery}; the plan has {p.Surrogates}{verdict}"));
        if (p.SurrogatesForOneDifference is { } forDifference)
        {
            string contrastVerdict = p.Surrogates == 0 ? " (values only, no test)."
                : p.Surrogates < forDifference ? " (too few for a lone pair that differs to pass the correction)." : ".";
            output.WriteLine(string.Create(inv,
                $"Surrogates needed for a single difference between conditions (two-sided): at least {forDifference}; the plan has {p.Surrogates}{contrastVerdict}"));
        }
        foreach (var w in p.Warnings) output.WriteLine($"warning: {w}");
        string state = !Directory.Exists(p.Output) ? " (new)"
            : Directory.EnumerateFileSystemEntries(p.Output).Any() ? " (earlier results, to be replaced)" : " (an empty folder, to be filled)";
        output.WriteLine($"Output: {p.Output}{state}");
    }

    private static void PrintOutcome(RunOutcome outcome, Plan plan, Verbosity verbosity, TextWriter output)
    {
        output.WriteLine($"Results: {outcome.OutputFolder}");
        if (verbosity == Verbosity.Quiet)
        {
            foreach (var w in outcome.Warnings) output.WriteLine($"  warning: {w}");
            return;
        }
        output.WriteLine($"  report:   {Path.Combine(outcome.OutputFolder, "report.html")}");
        output.WriteLine($"  edges:    {Path.Combine(outcome.OutputFolder, "edges.tsv")}");
        if (Directory.Exists(Path.Combine(outcome.OutputFolder, "figures")))
            output.WriteLine($"  figures:  {Path.Combine(outcome.OutputFolder, "figures")}");
        if (outcome.Contrasts.Count > 0)
            output.WriteLine($"  contrasts: {Path.Combine(outcome.OutputFolder, "contrasts.tsv")}");
        foreach (var c in outcome.Conditions)
            output.WriteLine($"  {c.Condition}: {c.Trials} trials{(c.Dropped.Count > 0 ? $", {c.Dropped.Count} dropped (listed in the manifest)" : "")}");
        if (outcome.ResumedUnits is { Count: > 0 } resumed)
            output.WriteLine($"  resumed: {resumed.Count} work unit(s) loaded from the interrupted earlier run ({string.Join("; ", resumed)})");
        if (outcome.Warnings.Count > 0) output.WriteLine($"  {outcome.Warnings.Count} warning(s), shown before the computation and in the report");
        output.WriteLine($"  {outcome.Results.Sum(r => r.Significant.Count(s => s))} significant pairs in {outcome.Results.Count} tables; {outcome.Elapsed.TotalSeconds:0.0} s");
    }
}
