namespace Coupling;

/// <summary>
/// Turns the system's file errors into the program's: a file that is not there is wrong input (<see cref="InputException"/>),
/// anything else the system refused or failed is a <see cref="FileAccessException"/>; both name the file and say why in
/// plain words, never in the system's own text.
/// </summary>
public static class FileErrors
{
    private const int NoSpace = 28, QuotaExceeded = 122; // errno ENOSPC and EDQUOT (Linux)

    /// <summary>The reason of a file error in plain words: "file not found", "permission denied", "no space left on the device"...</summary>
    public static string Reason(Exception e) => e switch
    {
        FileNotFoundException => "file not found",
        DirectoryNotFoundException => "folder not found",
        UnauthorizedAccessException => "permission denied",
        PathTooLongException => "the path or a name in it is too long",
        IOException io when (io.HResult & 0xFFFF) is NoSpace or QuotaExceeded or 0x70 or 0x27 => "no space left on the device",
        IOException io when io.Message.Contains("ile name too long", StringComparison.Ordinal) => "the path or a name in it is too long",
        IOException io when io.Message.Contains("ot a directory", StringComparison.Ordinal) => "a part of the path is a file, not a folder",
        IOException io when io.Message.Contains("already exists", StringComparison.Ordinal) => "a file of that name is in the way",
        _ => "input/output error",
    };

    /// <summary>Whether <paramref name="e"/> is a file error the system raised (IO or access).</summary>
    public static bool IsFileError(Exception e) => e is IOException or UnauthorizedAccessException;

    /// <summary>
    /// The error to raise when reading <paramref name="path"/> (a <paramref name="what"/>, e.g. "EDF file") failed with
    /// <paramref name="e"/>: an <see cref="InputException"/> when it is not there, else a <see cref="FileAccessException"/>.
    /// </summary>
    public static Exception Reading(string path, string what, Exception e) =>
        e is FileNotFoundException or DirectoryNotFoundException
            ? new InputException($"{path}: {what} not found.", e)
            : new FileAccessException($"{path}: cannot read the {what}: {Reason(e)}.", e);

    /// <summary>The error to raise when writing <paramref name="path"/> (a <paramref name="what"/>) failed with <paramref name="e"/>.</summary>
    public static FileAccessException Writing(string path, string what, Exception e) =>
        new($"{path}: cannot write the {what}: {Reason(e)}.", e);
}
