using System.Text.Json;

namespace Coupling.Outputs;

/// <summary>Writes a run <see cref="Manifest"/> as indented JSON (RFC 8259) with System.Text.Json.</summary>
/// <remarks>
/// Property names are snake_case (<c>run_seconds</c>, <c>time_step_seconds</c>); times are ISO 8601 with
/// offset; dictionary keys (package names, decomposition parameters) are kept as they are; NaN and
/// infinities, which JSON has no number for, are written as the strings "NaN", "Infinity" and "-Infinity".
/// UTF-8 without a byte-order mark, LF line ends, written atomically.
/// </remarks>
public static class ManifestWriter
{
    /// <summary>The manifest as JSON text.</summary>
    public static string Serialize(Manifest manifest)
    {
        ArgumentNullException.ThrowIfNull(manifest);
        return JsonSerializer.Serialize(manifest, ManifestJson.Options) + "\n";
    }

    /// <summary>Writes <paramref name="manifest"/> to <paramref name="path"/> atomically.</summary>
    public static void Write(Manifest manifest, string path) => AtomicFile.WriteAllText(path, Serialize(manifest));
}
