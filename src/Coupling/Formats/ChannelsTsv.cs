namespace Coupling.Formats;

/// <summary>Reads a BIDS channels.tsv file.</summary>
/// <remarks>Per the BIDS specification, "Channels description" (channels.tsv): REQUIRED columns name, type and units;
/// OPTIONAL status ("good", "bad" or "n/a").</remarks>
public static class ChannelsTsv
{
    /// <summary>Reads the rows in file order.</summary>
    /// <param name="path">The channels.tsv file.</param>
    /// <returns>One entry per row.</returns>
    /// <exception cref="InputException">A required column is missing, a name repeats, or a status is not good/bad/n/a.</exception>
    public static IReadOnlyList<ChannelsTsvEntry> Read(string path)
    {
        var table = TsvTable.Read(path);
        int name = table.RequireColumn("name");
        int type = table.RequireColumn("type");
        int units = table.RequireColumn("units");
        int? status = table.Column("status");
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var rows = new List<ChannelsTsvEntry>();
        foreach (var row in table.Rows)
        {
            string n = row.Cells[name];
            if (n.Length == 0 || !seen.Add(n))
                throw new InputException($"{path}: line {row.Line}, column 'name': '{n}' is empty or repeats an earlier row.");
            string s = status is int si ? row.Cells[si] : "n/a";
            if (s is not ("good" or "bad" or "n/a"))
                throw new InputException($"{path}: line {row.Line}, column 'status': '{s}'; expected good, bad or n/a.");
            rows.Add(new ChannelsTsvEntry(n, row.Cells[type].ToUpperInvariant(), row.Cells[units], s == "bad"));
        }
        return rows;
    }
}
