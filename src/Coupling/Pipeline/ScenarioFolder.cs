using Coupling.Simulation;

namespace Coupling.Pipeline;

/// <summary>Decides whether the simulated scenario (and the demo's results) may be written into a folder without touching a user's files.</summary>
public static class ScenarioFolder
{
    /// <summary>The files <see cref="ScenarioFiles.Write"/> puts into its folder.</summary>
    public static readonly IReadOnlyList<string> FileNames =
        ["scenario.edf", "scenario_channels.tsv", "scenario_electrodes.tsv", "truth.json", "plan.yaml"];

    /// <summary>
    /// Allows a folder that does not exist yet or is empty. A folder holding anything else is allowed only when
    /// <paramref name="replace"/> is set and it is recognisably an earlier scenario folder: it holds nothing but the
    /// scenario's files, its <c>results</c> folder (checked again by the run itself) and the hidden leftovers of an
    /// interrupted run, and its truth.json reads as a ground-truth file.
    /// </summary>
    /// <exception cref="InputException">The folder may not be written into; the message names it and what to do.</exception>
    public static void Check(string folder, bool replace, string option = "--output")
    {
        ArgumentException.ThrowIfNullOrEmpty(folder);
        string full = Path.GetFullPath(folder);
        if (File.Exists(full))
            throw new InputException($"{option}: '{full}' is an existing file; expected a folder for the scenario.");
        if (!Directory.Exists(full)) return;
        var entries = Directory.GetFileSystemEntries(full).Select(e => Path.GetFileName(e)!).Order(StringComparer.Ordinal).ToArray();
        if (entries.Length == 0) return;
        var foreign = entries.Where(e => !IsOwnName(e)).ToArray();
        if (foreign.Length > 0)
            throw new InputException($"{option}: the folder '{full}' already holds files this tool did not write ({string.Join(", ", foreign.Take(5))}{(foreign.Length > 5 ? ", ..." : "")}); " +
                "nothing was written. Name a new or empty folder.");
        if (!replace)
            throw new InputException($"{option}: the folder '{full}' holds an earlier scenario; give --force to replace it, or name a new folder.");
        string truth = Path.Combine(full, "truth.json");
        if (!File.Exists(truth))
            throw new InputException($"{option}: the folder '{full}' has no truth.json, so it is not recognised as an earlier scenario folder; nothing was written. Name a new folder.");
        try { TruthFile.Read(truth); }
        catch (Exception e) when (e is InputException or IOException or System.Text.Json.JsonException)
        {
            throw new InputException($"{option}: '{truth}' is not a ground-truth file of this tool, so the folder is not recognised as an earlier scenario folder; nothing was written. Name a new folder.", e);
        }
        foreach (string name in FileNames.Where(n => Directory.Exists(Path.Combine(full, n))))
            throw new InputException($"{option}: '{Path.Combine(full, name)}' is a folder where the scenario writes a file; nothing was written. Name a new folder.");
    }

    private static bool IsOwnName(string name) =>
        FileNames.Contains(name) || name == "results" || name.StartsWith(".results.", StringComparison.Ordinal)
        || FileNames.Any(f => name.StartsWith($".{f}.tmp-", StringComparison.Ordinal));
}
