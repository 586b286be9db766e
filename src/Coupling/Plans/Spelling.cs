namespace Coupling.Plans;

/// <summary>Finds the allowed word a misspelt one was most likely meant to be, for "did you mean" hints.</summary>
/// <remarks>
/// Distance is the optimal string alignment distance (Levenshtein distance with transposition of two adjacent
/// characters as one edit; Damerau 1964, Levenshtein 1966), compared case-insensitively. A candidate is offered when
/// it is at most a third of the word's length away (at least 1, at most 3 edits), or when one word starts with the
/// other; common practice for command-line spelling hints.
/// </remarks>
public static class Spelling
{
    /// <summary>The closest of <paramref name="allowed"/> to <paramref name="word"/>, or null when none is close.</summary>
    public static string? Closest(string word, IEnumerable<string> allowed)
    {
        string w = word.ToLowerInvariant();
        string? best = null;
        int bestDistance = int.MaxValue;
        int limit = Math.Clamp(w.Length / 3, 1, 3);
        foreach (var candidate in allowed)
        {
            string c = candidate.ToLowerInvariant();
            int d = Distance(w, c);
            bool prefix = w.Length >= 3 && c.Length >= 3 && (c.StartsWith(w, StringComparison.Ordinal) || w.StartsWith(c, StringComparison.Ordinal));
            if ((d <= limit || prefix) && d < bestDistance)
            {
                best = candidate;
                bestDistance = d;
            }
        }
        return best;
    }

    /// <summary>" (did you mean 'x'?)" for the closest allowed word, or an empty string.</summary>
    public static string Hint(string word, IEnumerable<string> allowed) =>
        Closest(word, allowed) is { } c ? $" (did you mean '{c}'?)" : "";

    /// <summary>Optimal string alignment distance between <paramref name="a"/> and <paramref name="b"/>.</summary>
    public static int Distance(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (int i = 0; i <= a.Length; i++) d[i, 0] = i;
        for (int j = 0; j <= b.Length; j++) d[0, j] = j;
        for (int i = 1; i <= a.Length; i++)
            for (int j = 1; j <= b.Length; j++)
            {
                int cost = a[i - 1] == b[j - 1] ? 0 : 1;
                d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + cost);
                if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
                    d[i, j] = Math.Min(d[i, j], d[i - 2, j - 2] + 1);
            }
        return d[a.Length, b.Length];
    }
}
