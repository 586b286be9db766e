namespace Coupling.Formats;

/// <summary>Reads a BIDS electrodes.tsv file.</summary>
/// <remarks>Per the BIDS specification, "Electrodes description" (electrodes.tsv): REQUIRED columns name, x, y, z
/// (coordinates in the units and system of the accompanying coordsystem.json; "n/a" where unknown).</remarks>
public static class ElectrodesTsv
{
    /// <summary>Reads the rows in file order.</summary>
    /// <param name="path">The electrodes.tsv file.</param>
    /// <returns>One entry per row; a row with any "n/a" coordinate has no position.</returns>
    /// <exception cref="InputException">A required column is missing or a coordinate is not a number or n/a.</exception>
    public static IReadOnlyList<ElectrodesTsvEntry> Read(string path)
    {
        var table = TsvTable.Read(path);
        int name = table.RequireColumn("name");
        int[] xyz = [table.RequireColumn("x"), table.RequireColumn("y"), table.RequireColumn("z")];
        var rows = new List<ElectrodesTsvEntry>();
        foreach (var row in table.Rows)
        {
            var c = xyz.Select(i => table.Number(row, i, allowMissing: true)).ToArray();
            ChannelPosition? p = c.All(v => v.HasValue) ? new ChannelPosition(c[0]!.Value, c[1]!.Value, c[2]!.Value) : null;
            rows.Add(new ElectrodesTsvEntry(row.Cells[name], p));
        }
        return rows;
    }
}
