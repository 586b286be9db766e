using System.Security.Cryptography;
using System.Text;

namespace Coupling.Outputs;

/// <summary>
/// Writes files so that a reader sees either the old file or the whole new one, never a part: the bytes go to
/// a temporary file in the same folder (named <c>.&lt;name&gt;.tmp-&lt;random&gt;</c>), which is flushed to disk
/// and then renamed over the target. A failed write deletes the temporary file and leaves the target untouched.
/// </summary>
/// <remarks>
/// Relies on rename within one file system replacing the target in one step (POSIX rename(2); MoveFileEx with
/// replace on Windows), which is why the temporary file sits beside the target rather than in the system
/// temporary folder.
/// </remarks>
public static class AtomicFile
{
    private static readonly UTF8Encoding Utf8NoBom = new(encoderShouldEmitUTF8Identifier: false);

    /// <summary>Writes <paramref name="contents"/> as UTF-8 without a byte-order mark, atomically.</summary>
    public static void WriteAllText(string path, string contents) => WriteAllText(path, contents, Utf8NoBom);

    /// <summary>Writes <paramref name="contents"/> in <paramref name="encoding"/>, atomically.</summary>
    public static void WriteAllText(string path, string contents, Encoding encoding)
    {
        ArgumentNullException.ThrowIfNull(contents);
        ArgumentNullException.ThrowIfNull(encoding);
        using var stream = Create(path);
        using (var writer = new StreamWriter(stream, encoding, bufferSize: 1 << 16, leaveOpen: true))
            writer.Write(contents);
        stream.Commit();
    }

    /// <summary>Writes <paramref name="bytes"/>, atomically.</summary>
    public static void WriteAllBytes(string path, ReadOnlySpan<byte> bytes)
    {
        using var stream = Create(path);
        stream.Write(bytes);
        stream.Commit();
    }

    /// <summary>
    /// Opens a stream to a new temporary file beside <paramref name="path"/>. Call
    /// <see cref="AtomicFileStream.Commit"/> when everything is written to put it in place; disposing the stream
    /// without committing deletes the temporary file.
    /// </summary>
    /// <exception cref="DirectoryNotFoundException">The folder of <paramref name="path"/> does not exist.</exception>
    public static AtomicFileStream Create(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        string full = Path.GetFullPath(path);
        string folder = Path.GetDirectoryName(full) ?? throw new ArgumentException($"'{path}' has no folder.", nameof(path));
        string name = Path.GetFileName(full);
        if (name.Length == 0) throw new ArgumentException($"'{path}' names a folder, not a file.", nameof(path));
        string temp = Path.Combine(folder, TemporaryName(name));
        var inner = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None, bufferSize: 1 << 16);
        return new AtomicFileStream(inner, temp, full);
    }

    /// <summary>The temporary name used for <paramref name="name"/>: <c>.name.tmp-</c> and 12 random hex digits.</summary>
    internal static string TemporaryName(string name) => $".{name}.tmp-{RandomSuffix()}";

    /// <summary>12 hex digits from the system's cryptographic generator (for unique names only, not for results).</summary>
    internal static string RandomSuffix() => Convert.ToHexStringLower(RandomNumberGenerator.GetBytes(6));
}
