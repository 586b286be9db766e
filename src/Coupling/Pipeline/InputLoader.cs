using System.Globalization;
using Coupling.Formats;
using Coupling.Plans;

namespace Coupling.Pipeline;

/// <summary>Reads the input a plan names: the recording, its events and its sidecars, with the plan's channel selection.</summary>
public static class InputLoader
{
    /// <summary>
    /// Reads the plan's recording. Events come from the plan's <c>events</c> file when given, else from a BIDS
    /// events.tsv beside the recording, else (EDF+) from its annotations. channels.tsv and electrodes.tsv beside the
    /// recording set types, units and positions; channels marked bad there are left out unless the plan names them.
    /// Refuses NaN samples (the readers do) and flat channels, naming them.
    /// </summary>
    public static LoadedInput Load(Plan plan)
    {
        string path = plan.Recording;
        if (!File.Exists(path)) throw new InputException($"{plan.Where("recording")}: file '{path}' not found.");
        if (plan.Events is not null && !File.Exists(plan.Events)) throw new InputException($"{plan.Where("events")}: file '{plan.Events}' not found.");
        string ext = Path.GetExtension(path).ToLowerInvariant();
        if (ext == ".npy") return LoadEpochs(plan);

        var sidecars = RecordingSidecars.FindBesides(path);
        if (ext is ".edf" or ".bdf") return LoadEdf(plan, sidecars);
        var recording = CsvRecording.Read(path, plan.SampleRate!.Value, allowNonFinite: plan.UnusableData != UnusableData.Refuse);
        if (plan.Channels is not null) recording = Select(recording, plan.Channels);

        string? eventsFile = plan.Events ?? sidecars.Events;
        IReadOnlyList<RecordingEvent>? events = eventsFile is null ? null : EventsTsv.Read(eventsFile);
        if (events is null)
            throw new InputException($"{plan.Source}: events: a CSV recording carries no events; give an events.tsv (onset, duration, trial_type) in 'events' or beside {path}.");
        recording = RecordingSidecars.Apply(recording, events,
            sidecars.Channels is null ? null : ChannelsTsv.Read(sidecars.Channels),
            sidecars.Electrodes is null ? null : ElectrodesTsv.Read(sidecars.Electrodes),
            keepBad: plan.Channels is not null);

        if (plan.UnusableData == UnusableData.Refuse)
        {
            CheckChannels(path, RecordingChecks.FindFlatChannels(recording), recording.Channels.Count);
            return LoadedInput.FromRecording(recording);
        }
        var flat = RecordingChecks.FindFlatChannels(recording);
        var runs = recording.Samples.Select(x => UnusableData.NonFiniteRuns(x)).ToArray();
        var notes = new List<string>(recording.Notes);
        var keep = Screen(plan, recording.Channels, c => flat.Contains(recording.Channels[c].Label), runs, "NaN or infinite", recording.SampleRate, notes);
        var screened = new Recording(recording.Source, recording.SampleRate, keep.Select(c => recording.Channels[c]).ToArray(),
            keep.Select(c => recording.Samples[c]).ToArray(), recording.Events, notes);
        return WithRuns(plan, LoadedInput.FromRecording(screened), keep, runs, "NaN or infinite");
    }

    /// <summary>
    /// The channels kept under the plan's <c>unusable_data</c> policy (drop-trials or drop-channels): flat channels are
    /// left out, and under drop-channels also those with unusable runs; each left out is named in <paramref name="notes"/>.
    /// </summary>
    private static int[] Screen(Plan plan, IReadOnlyList<ChannelInfo> channels, Func<int, bool> isFlat,
        IReadOnlyList<List<(int Start, int Length)>> runs, string kind, double rate, List<string> notes)
    {
        var keep = new List<int>();
        var reasons = new List<string>();
        for (int c = 0; c < channels.Count; c++)
        {
            string? reason = isFlat(c) ? "flat (every sample equal)"
                : plan.UnusableData == UnusableData.DropChannels && runs[c].Count > 0 ? UnusableData.Describe(runs[c], kind, rate) : null;
            if (reason is null) { keep.Add(c); continue; }
            notes.Add($"Channel '{channels[c].Label}' left out (unusable_data: {plan.UnusableData}): {reason}.");
            reasons.Add($"'{channels[c].Label}': {reason}");
        }
        if (keep.Count < 2)
            throw new InputException($"{plan.Where("unusable_data")}: connectivity needs at least 2 channels, but {keep.Count} remain{(keep.Count == 1 ? "s" : "")} once the unusable ones are left out ({string.Join("; ", reasons)}).");
        return keep.ToArray();
    }

    private static LoadedInput WithRuns(Plan plan, LoadedInput input, int[] keep, IReadOnlyList<IReadOnlyList<(int Start, int Length)>> runs, string kind) =>
        plan.UnusableData != UnusableData.DropTrials ? input
            : input.WithUnusableRuns(keep.SelectMany((c, k) => runs[c].Select(r => (k, r.Start, r.Length, kind))).ToArray());

    /// <summary>
    /// EDF input is read a segment at a time: the file is streamed once for its events and flat channels, and each
    /// condition's trials are read when they are cut, so memory grows with the trials, not the recording.
    /// </summary>
    private static LoadedInput LoadEdf(Plan plan, SidecarFiles sidecars)
    {
        string path = plan.Recording;
        var reader = EdfSegmentReader.Open(path, plan.Channels, plan.KeepCompleteRecords);
        string? eventsFile = plan.Events ?? sidecars.Events;
        var events = eventsFile is null ? reader.Events : RecordingSidecars.SortEvents(EventsTsv.Read(eventsFile));
        var kept = RecordingSidecars.ApplyToChannels(reader.Channels, reader.Notes,
            sidecars.Channels is null ? null : ChannelsTsv.Read(sidecars.Channels),
            sidecars.Electrodes is null ? null : ElectrodesTsv.Read(sidecars.Electrodes),
            keepBad: plan.Channels is not null);
        var indices = kept.Indices.ToArray();
        var channels = kept.Channels.ToArray();
        if (plan.Channels is not null)
        {
            // The reader keeps the file's order; results follow the order the plan lists the channels in.
            var order = plan.Channels.Select((label, i) => (label, i)).ToDictionary(x => x.label, x => x.i, StringComparer.Ordinal);
            var sorted = Enumerable.Range(0, channels.Length).OrderBy(k => order[channels[k].Label]).ToArray();
            indices = sorted.Select(k => indices[k]).ToArray();
            channels = sorted.Select(k => channels[k]).ToArray();
        }
        var samples = reader.WithChannels(indices, channels);
        if (reader.Gaps.Count > 0 && plan.UnusableData != UnusableData.DropTrials)
        {
            var gap = reader.Gaps[0];
            throw new InputException(string.Create(CultureInfo.InvariantCulture,
                $"{plan.Where("unusable_data")}: '{path}' is {reader.Header.FormatName} with {reader.Gaps.Count} gap(s) between its data records (the first from {gap.Start / reader.SampleRate:0.###} s, {gap.Length / reader.SampleRate:0.###} s long), where nothing was recorded; give 'unusable_data: drop-trials' to leave out the trials (with their padding) that reach into a gap."));
        }
        if (plan.UnusableData == UnusableData.Refuse)
        {
            CheckChannels(path, samples.FindFlatChannels(), samples.Channels.Count);
            return LoadedInput.FromSource(samples, events, kept.Notes);
        }
        var flat = samples.FindFlatChannels();
        var runs = Enumerable.Range(0, channels.Length).Select(c => samples.ClippedRuns(c).ToList()).ToArray();
        var notes = new List<string>(kept.Notes);
        var keep = Screen(plan, channels, c => flat.Contains(channels[c].Label), runs, "clipped", samples.SampleRate, notes);
        var screened = reader.WithChannels(keep.Select(k => indices[k]).ToArray(), keep.Select(k => channels[k]).ToArray());
        var input = WithRuns(plan, LoadedInput.FromSource(screened, events, notes), keep, runs, "clipped");
        // Gaps are missing in every channel alike: one run each, named after the first channel kept.
        return reader.Gaps.Count == 0 ? input
            : input.WithUnusableRuns(input.UnusableRuns.Concat(reader.Gaps.Select(g => (0, g.Start, g.Length, UnrecordedKind))).ToArray());
    }

    /// <summary>How a trial that reaches into an EDF+D gap is described among the dropped trials.</summary>
    internal const string UnrecordedKind = "unrecorded (a gap between data records)";

    private static void CheckChannels(string path, IReadOnlyList<string> flat, int channelCount)
    {
        if (flat.Count > 0)
            throw new InputException($"{path}: channel(s) {string.Join(", ", flat)} are flat (every sample equal): phase and envelope are undefined there; leave them out with 'channels' in the plan.");
        if (channelCount < 2)
            throw new InputException($"{path}: connectivity needs at least 2 channels, the selection has {channelCount}.");
    }

    private static Recording Select(Recording recording, IReadOnlyList<string> labels)
    {
        var rows = new double[labels.Count][];
        var channels = new ChannelInfo[labels.Count];
        for (int i = 0; i < labels.Count; i++)
        {
            int c = recording.IndexOf(labels[i]);
            if (c < 0)
                throw new InputException($"{recording.Source}: channel '{labels[i]}' not found; channels there: {string.Join(", ", recording.Channels.Select(x => x.Label))}.");
            rows[i] = recording.Samples[c];
            channels[i] = recording.Channels[c];
        }
        return new Recording(recording.Source, recording.SampleRate, channels, rows, recording.Events, recording.Notes);
    }

    private static LoadedInput LoadEpochs(Plan plan)
    {
        var spec = plan.Epochs!;
        var array = NpyArray.Read(plan.Recording, allowNonFinite: plan.UnusableData != UnusableData.Refuse);
        if (array.Shape.Count != 3)
            throw new InputException($"{plan.Recording}: an epochs array must have 3 dimensions (trials x channels x samples), this one has shape ({string.Join(", ", array.Shape)}).");
        int epochs = array.Shape[0], channels = array.Shape[1], samples = array.Shape[2];
        if (spec.ChannelLabels.Count != channels)
            throw new InputException($"{plan.Source}: epochs.channel_labels lists {spec.ChannelLabels.Count} channels, but {plan.Recording} holds {channels}.");
        if (!File.Exists(spec.LabelsFile)) throw new InputException($"{plan.Where("epochs.labels")}: file '{spec.LabelsFile}' not found.");
        string[] lines;
        try { lines = File.ReadAllLines(spec.LabelsFile); }
        catch (Exception e) when (FileErrors.IsFileError(e)) { throw FileErrors.Reading(spec.LabelsFile, "labels file", e); }
        var labels = lines.Select(l => l.Trim()).Where(l => l.Length > 0).ToArray();
        if (labels.Length != epochs)
            throw new InputException($"{spec.LabelsFile}: {labels.Length} labels, but {plan.Recording} holds {epochs} epochs (one label per line, one line per epoch).");

        double[] data = array.Values;
        var chosen = Enumerable.Range(0, channels).ToArray();
        if (plan.Channels is not null)
        {
            chosen = plan.Channels.Select(l =>
            {
                int i = spec.ChannelLabels.ToList().IndexOf(l);
                return i >= 0 ? i : throw new InputException($"{plan.Source}: channels: '{l}' is not among epochs.channel_labels ({string.Join(", ", spec.ChannelLabels)}).");
            }).ToArray();
            var picked = new double[(long)epochs * chosen.Length * samples];
            for (int e = 0; e < epochs; e++)
                for (int c = 0; c < chosen.Length; c++)
                    data.AsSpan((e * channels + chosen[c]) * samples, samples).CopyTo(picked.AsSpan((e * chosen.Length + c) * samples, samples));
            data = picked;
        }
        var infos = chosen.Select(i => new ChannelInfo(spec.ChannelLabels[i], "unknown", "unknown")).ToArray();
        var flatChannels = new bool[chosen.Length];
        for (int c = 0; c < chosen.Length; c++)
        {
            double first = data[c * samples];
            bool flat = true;
            for (int e = 0; e < epochs && flat; e++)
                foreach (double v in data.AsSpan((e * chosen.Length + c) * samples, samples))
                    if (v != first) { flat = false; break; }
            if (flat && plan.UnusableData == UnusableData.Refuse)
                throw new InputException($"{plan.Recording}: channel '{infos[c].Label}' is flat (every sample equal): leave it out with 'channels' in the plan, or give 'unusable_data: drop-trials'.");
            flatChannels[c] = flat;
        }
        if (plan.UnusableData == UnusableData.Refuse)
            return LoadedInput.FromEpochs(plan.Recording, plan.SampleRate!.Value, infos, data, epochs, samples, spec.FirstSampleTime, labels);
        return ScreenEpochs(plan, infos, flatChannels, data, epochs, samples, labels);
    }

    /// <summary>Epochs under drop-trials or drop-channels: flat channels left out, then channels (drop-channels) or epochs
    /// (drop-trials) that hold a NaN or infinite sample; each left out is named in the notes or among the dropped trials.</summary>
    private static LoadedInput ScreenEpochs(Plan plan, ChannelInfo[] infos, bool[] flat, double[] data, int epochs, int samples, string[] labels)
    {
        var spec = plan.Epochs!;
        int cc = infos.Length;
        // Runs per channel over the epochs laid end to end (sample index e * samples + s).
        var runs = Enumerable.Range(0, cc).Select(c =>
        {
            var row = new double[(long)epochs * samples];
            for (int e = 0; e < epochs; e++) data.AsSpan((e * cc + c) * samples, samples).CopyTo(row.AsSpan(e * samples, samples));
            return UnusableData.NonFiniteRuns(row);
        }).ToArray();
        var notes = new List<string>();
        var keep = Screen(plan, infos, c => flat[c], runs, "NaN or infinite", plan.SampleRate!.Value, notes);
        var badEpochs = new SortedDictionary<int, int>(); // epoch -> first channel (kept index) with an unusable sample
        if (plan.UnusableData == UnusableData.DropTrials)
            for (int k = 0; k < keep.Length; k++)
                foreach (var (start, length) in runs[keep[k]])
                    for (int e = start / samples; e <= (start + length - 1) / samples; e++) badEpochs.TryAdd(e, k);
        var keptEpochs = Enumerable.Range(0, epochs).Where(e => !badEpochs.ContainsKey(e)).ToArray();
        var packed = new double[(long)keptEpochs.Length * keep.Length * samples];
        for (int n = 0; n < keptEpochs.Length; n++)
            for (int k = 0; k < keep.Length; k++)
                data.AsSpan((keptEpochs[n] * cc + keep[k]) * samples, samples).CopyTo(packed.AsSpan((n * keep.Length + k) * samples, samples));
        var dropped = badEpochs.Select(b => (labels[b.Key],
            $"epoch {b.Key + 1} ('{labels[b.Key]}'): holds NaN or infinite samples (channel '{infos[keep[b.Value]].Label}')")).ToArray();
        var input = LoadedInput.FromEpochs(plan.Recording, plan.SampleRate!.Value, keep.Select(k => infos[k]).ToArray(), packed,
            keptEpochs.Length, samples, spec.FirstSampleTime, keptEpochs.Select(e => labels[e]).ToArray(), notes);
        return input.WithDroppedEpochs(dropped);
    }
}
