namespace Coupling.Formats;

/// <summary>Finds BIDS sidecar files next to a recording and applies their contents to it.</summary>
/// <remarks>
/// Sidecar names follow the BIDS specification ("Common principles: file name structure"): a recording
/// <c>sub-01_ses-1_task-rest_eeg.edf</c> has <c>sub-01_ses-1_task-rest_events.tsv</c> and
/// <c>..._channels.tsv</c> beside it, and electrodes often as <c>sub-01_ses-1_electrodes.tsv</c>.
/// </remarks>
public static class RecordingSidecars
{
    /// <summary>
    /// Looks in the recording's folder (only there; no inheritance from parent folders) for events.tsv,
    /// channels.tsv and electrodes.tsv. For each kind the first existing name wins, in this order:
    /// <c>&lt;stem&gt;_&lt;kind&gt;.tsv</c> (stem = file name without extension); then, dropping the stem's
    /// underscore-separated parts from the end one at a time (so the BIDS suffix such as "_eeg" goes first, then
    /// entities such as "run-1" or "task-rest"), <c>&lt;shorter stem&gt;_&lt;kind&gt;.tsv</c>; finally
    /// <c>&lt;kind&gt;.tsv</c>.
    /// </summary>
    /// <param name="recordingPath">Path of the recording file.</param>
    /// <returns>The paths found, null where none exists.</returns>
    public static SidecarFiles FindBesides(string recordingPath)
    {
        string folder = Path.GetDirectoryName(Path.GetFullPath(recordingPath)) ?? ".";
        string stem = Path.GetFileNameWithoutExtension(recordingPath);
        var parts = stem.Split('_');
        string? Find(string kind)
        {
            for (int k = parts.Length; k >= 1; k--)
            {
                string candidate = Path.Combine(folder, string.Join('_', parts[..k]) + "_" + kind + ".tsv");
                if (File.Exists(candidate)) return candidate;
            }
            string bare = Path.Combine(folder, kind + ".tsv");
            return File.Exists(bare) ? bare : null;
        }
        return new SidecarFiles(Find("events"), Find("channels"), Find("electrodes"));
    }

    /// <summary>
    /// Returns a copy of <paramref name="recording"/> with sidecar contents applied: events replaced (when given);
    /// each channel listed in channels.tsv takes its type and units from there; channels marked bad are left out
    /// unless <paramref name="keepBad"/>; channels named in electrodes.tsv take its position. Mismatches in names
    /// (a channel missing from a table, a table row naming no channel) are reported in <see cref="Recording.Notes"/>.
    /// Samples of kept channels are shared with the input, not copied.
    /// </summary>
    /// <param name="recording">The recording as read.</param>
    /// <param name="events">Events to use instead of the recording's, or null to keep them.</param>
    /// <param name="channels">channels.tsv rows, or null.</param>
    /// <param name="electrodes">electrodes.tsv rows, or null.</param>
    /// <param name="keepBad">Keep channels whose status is "bad".</param>
    /// <returns>The new recording.</returns>
    public static Recording Apply(Recording recording, IReadOnlyList<RecordingEvent>? events = null,
        IReadOnlyList<ChannelsTsvEntry>? channels = null, IReadOnlyList<ElectrodesTsvEntry>? electrodes = null,
        bool keepBad = false)
    {
        var kept = ApplyToChannels(recording.Channels, recording.Notes, channels, electrodes, keepBad);
        var samples = kept.Indices.Select(c => recording.Samples[c]).ToArray();
        var newEvents = events is null ? recording.Events : SortEvents(events);
        return new Recording(recording.Source, recording.SampleRate, kept.Channels, samples, newEvents, kept.Notes);
    }

    /// <summary>
    /// The channel part of <see cref="Apply"/>, for a recording whose samples are not in memory: which channels remain
    /// and how they are described, with the same notes.
    /// </summary>
    /// <param name="recordingChannels">The recording's channels as read.</param>
    /// <param name="recordingNotes">The recording's notes as read.</param>
    /// <param name="channels">channels.tsv rows, or null.</param>
    /// <param name="electrodes">electrodes.tsv rows, or null.</param>
    /// <param name="keepBad">Keep channels whose status is "bad".</param>
    /// <returns>The kept channels, their indices and the notes.</returns>
    public static KeptChannels ApplyToChannels(IReadOnlyList<ChannelInfo> recordingChannels, IReadOnlyList<string> recordingNotes,
        IReadOnlyList<ChannelsTsvEntry>? channels = null, IReadOnlyList<ElectrodesTsvEntry>? electrodes = null,
        bool keepBad = false)
    {
        var notes = new List<string>(recordingNotes);
        var byName = channels?.ToDictionary(c => c.Name, StringComparer.Ordinal);
        var positions = new Dictionary<string, ChannelPosition?>(StringComparer.Ordinal);
        foreach (var e in electrodes ?? []) positions.TryAdd(e.Name, e.Position);

        var kept = new List<ChannelInfo>();
        var indices = new List<int>();
        var missing = new List<string>();
        for (int c = 0; c < recordingChannels.Count; c++)
        {
            var ch = recordingChannels[c];
            if (byName is not null)
            {
                if (byName.TryGetValue(ch.Label, out var row))
                {
                    if (row.IsBad && !keepBad)
                    {
                        notes.Add($"Channel '{ch.Label}' left out: marked bad in channels.tsv.");
                        continue;
                    }
                    ch = ch with { Type = row.Type, Unit = row.Units };
                }
                else missing.Add(ch.Label);
            }
            if (positions.TryGetValue(ch.Label, out var p) && p is not null)
                ch = ch with { Position = p };
            kept.Add(ch);
            indices.Add(c);
        }
        if (missing.Count > 0)
            notes.Add($"Channels not listed in channels.tsv, kept as read: {string.Join(", ", missing)}.");
        var labels = recordingChannels.Select(c => c.Label).ToHashSet(StringComparer.Ordinal);
        var extra = (channels ?? []).Select(c => c.Name).Where(n => !labels.Contains(n)).ToList();
        if (extra.Count > 0)
            notes.Add($"channels.tsv lists channels the recording does not have: {string.Join(", ", extra)}.");
        if (electrodes is not null)
        {
            var unplaced = kept.Where(c => !positions.TryGetValue(c.Label, out var p) || p is null).Select(c => c.Label).ToList();
            if (unplaced.Count > 0)
                notes.Add($"No position in electrodes.tsv for: {string.Join(", ", unplaced)}.");
        }
        return new KeptChannels(indices.ToArray(), kept.ToArray(), notes);
    }

    /// <summary>Events in onset order (stable: events with equal onsets keep their order), as <see cref="Apply"/> uses them.</summary>
    /// <param name="events">Events in any order.</param>
    public static IReadOnlyList<RecordingEvent> SortEvents(IReadOnlyList<RecordingEvent> events) => events.OrderBy(e => e.Onset).ToArray();
}
