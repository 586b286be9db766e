using System.Runtime.CompilerServices;
using System.Text;

namespace Coupling.Tests.Cli;

/// <summary>
/// Approval testing (common practice): the received text must equal a committed approved file. On a mismatch the
/// received text is written beside it as *.received.txt and the assertion shows a line diff; to accept a change,
/// review the diff and copy the received file over the approved one.
/// </summary>
internal static class Approval
{
    public static void Verify(string received, string approvedName, [CallerFilePath] string caller = "")
    {
        string folder = Path.Combine(Path.GetDirectoryName(caller)!, "Approved");
        string approvedPath = Path.Combine(folder, approvedName);
        string receivedPath = Path.ChangeExtension(approvedPath, ".received.txt");
        received = received.ReplaceLineEndings("\n");
        string approved = File.Exists(approvedPath) ? File.ReadAllText(approvedPath).ReplaceLineEndings("\n") : "";
        if (approved == received)
        {
            File.Delete(receivedPath);
            return;
        }
        File.WriteAllText(receivedPath, received);
        Assert.Fail($"{approvedPath} differs from the received text (written to {receivedPath}):\n{Diff(approved, received)}");
    }

    /// <summary>A line diff from the longest common subsequence: "-" approved only, "+" received only.</summary>
    internal static string Diff(string approved, string received)
    {
        var a = approved.Split('\n');
        var b = received.Split('\n');
        var lcs = new int[a.Length + 1, b.Length + 1];
        for (int i = a.Length - 1; i >= 0; i--)
            for (int j = b.Length - 1; j >= 0; j--)
                lcs[i, j] = a[i] == b[j] ? lcs[i + 1, j + 1] + 1 : Math.Max(lcs[i + 1, j], lcs[i, j + 1]);
        var sb = new StringBuilder();
        int x = 0, y = 0;
        while (x < a.Length || y < b.Length)
        {
            if (x < a.Length && y < b.Length && a[x] == b[y]) { x++; y++; }
            else if (x < a.Length && (y == b.Length || lcs[x + 1, y] >= lcs[x, y + 1])) sb.Append($"-{x + 1}: ").AppendLine(a[x++]);
            else sb.Append($"+{y + 1}: ").AppendLine(b[y++]);
        }
        return sb.ToString();
    }
}
