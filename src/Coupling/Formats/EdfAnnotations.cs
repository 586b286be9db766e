using System.Globalization;
using System.Text;

namespace Coupling.Formats;

/// <summary>
/// Time-stamped annotation lists (TALs) of the EDF+ "EDF Annotations" signal: parsing and encoding.
/// A TAL is: '+' or '-' onset, optionally 0x15 and a duration, then 0x14, then each text followed by 0x14, then 0x00.
/// Onsets and durations are decimal seconds without exponent; texts are UTF-8.
/// </summary>
/// <remarks>Kemp B, Olivan J (2003) "European data format 'plus' (EDF+)", Clinical Neurophysiology 114:1755-1761, section 2.2.</remarks>
internal static class EdfAnnotations
{
    private const byte Separator = 0x14;
    private const byte DurationMark = 0x15;

    /// <summary>
    /// Parses the TALs of one record's annotation signal into <paramref name="found"/> (onsets from the file start time).
    /// When <paramref name="timekeeping"/> is set, the first TAL's onset is the record's time stamp and its empty first
    /// text is not an event. Returns that stamp, or null when there is no TAL or <paramref name="timekeeping"/> is false.
    /// </summary>
    public static double? Parse(ReadOnlySpan<byte> bytes, bool timekeeping, List<RecordingEvent> found,
        Func<int, string, InputException> error)
    {
        double? stamp = null;
        bool first = true;
        int pos = 0;
        while (pos < bytes.Length)
        {
            if (bytes[pos] == 0) { pos++; continue; }
            int end = bytes[pos..].IndexOf((byte)0);
            if (end < 0) throw error(pos, "a TAL is not closed by a 0x00 byte");
            var tal = bytes.Slice(pos, end);
            int talStart = pos;
            pos += end + 1;

            int headEnd = tal.IndexOf(Separator);
            if (headEnd < 0) throw error(talStart, "a TAL has no 0x14 after its onset");
            if (tal[^1] != Separator) throw error(talStart, "a TAL's last text is not closed by 0x14");
            var head = tal[..headEnd];
            int mark = head.IndexOf(DurationMark);
            var onsetText = mark < 0 ? head : head[..mark];
            double onset = ParseSeconds(onsetText, signed: true)
                ?? throw error(talStart, $"onset '{Encoding.ASCII.GetString(onsetText)}' is not '+' or '-' followed by decimal seconds");
            double duration = 0;
            if (mark >= 0)
                duration = ParseSeconds(head[(mark + 1)..], signed: false)
                    ?? throw error(talStart, $"duration '{Encoding.ASCII.GetString(head[(mark + 1)..])}' is not decimal seconds");

            // A TAL closed right after its onset ("+1 0x14 0x00") has no texts; it still carries the onset.
            var texts = headEnd + 1 < tal.Length ? tal[(headEnd + 1)..^1] : ReadOnlySpan<byte>.Empty;
            bool firstText = true;
            while (true)
            {
                int next = texts.IndexOf(Separator);
                var piece = next < 0 ? texts : texts[..next];
                bool skip = timekeeping && first && firstText;
                if (!skip && piece.Length > 0)
                    found.Add(new RecordingEvent(onset, duration, Encoding.UTF8.GetString(piece)));
                firstText = false;
                if (next < 0) break;
                texts = texts[(next + 1)..];
            }
            if (timekeeping && first) stamp = onset;
            first = false;
        }
        return stamp;
    }

    private static double? ParseSeconds(ReadOnlySpan<byte> text, bool signed)
    {
        if (text.Length == 0) return null;
        double sign = 1;
        if (signed)
        {
            if (text[0] == (byte)'-') sign = -1;
            else if (text[0] != (byte)'+') return null;
            text = text[1..];
        }
        int dots = 0;
        if (text.Length == 0) return null;
        foreach (byte b in text)
        {
            if (b == (byte)'.') dots++;
            else if (b < (byte)'0' || b > (byte)'9') return null;
        }
        if (dots > 1 || text[0] == (byte)'.' || text[^1] == (byte)'.') return null;
        return sign * double.Parse(Encoding.ASCII.GetString(text), NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture);
    }

    /// <summary>Seconds as decimal text without exponent that parses back to the same double (shortest round-trip digits).</summary>
    public static string FormatSeconds(double seconds)
    {
        string r = Math.Abs(seconds).ToString("R", CultureInfo.InvariantCulture);
        int e = r.IndexOfAny(['E', 'e']);
        if (e < 0) return r;
        int exponent = int.Parse(r[(e + 1)..], NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture);
        string mantissa = r[..e];
        int dot = mantissa.IndexOf('.');
        string digits = mantissa.Replace(".", "", StringComparison.Ordinal);
        int pointAt = (dot < 0 ? mantissa.Length : dot) + exponent;
        if (pointAt <= 0) return "0." + new string('0', -pointAt) + digits;
        if (pointAt >= digits.Length) return digits + new string('0', pointAt - digits.Length);
        return digits[..pointAt] + "." + digits[pointAt..];
    }

    /// <summary>Encodes one TAL: onset (signed), optional duration (when positive), and its texts.</summary>
    public static byte[] Encode(double onset, double duration, IReadOnlyList<string> texts)
    {
        var sb = new StringBuilder();
        sb.Append(onset < 0 ? '-' : '+').Append(FormatSeconds(onset));
        if (duration > 0) sb.Append((char)DurationMark).Append(FormatSeconds(duration));
        sb.Append((char)Separator);
        foreach (var t in texts) sb.Append(t).Append((char)Separator);
        sb.Append('\0');
        return Encoding.UTF8.GetBytes(sb.ToString());
    }
}
