using System.Globalization;

namespace Coupling.Formats;

/// <summary>Reads a plain comma-separated array as a recording: a header row of channel labels, then one row per sample.</summary>
/// <remarks>Comma-separated values as in RFC 4180 without quoted commas: a label may be wrapped in double quotes,
/// cells are numbers in invariant notation (decimal point, optional exponent). Common practice for exported arrays.</remarks>
public static class CsvRecording
{
    /// <summary>Reads the file; channel types and units are "unknown" (a channels.tsv can supply them).</summary>
    /// <param name="path">The CSV file.</param>
    /// <param name="sampleRate">Sampling rate in Hz (the file does not carry one).</param>
    /// <param name="allowNonFinite">Keep NaN and infinite samples (nan, inf, -inf in any case) instead of refusing them,
    /// for a caller that leaves them out later.</param>
    /// <returns>The recording, with no events.</returns>
    /// <exception cref="InputException">The header is missing or repeats a label, a row has the wrong number of cells,
    /// or a cell is empty, not a number, NaN or infinite (file, line, column and sample index named).</exception>
    public static Recording Read(string path, double sampleRate, bool allowNonFinite = false)
    {
        if (!(sampleRate > 0) || !double.IsFinite(sampleRate))
            throw new InputException($"{path}: sampling rate {sampleRate} Hz; expected a positive number of Hz.");
        StreamReader reader;
        try
        {
            reader = new StreamReader(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw FileErrors.Reading(path, "CSV file", e);
        }
        using (reader)
        {
            string? first = reader.ReadLine();
            if (first is null || first.Trim().Length == 0)
                throw new InputException($"{path}: line 1: expected a header row of channel labels.");
            var labels = first.TrimStart('\uFEFF').Split(',').Select(Unquote).ToArray();
            if (labels.Length == 1 && OtherSeparator(first) is { } other)
                throw new InputException($"{path}: line 1: the header has no commas but is separated by {other}; a CSV recording must separate its columns with commas (and use '.' as the decimal point).");
            var seen = new HashSet<string>(StringComparer.Ordinal);
            for (int c = 0; c < labels.Length; c++)
                if (labels[c].Length == 0 || !seen.Add(labels[c]))
                    throw new InputException($"{path}: line 1, column {c + 1}: label '{labels[c]}' is empty or repeats an earlier column.");

            var columns = labels.Select(_ => new List<double>()).ToArray();
            int lineNumber = 1;
            string? line;
            while ((line = reader.ReadLine()) is not null)
            {
                lineNumber++;
                if (line.Trim().Length == 0) continue;
                var cells = line.Split(',');
                if (cells.Length != labels.Length)
                    throw new InputException($"{path}: line {lineNumber}: {cells.Length} cells, but the header has {labels.Length} columns{SeparatorHint(line)}.");
                int sample = columns[0].Count;
                for (int c = 0; c < cells.Length; c++)
                {
                    string cell = cells[c].Trim();
                    string where = $"{path}: line {lineNumber}, column {c + 1} (channel '{labels[c]}', sample {sample})";
                    if (cell.Length == 0)
                        throw new InputException($"{where}: empty cell; expected a number.");
                    if (!SampleText.TryParse(cell, out double v))
                        throw new InputException($"{where}: '{cell}' is not a number{SeparatorHint(line)}.");
                    if (!double.IsFinite(v) && !allowNonFinite)
                        throw new InputException($"{where}: '{cell}' is {SampleText.NonFinite(v)}; samples must be finite numbers.");
                    columns[c].Add(v);
                }
            }
            var channels = labels.Select(l => new ChannelInfo(l, "unknown", "unknown")).ToArray();
            return new Recording(path, sampleRate, channels, columns.Select(c => c.ToArray()).ToArray(), Array.Empty<RecordingEvent>());
        }
    }

    /// <summary>"semicolons" or "tabs" when the line is split by one of them instead of commas; else null.</summary>
    private static string? OtherSeparator(string line) =>
        line.Contains(';', StringComparison.Ordinal) ? "semicolons" : line.Contains('\t', StringComparison.Ordinal) ? "tabs" : null;

    private static string SeparatorHint(string line) =>
        OtherSeparator(line) is { } other ? $" (the line holds {other}; columns must be separated by commas, with '.' as the decimal point)" : "";

    private static string Unquote(string s)
    {
        s = s.Trim();
        return s.Length >= 2 && s[0] == '"' && s[^1] == '"' ? s[1..^1].Trim() : s;
    }
}
