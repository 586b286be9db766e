namespace Coupling.Tests.Simulation;

/// <summary>Test classes that read the default scenario share one generated copy of it.</summary>
[CollectionDefinition(Name)]
public sealed class ScenarioCollection : ICollectionFixture<ScenarioFixture>
{
    public const string Name = "default simulated scenario";
}
