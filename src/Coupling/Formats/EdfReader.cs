using System.Buffers.Binary;
using System.Globalization;
using System.Text;

namespace Coupling.Formats;

/// <summary>
/// Reads EDF and EDF+ continuous (EDF+C) files: the header, the 16-bit samples scaled to physical units, and the
/// "EDF Annotations" signal as events.
/// </summary>
/// <remarks>
/// Format per Kemp B, Värri A, Rosa AC, Nielsen KD, Gade J (1992) "A simple format for exchange of digitized
/// polygraphic recordings", Electroencephalography and Clinical Neurophysiology 82:391-393, and Kemp B, Olivan J
/// (2003) "European data format 'plus' (EDF+), an EDF alike standard format for the exchange of physiological data",
/// Clinical Neurophysiology 114:1755-1761. Samples are 16-bit little-endian two's complement integers, scaled as
/// phys = (dig - digMin) * (physMax - physMin) / (digMax - digMin) + physMin.
/// Annotations are time-stamped annotation lists (TALs): +onset[0x15 duration] 0x14 text 0x14 [text 0x14 ...] 0x00.
/// The first TAL of each data record is its time-keeping stamp (the record's start relative to the file's start
/// time); it is not an event. Several texts in one TAL become several events with the same onset and duration.
/// </remarks>
public static class EdfReader
{
    private const int FixedHeaderBytes = 256;
    private const int BlockBytes = 4 << 20;

    /// <summary>Reads only the header of an EDF/EDF+ file (every signal, including annotation signals).</summary>
    /// <param name="path">The file to read.</param>
    /// <returns>The header, with the record count taken from the file size where the header says -1.</returns>
    /// <exception cref="InputException">The file is missing, truncated or has a malformed header field.</exception>
    public static EdfHeader ReadHeader(string path)
    {
        using var stream = Open(path);
        return ParseHeader(path, stream);
    }

    /// <summary>
    /// Reads an EDF or EDF+C file into a recording of one sampling rate, with events from its annotation signals.
    /// </summary>
    /// <param name="path">The file to read.</param>
    /// <param name="selectedChannels">Labels of the signals to read (trimmed labels, ordinal match), or null for all
    /// ordinary signals at the most common sampling rate (ties go to the rate of the earliest signal).</param>
    /// <returns>Channels in file order. Signals left out for another sampling rate are named in
    /// <see cref="Recording.Notes"/>. Event onsets are seconds from the first sample (the first record's
    /// time-keeping stamp); events are sorted by onset.</returns>
    /// <exception cref="InputException">The file is EDF+D, malformed or truncated; a selected label is unknown;
    /// or selected signals differ in sampling rate.</exception>
    public static Recording Read(string path, IReadOnlyCollection<string>? selectedChannels = null)
    {
        using var stream = Open(path);
        var header = ParseHeader(path, stream);
        var notes = new List<string>();
        var selected = SelectReadable(header, selectedChannels, notes);
        long perChannel = (long)header.RecordCount * header.Signals[selected[0]].SamplesPerRecord;
        if (perChannel > Array.MaxLength)
            throw new InputException($"{header.Source}: {perChannel} samples per signal is more than one array can hold; select a shorter file.");
        var samples = selected.Select(_ => new double[perChannel]).ToArray();
        var gains = selected.Select(i => header.Signals[i].Resolution).ToArray();
        var offsets = SignalOffsets(header);
        var events = ScanRecords(header, stream, notes, (r, record) =>
        {
            for (int c = 0; c < selected.Length; c++)
            {
                var s = header.Signals[selected[c]];
                var bytes = record.Slice(offsets[selected[c]], header.BytesPerSample * s.SamplesPerRecord);
                ScaleInto(bytes, header.BytesPerSample, s.DigitalMinimum, gains[c], s.PhysicalMinimum, samples[c].AsSpan(r * s.SamplesPerRecord, s.SamplesPerRecord));
            }
        });
        var channels = selected.Select(i => ToChannel(header.Signals[i])).ToArray();
        double rate = header.Signals[selected[0]].SampleRate;
        return new Recording(path, rate, channels, samples, events, notes);
    }

    /// <summary>Reads only the events (annotation signals) of an EDF/EDF+ file; plain EDF gives none.</summary>
    /// <param name="path">The file to read.</param>
    /// <returns>Events sorted by onset, onsets in seconds from the first record's time-keeping stamp.</returns>
    /// <exception cref="InputException">The file is malformed or truncated.</exception>
    public static IReadOnlyList<RecordingEvent> ReadEvents(string path)
    {
        using var stream = Open(path);
        var header = ParseHeader(path, stream);
        return ScanRecords(header, stream, new List<string>(), null);
    }

    /// <summary>
    /// Checks that <paramref name="header"/> describes a file with data signals (continuous, unless
    /// <paramref name="allowDiscontinuous"/>) and chooses the signals to read (see <see cref="Read"/>); signals left out for
    /// another sampling rate, and a BDF file's Status signal, are noted in <paramref name="notes"/>.
    /// </summary>
    /// <param name="header">The file's header.</param>
    /// <param name="selectedChannels">Labels to read, or null (see <see cref="Read"/>).</param>
    /// <param name="notes">Receives the signals left out.</param>
    /// <param name="allowDiscontinuous">Accept an EDF+D file (<see cref="EdfSegmentReader"/> places its records by their
    /// time stamps); the whole-file read refuses one.</param>
    internal static int[] SelectReadable(EdfHeader header, IReadOnlyCollection<string>? selectedChannels, List<string> notes,
        bool allowDiscontinuous = false)
    {
        string path = header.Source;
        if (header.IsDiscontinuous && !allowDiscontinuous)
            throw new InputException($"{path}: {header.FormatName} (discontinuous) files are read only through a plan (a run or check), which places each data record at its time stamp; this reader takes continuous files.");
        if (header.IsDiscontinuous && !header.Signals.Any(s => s.IsAnnotation))
            throw new InputException($"{path}: a {header.FormatName} file needs an annotation signal ('{(header.IsBdf ? EdfSignalHeader.BdfAnnotationLabel : EdfSignalHeader.AnnotationLabel)}') whose time stamps place its data records; this one has none.");
        var selected = SelectSignals(header, selectedChannels, notes);
        if (header.RecordDuration <= 0)
            throw new InputException($"{path}: header field 'duration of a data record' at byte 244 is {Text(header.RecordDuration)}; a file with data signals needs a positive record duration.");
        return selected;
    }

    internal static FileStream Open(string path)
    {
        try
        {
            return new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw FileErrors.Reading(path, "EDF file", e);
        }
    }

    internal static ChannelInfo ToChannel(EdfSignalHeader s) => new(s.Label, TypeFromLabel(s.Label), s.PhysicalDimension);

    /// <summary>EDF+ labels start with a signal type ("EEG Fpz-Cz"); the known EDF+ types are taken as the channel type.</summary>
    internal static string TypeFromLabel(string label)
    {
        string first = label.Split(' ', 2)[0];
        string[] known = ["EEG", "ECG", "EOG", "ERG", "EMG", "MEG", "MCG", "EP", "Temp", "Resp", "SaO2", "Light", "Sound", "Event"];
        foreach (var k in known)
            if (label.Length > first.Length && string.Equals(first, k, StringComparison.OrdinalIgnoreCase))
                return k.ToUpperInvariant();
        return "unknown";
    }

    /// <summary>The label of a BDF file's trigger and status signal (BioSemi).</summary>
    public const string StatusLabel = "Status";

    /// <summary>
    /// The index of a BDF file's "Status" signal, whose lower 16 bits carry the trigger inputs (BioSemi's BDF
    /// description, from memory); −1 for EDF files and BDF files without one.
    /// </summary>
    public static int StatusSignal(EdfHeader header) =>
        header.IsBdf ? header.Signals.ToList().FindIndex(s => s.Label == StatusLabel) : -1;

    private static int[] SelectSignals(EdfHeader header, IReadOnlyCollection<string>? selection, List<string> notes)
    {
        var signals = header.Signals;
        int status = StatusSignal(header);
        // The Status signal is selected only when named: it holds trigger codes, not a voltage.
        var ordinary = Enumerable.Range(0, signals.Count).Where(i => !signals[i].IsAnnotation && (i != status || selection is { Count: > 0 })).ToList();
        if (status >= 0 && selection is not { Count: > 0 })
            notes.Add($"The '{StatusLabel}' signal holds trigger codes, not a voltage, and is not analysed; name it in 'channels' to analyse it anyway.");
        if (ordinary.Count == 0)
            throw new InputException($"{header.Source}: the file holds no data signals, only annotations.");
        if (selection is { Count: > 0 })
        {
            var wanted = new List<int>();
            foreach (var label in selection)
            {
                int index = ordinary.FirstOrDefault(i => signals[i].Label == label.Trim(), -1);
                if (index < 0)
                    throw new InputException($"{header.Source}: no signal labelled '{label}'. Available: {string.Join(", ", ordinary.Select(i => "'" + signals[i].Label + "'"))}.");
                if (!wanted.Contains(index)) wanted.Add(index);
            }
            var first = signals[wanted[0]];
            foreach (int i in wanted)
                if (signals[i].SamplesPerRecord != first.SamplesPerRecord)
                    throw new InputException($"{header.Source}: selected signal '{signals[i].Label}' is sampled at {Text(signals[i].SampleRate)} Hz but selected signal '{first.Label}' at {Text(first.SampleRate)} Hz; select signals of one sampling rate.");
            wanted.Sort();
            return wanted.ToArray();
        }
        // Most common rate among ordinary signals; on a tie the rate met first in file order wins.
        int bestRate = ordinary
            .GroupBy(i => signals[i].SamplesPerRecord)
            .Select(g => (Rate: g.Key, Count: g.Count(), First: g.Min()))
            .OrderByDescending(g => g.Count).ThenBy(g => g.First)
            .First().Rate;
        var kept = ordinary.Where(i => signals[i].SamplesPerRecord == bestRate).ToArray();
        double keptRate = signals[kept[0]].SampleRate;
        foreach (int i in ordinary.Where(i => signals[i].SamplesPerRecord != bestRate))
            notes.Add($"Signal '{signals[i].Label}' left out: sampled at {Text(signals[i].SampleRate)} Hz, not the {Text(keptRate)} Hz of the other signals.");
        return kept;
    }

    /// <summary>Called with each data record's bytes, in record order.</summary>
    internal delegate void RecordHandler(int record, ReadOnlySpan<byte> bytes);

    /// <summary>Byte offset of each signal within a data record.</summary>
    internal static int[] SignalOffsets(EdfHeader header)
    {
        var signals = header.Signals;
        var offsets = new int[signals.Count];
        for (int i = 1; i < signals.Count; i++) offsets[i] = offsets[i - 1] + header.BytesPerSample * signals[i - 1].SamplesPerRecord;
        return offsets;
    }

    /// <summary>
    /// Streams every data record in blocks of about 4 MiB, parses the annotation signals and then hands each record to
    /// <paramref name="onRecord"/>. Returns the events (onsets from the first record's time-keeping stamp, sorted); notes on
    /// the records' timing go to <paramref name="notes"/>.
    /// </summary>
    /// <param name="header">The file's header.</param>
    /// <param name="stream">The file, open for reading.</param>
    /// <param name="notes">Receives notes on the records' timing.</param>
    /// <param name="onRecord">Called with each record after its time-keeping stamp is parsed; may be null.</param>
    /// <param name="recordStamps">When given (length: the record count), receives each record's time-keeping stamp in
    /// seconds from the first record's, filled for record r before <paramref name="onRecord"/> sees it (EDF+ only).</param>
    internal static IReadOnlyList<RecordingEvent> ScanRecords(EdfHeader header, Stream stream, List<string> notes, RecordHandler? onRecord,
        double[]? recordStamps = null)
    {
        var signals = header.Signals;
        int signalCount = signals.Count;
        var offsets = SignalOffsets(header);
        int recordBytes = checked((int)header.RecordBytes);

        var annotationSignals = Enumerable.Range(0, signalCount).Where(i => signals[i].IsAnnotation).ToArray();
        var found = new List<RecordingEvent>();
        // A BDF file without annotations: events are the trigger codes of its Status signal.
        int status = annotationSignals.Length == 0 ? StatusSignal(header) : -1;
        int previousCode = 0;
        var stamps = new double[annotationSignals.Length > 0 ? header.RecordCount : 0];

        int recordsPerBlock = Math.Max(1, BlockBytes / Math.Max(1, recordBytes));
        var buffer = new byte[(long)Math.Min(recordsPerBlock, header.RecordCount) * recordBytes];
        stream.Position = header.HeaderBytes;
        for (int r0 = 0; r0 < header.RecordCount; r0 += recordsPerBlock)
        {
            int count = Math.Min(recordsPerBlock, header.RecordCount - r0);
            stream.ReadExactly(buffer, 0, count * recordBytes);
            for (int k = 0; k < count; k++)
            {
                int r = r0 + k;
                var record = new ReadOnlySpan<byte>(buffer, k * recordBytes, recordBytes);
                for (int a = 0; a < annotationSignals.Length; a++)
                {
                    var s = signals[annotationSignals[a]];
                    var bytes = record.Slice(offsets[annotationSignals[a]], header.BytesPerSample * s.SamplesPerRecord);
                    double? stamp = EdfAnnotations.Parse(bytes, a == 0, found,
                        (offset, what) => new InputException($"{header.Source}: annotation signal {annotationSignals[a] + 1} in data record {r + 1} (byte {header.HeaderBytes + (long)r * recordBytes + offsets[annotationSignals[a]] + offset}): {what}."));
                    if (a == 0)
                        stamps[r] = stamp ?? throw new InputException($"{header.Source}: data record {r + 1} has no time-keeping annotation; EDF+ requires one as the first TAL of every record.");
                }
                if (status >= 0)
                    previousCode = AddTriggers(signals[status], record.Slice(offsets[status], header.BytesPerSample * signals[status].SamplesPerRecord),
                        header.BytesPerSample, r, previousCode, found);
                if (recordStamps is not null && stamps.Length > 0) recordStamps[r] = stamps[r] - stamps[0];
                onRecord?.Invoke(r, record);
            }
        }

        if (status >= 0)
            notes.Add($"Events from the trigger codes of the '{StatusLabel}' signal (its lower 16 bits): {found.Count} onsets of a new nonzero code, labelled by the code ({string.Join(", ", found.Select(e => e.Label).Distinct().Order(StringComparer.Ordinal).Take(12))}{(found.Select(e => e.Label).Distinct().Count() > 12 ? ", ..." : "")}).");
        double start = stamps.Length > 0 ? stamps[0] : 0.0;
        if (start != 0)
            notes.Add($"The first data record starts {Text(start)} s after the header's start time; event onsets are measured from the first sample.");
        // In an EDF+D file the stamps place the records (with gaps between them): they are not expected to follow on.
        if (!header.IsDiscontinuous) CheckContinuity(header, stamps, notes);
        return found.Select(e => e with { Onset = e.Onset - start }).OrderBy(e => e.Onset).ToArray();
    }

    /// <summary>
    /// Adds an event at every sample of data record <paramref name="r"/> of the Status signal where the trigger code (the
    /// lower 16 bits of the digital value) changes to a nonzero value, labelled by that value in decimal; returns the last
    /// sample's code, which the next record continues from.
    /// </summary>
    private static int AddTriggers(EdfSignalHeader status, ReadOnlySpan<byte> bytes, int width, int r, int previousCode, List<RecordingEvent> found)
    {
        int perRecord = status.SamplesPerRecord;
        for (int k = 0; k < perRecord; k++)
        {
            int code = Digital(bytes, k, width) & 0xFFFF;
            if (code != previousCode && code != 0)
                found.Add(new RecordingEvent(((long)r * perRecord + k) / status.SampleRate, 0, code.ToString(CultureInfo.InvariantCulture)));
            previousCode = code;
        }
        return previousCode;
    }

    private static void CheckContinuity(EdfHeader header, double[] stamps, List<string> notes)
    {
        if (stamps.Length == 0) return;
        // The stamps are decimal text; allow for their parse rounding and for onset text of limited length.
        double tolerance = 1e-6 * Math.Max(1.0, header.RecordDuration);
        int off = 0;
        int firstOff = -1;
        for (int r = 1; r < stamps.Length; r++)
        {
            if (Math.Abs(stamps[r] - (stamps[0] + r * header.RecordDuration)) > tolerance)
            {
                off++;
                if (firstOff < 0) firstOff = r;
            }
        }
        if (off > 0)
            notes.Add($"{off} data record(s) carry time stamps that do not follow on from the record duration (first: record {firstOff + 1} at {Text(stamps[firstOff])} s); samples were read as continuous.");
    }

    /// <summary>phys = (dig - digMin) * gain + physMin, gain = (physMax - physMin) / (digMax - digMin).</summary>
    /// <param name="bytes">The samples, <paramref name="width"/> bytes each.</param>
    /// <param name="width">2 for EDF, 3 for BDF (<see cref="Digital"/>).</param>
    /// <param name="digitalMinimum">The signal's digital minimum.</param>
    /// <param name="gain">The signal's resolution, physical units per digital step.</param>
    /// <param name="physicalMinimum">The signal's physical minimum.</param>
    /// <param name="target">Receives one physical value per sample.</param>
    internal static void ScaleInto(ReadOnlySpan<byte> bytes, int width, int digitalMinimum, double gain, double physicalMinimum, Span<double> target)
    {
        for (int i = 0; i < target.Length; i++)
            target[i] = (Digital(bytes, i, width) - digitalMinimum) * gain + physicalMinimum;
    }

    /// <summary>
    /// Digital value <paramref name="i"/> of <paramref name="bytes"/>: a little-endian two's-complement integer of
    /// <paramref name="width"/> bytes, 16-bit for EDF (Kemp et al. 1992) and 24-bit for BDF.
    /// </summary>
    internal static int Digital(ReadOnlySpan<byte> bytes, int i, int width) => width == 2
        ? BinaryPrimitives.ReadInt16LittleEndian(bytes.Slice(2 * i, 2))
        : bytes[3 * i] | bytes[3 * i + 1] << 8 | (sbyte)bytes[3 * i + 2] << 16;

    /// <summary>Longest data record supported (bytes); a record is read into memory whole.</summary>
    internal const long MaxRecordBytes = 64L << 20;

    internal static EdfHeader ParseHeader(string path, Stream stream, bool keepCompleteRecords = false, List<string>? notes = null)
    {
        long length = stream.Length;
        if (length < FixedHeaderBytes)
            throw new InputException($"{path}: truncated EDF file: {length} bytes, fewer than the 256-byte fixed header.");
        var fixedPart = new byte[FixedHeaderBytes];
        stream.Position = 0;
        stream.ReadExactly(fixedPart);
        var f = new FieldReader(path, fixedPart, 0);

        // BDF (BioSemi, 24-bit): the version field is byte 0xFF and then "BIOSEMI".
        bool bdf = fixedPart[0] == 0xFF && fixedPart.AsSpan(1, 7).SequenceEqual("BIOSEMI"u8);
        int width = bdf ? 3 : 2;
        string version = bdf ? "BIOSEMI" : f.Text(0, 8, "version");
        string patient = f.Text(8, 80, "local patient identification");
        string recording = f.Text(88, 80, "local recording identification");
        string date = f.Text(168, 8, "startdate");
        string time = f.Text(176, 8, "starttime");
        int headerBytes = f.Int(184, 8, "number of bytes in header record");
        string reserved = f.Text(192, 44, "reserved");
        int recordCount = f.Int(236, 8, "number of data records");
        double duration = f.Double(244, 8, "duration of a data record");
        int ns = f.Int(252, 4, "number of signals");

        if (ns < 1)
            throw new InputException($"{path}: header field 'number of signals' at byte 252 is {ns}; expected at least 1.");
        if (duration < 0)
            throw new InputException($"{path}: header field 'duration of a data record' at byte 244 is {Text(duration)}; expected a non-negative number of seconds.");
        long expectedHeader = FixedHeaderBytes * (ns + 1L);
        if (headerBytes != expectedHeader)
            throw new InputException($"{path}: header field 'number of bytes in header record' at byte 184 is {headerBytes}; with {ns} signals it must be {expectedHeader}.");
        if (length < expectedHeader)
            throw new InputException($"{path}: truncated EDF file: {length} bytes, fewer than the {expectedHeader}-byte header for {ns} signals.");

        var signalPart = new byte[ns * FixedHeaderBytes];
        stream.ReadExactly(signalPart);
        var g = new FieldReader(path, signalPart, FixedHeaderBytes);
        int offset = 0;
        string[] Texts(int width, string name) { var v = new string[ns]; for (int i = 0; i < ns; i++) v[i] = g.Text(offset + i * width, width, name); offset += ns * width; return v; }
        double[] Doubles(int width, string name) { var v = new double[ns]; for (int i = 0; i < ns; i++) v[i] = g.Double(offset + i * width, width, name + $" of signal {i + 1}"); offset += ns * width; return v; }
        int[] Ints(int width, string name) { var v = new int[ns]; for (int i = 0; i < ns; i++) v[i] = g.Int(offset + i * width, width, name + $" of signal {i + 1}"); offset += ns * width; return v; }
        int At(int fieldStart, int width, int i) => FixedHeaderBytes + fieldStart + i * width;

        var labels = Texts(16, "label");
        var transducers = Texts(80, "transducer type");
        var dimensions = Texts(8, "physical dimension");
        int pMinAt = offset; var pMin = Doubles(8, "physical minimum");
        int pMaxAt = offset; var pMax = Doubles(8, "physical maximum");
        int dMinAt = offset; var dMin = Ints(8, "digital minimum");
        int dMaxAt = offset; var dMax = Ints(8, "digital maximum");
        var prefilters = Texts(80, "prefiltering");
        int sprAt = offset; var spr = Ints(8, "number of samples in each data record");
        var reservedSignal = Texts(32, "reserved");

        var signals = new EdfSignalHeader[ns];
        for (int i = 0; i < ns; i++)
        {
            string who = $"signal {i + 1} ('{labels[i]}')";
            if (dMin[i] >= dMax[i])
                throw new InputException($"{path}: {who} has digital minimum {dMin[i]} (byte {At(dMinAt, 8, i)}) not below digital maximum {dMax[i]} (byte {At(dMaxAt, 8, i)}).");
            if (!bdf && (dMin[i] < short.MinValue || dMax[i] > short.MaxValue))
                throw new InputException($"{path}: {who} has digital range {dMin[i]}..{dMax[i]} (bytes {At(dMinAt, 8, i)}, {At(dMaxAt, 8, i)}); 16-bit EDF allows -32768..32767.");
            if (bdf && (dMin[i] < -(1 << 23) || dMax[i] > (1 << 23) - 1))
                throw new InputException($"{path}: {who} has digital range {dMin[i]}..{dMax[i]} (bytes {At(dMinAt, 8, i)}, {At(dMaxAt, 8, i)}); 24-bit BDF allows -8388608..8388607.");
            if (spr[i] < 1)
                throw new InputException($"{path}: {who} has {spr[i]} samples per data record (byte {At(sprAt, 8, i)}); expected at least 1.");
            bool annotation = EdfSignalHeader.IsAnnotationLabel(labels[i]);
            if (!annotation)
            {
                if (!double.IsFinite(pMin[i]) || !double.IsFinite(pMax[i]) || pMin[i] == pMax[i]
                    || !double.IsFinite((pMax[i] - pMin[i]) / ((double)dMax[i] - dMin[i])))
                    throw new InputException($"{path}: {who} has physical minimum {Text(pMin[i])} (byte {At(pMinAt, 8, i)}) and maximum {Text(pMax[i])} (byte {At(pMaxAt, 8, i)}); expected two different finite numbers.");
            }
            double rate = duration > 0 ? spr[i] / duration : 0.0;
            signals[i] = new EdfSignalHeader(labels[i], transducers[i], dimensions[i], pMin[i], pMax[i], dMin[i], dMax[i],
                prefilters[i], spr[i], reservedSignal[i], rate);
        }

        long recordBytes = signals.Sum(s => (long)width * s.SamplesPerRecord);
        // Checked against the file length before anything is sized from it: a header may promise more than the file holds.
        if (recordBytes > MaxRecordBytes)
            throw new InputException($"{path}: header fields 'number of samples in each data record' make a data record {recordBytes} bytes long; at most {MaxRecordBytes} are supported.");
        long complete = (length - headerBytes) / recordBytes;
        if (recordCount == -1)
            recordCount = (int)Math.Min(int.MaxValue, complete);
        else if (recordCount < 0)
            throw new InputException($"{path}: header field 'number of data records' at byte 236 is {recordCount}; expected a count or -1.");
        if (recordCount > complete)
        {
            long needed = headerBytes + recordCount * recordBytes; // no overflow: recordCount < 2^31, recordBytes <= MaxRecordBytes
            if (!keepCompleteRecords)
                throw new InputException($"{path}: truncated EDF file: {length} bytes, but the header promises {needed} ({recordCount} data records of {recordBytes} bytes after a {headerBytes}-byte header). " +
                    "To analyse the complete records it holds, give 'truncated_recording: keep-complete-records' in the plan.");
            notes?.Add($"Truncated file: {complete} of the {recordCount} data records the header promises are complete and were kept ({Text(complete * duration)} s); the rest ({length - headerBytes - complete * recordBytes} bytes of a partial record) was left out.");
            recordCount = (int)complete;
        }

        var start = ParseStart(path, date, time, recording, reserved);
        return new EdfHeader(path, version, patient, recording, start, headerBytes, reserved, recordCount, duration, signals) { BytesPerSample = width };
    }

    private static DateTime ParseStart(string path, string date, string time, string recordingId, string reserved)
    {
        static bool Three(string s, out int a, out int b, out int c)
        {
            a = b = c = 0;
            var parts = s.Split('.');
            return parts.Length == 3 && parts.All(p => p.Length == 2 && p.All(char.IsAsciiDigit))
                && int.TryParse(parts[0], NumberStyles.None, CultureInfo.InvariantCulture, out a)
                && int.TryParse(parts[1], NumberStyles.None, CultureInfo.InvariantCulture, out b)
                && int.TryParse(parts[2], NumberStyles.None, CultureInfo.InvariantCulture, out c);
        }
        bool edfPlus = reserved.StartsWith("EDF+", StringComparison.Ordinal) || reserved.StartsWith("BDF+", StringComparison.Ordinal);
        int day, month, yy;
        // EDF+ allows "yy" in the year place after 2084; the recording id then carries the four-digit year.
        if (!Three(date, out day, out month, out yy) && !(edfPlus && date.EndsWith(".yy", StringComparison.Ordinal)
            && Three(date[..^2] + "00", out day, out month, out yy)))
            throw new InputException($"{path}: header field 'startdate' at byte 168 is '{date}'; expected dd.mm.yy.");
        if (!Three(time, out int hour, out int minute, out int second))
            throw new InputException($"{path}: header field 'starttime' at byte 176 is '{time}'; expected hh.mm.ss.");
        int year = yy >= 85 ? 1900 + yy : 2000 + yy;
        if (edfPlus)
        {
            var parts = recordingId.Split(' ', StringSplitOptions.RemoveEmptyEntries);
            if (parts.Length >= 2 && parts[0] == "Startdate"
                && DateTime.TryParseExact(parts[1], "dd-MMM-yyyy", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d)
                && d.Day == day && d.Month == month)
                year = d.Year;
        }
        try
        {
            return new DateTime(year, month, day, hour, minute, second, DateTimeKind.Unspecified);
        }
        catch (ArgumentOutOfRangeException)
        {
            throw new InputException($"{path}: header fields 'startdate' '{date}' and 'starttime' '{time}' (bytes 168 and 176) do not form a valid date and time.");
        }
    }

    private static string Text(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private readonly struct FieldReader(string path, byte[] bytes, int baseOffset)
    {
        public string Text(int offset, int width, string name)
        {
            var span = bytes.AsSpan(offset, width);
            foreach (byte b in span)
                if (b < 32 || b > 126)
                    throw new InputException($"{path}: header field '{name}' at byte {baseOffset + offset} holds byte 0x{b:X2}; EDF header fields are printable ASCII.");
            return Encoding.ASCII.GetString(span).Trim();
        }

        public int Int(int offset, int width, string name)
        {
            string s = Text(offset, width, name);
            if (!int.TryParse(s, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out int v))
                throw new InputException($"{path}: header field '{name}' at byte {baseOffset + offset} is '{s}'; expected an integer.");
            return v;
        }

        public double Double(int offset, int width, string name)
        {
            string s = Text(offset, width, name);
            if (!double.TryParse(s, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint | NumberStyles.AllowExponent,
                    CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
                throw new InputException($"{path}: header field '{name}' at byte {baseOffset + offset} is '{s}'; expected a number.");
            return v;
        }
    }
}
