using System.Text.Json;
using System.Text.Json.Nodes;
using System.Xml.Linq;
using Coupling.Outputs;
using Coupling.Spectral;

namespace Coupling.Tests.Outputs;

public class ManifestTests
{
    private static Manifest Sample() => new()
    {
        Tool = ToolInfo.Current(),
        Started = new DateTimeOffset(2025, 3, 4, 10, 0, 0, TimeSpan.FromHours(1)),
        Finished = new DateTimeOffset(2025, 3, 4, 10, 2, 30, 500, TimeSpan.FromHours(1)),
        CommandLine = ["coupling", "run", "plan.yaml", "--out", "results dir"],
        Inputs = [new InputFileRecord("data/sub-01.edf", 1234, new string('a', 64))],
        Plan = JsonNode.Parse("""{"bands":[{"name":"theta","low":4,"high":8}],"surrogates":200,"window":[0.1,0.5]}"""),
        Seed = 20250304,
        Decompositions =
        [
            new DecompositionInfo("fir-hilbert", "theta", new Dictionary<string, double> { ["pass_low_hz"] = 4, ["filter_taps"] = 825 }),
            new DecompositionInfo("morlet", "gamma", new Dictionary<string, double> { ["cycles"] = 7, ["time_sd_s"] = double.NaN }),
        ],
        Conditions =
        [
            new ConditionTrials("go", 58, ["trial 12: amplitude above 150 uV", "trial 40: overlaps recording end"]),
            new ConditionTrials("stop", 60, []),
        ],
        TimeSteps = [new BandTimeStep("theta", 15, 0.06), new BandTimeStep("gamma", 1, 0.004)],
        Outputs = ["edges.tsv", "manifest.json"],
        Extra = new JsonObject { ["shard"] = 3 },
    };

    [Fact]
    public void A_manifest_written_to_disk_parses_back_with_every_field()
    {
        using var dir = new TempFolder();
        var m = Sample();
        ManifestWriter.Write(m, dir["manifest.json"]);
        var back = ManifestReader.Read(dir["manifest.json"]);

        Assert.Equal(m.Tool.Name, back.Tool.Name);
        Assert.Equal(m.Tool.Version, back.Tool.Version);
        Assert.Equal(m.Tool.Runtime, back.Tool.Runtime);
        Assert.Equal(m.Tool.OperatingSystem, back.Tool.OperatingSystem);
        Assert.Equal(m.Tool.Packages, back.Tool.Packages);
        Assert.Equal(m.Started, back.Started);
        Assert.Equal(m.Finished, back.Finished);
        Assert.Equal(150.5, back.RunSeconds);
        Assert.Equal(m.CommandLine, back.CommandLine);
        Assert.Equal(m.Inputs, back.Inputs);
        Assert.True(JsonNode.DeepEquals(m.Plan, back.Plan));
        Assert.Equal(m.Seed, back.Seed);
        Assert.Equal(2, back.Decompositions.Count);
        Assert.Equal("fir-hilbert", back.Decompositions[0].Method);
        Assert.Equal(825, back.Decompositions[0].Parameters["filter_taps"]);
        Assert.True(double.IsNaN(back.Decompositions[1].Parameters["time_sd_s"]));
        Assert.Equal(m.Conditions.Select(c => (c.Condition, c.Trials)), back.Conditions.Select(c => (c.Condition, c.Trials)));
        Assert.Equal(m.Conditions[0].Dropped, back.Conditions[0].Dropped);
        Assert.Equal(m.TimeSteps, back.TimeSteps);
        Assert.Equal(m.Outputs, back.Outputs);
        Assert.Equal(3, (int)back.Extra!["shard"]!);
    }

    [Fact]
    public void The_json_is_indented_with_snake_case_names()
    {
        string json = ManifestWriter.Serialize(Sample());
        using var doc = JsonDocument.Parse(json);
        var names = doc.RootElement.EnumerateObject().Select(p => p.Name).ToArray();
        Assert.Equal(
            ["format", "tool", "started", "finished", "run_seconds", "command_line", "inputs", "plan", "seed", "decompositions",
             "conditions", "time_steps", "outputs", "resumed_units", "extra"], names);
        Assert.Contains("\n  \"tool\": {\n", json);
        Assert.Equal("2025-03-04T10:00:00+01:00", doc.RootElement.GetProperty("started").GetString()); // ISO 8601
        Assert.Equal(JsonValueKind.Object, doc.RootElement.GetProperty("plan").ValueKind);
        Assert.Equal("NaN", doc.RootElement.GetProperty("decompositions")[1].GetProperty("parameters").GetProperty("time_sd_s").GetString());
    }

    [Fact]
    public void Library_versions_match_the_central_package_pins()
    {
        // Directory.Packages.props is the single place versions are pinned; the loaded assemblies must be those.
        var props = XDocument.Load(FindUp("Directory.Packages.props"));
        var pins = props.Descendants("PackageVersion").ToDictionary(e => (string)e.Attribute("Include")!, e => (string)e.Attribute("Version")!);
        var tool = ToolInfo.Current();
        foreach (var name in new[] { "MathNet.Numerics", "QuikGraph", "ScottPlot", "YamlDotNet" })
            Assert.Equal(pins[name], tool.Packages[name].Split('+')[0]);
        Assert.StartsWith(".NET ", tool.Runtime);
        Assert.False(string.IsNullOrWhiteSpace(tool.OperatingSystem));
    }

    [Fact]
    public void The_tool_version_is_the_library_informational_version()
    {
        var version = ToolInfo.Current().Version;
        var props = XDocument.Load(FindUp("Directory.Build.props"));
        Assert.StartsWith(props.Descendants("Version").Single().Value, version);
    }

    [Fact]
    public void Text_that_is_not_a_manifest_is_an_input_error_naming_the_source()
    {
        var e = Assert.Throws<InputException>(() => ManifestReader.Parse("{\"tool\": 3}", "shard-2/manifest.json"));
        Assert.Contains("shard-2/manifest.json", e.Message);
        Assert.Throws<InputException>(() => ManifestReader.Parse("{ not json", "m.json"));
    }

    private static string FindUp(string fileName)
    {
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
        {
            string candidate = Path.Combine(d.FullName, fileName);
            if (File.Exists(candidate)) return candidate;
        }
        throw new FileNotFoundException($"{fileName} not found above {AppContext.BaseDirectory}");
    }
}
