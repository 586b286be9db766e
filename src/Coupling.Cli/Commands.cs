using System.Globalization;
using Coupling.Formats;
using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Simulation;

namespace Coupling.Cli;

/// <summary>The actions behind the commands: each calls the library and prints through the given writers.</summary>
internal static class Commands
{
    public static int Demo(string folder, int? surrogates, int threads, TextWriter output, TextWriter error)
    {
        output.WriteLine($"Simulating the demo scenario into {folder} ...");
        var paths = ScenarioFiles.Write(folder, new ScenarioOptions { Seed = ScenarioFiles.DefaultSeed },
            surrogates ?? ScenarioFiles.DefaultSurrogates);
        var plan = PlanReader.Read(paths.Plan);
        var outcome = Execute(plan, threads, $"coupling demo --output {folder}", error);
        PrintOutcome(outcome, output);

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

    public static int RunPlan(string planPath, int threads, TextWriter output, TextWriter error)
    {
        var plan = PlanReader.Read(planPath);
        var outcome = Execute(plan, threads, $"coupling run {planPath}", error);
        PrintOutcome(outcome, output);
        return 0;
    }

    public static int Simulate(string folder, int seed, int? trials, TextWriter output)
    {
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
        string ext = Path.GetExtension(file).ToLowerInvariant();
        RecordingSummary summary = ext switch
        {
            ".edf" => RecordingSummary.Describe(EdfReader.ReadHeader(file), EdfReader.ReadEvents(file))
                .WithSidecars(RecordingSidecars.FindBesides(file)),
            ".csv" => RecordingSummary.Describe(CsvRecording.Read(file, rate ?? throw new InputException($"{file}: a CSV file carries no sampling rate; give --rate in Hz.")), "CSV"),
            ".npy" => throw new InputException($"{file}: an NPY array holds no channel names or rate; use it through a plan with 'epochs' and 'sample_rate'. Its shape: ({string.Join(", ", NpyArray.Read(file).Shape)})."),
            _ => throw new InputException($"{file}: unknown extension '{ext}'; expected .edf, .csv or .npy."),
        };
        foreach (var line in summary.Format()) output.WriteLine(line);
        return 0;
    }

    private static RunOutcome Execute(Plan plan, int threads, string commandLine, TextWriter error)
    {
        var progress = new TerminalProgress(error, ReferenceEquals(error, Console.Error) && !Console.IsErrorRedirected);
        using var stop = new CancellationTokenSource();
        ConsoleCancelEventHandler onCancel = (_, e) => { e.Cancel = true; stop.Cancel(); };
        Console.CancelKeyPress += onCancel;
        try { return AnalysisRunner.Run(plan, progress, threads, commandLine, stop.Token); }
        finally
        {
            Console.CancelKeyPress -= onCancel;
            progress.End();
        }
    }

    private static void PrintOutcome(RunOutcome outcome, TextWriter output)
    {
        output.WriteLine($"Results: {outcome.OutputFolder}");
        output.WriteLine($"  report:   {Path.Combine(outcome.OutputFolder, "report.html")}");
        output.WriteLine($"  edges:    {Path.Combine(outcome.OutputFolder, "edges.tsv")}");
        output.WriteLine($"  figures:  {Path.Combine(outcome.OutputFolder, "figures")}");
        if (outcome.Contrasts.Count > 0)
            output.WriteLine($"  contrasts: {Path.Combine(outcome.OutputFolder, "contrasts.tsv")}");
        foreach (var c in outcome.Conditions)
            output.WriteLine($"  {c.Condition}: {c.Trials} trials{(c.Dropped.Count > 0 ? $", {c.Dropped.Count} dropped (listed in the manifest)" : "")}");
        foreach (var w in outcome.Warnings) output.WriteLine($"  warning: {w}");
        output.WriteLine($"  {outcome.Results.Sum(r => r.Significant.Count(s => s))} significant pairs in {outcome.Results.Count} tables; {outcome.Elapsed.TotalSeconds:0.0} s");
    }
}
