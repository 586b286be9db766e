using System.Text.Json;

namespace Coupling.Tests.Spectral;

/// <summary>Reads the scipy reference files in Fixtures/Spectral (made by make_fixtures.py there).</summary>
internal static class SpectralFixtures
{
    public static IEnumerable<JsonElement> Cases(string file)
    {
        string path = Path.Combine(AppContext.BaseDirectory, "Fixtures", "Spectral", file);
        using var document = JsonDocument.Parse(File.ReadAllText(path));
        // Clone so the elements outlive the document.
        return document.RootElement.GetProperty("cases").EnumerateArray().Select(e => e.Clone()).ToList();
    }

    public static double[] Doubles(this JsonElement e, string name) =>
        e.GetProperty(name).EnumerateArray().Select(v => v.GetDouble()).ToArray();

    public static double Double(this JsonElement e, string name) => e.GetProperty(name).GetDouble();

    public static int Int(this JsonElement e, string name) => e.GetProperty(name).GetInt32();
}
