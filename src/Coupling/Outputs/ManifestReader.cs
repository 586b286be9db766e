using System.Text.Json;

namespace Coupling.Outputs;

/// <summary>Reads a run manifest written by <see cref="ManifestWriter"/> (for merging shards and resuming runs).</summary>
public static class ManifestReader
{
    /// <summary>Parses manifest JSON text; <paramref name="source"/> names it in error messages.</summary>
    /// <exception cref="InputException">The text is not a manifest.</exception>
    public static Manifest Parse(string json, string source = "manifest")
    {
        ArgumentNullException.ThrowIfNull(json);
        try
        {
            return JsonSerializer.Deserialize<Manifest>(json, ManifestJson.Options)
                ?? throw new InputException($"{source}: expected a JSON object with the manifest fields, found null.");
        }
        catch (JsonException e)
        {
            string where = e.LineNumber is { } line ? $" at line {line + 1}" : "";
            throw new InputException($"{source}{where}: not a valid manifest ({e.Message})", e);
        }
    }

    /// <summary>Reads the manifest file at <paramref name="path"/>.</summary>
    /// <exception cref="InputException">The file cannot be read or is not a manifest.</exception>
    public static Manifest Read(string path)
    {
        string text;
        try { text = File.ReadAllText(path); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InputException($"Cannot read manifest '{path}': {e.Message}", e);
        }
        return Parse(text, path);
    }
}
