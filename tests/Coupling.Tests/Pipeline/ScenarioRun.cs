using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Simulation;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// The simulated demo scenario written to files and analysed once by the whole pipeline, at the default 2000
/// surrogates: with 45 pairs the smallest possible two-sided p, 2/(M + 1), must pass the Benjamini-Hochberg step
/// 0.05/45 (Benjamini &amp; Hochberg 1995, J. R. Stat. Soc. B 57:289), which needs M >= 1799.
/// </summary>
public sealed class ScenarioRun : IDisposable
{
    private readonly TempFolder _folder = new();

    public ScenarioRun()
    {
        Paths = ScenarioFiles.Write(_folder.Path, new ScenarioOptions(), ScenarioFiles.DefaultSurrogates);
        Plan = PlanReader.Read(Paths.Plan);
        Outcome = AnalysisRunner.Run(Plan);
        Truth = TruthFile.Read(Paths.Truth);
        Lines = TruthCheck.Compare(Truth, Outcome.Results);
        ContrastLines = TruthCheck.CompareContrasts(Truth, Outcome.Contrasts);
    }

    public ScenarioPaths Paths { get; }

    public Plan Plan { get; }

    public RunOutcome Outcome { get; }

    public GroundTruth Truth { get; }

    public IReadOnlyList<TruthCheckLine> Lines { get; }

    /// <summary>The ground truth held against the condition contrasts (the plan contrasts tone with light).</summary>
    public IReadOnlyList<TruthCheckLine> ContrastLines { get; }

    public string Output(string relative) => Path.Combine(Outcome.OutputFolder, relative);

    public void Dispose() => _folder.Dispose();
}

/// <summary>Test classes that read the one analysed scenario.</summary>
[CollectionDefinition(Name)]
public sealed class ScenarioRunCollection : ICollectionFixture<ScenarioRun>
{
    public const string Name = "scenario analysed end to end";
}
