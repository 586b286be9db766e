using System.Text;
using Coupling.Results;

namespace Coupling.Outputs;

/// <summary>Plain, predictable file names for per-result outputs.</summary>
public static class OutputNames
{
    /// <summary>
    /// <paramref name="name"/> made safe for a file name on every common file system: ASCII letters, digits,
    /// '-' and '.' are kept, every other run of characters (spaces, '_', '/', non-ASCII) becomes one '-',
    /// and leading or trailing '-' and '.' are dropped; an empty result becomes "unnamed". '_' is kept out so
    /// that it only ever separates the parts of a <see cref="Stem"/>.
    /// </summary>
    public static string Sanitise(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        var sb = new StringBuilder(name.Length);
        foreach (char ch in name)
        {
            if (char.IsAsciiLetterOrDigit(ch) || ch is '-' or '.') sb.Append(ch);
            else if (sb.Length == 0 || sb[^1] != '-') sb.Append('-');
        }
        string s = sb.ToString().Trim('-', '.');
        return s.Length == 0 ? "unnamed" : s;
    }

    /// <summary>The shared stem of a result's files: <c>&lt;condition&gt;_&lt;band&gt;_&lt;measure&gt;</c>, each part sanitised.</summary>
    public static string Stem(PairResult result)
    {
        ArgumentNullException.ThrowIfNull(result);
        return $"{Sanitise(result.Condition)}_{Sanitise(result.Band)}_{Sanitise(result.Measure)}";
    }
}
