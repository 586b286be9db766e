using System.Collections.Concurrent;
using System.Security.Cryptography;

namespace Coupling.Outputs;

/// <summary>Content hashes of input files, for the run manifest.</summary>
public static class FileHashes
{
    /// <summary>
    /// SHA-256 of the file's bytes as 64 lowercase hex digits, read as a stream (the file is never held in memory whole).
    /// </summary>
    /// <remarks>SHA-256 as specified in NIST FIPS 180-4, Secure Hash Standard (2015).</remarks>
    /// <exception cref="InputException">The file does not exist or cannot be read.</exception>
    public static string Sha256(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        try
        {
            // A run hashes its inputs twice (when it starts, for resuming, and for the manifest); a file whose full
            // path, length and modification time are unchanged is not read again.
            var info = new FileInfo(path);
            var key = (info.FullName, info.Length, info.LastWriteTimeUtc.Ticks);
            if (Known.TryGetValue(key, out var known)) return known;
            string hash = Hash(path);
            Known[key] = hash;
            return hash;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw FileErrors.Reading(path, "input file", e);
        }
    }

    private static readonly ConcurrentDictionary<(string Path, long Bytes, long Ticks), string> Known = new();

    private static string Hash(string path)
    {
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 1 << 20, FileOptions.SequentialScan);
        return Convert.ToHexStringLower(SHA256.HashData(stream));
    }
}
