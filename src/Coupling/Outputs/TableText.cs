using System.Globalization;

namespace Coupling.Outputs;

/// <summary>Text forms shared by the CSV and TSV writers.</summary>
internal static class TableText
{
    /// <summary>The missing-value marker; R's read.csv/read.delim and pandas' read_csv read it as NA/NaN by default.</summary>
    public const string Missing = "NA";

    /// <summary>
    /// Shortest invariant text that parses back to the same double ("R"), NA for NaN, Inf and -Inf for the
    /// infinities (R's spelling, which pandas also reads).
    /// </summary>
    public static string Number(double v) =>
        double.IsNaN(v) ? Missing
        : double.IsPositiveInfinity(v) ? "Inf"
        : double.IsNegativeInfinity(v) ? "-Inf"
        : v.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>
    /// <paramref name="field"/> as is, or in double quotes with inner quotes doubled (RFC 4180) when it holds the
    /// separator, a quote, or a line break.
    /// </summary>
    public static string Field(string field, char separator)
    {
        if (field.AsSpan().IndexOfAny([separator, '"', '\n', '\r']) < 0) return field;
        return "\"" + field.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
    }
}
