namespace Coupling;

/// <summary>
/// Raised when the system refuses or fails to read or write a file or folder that is there to use (permission denied,
/// disk full, device error), as opposed to input that is wrong (<see cref="InputException"/>). The message names the
/// file or folder and the reason in plain words, so it can be shown to the user as is.
/// </summary>
public sealed class FileAccessException : IOException
{
    /// <summary>Creates the error with a message that already names the file and the reason, and the system's exception.</summary>
    public FileAccessException(string message, Exception inner) : base(message, inner) { }
}
