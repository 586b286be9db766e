using Coupling.Plans;

namespace Coupling.Tests.Plans;

/// <summary>
/// Plans are read with YamlDotNet's representation model only (nodes and strings), never with its object deserializer:
/// a YAML tag naming a type, in any language, creates nothing and is at most plain data that the checks then judge.
/// </summary>
public sealed class PlanTagTests
{
    private static readonly string Source = Path.Combine(Path.GetTempPath(), "coupling-plan-tests", "tags.yaml");

    private static string Plan(string recording = "rec.edf", string seed = "7", string measures = "[plv]", string output = "results") => $"""
        recording: {recording}
        conditions: {"{"} cue: [cue] {"}"}
        trial: {"{"} start: -0.5, end: 1.5 {"}"}
        window: {"{"} start: 0.0, end: 1.0 {"}"}
        bands: {"{"} theta: [4, 8] {"}"}
        measures: {measures}
        seed: {seed}
        output: {output}
        """;

    private static Plan Parse(string text) => PlanReader.Parse(new StringReader(text), Source);

    [Fact]
    public void A_type_tag_on_a_scalar_is_plain_data()
    {
        // A .NET type tag and a Python object tag: the values are read as the strings they hold.
        var plan = Parse(Plan(output: "!<tag:yaml.org,2002:System.Diagnostics.Process> results", seed: "!!python/object:os.system 7"));
        Assert.Equal(7UL, plan.Seed);
        Assert.Equal(Path.Combine(Path.GetDirectoryName(Source)!, "results"), plan.Output);
    }

    [Fact]
    public void A_type_tag_on_a_collection_creates_nothing_and_is_judged_as_data()
    {
        var e = Assert.Throws<InputException>(() => Parse(Plan(measures: "!!python/object/apply:os.system [\"touch /tmp/coupling-tag-test\"]")));
        Assert.Contains("measures", e.Message);
        Assert.Contains("is not a known measure", e.Message);
        Assert.False(File.Exists("/tmp/coupling-tag-test"));
        e = Assert.Throws<InputException>(() => Parse(Plan(recording: "!System.IO.FileInfo { fileName: /etc/passwd }")));
        Assert.Contains("recording", e.Message);
        Assert.Contains("expected a single value", e.Message);
    }

    [Fact]
    public void The_library_never_uses_the_yaml_object_deserializer()
    {
        // ToolInfo names the Deserializer type only to read the package's version.
        string src = Path.Combine(FindUp("src"), "Coupling");
        var offenders = Directory.EnumerateFiles(src, "*.cs", SearchOption.AllDirectories)
            .Where(f => Path.GetFileName(f) != "ToolInfo.cs")
            .Where(f => File.ReadAllText(f) is var t && (t.Contains("YamlDotNet.Serialization", StringComparison.Ordinal) || t.Contains("Deserializer", StringComparison.Ordinal)))
            .ToArray();
        Assert.Empty(offenders);
        Assert.Contains("YamlDotNet.RepresentationModel", File.ReadAllText(Path.Combine(src, "Plans", "PlanReader.cs")));
    }

    private static string FindUp(string name)
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (Directory.Exists(Path.Combine(dir.FullName, name)) && File.Exists(Path.Combine(dir.FullName, "Coupling.sln")))
                return Path.Combine(dir.FullName, name);
        throw new DirectoryNotFoundException(name);
    }
}
