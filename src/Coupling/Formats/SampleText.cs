using System.Globalization;

namespace Coupling.Formats;

/// <summary>Sample values written as text: parsing that knows the usual spellings of NaN and infinity, and one wording for them.</summary>
internal static class SampleText
{
    /// <summary>Parses a number in invariant notation, also accepting nan, inf, -inf, infinity (any case) as NaN and infinities.</summary>
    public static bool TryParse(string cell, out double value)
    {
        if (double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out value)) return true;
        string t = cell.Trim().ToLowerInvariant();
        double sign = 1;
        if (t.StartsWith('-')) { sign = -1; t = t[1..]; }
        else if (t.StartsWith('+')) t = t[1..];
        value = t switch
        {
            "nan" => double.NaN,
            "inf" or "infinity" or "∞" => sign * double.PositiveInfinity,
            _ => 0,
        };
        return t is "nan" or "inf" or "infinity" or "∞";
    }

    /// <summary>The one wording for a value that is not finite: "not a number (NaN)", "infinite (+inf)" or "infinite (-inf)".</summary>
    public static string NonFinite(double v) =>
        double.IsNaN(v) ? "not finite (NaN)" : v > 0 ? "not finite (+inf)" : "not finite (-inf)";
}
