using System.Buffers.Binary;
using System.Globalization;
using System.Text;

namespace Coupling.Formats;

/// <summary>
/// Writes a recording as an EDF+C file: one 16-bit signal per channel plus an "EDF Annotations" signal carrying the events.
/// </summary>
/// <remarks>
/// Format per Kemp B, Värri A, Rosa AC, Nielsen KD, Gade J (1992) "A simple format for exchange of digitized
/// polygraphic recordings", Electroencephalography and Clinical Neurophysiology 82:391-393, and Kemp B, Olivan J
/// (2003) "European data format 'plus' (EDF+)", Clinical Neurophysiology 114:1755-1761.
/// <para>Record duration: 1 s when the rate is a whole number of Hz and the sample count a whole number of seconds;
/// otherwise the duration between 0.1 s and 10 s closest to 1 s that holds a whole number of samples and divides the
/// data exactly; failing that, the shortest whole number of seconds holding a whole number of samples, with the last
/// record padded. Padding keeps every sample; the padded tail reads back as the value nearest 0 that the channel's
/// range can hold.</para>
/// <para>Physical minimum and maximum per channel are the data's extremes widened by 0.1% of the range (1 unit, or
/// 0.1% of the value, for a flat channel) and rounded outward to fit the 8-character field, so no sample clips.
/// Digital range is -32768..32767; samples are rounded to the nearest digital step, so a value read back is within
/// half a step, (physMax - physMin) / 65535 / 2, of the value written. Event onsets and durations are written with
/// the shortest decimal digits that parse back to the same double.</para>
/// </remarks>
public static class EdfWriter
{
    private const int DigitalMinimum = short.MinValue;
    private const int DigitalMaximum = short.MaxValue;
    private const int BlockBytes = 4 << 20;

    /// <summary>Writes <paramref name="recording"/> to <paramref name="path"/> as EDF+C, atomically
    /// (to <c>path + ".tmp"</c>, then renamed over <paramref name="path"/>).</summary>
    /// <param name="recording">The recording; labels of at most 16 and units of at most 8 printable ASCII characters.</param>
    /// <param name="path">The file to create or replace.</param>
    /// <param name="startTime">Start date and time for the header (years 1985-2084); null writes the EDF+ "unknown"
    /// convention, 01.01.85 00.00.00 with "Startdate X".</param>
    /// <exception cref="InputException">A label, unit, sample or event cannot be represented in EDF+.</exception>
    public static void Write(Recording recording, string path, DateTime? startTime = null)
    {
        string source = recording.Source;
        if (recording.Channels.Count == 0)
            throw new InputException($"{source}: a recording without channels cannot be written as EDF.");
        if (recording.SampleCount == 0)
            throw new InputException($"{source}: a recording without samples cannot be written as EDF.");
        foreach (var ch in recording.Channels)
        {
            CheckAscii(source, ch.Label, 16, $"channel label '{ch.Label}'");
            if (ch.Label.Trim() != ch.Label || ch.Label.Length == 0 || ch.Label == EdfSignalHeader.AnnotationLabel)
                throw new InputException($"{source}: channel label '{ch.Label}' cannot be written to EDF (empty, padded with spaces, or reserved).");
            CheckAscii(source, ch.Unit, 8, $"unit '{ch.Unit}' of channel '{ch.Label}'");
        }
        for (int c = 0; c < recording.Samples.Length; c++)
        {
            int bad = FirstNonFinite(recording.Samples[c]);
            if (bad >= 0)
                throw new InputException($"{source}: channel '{recording.Channels[c].Label}' sample {bad} is {recording.Samples[c][bad]}; EDF holds finite values only.");
        }
        foreach (var e in recording.Events)
        {
            if (!double.IsFinite(e.Onset) || !double.IsFinite(e.Duration) || e.Duration < 0)
                throw new InputException($"{source}: event '{e.Label}' has onset {e.Onset} s and duration {e.Duration} s; EDF+ needs a finite onset and a non-negative duration.");
            if (e.Label.Length == 0 || e.Label.IndexOfAny(['\u0000', '\u0014', '\u0015']) >= 0)
                throw new InputException($"{source}: event label '{e.Label}' at {e.Onset} s is empty or holds a byte EDF+ reserves (0x00, 0x14, 0x15).");
        }

        var layout = ChooseLayout(recording);
        var ranges = recording.Samples.Select(s => PhysicalRange(source, s)).ToArray();
        var annotations = PlaceAnnotations(recording.Events, layout);

        string tmp = path + ".tmp";
        try
        {
            using (var stream = new FileStream(tmp, FileMode.Create, FileAccess.Write, FileShare.None, 1 << 16))
            {
                WriteHeader(stream, recording, layout, ranges, annotations.BytesPerRecord, startTime);
                WriteRecords(stream, recording, layout, ranges, annotations);
            }
            File.Move(tmp, path, overwrite: true);
        }
        catch
        {
            try { File.Delete(tmp); } catch (IOException) { }
            throw;
        }
    }

    private static int FirstNonFinite(double[] values)
    {
        for (int i = 0; i < values.Length; i++)
            if (!double.IsFinite(values[i])) return i;
        return -1;
    }

    private static void CheckAscii(string source, string text, int width, string what)
    {
        if (text.Length > width || text.Any(ch => ch < ' ' || ch > '~'))
            throw new InputException($"{source}: {what} does not fit EDF: at most {width} printable ASCII characters.");
    }

    private sealed record Layout(int SamplesPerRecord, string DurationText, decimal Duration, int RecordCount);

    private static Layout ChooseLayout(Recording recording)
    {
        double fs = recording.SampleRate;
        int n = recording.SampleCount;
        string source = recording.Source;

        // Exact division first: whole records of a duration between 0.1 s and 10 s, closest to 1 s.
        Layout? best = null;
        double bestDistance = double.PositiveInfinity;
        for (long d = 1; d * d <= n; d++)
        {
            if (n % d != 0) continue;
            foreach (long spr in new[] { d, n / d })
            {
                double duration = spr / fs;
                if (duration < 0.1 || duration > 10) continue;
                var text = DurationText(spr, fs);
                if (text is null) continue;
                double distance = Math.Abs(Math.Log(duration));
                if (distance < bestDistance)
                {
                    bestDistance = distance;
                    best = new Layout((int)spr, text, decimal.Parse(text, CultureInfo.InvariantCulture), (int)(n / spr));
                }
            }
        }
        if (best is not null) return best;

        // Otherwise pad: the shortest whole number of seconds that holds a whole number of samples.
        for (int k = 1; k <= 100_000; k++)
        {
            double spr = Math.Round(fs * k);
            if (spr >= 1 && spr <= int.MaxValue && DurationText((long)spr, fs) is { } text && text == k.ToString(CultureInfo.InvariantCulture))
                return new Layout((int)spr, text, k, (int)((n + (long)spr - 1) / (long)spr));
        }
        throw new InputException($"{source}: sampling rate {fs} Hz gives no whole number of samples in any EDF record duration.");
    }

    /// <summary>The duration spr/fs as at most 8 characters, if it reproduces fs to 1e-12 relative, else null.</summary>
    private static string? DurationText(long spr, double fs)
    {
        double duration = spr / fs;
        string exact = EdfAnnotations.FormatSeconds(duration);
        var candidates = new List<string> { exact };
        for (int decimals = 7; decimals >= 0; decimals--)
            candidates.Add(Math.Round((decimal)duration, decimals).ToString("0.#######", CultureInfo.InvariantCulture));
        foreach (var t in candidates)
        {
            if (t.Length > 8) continue;
            double parsed = double.Parse(t, CultureInfo.InvariantCulture);
            if (parsed > 0 && Math.Abs(spr / parsed - fs) <= 1e-12 * fs) return t;
        }
        return null;
    }

    private sealed record Scale(string MinText, string MaxText, double Min, double Max)
    {
        public double Gain => (Max - Min) / ((double)DigitalMaximum - DigitalMinimum);

        public short Quantise(double x)
        {
            double d = Math.Round((x - Min) / Gain) + DigitalMinimum;
            return (short)Math.Clamp(d, DigitalMinimum, DigitalMaximum);
        }
    }

    private static Scale PhysicalRange(string source, double[] samples)
    {
        double lo = samples.Min(), hi = samples.Max();
        double margin = hi > lo ? (hi - lo) * 1e-3 : lo != 0 ? Math.Abs(lo) * 1e-3 : 1.0;
        string minText = FieldText(source, lo - margin, roundUp: false);
        string maxText = FieldText(source, hi + margin, roundUp: true);
        double min = double.Parse(minText, CultureInfo.InvariantCulture);
        double max = double.Parse(maxText, CultureInfo.InvariantCulture);
        return new Scale(minText, maxText, min, max);
    }

    /// <summary>The value rounded outward to the most decimals that fit 8 characters (no exponent).</summary>
    private static string FieldText(string source, double x, bool roundUp)
    {
        if (x >= 1e8 || x <= -1e7)
            throw new InputException($"{source}: physical value {x} is too large for the 8-character EDF field; rescale the data.");
        decimal value = (decimal)x;
        for (int decimals = 7; decimals >= 0; decimals--)
        {
            decimal scale = Pow10(decimals);
            decimal rounded = (roundUp ? Math.Ceiling(value * scale) : Math.Floor(value * scale)) / scale;
            double back = (double)rounded;
            // The decimal conversion keeps 15 significant digits; step once more if that rounding went the wrong way.
            if (roundUp && back < x) rounded += 1 / scale;
            if (!roundUp && back > x) rounded -= 1 / scale;
            string text = rounded.ToString("0.#######", CultureInfo.InvariantCulture);
            if (text == "-0") text = "0";
            if (text.Length <= 8) return text;
        }
        throw new InputException($"{source}: physical value {x} does not fit the 8-character EDF field.");
    }

    private static decimal Pow10(int n)
    {
        decimal p = 1;
        for (int i = 0; i < n; i++) p *= 10;
        return p;
    }

    private sealed record Annotations(int BytesPerRecord, byte[][] PerRecord);

    private static Annotations PlaceAnnotations(IReadOnlyList<RecordingEvent> events, Layout layout)
    {
        int records = layout.RecordCount;
        var stamps = new byte[records][];
        for (int r = 0; r < records; r++)
        {
            string seconds = (r * layout.Duration).ToString("0.############", CultureInfo.InvariantCulture);
            stamps[r] = Encoding.ASCII.GetBytes("+" + seconds + "\u0014\u0014\0");
        }
        var tals = events.OrderBy(e => e.Onset).Select(e => EdfAnnotations.Encode(e.Onset, e.Duration, [e.Label])).ToArray();
        int maxStamp = stamps.Max(s => s.Length);
        long total = stamps.Sum(s => (long)s.Length) + tals.Sum(t => (long)t.Length);
        long capacity = Math.Max(maxStamp + (tals.Length > 0 ? tals.Max(t => t.Length) : 0), (total + records - 1) / records);
        while (true)
        {
            capacity += capacity % 2;
            var perRecord = new List<byte>[records];
            int next = 0;
            for (int r = 0; r < records; r++)
            {
                var bytes = new List<byte>(stamps[r]);
                while (next < tals.Length && bytes.Count + tals[next].Length <= capacity)
                    bytes.AddRange(tals[next++]);
                perRecord[r] = bytes;
            }
            if (next == tals.Length)
            {
                if (capacity * records > int.MaxValue || capacity / 2 > int.MaxValue)
                    throw new InputException("Too many events to store in the EDF annotation signal.");
                return new Annotations((int)capacity, perRecord.Select(b => b.ToArray()).ToArray());
            }
            capacity = capacity * 5 / 4 + 2;
        }
    }

    private static void WriteHeader(Stream stream, Recording recording, Layout layout, Scale[] scales, int annotationBytes, DateTime? startTime)
    {
        int ns = recording.Channels.Count + 1;
        var sb = new StringBuilder();
        void Field(string text, int width) => sb.Append(text.PadRight(width)[..width]);

        string date = "01.01.85", time = "00.00.00", recordingId = "Startdate X X X X";
        if (startTime is { } t)
        {
            if (t.Year < 1985 || t.Year > 2084)
                throw new InputException($"{recording.Source}: start year {t.Year} is outside the EDF range 1985-2084.");
            date = t.ToString("dd.MM.yy", CultureInfo.InvariantCulture);
            time = t.ToString("HH.mm.ss", CultureInfo.InvariantCulture);
            recordingId = "Startdate " + t.ToString("dd-MMM-yyyy", CultureInfo.InvariantCulture).ToUpperInvariant() + " X X X";
        }
        Field("0", 8);
        Field("X X X X", 80);
        Field(recordingId, 80);
        Field(date, 8);
        Field(time, 8);
        Field((256 * (ns + 1)).ToString(CultureInfo.InvariantCulture), 8);
        Field("EDF+C", 44);
        Field(layout.RecordCount.ToString(CultureInfo.InvariantCulture), 8);
        Field(layout.DurationText, 8);
        Field(ns.ToString(CultureInfo.InvariantCulture), 4);

        var channels = recording.Channels;
        string I(int v) => v.ToString(CultureInfo.InvariantCulture);
        foreach (var ch in channels) Field(ch.Label, 16);
        Field(EdfSignalHeader.AnnotationLabel, 16);
        for (int i = 0; i < ns; i++) Field("", 80);
        foreach (var ch in channels) Field(ch.Unit, 8);
        Field("", 8);
        foreach (var r in scales) Field(r.MinText, 8);
        Field("-1", 8);
        foreach (var r in scales) Field(r.MaxText, 8);
        Field("1", 8);
        for (int i = 0; i < ns; i++) Field(I(DigitalMinimum), 8);
        for (int i = 0; i < ns; i++) Field(I(DigitalMaximum), 8);
        for (int i = 0; i < ns; i++) Field("", 80);
        foreach (var _ in channels) Field(I(layout.SamplesPerRecord), 8);
        Field(I(annotationBytes / 2), 8);
        for (int i = 0; i < ns; i++) Field("", 32);

        var bytes = Encoding.ASCII.GetBytes(sb.ToString());
        if (bytes.Length != 256 * (ns + 1)) throw new InvalidOperationException("EDF header length mismatch.");
        stream.Write(bytes);
    }

    private static void WriteRecords(Stream stream, Recording recording, Layout layout, Scale[] scales, Annotations annotations)
    {
        int spr = layout.SamplesPerRecord;
        int channels = recording.Channels.Count;
        int recordBytes = 2 * spr * channels + annotations.BytesPerRecord;
        int perBlock = Math.Max(1, BlockBytes / recordBytes);
        var buffer = new byte[(long)Math.Min(perBlock, layout.RecordCount) * recordBytes];
        int n = recording.SampleCount;
        var padding = scales.Select(r => r.Quantise(Math.Clamp(0.0, r.Min, r.Max))).ToArray();
        for (int r0 = 0; r0 < layout.RecordCount; r0 += perBlock)
        {
            int count = Math.Min(perBlock, layout.RecordCount - r0);
            Array.Clear(buffer);
            for (int k = 0; k < count; k++)
            {
                int r = r0 + k;
                var record = buffer.AsSpan(k * recordBytes, recordBytes);
                for (int c = 0; c < channels; c++)
                {
                    var target = record.Slice(2 * spr * c, 2 * spr);
                    var samples = recording.Samples[c];
                    for (int i = 0; i < spr; i++)
                    {
                        long s = (long)r * spr + i;
                        short d = s < n ? scales[c].Quantise(samples[s]) : padding[c];
                        BinaryPrimitives.WriteInt16LittleEndian(target.Slice(2 * i, 2), d);
                    }
                }
                annotations.PerRecord[r].CopyTo(record[(2 * spr * channels)..]);
            }
            stream.Write(buffer, 0, count * recordBytes);
        }
    }
}
