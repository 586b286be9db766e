using System.Text;

namespace Coupling.Outputs;

/// <summary>
/// Writes a tidy tab-separated table: a header row, then one line per row, every cell passed through
/// <see cref="TableText.Field"/>; LF line ends, UTF-8 without a byte-order mark, written atomically.
/// </summary>
internal static class TidyTable
{
    /// <summary>Writes <paramref name="rows"/> (cells already in text form) under <paramref name="columns"/>; returns the row count.</summary>
    public static int Write(string path, IReadOnlyList<string> columns, IEnumerable<IReadOnlyList<string>> rows)
    {
        using var stream = AtomicFile.Create(path);
        int count = 0;
        using (var w = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true) { NewLine = "\n" })
        {
            w.Write(string.Join('\t', columns));
            w.Write('\n');
            foreach (var row in rows)
            {
                if (row.Count != columns.Count)
                    throw new ArgumentException($"A row of {row.Count} cells under {columns.Count} columns.", nameof(rows));
                for (int i = 0; i < row.Count; i++)
                {
                    if (i > 0) w.Write('\t');
                    w.Write(TableText.Field(row[i], '\t'));
                }
                w.Write('\n');
                count++;
            }
        }
        stream.Commit();
        return count;
    }
}
