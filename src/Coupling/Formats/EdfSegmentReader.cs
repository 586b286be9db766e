using System.Buffers;
using System.Buffers.Binary;
using System.Globalization;

namespace Coupling.Formats;

/// <summary>
/// Reads segments of the selected signals of an EDF or EDF+C file on demand, without holding the samples: each
/// <see cref="Read"/> reads only the data records that cover the segment.
/// </summary>
/// <remarks>
/// Signals are selected and scaled to physical units exactly as <see cref="EdfReader.Read"/> does, so a segment holds
/// the same doubles as the same stretch of the whole-file read. Record layout per Kemp B, Värri A, Rosa AC,
/// Nielsen KD, Gade J (1992) "A simple format for exchange of digitized polygraphic recordings", Electroencephalography
/// and Clinical Neurophysiology 82:391-393: record r starts at byte <c>headerBytes + r * recordBytes</c>.
/// <para>Opening streams through the file once, in blocks of records, to read the annotation signals (EDF+, Kemp B,
/// Olivan J (2003) Clinical Neurophysiology 114:1755-1761) and to find flat channels; the samples are not kept.
/// Each read opens the file anew, so a reader holds no open file and may be used from several threads.</para>
/// </remarks>
public sealed class EdfSegmentReader : ISampleSource
{
    private const int BlockBytes = 4 << 20;

    private readonly int[] _signals;
    private readonly bool[] _flat;
    private readonly List<(int Start, int Length)>[] _clipped;
    private readonly int[] _offsets;
    private readonly int _perRecord;
    private readonly int[]? _recordStarts;

    private EdfSegmentReader(EdfHeader header, int perRecord, double sampleRate, int[] signals, IReadOnlyList<ChannelInfo> channels,
        bool[] flat, List<(int Start, int Length)>[] clipped, IReadOnlyList<RecordingEvent> events, IReadOnlyList<string> notes, int sampleCount,
        int[]? recordStarts, IReadOnlyList<(int Start, int Length)> gaps)
    {
        _clipped = clipped;
        _perRecord = perRecord;
        _recordStarts = recordStarts;
        Gaps = gaps;
        Header = header;
        _signals = signals;
        _flat = flat;
        _offsets = EdfReader.SignalOffsets(header);
        Channels = channels;
        Events = events;
        Notes = notes;
        SampleCount = sampleCount;
        SampleRate = sampleRate;
    }

    /// <summary>
    /// Opens an EDF, EDF+C or EDF+D file: parses the header, selects the signals, and streams through the records once to
    /// read the events and find flat channels. The data records of an EDF+D file are placed at their time-keeping
    /// stamps (each record's start rounded to the nearest sample from the first record's); the samples between records
    /// that do not follow on are <see cref="Gaps"/> and read as NaN.
    /// </summary>
    /// <param name="path">The file to read.</param>
    /// <param name="selectedChannels">Labels of the signals to read (trimmed labels, ordinal match), or null for all
    /// ordinary signals at the most common sampling rate, as in <see cref="EdfReader.Read"/>.</param>
    /// <param name="keepCompleteRecords">For a file shorter than its header promises: read the complete data records
    /// it holds (saying how many in <see cref="Notes"/>) instead of refusing it.</param>
    /// <returns>The reader, with the events and notes <see cref="EdfReader.Read"/> would give.</returns>
    /// <exception cref="InputException">The file is missing, malformed or truncated; an EDF+D file's records overlap or
    /// go back in time; a selected label is unknown; or selected signals differ in sampling rate.</exception>
    public static EdfSegmentReader Open(string path, IReadOnlyCollection<string>? selectedChannels = null, bool keepCompleteRecords = false)
    {
        using var stream = EdfReader.Open(path);
        var notes = new List<string>();
        var header = EdfReader.ParseHeader(path, stream, keepCompleteRecords, notes);
        var selected = EdfReader.SelectReadable(header, selectedChannels, notes, allowDiscontinuous: true);
        var signals = header.Signals;
        int perRecord = signals[selected[0]].SamplesPerRecord;
        double sampleRate = signals[selected[0]].SampleRate;
        long perChannel = (long)header.RecordCount * perRecord;
        if (perChannel > int.MaxValue)
            throw new InputException($"{path}: {perChannel} samples per signal is more than a sample index can count; select a shorter file.");
        bool discontinuous = header.IsDiscontinuous;
        int width = header.BytesPerSample;
        var stamps = discontinuous ? new double[header.RecordCount] : null;
        var recordStarts = discontinuous ? new int[header.RecordCount] : null;
        var gaps = new List<(int Start, int Length)>();
        int offGrid = 0;
        long end = 0; // the sample after the last record placed

        // A channel is flat when every physical sample equals its first (exact comparison, as RecordingChecks does).
        var flat = Enumerable.Repeat(true, selected.Length).ToArray();
        var first = new double[selected.Length];
        var scratch = new double[header.RecordCount > 0 ? perRecord : 0]; // sized only when the file backs a record
        var offsets = EdfReader.SignalOffsets(header);
        var clipped = selected.Select(_ => new List<(int Start, int Length)>()).ToArray();
        var runStart = Enumerable.Repeat(-1, selected.Length).ToArray();
        var runValue = new int[selected.Length];
        void Close(int c, int end)
        {
            if (runStart[c] >= 0 && end - runStart[c] >= 2) clipped[c].Add((runStart[c], end - runStart[c]));
            runStart[c] = -1;
        }
        var events = EdfReader.ScanRecords(header, stream, notes, (r, record) =>
        {
            long start = (long)r * perRecord;
            if (recordStarts is not null)
            {
                start = PlaceRecord(header, r, stamps![r], sampleRate, end, perRecord, ref offGrid);
                if (start > end)
                {
                    // A gap: clipping runs do not continue across it.
                    for (int c = 0; c < selected.Length; c++) Close(c, (int)end);
                    gaps.Add(((int)end, (int)(start - end)));
                }
                recordStarts[r] = (int)start;
            }
            end = start + perRecord;
            // Clipping: runs of two or more consecutive samples at the signal's digital minimum or maximum.
            for (int c = 0; c < selected.Length; c++)
            {
                var s = signals[selected[c]];
                var bytes = record.Slice(offsets[selected[c]], width * perRecord);
                for (int i = 0; i < perRecord; i++)
                {
                    int d = EdfReader.Digital(bytes, i, width);
                    int at = (int)start + i;
                    bool limit = d == s.DigitalMinimum || d == s.DigitalMaximum;
                    if (runStart[c] >= 0 && (!limit || d != runValue[c])) Close(c, at);
                    if (limit && runStart[c] < 0) { runStart[c] = at; runValue[c] = d; }
                }
            }
            for (int c = 0; c < selected.Length; c++)
            {
                if (!flat[c]) continue;
                var s = signals[selected[c]];
                EdfReader.ScaleInto(record.Slice(offsets[selected[c]], width * perRecord), width, s.DigitalMinimum, s.Resolution, s.PhysicalMinimum, scratch);
                if (r == 0) first[c] = scratch[0];
                if (scratch.AsSpan().IndexOfAnyExcept(first[c]) >= 0) flat[c] = false;
            }
        }, stamps);
        for (int c = 0; c < selected.Length; c++) Close(c, (int)end);
        if (gaps.Count > 0)
        {
            long missing = gaps.Sum(g => (long)g.Length);
            notes.Add(string.Create(CultureInfo.InvariantCulture,
                $"{header.FormatName}: {gaps.Count} gap(s) between data records, {missing / sampleRate:0.###} s in all (first from {gaps[0].Start / sampleRate:0.###} s, {gaps[0].Length / sampleRate:0.###} s long); trials that reach into a gap cannot be analysed."));
        }
        if (offGrid > 0)
            notes.Add($"{header.FormatName}: {offGrid} data record(s) start off the sampling grid by more than a hundredth of a sample; each was placed at the nearest sample.");
        var channels = selected.Select(i => EdfReader.ToChannel(signals[i])).ToArray();
        return new EdfSegmentReader(header, perRecord, sampleRate, selected, channels, flat, clipped, events, notes, (int)end, recordStarts, gaps);
    }

    /// <summary>
    /// The first sample of EDF+D data record <paramref name="r"/>: its stamp (seconds from the first record's) times the
    /// rate, rounded; refused when it would overlap the record before (which ends at <paramref name="end"/>).
    /// </summary>
    private static long PlaceRecord(EdfHeader header, int r, double stamp, double rate, long end, int perRecord, ref int offGrid)
    {
        string path = header.Source;
        double exact = stamp * rate;
        long start = (long)Math.Round(exact);
        if (Math.Abs(exact - start) > 0.01) offGrid++;
        if (start < end)
            throw new InputException(string.Create(CultureInfo.InvariantCulture,
                $"{path}: {header.FormatName} data record {r + 1} starts at {stamp:0.######} s after the first, before the record ahead of it ends ({end / rate:0.######} s); records must follow each other in time without overlapping."));
        if (start + perRecord > int.MaxValue)
            throw new InputException($"{path}: {header.FormatName} data record {r + 1} lies more than a sample index can count from the first; select a shorter file.");
        return start;
    }

    /// <summary>
    /// Stretches between EDF+D data records that hold no samples, as (first sample, length) on the recording's sample
    /// axis; <see cref="Read"/> gives NaN there. Empty for EDF and EDF+C files and for EDF+D files whose records follow on.
    /// </summary>
    public IReadOnlyList<(int Start, int Length)> Gaps { get; }

    /// <summary>The file's header (every signal, including annotation signals).</summary>
    public EdfHeader Header { get; }

    /// <inheritdoc/>
    public string Source => Header.Source;

    /// <inheritdoc/>
    public double SampleRate { get; }

    /// <inheritdoc/>
    public int SampleCount { get; }

    /// <inheritdoc/>
    public IReadOnlyList<ChannelInfo> Channels { get; }

    /// <summary>Events from the annotation signals, sorted by onset, onsets in seconds from the first sample.</summary>
    public IReadOnlyList<RecordingEvent> Events { get; }

    /// <summary>Messages from opening: signals left out for another sampling rate, records whose time stamps do not follow on.</summary>
    public IReadOnlyList<string> Notes { get; }

    /// <summary>Labels of the channels whose samples are all equal (exact comparison), in channel order, as found when
    /// the file was opened; agrees with <see cref="RecordingChecks.FindFlatChannels"/> on the whole-file read.</summary>
    public IReadOnlyList<string> FindFlatChannels() =>
        Enumerable.Range(0, Channels.Count).Where(c => _flat[c]).Select(c => Channels[c].Label).ToArray();

    /// <summary>
    /// Runs of clipped samples of channel <paramref name="channel"/> as (first sample, length): two or more consecutive
    /// samples at the signal's digital minimum or maximum (the same one), as found when the file was opened.
    /// </summary>
    /// <param name="channel">Index into <see cref="Channels"/>.</param>
    public IReadOnlyList<(int Start, int Length)> ClippedRuns(int channel) => _clipped[channel];

    /// <summary>A reader of some of this reader's channels (no file access), in the given order, with new channel
    /// descriptions (e.g. types and positions from sidecar files); events and notes are kept. No channels is allowed.</summary>
    /// <param name="indices">Indices into <see cref="Channels"/>.</param>
    /// <param name="channels">One description per index.</param>
    public EdfSegmentReader WithChannels(IReadOnlyList<int> indices, IReadOnlyList<ChannelInfo> channels)
    {
        if (indices.Count != channels.Count)
            throw new ArgumentException($"{indices.Count} indices but {channels.Count} channel descriptions.", nameof(channels));
        foreach (int i in indices) ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual((uint)i, (uint)Channels.Count, nameof(indices));
        return new EdfSegmentReader(Header, _perRecord, SampleRate, indices.Select(i => _signals[i]).ToArray(), channels.ToArray(),
            indices.Select(i => _flat[i]).ToArray(), indices.Select(i => _clipped[i]).ToArray(), Events, Notes, SampleCount, _recordStarts, Gaps);
    }

    /// <inheritdoc/>
    /// <exception cref="InputException">The file can no longer be opened or has become shorter since it was opened.</exception>
    public void Read(int firstSample, int length, Span<double> target)
    {
        SampleSegment.Check(firstSample, length, SampleCount, Channels.Count, target.Length);
        if (length == 0 || _signals.Length == 0) return;
        var signals = Header.Signals;
        int perRecord = _perRecord;
        int recordBytes = checked((int)Header.RecordBytes), width = Header.BytesPerSample;
        int firstRecord = firstSample / perRecord;
        int lastRecord = (int)(((long)firstSample + length - 1) / perRecord);
        if (_recordStarts is { } starts)
        {
            // Records placed at their stamps: those overlapping the segment, and NaN wherever none does.
            target.Fill(double.NaN);
            firstRecord = RecordAtOrBefore(starts, firstSample);
            if (firstRecord < 0 || starts[firstRecord] + perRecord <= firstSample) firstRecord++;
            lastRecord = RecordAtOrBefore(starts, firstSample + length - 1);
            if (firstRecord > lastRecord) return;
        }
        int recordsPerBlock = Math.Max(1, BlockBytes / recordBytes);
        int blockRecords = Math.Min(recordsPerBlock, lastRecord - firstRecord + 1);
        var buffer = ArrayPool<byte>.Shared.Rent(blockRecords * recordBytes);
        try
        {
            using var stream = EdfReader.Open(Source);
            for (int b0 = firstRecord; b0 <= lastRecord; b0 += blockRecords)
            {
                int count = Math.Min(blockRecords, lastRecord - b0 + 1);
                stream.Position = Header.HeaderBytes + (long)b0 * recordBytes;
                try
                {
                    stream.ReadExactly(buffer, 0, count * recordBytes);
                }
                catch (EndOfStreamException e)
                {
                    throw new InputException($"{Source}: the file ends inside data record {b0 + 1}; it has become shorter since it was opened.", e);
                }
                for (int k = 0; k < count; k++)
                {
                    var record = new ReadOnlySpan<byte>(buffer, k * recordBytes, recordBytes);
                    long recordStart = _recordStarts is null ? (long)(b0 + k) * perRecord : _recordStarts[b0 + k];
                    int lo = (int)Math.Max(firstSample, recordStart);
                    int hi = (int)Math.Min((long)firstSample + length, recordStart + perRecord);
                    for (int c = 0; c < _signals.Length; c++)
                    {
                        var s = signals[_signals[c]];
                        var bytes = record.Slice(_offsets[_signals[c]] + width * (int)(lo - recordStart), width * (hi - lo));
                        EdfReader.ScaleInto(bytes, width, s.DigitalMinimum, s.Resolution, s.PhysicalMinimum, target.Slice(c * length + lo - firstSample, hi - lo));
                    }
                }
            }
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(buffer);
        }
    }

    /// <summary>The last record whose first sample is at or before <paramref name="sample"/>; −1 when there is none.</summary>
    private static int RecordAtOrBefore(int[] starts, int sample)
    {
        int i = Array.BinarySearch(starts, sample);
        return i >= 0 ? i : ~i - 1;
    }
}
