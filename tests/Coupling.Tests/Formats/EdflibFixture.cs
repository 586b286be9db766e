using System.Text.Json;

namespace Coupling.Tests.Formats;

/// <summary>The values EDFlib was told to write into edflib_two_rates.edf (see Fixtures/Formats/README.md).</summary>
internal sealed class EdflibFixture
{
    public const string EdfName = "edflib_two_rates.edf";

    private EdflibFixture(JsonElement root) => Root = root;

    public JsonElement Root { get; }

    public static EdflibFixture Load()
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(Fixtures.Path("edflib_two_rates.json")));
        return new EdflibFixture(doc.RootElement.Clone());
    }

    public JsonElement Signal(int i) => Root.GetProperty("signals")[i];

    public int SignalCount => Root.GetProperty("signals").GetArrayLength();

    public static double[] Doubles(JsonElement e) => e.EnumerateArray().Select(x => x.GetDouble()).ToArray();
}
