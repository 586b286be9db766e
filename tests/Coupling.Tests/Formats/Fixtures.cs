namespace Coupling.Tests.Formats;

internal static class Fixtures
{
    public static string Path(string name) => System.IO.Path.Combine(AppContext.BaseDirectory, "Fixtures", "Formats", name);
}
