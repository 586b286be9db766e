using System.Globalization;

namespace Coupling.Formats;

/// <summary>A tab-separated table with a header row, as BIDS sidecars are (UTF-8, "n/a" for missing values).</summary>
internal sealed class TsvTable
{
    private readonly Dictionary<string, int> _columns;

    private TsvTable(string path, string[] header, List<(int Line, string[] Cells)> rows)
    {
        Path = path;
        Header = header;
        Rows = rows;
        _columns = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int i = 0; i < header.Length; i++) _columns.TryAdd(header[i], i);
    }

    public string Path { get; }

    public string[] Header { get; }

    /// <summary>Data rows with their 1-based line numbers in the file.</summary>
    public List<(int Line, string[] Cells)> Rows { get; }

    public static TsvTable Read(string path)
    {
        string[] lines;
        try
        {
            lines = File.ReadAllLines(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw FileErrors.Reading(path, "table", e);
        }
        if (lines.Length == 0 || lines[0].Trim().Length == 0)
            throw new InputException($"{path}: line 1: expected a header row of tab-separated column names.");
        var header = lines[0].TrimStart('\uFEFF').Split('\t').Select(h => h.Trim()).ToArray();
        var rows = new List<(int, string[])>();
        for (int i = 1; i < lines.Length; i++)
        {
            if (lines[i].Trim().Length == 0) continue;
            var cells = lines[i].Split('\t');
            if (cells.Length != header.Length)
                throw new InputException($"{path}: line {i + 1}: {cells.Length} tab-separated cells, but the header has {header.Length} columns.");
            rows.Add((i + 1, cells.Select(c => c.Trim()).ToArray()));
        }
        return new TsvTable(path, header, rows);
    }

    public int? Column(string name) => _columns.TryGetValue(name, out int i) ? i : null;

    public int RequireColumn(string name) =>
        Column(name) ?? throw new InputException($"{Path}: line 1: missing required column '{name}' (columns: {string.Join(", ", Header)}).");

    /// <summary>The cell as a finite number, or null for "n/a" when <paramref name="allowMissing"/>.</summary>
    public double? Number((int Line, string[] Cells) row, int column, bool allowMissing)
    {
        string cell = row.Cells[column];
        if (allowMissing && cell == "n/a") return null;
        if (double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) && double.IsFinite(v))
            return v;
        throw new InputException($"{Path}: line {row.Line}, column '{Header[column]}': '{cell}' is not a finite number{(allowMissing ? " or n/a" : "")}.");
    }
}
