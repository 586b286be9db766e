using System.Globalization;

namespace Coupling.Tests.Outputs;

/// <summary>
/// A plain reader for the written tables, following the conventions R's read.delim/read.csv and pandas apply by
/// default: NA is missing, Inf/-Inf are infinities, fields may be double-quoted with doubled inner quotes.
/// </summary>
internal static class TableParsing
{
    public static List<string[]> Read(string path, char separator)
    {
        string text = File.ReadAllText(path);
        var rows = new List<string[]>();
        var row = new List<string>();
        var field = new System.Text.StringBuilder();
        bool quoted = false;
        for (int i = 0; i < text.Length; i++)
        {
            char ch = text[i];
            if (quoted)
            {
                if (ch == '"' && i + 1 < text.Length && text[i + 1] == '"') { field.Append('"'); i++; }
                else if (ch == '"') quoted = false;
                else field.Append(ch);
            }
            else if (ch == '"') quoted = true;
            else if (ch == separator) { row.Add(field.ToString()); field.Clear(); }
            else if (ch == '\n') { row.Add(field.ToString()); field.Clear(); rows.Add([.. row]); row.Clear(); }
            else field.Append(ch);
        }
        if (field.Length > 0 || row.Count > 0) throw new InvalidDataException("last line has no line feed");
        return rows;
    }

    public static double Number(string s) => s switch
    {
        "NA" => double.NaN,
        "Inf" => double.PositiveInfinity,
        "-Inf" => double.NegativeInfinity,
        _ => double.Parse(s, NumberStyles.Float, CultureInfo.InvariantCulture),
    };
}
