namespace Coupling.Tests.Pipeline;

/// <summary>Every file under a folder (hidden ones too) with its bytes, to show later that none was changed, moved or lost.</summary>
internal sealed class FolderSnapshot
{
    private readonly string _root;
    private readonly Dictionary<string, byte[]> _files;

    private FolderSnapshot(string root, Dictionary<string, byte[]> files)
    {
        _root = root;
        _files = files;
    }

    public static FolderSnapshot Take(string root) => new(root, Directory
        .EnumerateFiles(root, "*", new EnumerationOptions { RecurseSubdirectories = true, AttributesToSkip = 0 })
        .ToDictionary(f => Path.GetRelativePath(root, f), File.ReadAllBytes));

    public int Count => _files.Count;

    /// <summary>Asserts every file of the snapshot is still at its place with the same bytes.</summary>
    public void AssertAllStillThere()
    {
        foreach (var (relative, bytes) in _files)
        {
            string path = Path.Combine(_root, relative);
            Assert.True(File.Exists(path), $"{relative} is gone");
            Assert.True(bytes.AsSpan().SequenceEqual(File.ReadAllBytes(path)), $"{relative} was changed");
        }
    }
}
