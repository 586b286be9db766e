using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Simulation;

namespace Coupling.Tests.Reports;

/// <summary>
/// A small run shaped like the demo: the simulated scenario (two conditions, a contrast, every measure, evoked response
/// kept) cut down to six channels and two bands so it runs in seconds. With 15 pairs, 400 surrogates let a single pair
/// pass the Benjamini-Hochberg step 0.05/15 (smallest p 1/401; Benjamini &amp; Hochberg 1995, J R Stat Soc B 57:289).
/// Kept: the theta pair L1-R4 (phase-coupled at a lag), the alpha zero-lag pair L4-L5 and the stimulus-locked pair R2-R3.
/// </summary>
public sealed class ReportRun : IDisposable
{
    private readonly Pipeline.TempFolder _folder = new();

    public ReportRun()
    {
        var paths = ScenarioFiles.Write(_folder.Path, new ScenarioOptions(), surrogates: 400);
        var lines = File.ReadAllLines(paths.Plan)
            .Where(l => !l.StartsWith("  beta:", StringComparison.Ordinal) && !l.StartsWith("  gamma:", StringComparison.Ordinal))
            .Append("channels: [L1, R4, L4, L5, R2, R3]");
        File.WriteAllLines(paths.Plan, lines);
        Plan = PlanReader.Read(paths.Plan);
        Outcome = AnalysisRunner.Run(Plan);
    }

    public Plan Plan { get; }

    public RunOutcome Outcome { get; }

    public string Output(string relative) => Path.Combine(Outcome.OutputFolder, relative);

    public void Dispose() => _folder.Dispose();
}

/// <summary>Test classes that read the one small demo-like run.</summary>
[CollectionDefinition(Name)]
public sealed class ReportRunCollection : ICollectionFixture<ReportRun>
{
    public const string Name = "small demo-like run for the report";
}
