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
}
