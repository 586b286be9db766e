using System.Globalization;
using System.Net;
using System.Text;

namespace Coupling.Reports;

/// <summary>Small pieces of HTML: escaped text, numbers, tables, images embedded as data URIs, tab-separated files read back.</summary>
internal static class HtmlParts
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static string E(string? text) => WebUtility.HtmlEncode(text ?? "");

    /// <summary>A number for reading: "–" for NaN, otherwise the given format in invariant culture.</summary>
    public static string Num(double v, string format) =>
        double.IsNaN(v) ? "–" : double.IsPositiveInfinity(v) ? "∞" : double.IsNegativeInfinity(v) ? "−∞" : v.ToString(format, Inv).Replace('-', '−');

    /// <summary>A p-value: three significant digits, scientific below 0.001.</summary>
    public static string P(double p) => double.IsNaN(p) ? "–" : p < 0.001 ? p.ToString("0.00E+0", Inv).Replace('-', '−') : p.ToString("0.####", Inv);

    /// <summary>An HTML table with a header row; cells are already HTML. Columns listed in <paramref name="numeric"/> align right.</summary>
    public static void Table(StringBuilder sb, IReadOnlyList<string> header, IEnumerable<IReadOnlyList<string>> rows, ISet<int>? numeric = null,
        string? cssClass = null)
    {
        sb.Append("<div class=\"scroll\"><table").Append(cssClass is null ? "" : $" class=\"{cssClass}\"").Append("><thead><tr>");
        for (int i = 0; i < header.Count; i++)
            sb.Append(numeric?.Contains(i) == true ? "<th class=\"n\">" : "<th>").Append(E(header[i])).Append("</th>");
        sb.Append("</tr></thead><tbody>\n");
        foreach (var row in rows)
        {
            sb.Append("<tr>");
            for (int i = 0; i < row.Count; i++)
                sb.Append(numeric?.Contains(i) == true ? "<td class=\"n\">" : "<td>").Append(row[i]).Append("</td>");
            sb.Append("</tr>\n");
        }
        sb.Append("</tbody></table></div>\n");
    }

    /// <summary>The media type of an image file by its extension, or null when it is not an image the report embeds.</summary>
    public static string? ImageType(string path) => Path.GetExtension(path).ToLowerInvariant() switch
    {
        ".png" => "image/png",
        ".svg" => "image/svg+xml",
        ".jpg" or ".jpeg" => "image/jpeg",
        _ => null,
    };

    /// <summary>An &lt;img&gt; whose source is the file's bytes as a base64 data URI.</summary>
    public static string Image(string path, string alt, string? id = null)
    {
        string type = ImageType(path) ?? throw new ArgumentException($"{path} is not an image the report embeds.", nameof(path));
        string data = Convert.ToBase64String(File.ReadAllBytes(path));
        return $"<img{(id is null ? "" : $" id=\"{id}\"")} src=\"data:{type};base64,{data}\" alt=\"{E(alt)}\">";
    }

    /// <summary>
    /// The images of a folder whose names start with <paramref name="prefix"/>, in name order; where the same name exists
    /// as PNG and as another image type, only the PNG.
    /// </summary>
    public static IReadOnlyList<string> ImagesStartingWith(string folder, string prefix)
    {
        if (!Directory.Exists(folder)) return [];
        var files = Directory.EnumerateFiles(folder)
            .Where(f => Path.GetFileName(f).StartsWith(prefix, StringComparison.Ordinal) && ImageType(f) is not null
                        && !Path.GetFileName(f).StartsWith('.'))
            .Order(StringComparer.Ordinal).ToList();
        return files.Where(f => Path.GetExtension(f).Equals(".png", StringComparison.OrdinalIgnoreCase)
                                || !files.Contains(Path.ChangeExtension(f, ".png"))).ToArray();
    }

    /// <summary>Reads a tab-separated file written by the tool (header row, fields quoted when they hold a tab, quote or line break).</summary>
    public static (string[] Header, List<string[]> Rows) ReadTsv(string path)
    {
        var records = new List<string[]>();
        var field = new StringBuilder();
        var record = new List<string>();
        string text = File.ReadAllText(path);
        bool quoted = false;
        for (int i = 0; i < text.Length; i++)
        {
            char c = text[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < text.Length && text[i + 1] == '"') { field.Append('"'); i++; }
                else if (c == '"') quoted = false;
                else field.Append(c);
            }
            else if (c == '"' && field.Length == 0) quoted = true;
            else if (c == '\t') { record.Add(field.ToString()); field.Clear(); }
            else if (c == '\n')
            {
                record.Add(field.ToString()); field.Clear();
                records.Add(record.ToArray()); record.Clear();
            }
            else if (c != '\r') field.Append(c);
        }
        if (field.Length > 0 || record.Count > 0) { record.Add(field.ToString()); records.Add(record.ToArray()); }
        return records.Count == 0 ? ([], []) : (records[0], records.Skip(1).ToList());
    }

    /// <summary>A table cell's text, shortened for reading when it is a long number ("0.123456789" to "0.1235").</summary>
    public static string Cell(string text) =>
        text.Length > 8 && double.TryParse(text, NumberStyles.Float, Inv, out double v) ? Num(v, "G4") : E(text);
}
