namespace Coupling.Formats;

/// <summary>Reads a BIDS events.tsv file into events.</summary>
/// <remarks>
/// Per the BIDS specification, "Task events" (events.tsv): tab-separated with a header row; REQUIRED columns
/// onset and duration in seconds (duration may be "n/a", read here as 0); trial_type holds the event's category.
/// Onset is relative to the first sample of the recording.
/// </remarks>
public static class EventsTsv
{
    /// <summary>Reads the events; onset, duration and trial_type columns are needed, other columns are ignored.</summary>
    /// <param name="path">The events.tsv file.</param>
    /// <returns>Events sorted by onset (stable for equal onsets); trial_type "n/a" is kept as the label "n/a".</returns>
    /// <exception cref="InputException">A needed column is missing, or a cell is not a number (file, line and column named).</exception>
    public static IReadOnlyList<RecordingEvent> Read(string path)
    {
        var table = TsvTable.Read(path);
        int onset = table.RequireColumn("onset");
        int duration = table.RequireColumn("duration");
        int type = table.RequireColumn("trial_type");
        var events = new List<RecordingEvent>(table.Rows.Count);
        foreach (var row in table.Rows)
        {
            double t = table.Number(row, onset, allowMissing: false)!.Value;
            double d = table.Number(row, duration, allowMissing: true) ?? 0.0;
            if (d < 0)
                throw new InputException($"{path}: line {row.Line}, column 'duration': {d} is negative; expected seconds >= 0 or n/a.");
            events.Add(new RecordingEvent(t, d, row.Cells[type]));
        }
        return events.OrderBy(e => e.Onset).ToArray();
    }
}
