using System.Buffers;
using System.Buffers.Binary;

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

    private EdfSegmentReader(EdfHeader header, int perRecord, double sampleRate, int[] signals, IReadOnlyList<ChannelInfo> channels,
        bool[] flat, List<(int Start, int Length)>[] clipped, IReadOnlyList<RecordingEvent> events, IReadOnlyList<string> notes, int sampleCount)
    {
        _clipped = clipped;
        _perRecord = perRecord;
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
    /// Opens an EDF or EDF+C file: parses the header, selects the signals, and streams through the records once to
    /// read the events and find flat channels.
    /// </summary>
    /// <param name="path">The file to read.</param>
    /// <param name="selectedChannels">Labels of the signals to read (trimmed labels, ordinal match), or null for all
    /// ordinary signals at the most common sampling rate, as in <see cref="EdfReader.Read"/>.</param>
    /// <param name="keepCompleteRecords">For a file shorter than its header promises: read the complete data records
    /// it holds (saying how many in <see cref="Notes"/>) instead of refusing it.</param>
    /// <returns>The reader, with the events and notes <see cref="EdfReader.Read"/> would give.</returns>
    /// <exception cref="InputException">The file is missing, EDF+D, malformed or truncated; a selected label is unknown;
    /// or selected signals differ in sampling rate.</exception>
    public static EdfSegmentReader Open(string path, IReadOnlyCollection<string>? selectedChannels = null, bool keepCompleteRecords = false)
    {
        using var stream = EdfReader.Open(path);
        var notes = new List<string>();
        var header = EdfReader.ParseHeader(path, stream, keepCompleteRecords, notes);
        var selected = EdfReader.SelectReadable(header, selectedChannels, notes);
        var signals = header.Signals;
        int perRecord = signals[selected[0]].SamplesPerRecord;
        long perChannel = (long)header.RecordCount * perRecord;
        if (perChannel > int.MaxValue)
            throw new InputException($"{path}: {perChannel} samples per signal is more than a sample index can count; select a shorter file.");

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
            // Clipping: runs of two or more consecutive samples at the signal's digital minimum or maximum.
            for (int c = 0; c < selected.Length; c++)
            {
                var s = signals[selected[c]];
                var bytes = record.Slice(offsets[selected[c]], 2 * perRecord);
                for (int i = 0; i < perRecord; i++)
                {
                    int d = BinaryPrimitives.ReadInt16LittleEndian(bytes.Slice(2 * i, 2));
                    int at = r * perRecord + i;
                    bool limit = d == s.DigitalMinimum || d == s.DigitalMaximum;
                    if (runStart[c] >= 0 && (!limit || d != runValue[c])) Close(c, at);
                    if (limit && runStart[c] < 0) { runStart[c] = at; runValue[c] = d; }
                }
            }
            for (int c = 0; c < selected.Length; c++)
            {
                if (!flat[c]) continue;
                var s = signals[selected[c]];
                EdfReader.ScaleInto(record.Slice(offsets[selected[c]], 2 * perRecord), s.DigitalMinimum, s.Resolution, s.PhysicalMinimum, scratch);
                if (r == 0) first[c] = scratch[0];
                if (scratch.AsSpan().IndexOfAnyExcept(first[c]) >= 0) flat[c] = false;
            }
        });
        for (int c = 0; c < selected.Length; c++) Close(c, (int)perChannel);
        var channels = selected.Select(i => EdfReader.ToChannel(signals[i])).ToArray();
        return new EdfSegmentReader(header, perRecord, signals[selected[0]].SampleRate, selected, channels, flat, clipped, events, notes, (int)perChannel);
    }

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
            indices.Select(i => _flat[i]).ToArray(), indices.Select(i => _clipped[i]).ToArray(), Events, Notes, SampleCount);
    }

    /// <inheritdoc/>
    /// <exception cref="InputException">The file can no longer be opened or has become shorter since it was opened.</exception>
    public void Read(int firstSample, int length, Span<double> target)
    {
        SampleSegment.Check(firstSample, length, SampleCount, Channels.Count, target.Length);
        if (length == 0 || _signals.Length == 0) return;
        var signals = Header.Signals;
        int perRecord = _perRecord;
        int recordBytes = checked((int)Header.RecordBytes);
        int firstRecord = firstSample / perRecord;
        int lastRecord = (int)(((long)firstSample + length - 1) / perRecord);
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
                    long recordStart = (long)(b0 + k) * perRecord;
                    int lo = (int)Math.Max(firstSample, recordStart);
                    int hi = (int)Math.Min((long)firstSample + length, recordStart + perRecord);
                    for (int c = 0; c < _signals.Length; c++)
                    {
                        var s = signals[_signals[c]];
                        var bytes = record.Slice(_offsets[_signals[c]] + 2 * (int)(lo - recordStart), 2 * (hi - lo));
                        EdfReader.ScaleInto(bytes, s.DigitalMinimum, s.Resolution, s.PhysicalMinimum, target.Slice(c * length + lo - firstSample, hi - lo));
                    }
                }
            }
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(buffer);
        }
    }
}
