using Coupling.Pipeline;
using Coupling.Plans;
using Coupling.Simulation;

namespace Coupling.Tests.Pipeline;

public sealed class ChannelOrderTests
{
    [Fact]
    public void Results_list_the_channels_of_an_EDF_recording_in_the_order_the_plan_names_them()
    {
        using var folder = new TempFolder();
        var paths = ScenarioFiles.Write(folder.Path, new ScenarioOptions { TrialsPerCondition = 20 }, surrogates: 20);
        string plan = File.ReadAllText(paths.Plan)
            .Replace("recording: scenario.edf", "recording: scenario.edf\nchannels: [R4, L1, L3]")
            .Replace("figures: true", "figures: false");
        plan = System.Text.RegularExpressions.Regex.Replace(plan, "measures: \\[.*\\]", "measures: [plv]");
        File.WriteAllText(paths.Plan, plan);
        var outcome = AnalysisRunner.Run(PlanReader.Read(paths.Plan));
        Assert.All(outcome.Results, r => Assert.Equal(["R4", "L1", "L3"], r.Channels));
        string header = File.ReadLines(Path.Combine(outcome.OutputFolder, "matrices", "tone_theta_plv_value.csv")).First();
        Assert.Equal("channel,R4,L1,L3", header);
    }
}
