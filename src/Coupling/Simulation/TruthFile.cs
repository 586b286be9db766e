using System.Text.Encodings.Web;
using System.Text.Json;

namespace Coupling.Simulation;

/// <summary>Writes and reads a <see cref="GroundTruth"/> as an indented JSON file (truth.json) with snake_case keys.</summary>
/// <remarks>
/// Uses System.Text.Json. Kinds are written as "phase-coupled", "zero-lag-mixing", "envelope-only" or
/// "stimulus-locked"; measures as their short keys ("plv", "wpli-debiased", "aec-orth", ...).
/// </remarks>
public static class TruthFile
{
    private static readonly JsonSerializerOptions Json = new()
    {
        WriteIndented = true,
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping, // keep quotes and apostrophes readable in the notes
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        IgnoreReadOnlyProperties = true,
        Converters = { new MeasureKeyConverter() },
    };

    /// <summary>Serialises the truth to JSON text (what <see cref="Write"/> puts in the file).</summary>
    public static string ToJson(GroundTruth truth)
    {
        ArgumentNullException.ThrowIfNull(truth);
        return JsonSerializer.Serialize(truth, Json);
    }

    /// <summary>
    /// Writes the truth to <paramref name="path"/>: first to <c>path + ".tmp"</c>, then renamed over the target,
    /// so a stopped write never leaves a half-written file under the final name.
    /// </summary>
    public static void Write(GroundTruth truth, string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        string json = ToJson(truth);
        string tmp = path + ".tmp";
        File.WriteAllText(tmp, json + "\n");
        File.Move(tmp, path, overwrite: true);
    }

    /// <summary>Reads a truth file written by <see cref="Write"/>.</summary>
    /// <exception cref="InputException">The file is missing, not valid JSON, or lacks the expected fields; the message names the file.</exception>
    public static GroundTruth Read(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        string text;
        try
        {
            text = File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InputException($"Cannot read ground-truth file '{path}': {e.Message}", e);
        }
        GroundTruth? truth;
        try
        {
            truth = JsonSerializer.Deserialize<GroundTruth>(text, Json);
        }
        catch (JsonException e)
        {
            string where = e.Path is null ? "" : $" at {e.Path}";
            throw new InputException($"Ground-truth file '{path}'{where} (line {e.LineNumber + 1}): {e.Message}", e);
        }
        if (truth is null || truth.Pairs is null || truth.Conditions is null || truth.Bands is null || truth.Channels is null)
            throw new InputException($"Ground-truth file '{path}': expected an object with channels, conditions, bands and pairs.");
        return truth;
    }
}
