using System.Text.Encodings.Web;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace Coupling.Outputs;

/// <summary>The JSON settings shared by <see cref="ManifestWriter"/> and <see cref="ManifestReader"/>.</summary>
internal static class ManifestJson
{
    /// <summary>snake_case names, indented, NaN and infinities as the strings "NaN", "Infinity", "-Infinity".</summary>
    public static JsonSerializerOptions Options { get; } = new()
    {
        WriteIndented = true,
        IndentSize = 2,
        NewLine = "\n",
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        DictionaryKeyPolicy = null,
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
        Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping,
        RespectRequiredConstructorParameters = true,
    };
}
