using Coupling.TimeFrequency;

namespace Coupling.Outputs;

/// <summary>
/// Writes frequency- or time-resolved connectivity as one tidy tab-separated table: one row per condition x pair x
/// measure x frequency (x time bin), columns <see cref="SpectrumColumns"/> or <see cref="TimeColumns"/>.
/// </summary>
/// <remarks>
/// Conventions of <see cref="EdgeTableWriter"/>: numbers are invariant-culture shortest round-trip text, NaN is NA; LF
/// line ends, UTF-8 without a byte-order mark, written atomically. Rows follow the results' order, then frequency, then
/// time.
/// </remarks>
public static class TimeFrequencyTableWriter
{
    /// <summary>Header of the spectrum table (values over the analysis window).</summary>
    public static IReadOnlyList<string> SpectrumColumns { get; } =
        ["condition", "channel_a", "channel_b", "measure", "frequency_hz", "value"];

    /// <summary>Header of the time-resolved table; change_from_baseline is NA without a baseline.</summary>
    public static IReadOnlyList<string> TimeColumns { get; } =
        ["condition", "channel_a", "channel_b", "measure", "frequency_hz", "time_s", "value", "change_from_baseline"];

    /// <summary>Writes the spectrum table (each result must hold one time bin); returns the row count.</summary>
    /// <exception cref="ArgumentException">A result holds more than one time bin.</exception>
    public static int WriteSpectrum(IReadOnlyList<TimeFrequencyValues> results, string path) =>
        TidyTable.Write(path, SpectrumColumns, results.SelectMany(r =>
        {
            if (r.Times.Count != 1) throw new ArgumentException($"{r.Condition}/{r.ChannelA}-{r.ChannelB}/{r.Measure}: a spectrum has one time bin, not {r.Times.Count}.", nameof(results));
            return r.Frequencies.Select((f, i) => (IReadOnlyList<string>)
                [r.Condition, r.ChannelA, r.ChannelB, r.Measure, TableText.Number(f), TableText.Number(r.Values[i])]);
        }));

    /// <summary>Writes the time-resolved table; returns the row count.</summary>
    public static int WriteTimeCourse(IReadOnlyList<TimeFrequencyValues> results, string path) =>
        TidyTable.Write(path, TimeColumns, results.SelectMany(r =>
            Enumerable.Range(0, r.Values.Length).Select(i => (IReadOnlyList<string>)
            [
                r.Condition, r.ChannelA, r.ChannelB, r.Measure, TableText.Number(r.Frequencies[i / r.Times.Count]),
                TableText.Number(r.Times[i % r.Times.Count]), TableText.Number(r.Values[i]),
                TableText.Number(r.Change is null ? double.NaN : r.Change[i]),
            ])));
}
