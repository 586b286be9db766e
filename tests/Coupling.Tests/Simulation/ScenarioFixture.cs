using Coupling.Simulation;

namespace Coupling.Tests.Simulation;

/// <summary>The default scenario, generated once for the tests that only read it.</summary>
public sealed class ScenarioFixture
{
    public ScenarioFixture()
    {
        Options = new ScenarioOptions();
        Scenario = Simulator.Generate(Options);
    }

    public ScenarioOptions Options { get; }

    public SimulatedScenario Scenario { get; }

    public double[] Channel(string label) => Scenario.Recording.Samples[Scenario.Recording.IndexOf(label)];

    /// <summary>First sample of each trial span of the given condition (all trials when null).</summary>
    public int[] SpanStarts(string? condition = null) =>
        Scenario.Recording.Events
            .Where(e => condition is null || e.Label == condition)
            .Select(e => (int)Math.Round((e.Onset + Options.TrialStart) * Scenario.Recording.SampleRate))
            .ToArray();

    /// <summary>Samples per trial span.</summary>
    public int SpanLength => (int)Math.Round((Options.TrialEnd - Options.TrialStart) * Options.SampleRate);
}
