using System.Text.Json;
using System.Text.Json.Serialization;
using Coupling.Measures;

namespace Coupling.Simulation;

/// <summary>Writes a <see cref="Measure"/> as its short lowercase key (plv, ppc, pli, wpli, wpli-debiased, coherence, imag-coherency, aec, aec-orth) and reads it back.</summary>
internal sealed class MeasureKeyConverter : JsonConverter<Measure>
{
    private static readonly (Measure Measure, string Key)[] Keys =
    [
        (Measure.Plv, "plv"), (Measure.Ppc, "ppc"), (Measure.Pli, "pli"), (Measure.Wpli, "wpli"),
        (Measure.WpliDebiased, "wpli-debiased"), (Measure.Coherence, "coherence"), (Measure.ImagCoherency, "imag-coherency"),
        (Measure.Aec, "aec"), (Measure.AecOrth, "aec-orth"),
    ];

    /// <summary>The key of a measure.</summary>
    public static string KeyOf(Measure measure)
    {
        foreach (var (m, k) in Keys) if (m == measure) return k;
        throw new ArgumentOutOfRangeException(nameof(measure), measure, "Measure without a key.");
    }

    public override Measure Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        string? text = reader.TokenType == JsonTokenType.String ? reader.GetString() : null;
        foreach (var (m, k) in Keys) if (k == text) return m;
        throw new JsonException($"Unknown measure key '{text}'; expected one of {string.Join(", ", Keys.Select(x => x.Key))}.");
    }

    public override void Write(Utf8JsonWriter writer, Measure value, JsonSerializerOptions options) => writer.WriteStringValue(KeyOf(value));
}
