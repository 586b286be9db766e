using System.Globalization;

namespace Coupling.Formats;

/// <summary>
/// A description of a recording for display: format, start, duration, channels with type, unit and rate,
/// and event counts per label. Built from an EDF header (every signal, at its own rate) or from a recording.
/// </summary>
/// <param name="Source">The file or description the recording came from.</param>
/// <param name="FormatName">"EDF", "EDF+C", "EDF+D", or the caller's name for the format of a recording.</param>
/// <param name="StartTime">Start date and time, where the input states one.</param>
/// <param name="Duration">Duration in seconds.</param>
/// <param name="RecordCount">EDF data records, or null for other inputs.</param>
/// <param name="RecordDuration">EDF record duration in seconds, or null for other inputs.</param>
/// <param name="Channels">Data channels (EDF annotation signals are not channels).</param>
/// <param name="EventCounts">Events per label, sorted by label (ordinal), or null when events were not read.</param>
/// <param name="Notes">Remarks, e.g. signals a reader would leave out.</param>
public sealed record RecordingSummary(
    string Source,
    string FormatName,
    DateTime? StartTime,
    double Duration,
    int? RecordCount,
    double? RecordDuration,
    IReadOnlyList<ChannelSummary> Channels,
    IReadOnlyList<EventCount>? EventCounts,
    IReadOnlyList<string> Notes)
{
    /// <summary>Summarises an EDF/EDF+ header: every data signal at its own rate.</summary>
    /// <param name="header">The header, from <see cref="EdfReader.ReadHeader"/>.</param>
    /// <param name="events">The file's events (from <see cref="EdfReader.ReadEvents"/>), or null if not read.</param>
    /// <returns>The summary.</returns>
    public static RecordingSummary Describe(EdfHeader header, IReadOnlyList<RecordingEvent>? events = null)
    {
        var channels = header.Signals.Where(s => !s.IsAnnotation)
            .Select(s => new ChannelSummary(s.Label, EdfReader.TypeFromLabel(s.Label), s.PhysicalDimension, s.SampleRate,
                (long)s.SamplesPerRecord * header.RecordCount))
            .ToArray();
        var notes = new List<string>();
        int annotationSignals = header.Signals.Count(s => s.IsAnnotation);
        if (annotationSignals > 0) notes.Add($"{annotationSignals} annotation signal(s).");
        int rates = channels.Select(c => c.SampleRate).Distinct().Count();
        if (rates > 1) notes.Add($"Signals at {rates} different sampling rates; a recording holds one rate, so reading keeps the most common or the selected one.");
        return new RecordingSummary(header.Source, header.FormatName, header.StartTime, header.Duration, header.RecordCount,
            header.RecordDuration, channels, events is null ? null : Count(events), notes);
    }

    /// <summary>Summarises a recording as read.</summary>
    /// <param name="recording">The recording.</param>
    /// <param name="format">Name of its input format (e.g. "CSV", "EDF+C").</param>
    /// <param name="startTime">Start date and time, if known.</param>
    /// <returns>The summary, with the recording's notes.</returns>
    public static RecordingSummary Describe(Recording recording, string format, DateTime? startTime = null)
    {
        var channels = recording.Channels
            .Select(c => new ChannelSummary(c.Label, c.Type, c.Unit, recording.SampleRate, recording.SampleCount))
            .ToArray();
        return new RecordingSummary(recording.Source, format, startTime, recording.Duration, null, null, channels,
            Count(recording.Events), recording.Notes);
    }

    /// <summary>
    /// The summary as the analysis would see the recording with its BIDS sidecars: channel types and units from
    /// channels.tsv (channels marked bad noted), event counts from events.tsv; each sidecar used is named in the notes.
    /// </summary>
    /// <param name="sidecars">Sidecar files, e.g. from <see cref="RecordingSidecars.FindBesides"/>.</param>
    public RecordingSummary WithSidecars(SidecarFiles sidecars)
    {
        var notes = new List<string>(Notes);
        var channels = Channels;
        if (sidecars.Channels is { } channelsFile)
        {
            var rows = ChannelsTsv.Read(channelsFile).ToDictionary(r => r.Name, StringComparer.Ordinal);
            channels = Channels.Select(c => rows.TryGetValue(c.Label, out var row)
                ? c with { Type = row.Type, Unit = row.Units } : c).ToArray();
            var bad = rows.Values.Where(r => r.IsBad).Select(r => r.Name).ToArray();
            notes.Add($"Channel types and units from {Path.GetFileName(channelsFile)}.");
            if (bad.Length > 0) notes.Add($"Marked bad there (left out unless a plan names them): {string.Join(", ", bad)}.");
        }
        var counts = EventCounts;
        if (sidecars.Events is { } eventsFile)
        {
            counts = Count(EventsTsv.Read(eventsFile));
            notes.Add($"Events from {Path.GetFileName(eventsFile)}.");
        }
        return this with { Channels = channels, EventCounts = counts, Notes = notes };
    }

    private static EventCount[] Count(IReadOnlyList<RecordingEvent> events) =>
        events.GroupBy(e => e.Label, StringComparer.Ordinal)
            .Select(g => new EventCount(g.Key, g.Count()))
            .OrderBy(c => c.Label, StringComparer.Ordinal)
            .ToArray();

    /// <summary>The summary as text lines: a few "name: value" lines, then a channel table, event counts and notes.</summary>
    /// <returns>Lines without line terminators.</returns>
    public IReadOnlyList<string> Format()
    {
        static string N(double v) => v.ToString("0.######", CultureInfo.InvariantCulture);
        var lines = new List<string>
        {
            $"source: {Source}",
            $"format: {FormatName}",
            $"start: {(StartTime is { } t ? t.ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture) : "unknown")}",
            RecordCount is int r && RecordDuration is double d
                ? $"duration: {N(Duration)} s ({r} records of {N(d)} s)"
                : $"duration: {N(Duration)} s",
            $"channels: {Channels.Count}",
        };
        var table = new List<string[]> { new[] { "label", "type", "unit", "rate (Hz)", "samples" } };
        table.AddRange(Channels.Select(c => new[] { c.Label, c.Type, c.Unit, N(c.SampleRate), c.SampleCount.ToString(CultureInfo.InvariantCulture) }));
        var widths = Enumerable.Range(0, 5).Select(i => table.Max(row => row[i].Length)).ToArray();
        foreach (var row in table)
            lines.Add("  " + string.Join("  ", row.Select((cell, i) => cell.PadRight(widths[i]))).TrimEnd());
        if (EventCounts is null)
            lines.Add("events: not read");
        else
        {
            lines.Add($"events: {EventCounts.Sum(e => e.Count)} ({EventCounts.Count} labels)");
            int w = EventCounts.Count == 0 ? 0 : EventCounts.Max(e => e.Label.Length);
            lines.AddRange(EventCounts.Select(e => $"  {e.Label.PadRight(w)}  {e.Count}"));
        }
        if (Notes.Count > 0)
        {
            lines.Add("notes:");
            lines.AddRange(Notes.Select(n => "  " + n));
        }
        return lines;
    }
}
