namespace Coupling.Tests.Pipeline;

/// <summary>A fresh empty folder under the system temporary folder, deleted on dispose.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "coupling-pipeline-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public string this[string name] => System.IO.Path.Combine(Path, name);

    /// <summary>Names of all entries (hidden ones too) directly in the folder, sorted.</summary>
    public string[] Entries() =>
        Directory.EnumerateFileSystemEntries(Path).Select(p => System.IO.Path.GetFileName(p)!).Order(StringComparer.Ordinal).ToArray();

    public void Dispose()
    {
        try { Directory.Delete(Path, recursive: true); } catch (IOException) { }
    }
}
