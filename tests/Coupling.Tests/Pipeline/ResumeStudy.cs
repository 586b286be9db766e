using System.Text.Json.Nodes;

namespace Coupling.Tests.Pipeline;

/// <summary>
/// The small study with two conditions (alternate onsets), two bands and one contrast: six work units, for the tests of
/// interrupted and resumed runs; and the comparison of two results folders that ignores only the manifest's fields
/// about the run itself (times, command line, resumed units).
/// </summary>
internal static class ResumeStudy
{
    /// <summary>The manifest fields that describe the run rather than its results.</summary>
    public static readonly string[] RunFields = ["started", "finished", "run_seconds", "resumed_units"];

    /// <summary>Writes recording, events (go and stop alternating) and plan into <paramref name="folder"/>; returns the plan's path.</summary>
    /// <param name="correction">The plan's <c>correction</c> value, or null for the default.</param>
    public static string Write(string folder, int surrogates, string? correction = null)
    {
        SmallStudy.WriteRecording(folder);
        string events = Path.Combine(folder, "rec_events.tsv");
        var rows = File.ReadAllLines(events);
        for (int i = 1; i < rows.Length; i++) if (i % 2 == 0) rows[i] = rows[i].Replace("\tgo", "\tstop", StringComparison.Ordinal);
        File.WriteAllText(events, string.Join("\n", rows) + "\n");
        string plan = Path.Combine(folder, "plan.yaml");
        File.WriteAllText(plan, SmallStudy.PlanText(surrogates, conditions: "{ go: [go], stop: [stop] }", bands: "{ alpha: [8, 12], beta: [15, 25] }")
            + "\ncontrasts: [[go, stop]]\n" + (correction is null ? "" : $"correction: {correction}\n"));
        return plan;
    }

    /// <summary>Every file of the folder, relative path to bytes; the manifest with the run's own fields left out.</summary>
    public static SortedDictionary<string, string> Contents(string folder)
    {
        var files = new SortedDictionary<string, string>(StringComparer.Ordinal);
        foreach (string f in Directory.EnumerateFiles(folder, "*", new EnumerationOptions { RecurseSubdirectories = true, AttributesToSkip = 0 }))
        {
            string relative = Path.GetRelativePath(folder, f).Replace('\\', '/');
            if (relative == "manifest.json")
            {
                var json = JsonNode.Parse(File.ReadAllText(f))!.AsObject();
                foreach (string field in RunFields) Assert.True(json.Remove(field), $"manifest has no '{field}'");
                Assert.True(json["extra"]!.AsObject().Remove("analysis_seconds"));
                files[relative] = json.ToJsonString();
            }
            else files[relative] = Convert.ToBase64String(File.ReadAllBytes(f));
        }
        return files;
    }

    /// <summary>The manifest's list of resumed units.</summary>
    public static string[] ResumedUnits(string folder) =>
        JsonNode.Parse(File.ReadAllText(Path.Combine(folder, "manifest.json")))!["resumed_units"]!.AsArray().Select(n => (string)n!).ToArray();
}
