namespace Coupling.Outputs;

/// <summary>One input file of a run, as the manifest records it.</summary>
/// <param name="Path">The path as given to the program (or relative to the plan).</param>
/// <param name="Bytes">File size in bytes.</param>
/// <param name="Sha256">SHA-256 of the contents, lowercase hex (<see cref="FileHashes.Sha256"/>).</param>
public sealed record InputFileRecord(string Path, long Bytes, string Sha256)
{
    /// <summary>Records <paramref name="path"/> with its size and hash, keeping the path as given.</summary>
    /// <exception cref="InputException">The file does not exist or cannot be read.</exception>
    public static InputFileRecord Of(string path)
    {
        string hash = FileHashes.Sha256(path);
        return new InputFileRecord(path, new FileInfo(path).Length, hash);
    }
}
