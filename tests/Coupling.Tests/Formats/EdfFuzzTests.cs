using System.Text;
using Coupling.Formats;

namespace Coupling.Tests.Formats;

/// <summary>
/// Mutation fuzzing of the EDF/EDF+ readers (common practice): a valid EDF+C file is spoilt thousands of times from a
/// fixed seed by bit flips, truncation, junk in header fields, lying record and sample counts and appended junk. Every
/// outcome must be a read that agrees between the whole-file and the segment reader, or an InputException naming the
/// file; never another exception, and never an allocation sized by a header that the file does not back.
/// </summary>
public sealed class EdfFuzzTests : IDisposable
{
    private const int Cases = 2000;
    private const int Seed = 20_261_202;

    /// <summary>Allocation allowed per case: a few times the file plus fixed buffers (the 64 KiB file buffer, header
    /// arrays). A reader that sized anything from an unchecked header field would exceed it by orders of magnitude.</summary>
    private const long AllocationBudget = 4L << 20;

    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>Two 16-sample signals and an annotation signal, 6 one-second records, events in records 2 and 4.</summary>
    private static byte[] ValidFile()
    {
        var b = new EdfBuilder();
        b.Signals.Add(new("EEG A1", "uV", "-500", "500", "-2048", "2047", 16));
        b.Signals.Add(new("EEG A2", "uV", "-500", "500", "-2048", "2047", 16));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 30));
        var rng = new Random(3);
        for (int r = 0; r < 6; r++)
        {
            var tal = new List<byte>(EdfBuilder.Tal($"+{r}||"));
            if (r is 2 or 4) tal.AddRange(EdfBuilder.Tal($"+{r}.25~0.5|cue|"));
            var annotation = new byte[60];
            tal.ToArray().CopyTo(annotation, 0);
            b.Records.Add([
                Enumerable.Range(0, 16).Select(_ => (short)rng.Next(-2048, 2048)).ToArray(),
                Enumerable.Range(0, 16).Select(_ => (short)rng.Next(-2048, 2048)).ToArray(),
                annotation,
            ]);
        }
        return b.Build();
    }

    // Header fields (offset, width) of the fixed part and of the first signal (Kemp et al. 1992, Table 1), as laid out
    // for 3 signals: labels at 256, transducer 304, dimension 544, physical min 568, max 592, digital min 616, max 640,
    // prefiltering 664, samples per record 904.
    private static readonly (int Offset, int Width)[] Fields =
    [
        (0, 8), (8, 80), (88, 80), (168, 8), (176, 8), (184, 8), (192, 44), (236, 8), (244, 8), (252, 4),
        (256, 16), (304, 80), (544, 8), (568, 8), (592, 8), (616, 8), (640, 8), (664, 80), (904, 8), (912, 8), (920, 8),
    ];

    private static readonly string[] Junk =
    [
        "", " ", "-1", "0", "1", "-0", "99999999", "-9999999", "2147483647", "1e308", "1e-308", "NaN", "Infinity", "abc", "+",
        "12 34", "0x10", "3.5", "-32769", "32768", "\u0001", "\u007f", "EDF+D", "EDF+C", "EDF Annotations", "01.01.85", "99.99.99",
    ];

    private static byte[] Mutate(byte[] valid, Random rng, out string what)
    {
        var b = (byte[])valid.Clone();
        switch (rng.Next(8))
        {
            case 0:
            {
                int flips = rng.Next(1, 9);
                for (int k = 0; k < flips; k++) b[rng.Next(b.Length)] ^= (byte)(1 << rng.Next(8));
                what = $"{flips} bit flips";
                return b;
            }
            case 1:
            {
                int length = rng.Next(b.Length);
                what = $"truncated to {length} bytes";
                return b[..length];
            }
            case 2:
            case 3:
            {
                var (offset, width) = Fields[rng.Next(Fields.Length)];
                string junk = Junk[rng.Next(Junk.Length)];
                Encoding.Latin1.GetBytes(junk.PadRight(width)[..width]).CopyTo(b, offset);
                what = $"field at byte {offset} set to '{junk}'";
                return b;
            }
            case 4:
            {
                string count = rng.Next(3) switch { 0 => "99999999", 1 => "2147483", _ => rng.Next(7, 100000).ToString(System.Globalization.CultureInfo.InvariantCulture) };
                Encoding.ASCII.GetBytes(count.PadRight(8)).CopyTo(b, 236);
                what = $"record count {count}";
                return b;
            }
            case 5:
            {
                string samples = rng.Next(2) == 0 ? "99999999" : rng.Next(17, 1_000_000).ToString(System.Globalization.CultureInfo.InvariantCulture);
                int signal = rng.Next(3);
                Encoding.ASCII.GetBytes(samples.PadRight(8)).CopyTo(b, 904 + 8 * signal);
                what = $"samples per record of signal {signal + 1} set to {samples}";
                return b;
            }
            case 6:
            {
                // A header whose records hold nothing of the file: no (or an unknown number of) records, each huge.
                string count = rng.Next(2) == 0 ? "0" : "-1";
                string samples = rng.Next(2) == 0 ? "99999999" : "5000000";
                Encoding.ASCII.GetBytes(count.PadRight(8)).CopyTo(b, 236);
                Encoding.ASCII.GetBytes(samples.PadRight(8)).CopyTo(b, 904 + 8 * rng.Next(3));
                what = $"record count {count} with {samples} samples per record";
                return b;
            }
            default:
            {
                var extra = new byte[rng.Next(1, 400)];
                rng.NextBytes(extra);
                what = $"{extra.Length} junk bytes appended";
                return [.. b, .. extra];
            }
        }
    }

    [Fact]
    public void Mutated_files_are_read_consistently_or_refused_with_an_input_error()
    {
        byte[] valid = ValidFile();
        string path = _folder.File("fuzz.edf");
        File.WriteAllBytes(path, valid);
        var reference = EdfReader.Read(path);
        Assert.Equal(2, reference.Channels.Count);
        Assert.Equal(96, reference.Samples[0].Length);
        Assert.Equal(2, reference.Events.Count);

        var rng = new Random(Seed);
        int read = 0, refused = 0;
        for (int i = 0; i < Cases; i++)
        {
            byte[] bytes = Mutate(valid, rng, out string what);
            File.WriteAllBytes(path, bytes);
            long before = GC.GetAllocatedBytesForCurrentThread();
            try
            {
                var whole = EdfReader.Read(path);
                var segments = EdfSegmentReader.Open(path);
                // A read is correct when both readers agree on every channel, sample and event.
                Assert.Equal(whole.Channels.Select(c => c.Label), segments.Channels.Select(c => c.Label));
                Assert.Equal(whole.Samples[0].Length, segments.SampleCount);
                Assert.Equal(whole.Events, segments.Events);
                var buffer = new double[segments.Channels.Count * segments.SampleCount];
                segments.Read(0, segments.SampleCount, buffer);
                for (int c = 0; c < whole.Channels.Count; c++)
                    Assert.True(whole.Samples[c].AsSpan().SequenceEqual(buffer.AsSpan(c * segments.SampleCount, segments.SampleCount)), $"case {i} ({what}): channel {c} differs");
                read++;
            }
            catch (InputException e)
            {
                Assert.True(e.Message.StartsWith(path, StringComparison.Ordinal), $"case {i} ({what}): message does not name the file: {e.Message}");
                refused++;
            }
            catch (Exception e)
            {
                Assert.Fail($"case {i} ({what}): {e.GetType().Name}: {e.Message}");
            }
            long allocated = GC.GetAllocatedBytesForCurrentThread() - before;
            Assert.True(allocated < AllocationBudget + 16L * bytes.Length, $"case {i} ({what}): {allocated} bytes allocated for a {bytes.Length}-byte file");
        }
        // Both outcomes occur: the mutations are neither all harmless nor all fatal.
        Assert.True(read > Cases / 10, $"{read} read");
        Assert.True(refused > Cases / 10, $"{refused} refused");
    }

    [Fact]
    public void A_header_promising_more_records_than_the_file_holds_allocates_nothing_for_them()
    {
        byte[] b = ValidFile();
        Encoding.ASCII.GetBytes("99999999").CopyTo(b, 236);
        string path = _folder.File("lying.edf");
        File.WriteAllBytes(path, b);
        long before = GC.GetAllocatedBytesForCurrentThread();
        var e = Assert.Throws<InputException>(() => EdfReader.Read(path));
        Assert.True(GC.GetAllocatedBytesForCurrentThread() - before < AllocationBudget);
        Assert.Contains("truncated EDF file", e.Message);
        Assert.Contains("99999999 data records", e.Message);
    }

    [Fact]
    public void A_header_with_no_records_of_a_huge_size_allocates_no_record_buffer()
    {
        byte[] b = ValidFile();
        Encoding.ASCII.GetBytes("0       ").CopyTo(b, 236);
        Encoding.ASCII.GetBytes("99999999").CopyTo(b, 904);
        string path = _folder.File("empty.edf");
        File.WriteAllBytes(path, b);
        long before = GC.GetAllocatedBytesForCurrentThread();
        try { EdfSegmentReader.Open(path); }
        catch (InputException) { }
        Assert.True(GC.GetAllocatedBytesForCurrentThread() - before < AllocationBudget);
    }

    [Fact]
    public void A_tal_closed_right_after_its_onset_gives_the_stamp_and_no_event()
    {
        // EDF+ (Kemp and Olivan 2003, section 2.2.4) closes every annotation text with 0x14; "+2 0x14 0x00" has none.
        var b = new EdfBuilder();
        b.Signals.Add(new("EEG A1", "uV", "-500", "500", "-2048", "2047", 4));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 20));
        for (int r = 0; r < 3; r++)
        {
            var annotation = new byte[40];
            EdfBuilder.Tal(r == 2 ? "+2|" : $"+{r}||").CopyTo(annotation, 0);
            if (r == 1) EdfBuilder.Tal("+1.5|cue|").CopyTo(annotation, 10);
            b.Records.Add([new short[] { 1, -1, 2, -2 }, annotation]);
        }
        string path = _folder.File("bare.edf");
        File.WriteAllBytes(path, b.Build());
        var events = EdfReader.ReadEvents(path);
        Assert.Equal([new RecordingEvent(1.5, 0, "cue")], events);
    }

    [Fact]
    public void A_truncated_file_keeps_its_complete_records_when_asked_and_says_how_many()
    {
        byte[] valid = ValidFile();
        int recordBytes = 2 * (16 + 16 + 30);
        string path = _folder.File("cut.edf");
        // Header, 3 whole records and half of the fourth.
        File.WriteAllBytes(path, valid[..(256 * 4 + 3 * recordBytes + recordBytes / 2)]);
        Assert.Throws<InputException>(() => EdfSegmentReader.Open(path));
        var reader = EdfSegmentReader.Open(path, keepCompleteRecords: true);
        Assert.Equal(3 * 16, reader.SampleCount);
        Assert.Contains(reader.Notes, n => n.Contains("3 of the 6 data records", StringComparison.Ordinal));
        // The kept samples are those of the whole file.
        File.WriteAllBytes(_folder.File("whole.edf"), valid);
        var whole = EdfReader.Read(_folder.File("whole.edf"));
        var buffer = new double[2 * 48];
        reader.Read(0, 48, buffer);
        Assert.True(whole.Samples[1].AsSpan(0, 48).SequenceEqual(buffer.AsSpan(48, 48)));
        Assert.Single(reader.Events); // the event in record 2 (0-based) is kept, the one in record 4 is not
    }
}
