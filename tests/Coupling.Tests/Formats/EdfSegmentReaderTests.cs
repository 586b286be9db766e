using Coupling.Formats;

namespace Coupling.Tests.Formats;

/// <summary>
/// The segment reader against the whole-file read: the whole-file read is checked against EDFlib and the EDF layout
/// tables in EdfReaderTests, so a segment holding the same doubles holds the right samples. Record layout per
/// Kemp et al. (1992), "A simple format for exchange of digitized polygraphic recordings", EEG Clin Neurophysiol 82.
/// </summary>
public class EdfSegmentReaderTests
{
    // Independent writer: EDFlib 1.23 (Debian libedf1), see Fixtures/Formats/README.md. 0.5 s records, 200 Hz and 50 Hz.
    private static readonly string EdflibFile = Fixtures.Path(EdflibFixture.EdfName);

    /// <summary>Checks segments that start and end anywhere: at both ends, on and across record boundaries,
    /// single samples and the whole recording. Exact equality: both paths scale the same 16-bit values the same way.</summary>
    private static void AssertSegmentsEqualWholeRead(string path, IReadOnlyCollection<string>? selection, int perRecord)
    {
        var whole = EdfReader.Read(path, selection);
        var reader = EdfSegmentReader.Open(path, selection);
        Assert.Equal(whole.SampleCount, reader.SampleCount);
        Assert.Equal(whole.SampleRate, reader.SampleRate);
        Assert.Equal(whole.Channels, reader.Channels);
        Assert.Equal(whole.Events, reader.Events);
        Assert.Equal(whole.Notes, reader.Notes);
        Assert.Equal(path, reader.Source);

        int n = whole.SampleCount;
        var segments = new List<(int First, int Length)>
        {
            (0, n), (0, 1), (n - 1, 1), (0, perRecord), (perRecord - 1, 2), (n - perRecord - 1, perRecord + 1),
            (perRecord, perRecord), (1, n - 2), (n - 3, 3),
        };
        var random = new Random(20240611);
        for (int k = 0; k < 60; k++)
        {
            int first = random.Next(n);
            segments.Add((first, 1 + random.Next(n - first)));
        }
        foreach (var (first, length) in segments)
        {
            var target = new double[whole.Channels.Count * length];
            reader.Read(first, length, target);
            for (int c = 0; c < whole.Channels.Count; c++)
                Assert.Equal(whole.Samples[c].AsSpan(first, length).ToArray(), target.AsSpan(c * length, length).ToArray());
        }
    }

    [Fact]
    public void Segments_of_the_EDFlib_file_equal_the_whole_file_read_at_both_rates()
    {
        AssertSegmentsEqualWholeRead(EdflibFile, ["EEG Fz", "EEG Cz"], 100);
        AssertSegmentsEqualWholeRead(EdflibFile, ["Resp belt"], 25);
        AssertSegmentsEqualWholeRead(EdflibFile, null, 100);
    }

    [Fact]
    public void Segments_of_records_lasting_a_non_integer_time_with_two_rates_equal_the_whole_file_read()
    {
        using var tmp = new TempFolder();
        var b = new EdfBuilder { Duration = "0.3" };
        b.Signals.Add(new("EEG A", "uV", "-500", "500", "-2048", "2047", 7));
        b.Signals.Add(new("EEG B", "uV", "-3276.8", "3276.7", "-32768", "32767", 7));
        b.Signals.Add(new("Resp", "mV", "-1", "1", "0", "1000", 3));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 30));
        var random = new Random(7);
        short[] Draw(int count, int lo, int hi) => Enumerable.Range(0, count).Select(_ => (short)random.Next(lo, hi + 1)).ToArray();
        for (int r = 0; r < 13; r++)
        {
            string stamp = (r * 0.3).ToString("0.0", System.Globalization.CultureInfo.InvariantCulture);
            var tal = EdfBuilder.Tal($"+{stamp}||").Concat(r % 4 == 1 ? EdfBuilder.Tal($"+{stamp}|mark|") : []).ToArray();
            b.Records.Add([Draw(7, -2048, 2047), Draw(7, -32768, 32767), Draw(3, 0, 1000), tal]);
        }
        string path = tmp.File("odd.edf");
        File.WriteAllBytes(path, b.Build());

        // 7 samples per 0.3 s is 23.33... Hz; without a selection the 10 Hz signal is left out with a note.
        AssertSegmentsEqualWholeRead(path, null, 7);
        AssertSegmentsEqualWholeRead(path, ["Resp"], 3);
        AssertSegmentsEqualWholeRead(path, ["EEG B", "EEG A"], 7);
        Assert.Single(EdfSegmentReader.Open(path).Notes);
        Assert.Equal(3, EdfSegmentReader.Open(path).Events.Count); // records 1, 5 and 9 carry a "mark"
    }

    [Fact]
    public void Segments_of_a_file_from_the_writer_with_non_integer_records_equal_the_whole_file_read()
    {
        using var tmp = new TempFolder();
        double rate = 1000.0 / 3.0;
        int n = 3000;
        var a = new double[n];
        var c = new double[n];
        for (int i = 0; i < n; i++)
        {
            a[i] = 25.0 * Math.Sin(2 * Math.PI * 7 * i / rate) - 4.0;
            c[i] = 0.5 * Math.Cos(0.01 * i * i);
        }
        var rec = new Recording("simulated", rate, [new ChannelInfo("EEG Fz", "EEG", "uV"), new ChannelInfo("EEG Pz", "EEG", "uV")],
            [a, c], [new RecordingEvent(1.0, 0, "cue"), new RecordingEvent(8.2, 0.5, "cue")]);
        string path = tmp.File("third.edf");
        EdfWriter.Write(rec, path);
        // The writer's documented choice for 3000 samples at 1000/3 Hz: 300-sample records of 0.9 s.
        Assert.Equal(0.9, EdfReader.ReadHeader(path).RecordDuration);
        AssertSegmentsEqualWholeRead(path, null, 300);
    }

    [Fact]
    public void Flat_channels_found_while_streaming_agree_with_the_whole_file_check()
    {
        using var tmp = new TempFolder();
        var b = new EdfBuilder { Duration = "0.5" };
        string[] labels = ["flat", "late", "early", "zero", "firstonly"];
        foreach (var label in labels) b.Signals.Add(new(label, "uV", "-100", "100", "-1000", "1000", 4));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 20));
        int records = 9;
        for (int r = 0; r < records; r++)
        {
            bool last = r == records - 1;
            b.Records.Add([
                new short[] { 17, 17, 17, 17 },
                new short[] { 5, 5, 5, (short)(last ? 6 : 5) },      // differs only at the very last sample
                new short[] { (short)(r == 0 ? -3 : 9), 9, 9, 9 },   // differs only at the very first sample
                new short[] { 0, 0, 0, 0 },
                new short[] { (short)(r == 0 ? 1 : 2), 2, 2, 2 },
                EdfBuilder.Tal("+" + (r * 0.5).ToString("0.0", System.Globalization.CultureInfo.InvariantCulture) + "||")]);
        }
        string path = tmp.File("flat.edf");
        File.WriteAllBytes(path, b.Build());

        var expected = RecordingChecks.FindFlatChannels(EdfReader.Read(path));
        Assert.Equal(["flat", "zero"], expected);
        var reader = EdfSegmentReader.Open(path);
        Assert.Equal(expected, reader.FindFlatChannels());
        // A view on some channels keeps their flags, in its own order.
        var view = reader.WithChannels([3, 1, 0], [reader.Channels[3], reader.Channels[1], reader.Channels[0]]);
        Assert.Equal(["zero", "flat"], view.FindFlatChannels());
    }

    [Fact]
    public void A_view_on_some_channels_reads_them_in_its_order_with_its_descriptions()
    {
        var whole = EdfReader.Read(EdflibFile, ["EEG Fz", "EEG Cz"]);
        var reader = EdfSegmentReader.Open(EdflibFile, ["EEG Fz", "EEG Cz"]);
        var described = new ChannelInfo("EEG Cz", "EEG", "uV", new ChannelPosition(0, 0, 1));
        var view = reader.WithChannels([1], [described]);
        Assert.Equal([described], view.Channels);
        Assert.Equal(reader.Events, view.Events);
        var target = new double[150];
        view.Read(99, 150, target);
        Assert.Equal(whole.Samples[1].AsSpan(99, 150).ToArray(), target);
    }

    [Fact]
    public void A_segment_outside_the_recording_or_a_target_of_the_wrong_size_is_refused()
    {
        var reader = EdfSegmentReader.Open(EdflibFile, ["EEG Fz", "EEG Cz"]);
        Assert.Throws<ArgumentOutOfRangeException>(() => reader.Read(-1, 2, new double[4]));
        Assert.Throws<ArgumentOutOfRangeException>(() => reader.Read(reader.SampleCount - 1, 2, new double[4]));
        Assert.Throws<ArgumentOutOfRangeException>(() => reader.Read(0, 2, new double[3]));
    }

    [Fact]
    public void A_truncated_file_is_refused_on_opening_with_its_name_and_sizes()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("short.edf");
        var bytes = File.ReadAllBytes(EdflibFile);
        File.WriteAllBytes(path, bytes[..^10]);
        var e = Assert.Throws<InputException>(() => EdfSegmentReader.Open(path));
        Assert.Contains(path, e.Message);
        Assert.Contains("truncated EDF file", e.Message);
        Assert.Contains($"{bytes.Length - 10} bytes", e.Message);
    }
    /// <summary>
    /// An EDF+D file of 1 s records, 8 samples each, two data signals and an annotation signal, with records stamped at
    /// <paramref name="stamps"/> s (the time-keeping TAL "+t" of EDF+, Kemp and Olivan 2003, section 2.2.4) and a "cue"
    /// annotation 0.25 s into record 1. Sample k of record r of signal c holds the digital value 100·r + 10·c + k.
    /// </summary>
    internal static EdfBuilder Discontinuous(params double[] stamps)
    {
        var b = new EdfBuilder { Reserved = "EDF+D" };
        b.Signals.Add(new("EEG Fz", "uV", "-3276.8", "3276.7", "-32768", "32767", 8));
        b.Signals.Add(new("EEG Cz", "uV", "-3276.8", "3276.7", "-32768", "32767", 8));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 20));
        for (int r = 0; r < stamps.Length; r++)
        {
            string stamp = "+" + stamps[r].ToString(System.Globalization.CultureInfo.InvariantCulture);
            var annotation = new byte[40];
            EdfBuilder.Tal(stamp + "||").CopyTo(annotation, 0);
            if (r == 1) EdfBuilder.Tal($"+{(stamps[1] + 0.25).ToString(System.Globalization.CultureInfo.InvariantCulture)}|cue|")
                .CopyTo(annotation, EdfBuilder.Tal(stamp + "||").Length);
            b.Records.Add([Values(r, 0), Values(r, 1), annotation]);
        }
        return b;
    }

    private static short[] Values(int record, int channel) => Enumerable.Range(0, 8).Select(k => (short)(100 * record + 10 * channel + k)).ToArray();

    [Fact]
    public void EDF_plus_D_records_are_placed_at_their_time_stamps_and_the_gaps_read_as_NaN()
    {
        // Records at 0, 1, 3.5 and 4.5 s (8 Hz): the third starts at sample 28, so samples 16..27 were never recorded.
        // Physical value = digital value · 0.1 (range 6553.5 over 65535 steps, Kemp et al. 1992).
        using var tmp = new TempFolder();
        string path = tmp.File("d.edf");
        File.WriteAllBytes(path, Discontinuous(0, 1, 3.5, 4.5).Build());
        var reader = EdfSegmentReader.Open(path);
        Assert.Equal(8, reader.SampleRate);
        Assert.Equal(28 + 16, reader.SampleCount);
        Assert.Equal([(16, 12)], reader.Gaps);
        Assert.Contains(reader.Notes, n => n.StartsWith("EDF+D: 1 gap(s) between data records, 1.5 s in all (first from 2 s, 1.5 s long)", StringComparison.Ordinal));
        // The cue 0.25 s into the record stamped 1 s: onsets are measured from the first record (EdfReader's convention).
        Assert.Equal(1.25, Assert.Single(reader.Events).Onset, 12);

        var all = new double[2 * reader.SampleCount];
        reader.Read(0, reader.SampleCount, all);
        for (int c = 0; c < 2; c++)
            for (int i = 0; i < reader.SampleCount; i++)
            {
                double value = all[c * reader.SampleCount + i];
                int record = i < 16 ? i / 8 : i >= 28 ? 2 + (i - 28) / 8 : -1;
                if (record < 0) Assert.True(double.IsNaN(value), $"sample {i} lies in the gap");
                else Assert.Equal(0.1 * (100 * record + 10 * c + (i < 16 ? i % 8 : (i - 28) % 8)), value, 9);
            }
        // A segment inside the gap, one across its end, and one after it.
        var inside = new double[2 * 4];
        reader.Read(18, 4, inside);
        Assert.All(inside, v => Assert.True(double.IsNaN(v)));
        var across = new double[2 * 3];
        reader.Read(26, 3, across);
        Assert.True(double.IsNaN(across[0]) && double.IsNaN(across[1]));
        Assert.Equal(0.1 * 200, across[2], 9);
        var after = new double[2 * 2];
        reader.Read(36, 2, after);
        Assert.Equal(0.1 * 300, after[0], 9);
        Assert.Equal(0.1 * 310, after[2], 9);
    }

    [Fact]
    public void EDF_plus_D_records_that_follow_on_read_as_the_same_file_marked_continuous()
    {
        using var tmp = new TempFolder();
        var d = Discontinuous(0, 1, 2);
        File.WriteAllBytes(tmp.File("d.edf"), d.Build());
        d.Reserved = "EDF+C";
        File.WriteAllBytes(tmp.File("c.edf"), d.Build());
        var discontinuous = EdfSegmentReader.Open(tmp.File("d.edf"));
        var continuous = EdfSegmentReader.Open(tmp.File("c.edf"));
        Assert.Empty(discontinuous.Gaps);
        Assert.Equal(continuous.SampleCount, discontinuous.SampleCount);
        var a = new double[2 * 24];
        var b = new double[2 * 24];
        discontinuous.Read(0, 24, a);
        continuous.Read(0, 24, b);
        Assert.Equal(b, a);
        Assert.Equal(continuous.Events, discontinuous.Events);
    }

    [Fact]
    public void EDF_plus_D_records_that_overlap_are_refused_naming_the_record()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("d.edf");
        File.WriteAllBytes(path, Discontinuous(0, 1, 1.5).Build());
        var e = Assert.Throws<InputException>(() => EdfSegmentReader.Open(path));
        Assert.Contains("EDF+D data record 3 starts at 1.5 s after the first, before the record ahead of it ends (2 s)", e.Message);
    }
}
