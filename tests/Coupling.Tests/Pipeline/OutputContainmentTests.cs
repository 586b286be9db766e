using System.Text;
using Coupling.Pipeline;
using Coupling.Plans;

namespace Coupling.Tests.Pipeline;

/// <summary>Names taken from plans, recordings and sidecars never make a run write outside its results folder.</summary>
public sealed class OutputContainmentTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void Channel_labels_and_sidecar_names_that_look_like_paths_write_nothing_outside_the_results_folder()
    {
        string study = _folder["study"];
        Directory.CreateDirectory(study);
        SmallStudy.WriteRecording(study);
        string csv = Path.Combine(study, "rec.csv");
        var lines = File.ReadAllLines(csv);
        lines[0] = "../../A,/tmp/B,..\\C,D";
        File.WriteAllLines(csv, lines);
        File.WriteAllText(Path.Combine(study, "rec_channels.tsv"), "name\ttype\tunits\n../../A\tEEG\tuV\n/tmp/B\tEEG\tuV\n..\\C\t../x\t/y\nD\tEEG\tuV\n", Encoding.UTF8);
        string plan = Path.Combine(study, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates: 20, channels: "['../../A', '/tmp/B', '..\\C', D]").Replace("figures: false", "figures: true"));
        var before = _folder.Entries();

        var outcome = AnalysisRunner.Run(PlanReader.Read(plan));

        Assert.Equal(before, _folder.Entries());
        Assert.Equal(["plan.yaml", "rec.csv", "rec_channels.tsv", "rec_events.tsv", "results"],
            Directory.GetFileSystemEntries(study).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        string root = outcome.OutputFolder + Path.DirectorySeparatorChar;
        Assert.All(Directory.EnumerateFiles(outcome.OutputFolder, "*", SearchOption.AllDirectories), f => Assert.StartsWith(root, Path.GetFullPath(f)));
        Assert.Equal("../../A", outcome.Results[0].Channels[0]);
    }

    [Theory]
    [InlineData("conditions: { ../../up: [go] }", "conditions")]
    [InlineData("conditions: { go/x: [go] }", "conditions")]
    [InlineData("bands: { ../alpha: [8, 12] }", "bands")]
    public void Condition_and_band_names_with_path_characters_are_refused(string line, string key)
    {
        string key0 = line.Split(':')[0];
        string text = string.Join("\n", SmallStudy.PlanText().Split('\n').Select(l => l.TrimStart().StartsWith(key0 + ":", StringComparison.Ordinal) ? line : l));
        var e = Assert.Throws<InputException>(() => PlanReader.Parse(new StringReader(text), _folder["plan.yaml"]));
        Assert.Contains(key, e.Message);
        Assert.Contains("may hold only letters, digits", e.Message);
    }
}
