namespace Coupling;

/// <summary>
/// Raised for input the program cannot use: a malformed file, an unknown key or label, a value out of range.
/// The message names the file, the field or line, and what was expected, so it can be shown to the user as is.
/// </summary>
public sealed class InputException : Exception
{
    /// <summary>Creates the error with a message that already names what is wrong and where.</summary>
    public InputException(string message) : base(message) { }

    /// <summary>Creates the error with a message and the lower-level cause.</summary>
    public InputException(string message, Exception inner) : base(message, inner) { }
}
