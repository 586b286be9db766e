using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Simulation;

namespace Coupling.Tests.Plans;

public class ExamplePlanTests
{
    private static string ExamplesFolder()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "Coupling.sln"))) dir = dir.Parent;
        return Path.Combine(dir?.FullName ?? throw new DirectoryNotFoundException("Coupling.sln not found above the test folder."), "examples");
    }

    [Theory]
    [InlineData("scenario-plan.yaml")]
    [InlineData("csv-recording-plan.yaml")]
    [InlineData("npy-epochs-plan.yaml")]
    public void Every_example_plan_passes_the_plan_checks(string name)
    {
        var plan = PlanReader.Read(Path.Combine(ExamplesFolder(), name));
        Assert.NotEmpty(plan.Conditions);
        Assert.NotEmpty(plan.Bands);
        Assert.NotEmpty(plan.Measures);
    }

    [Fact]
    public void The_scenario_example_is_the_plan_the_simulator_writes()
    {
        // The committed example must not drift from what `coupling simulate` writes for the default scenario.
        var truth = Simulator.Generate(new ScenarioOptions { Seed = ScenarioFiles.DefaultSeed }).Truth;
        string written = ScenarioFiles.PlanText(truth, ScenarioFiles.DefaultSurrogates);
        Assert.Equal(written.ReplaceLineEndings("\n"), File.ReadAllText(Path.Combine(ExamplesFolder(), "scenario-plan.yaml")).ReplaceLineEndings("\n"));
    }
}
