using Coupling.Formats;

namespace Coupling.Tests.Formats;

public class EdfReaderTests
{
    // Independent writer: EDFlib 1.23 (Debian libedf1), see Fixtures/Formats/README.md.
    private static readonly string EdflibFile = Fixtures.Path(EdflibFixture.EdfName);

    [Fact]
    public void Header_of_the_EDFlib_file_matches_what_EDFlib_was_told_to_write()
    {
        var expected = EdflibFixture.Load();
        var h = EdfReader.ReadHeader(EdflibFile);

        Assert.Equal("0", h.Version);
        Assert.Equal("EDF+C", h.FormatName);
        Assert.StartsWith("EDF+C", h.Reserved);
        Assert.Equal(expected.Root.GetProperty("records").GetInt32(), h.RecordCount);
        Assert.Equal(expected.Root.GetProperty("record_duration").GetDouble(), h.RecordDuration);
        Assert.Equal(DateTime.Parse(expected.Root.GetProperty("start").GetString()!, System.Globalization.CultureInfo.InvariantCulture), h.StartTime);
        Assert.Equal(256 * (expected.SignalCount + 2), h.HeaderBytes);
        Assert.Equal(expected.SignalCount + 1, h.Signals.Count);
        Assert.True(h.Signals[^1].IsAnnotation);
        Assert.StartsWith("Startdate 04-MAR-2021", h.RecordingId);

        for (int i = 0; i < expected.SignalCount; i++)
        {
            var e = expected.Signal(i);
            var s = h.Signals[i];
            Assert.Equal(e.GetProperty("label").GetString(), s.Label);
            Assert.Equal(e.GetProperty("unit").GetString(), s.PhysicalDimension);
            Assert.Equal(e.GetProperty("transducer").GetString(), s.Transducer);
            Assert.Equal(e.GetProperty("prefilter").GetString(), s.Prefiltering);
            Assert.Equal(e.GetProperty("digital_min").GetInt32(), s.DigitalMinimum);
            Assert.Equal(e.GetProperty("digital_max").GetInt32(), s.DigitalMaximum);
            Assert.Equal(e.GetProperty("samples_per_record").GetInt32(), s.SamplesPerRecord);
            Assert.Equal(s.SamplesPerRecord / 0.5, s.SampleRate);
            // The physical limits pass through an 8-character text field (Kemp et al. 1992), which holds
            // values like 3276.7 to 3 decimals at most: EDFlib wrote "3276.699". Tolerance: one unit in the 3rd decimal.
            Assert.Equal(e.GetProperty("physical_min").GetDouble(), s.PhysicalMinimum, 1e-3);
            Assert.Equal(e.GetProperty("physical_max").GetDouble(), s.PhysicalMaximum, 1e-3);
        }
    }

    [Fact]
    public void Samples_of_the_EDFlib_file_scale_to_the_physical_values_intended()
    {
        var expected = EdflibFixture.Load();
        var header = EdfReader.ReadHeader(EdflibFile);
        var rec = EdfReader.Read(EdflibFile, ["EEG Fz", "EEG Cz"]);
        Assert.Equal(200.0, rec.SampleRate);
        Assert.Equal(["EEG Fz", "EEG Cz"], rec.Channels.Select(c => c.Label));
        Assert.Equal("EEG", rec.Channels[0].Type);
        Assert.Equal("uV", rec.Channels[0].Unit);
        for (int c = 0; c < 2; c++)
            CheckSamples(header.Signals[c], expected.Signal(c), rec.Samples[c]);

        var slow = EdfReader.Read(EdflibFile, ["Resp belt"]);
        Assert.Equal(50.0, slow.SampleRate);
        CheckSamples(header.Signals[2], expected.Signal(2), slow.Samples[0]);
    }

    private static void CheckSamples(EdfSignalHeader s, System.Text.Json.JsonElement expected, double[] actual)
    {
        var digital = EdflibFixture.Doubles(expected.GetProperty("digital"));
        var intended = EdflibFixture.Doubles(expected.GetProperty("intended"));
        Assert.Equal(digital.Length, actual.Length);
        double range = s.PhysicalMaximum - s.PhysicalMinimum;
        for (int i = 0; i < actual.Length; i++)
        {
            // EDF scaling (Kemp et al. 1992) applied to the digital value EDFlib stored; only double rounding differs.
            double fromDigital = (digital[i] - s.DigitalMinimum) * range / (s.DigitalMaximum - s.DigitalMinimum) + s.PhysicalMinimum;
            Assert.Equal(fromDigital, actual[i], 1e-9 * range);
            // The intended physical value is recovered to the header's stated resolution (one digital step).
            Assert.True(Math.Abs(intended[i] - actual[i]) <= s.Resolution, $"{s.Label} sample {i}: {actual[i]} vs {intended[i]}");
        }
    }

    [Fact]
    public void Annotations_of_the_EDFlib_file_become_the_events_written()
    {
        var expected = EdflibFixture.Load().Root.GetProperty("annotations").EnumerateArray()
            .Select(a => new RecordingEvent(a.GetProperty("onset").GetDouble(), a.GetProperty("duration").GetDouble(), a.GetProperty("text").GetString()!))
            .ToArray();
        var rec = EdfReader.Read(EdflibFile);
        Assert.Equal(expected, rec.Events);
        Assert.Equal(expected, EdfReader.ReadEvents(EdflibFile));
    }

    [Fact]
    public void Without_a_selection_the_signal_at_the_minority_rate_is_left_out_with_a_note()
    {
        var rec = EdfReader.Read(EdflibFile);
        Assert.Equal(["EEG Fz", "EEG Cz"], rec.Channels.Select(c => c.Label));
        var note = Assert.Single(rec.Notes);
        Assert.Contains("Resp belt", note);
        Assert.Contains("50 Hz", note);
    }

    [Fact]
    public void Selecting_signals_of_two_rates_names_the_file_the_signal_and_both_rates()
    {
        var e = Assert.Throws<InputException>(() => EdfReader.Read(EdflibFile, ["EEG Fz", "Resp belt"]));
        Assert.Contains(EdflibFile, e.Message);
        Assert.Contains("'Resp belt'", e.Message);
        Assert.Contains("50 Hz", e.Message);
        Assert.Contains("200 Hz", e.Message);
    }

    [Fact]
    public void Unknown_label_lists_the_available_labels()
    {
        var e = Assert.Throws<InputException>(() => EdfReader.Read(EdflibFile, ["EEG Pz"]));
        Assert.Contains("'EEG Pz'", e.Message);
        Assert.Contains("'EEG Fz', 'EEG Cz', 'Resp belt'", e.Message);
    }

    [Fact]
    public void Truncated_file_is_rejected_with_the_sizes()
    {
        using var tmp = new TempFolder();
        var bytes = File.ReadAllBytes(EdflibFile);
        string path = tmp.File("cut.edf");
        File.WriteAllBytes(path, bytes[..^100]);
        var e = Assert.Throws<InputException>(() => EdfReader.Read(path));
        Assert.Contains(path, e.Message);
        Assert.Contains("truncated", e.Message);
        Assert.Contains(bytes.Length.ToString(System.Globalization.CultureInfo.InvariantCulture), e.Message);

        File.WriteAllBytes(path, bytes[..700]);
        Assert.Contains("truncated", Assert.Throws<InputException>(() => EdfReader.ReadHeader(path)).Message);
    }

    [Fact]
    public void Malformed_numeric_field_is_named_with_its_byte_offset()
    {
        using var tmp = new TempFolder();
        var bytes = File.ReadAllBytes(EdflibFile);
        string path = tmp.File("bad.edf");
        // Number of data records: bytes 236-243 of the fixed header (Kemp et al. 1992).
        "8x      "u8.ToArray().CopyTo(bytes, 236);
        File.WriteAllBytes(path, bytes);
        var e = Assert.Throws<InputException>(() => EdfReader.ReadHeader(path));
        Assert.Contains("'number of data records' at byte 236", e.Message);
        Assert.Contains("'8x'", e.Message);

        // Physical minimum of signal 2: after 4 signals' label (16), transducer (80) and dimension (8) fields,
        // then one 8-byte physical minimum: 256 + 4 * 104 + 8 = 680.
        bytes = File.ReadAllBytes(EdflibFile);
        "-5OO    "u8.ToArray().CopyTo(bytes, 680);
        File.WriteAllBytes(path, bytes);
        e = Assert.Throws<InputException>(() => EdfReader.ReadHeader(path));
        Assert.Contains("'physical minimum of signal 2' at byte 680", e.Message);
    }

    [Fact]
    public void Digital_minimum_not_below_maximum_is_rejected()
    {
        using var tmp = new TempFolder();
        var b = new EdfBuilder { Reserved = "" };
        b.Signals.Add(new("Fz", "uV", "-100", "100", "100", "100", 4));
        b.Records.Add([new short[] { 1, 2, 3, 4 }]);
        string path = tmp.File("digital.edf");
        File.WriteAllBytes(path, b.Build());
        var e = Assert.Throws<InputException>(() => EdfReader.Read(path));
        Assert.Contains("digital minimum 100", e.Message);
        Assert.Contains("'Fz'", e.Message);
    }

    [Fact]
    public void Discontinuous_EDF_plus_is_refused_clearly_by_the_whole_file_read()
    {
        using var tmp = new TempFolder();
        var b = new EdfBuilder { Reserved = "EDF+D" };
        b.Signals.Add(new("Fz", "uV", "-100", "100", "-32768", "32767", 2));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 8));
        b.Records.Add([new short[] { 1, 2 }, EdfBuilder.Tal("+0||")]);
        string path = tmp.File("d.edf");
        File.WriteAllBytes(path, b.Build());
        var e = Assert.Throws<InputException>(() => EdfReader.Read(path));
        Assert.Contains("EDF+D", e.Message);
        Assert.Contains("read only through a plan", e.Message);
        Assert.True(EdfReader.ReadHeader(path).IsDiscontinuous);
    }

    [Fact]
    public void Half_second_records_with_several_TALs_give_every_text_as_an_event_sorted_by_onset()
    {
        // TAL layout per Kemp and Olivan (2003), EDF+ section 2.2: the first TAL of a record is the record's
        // time stamp with an empty text; later TALs carry events; one TAL may hold several texts.
        using var tmp = new TempFolder();
        var b = new EdfBuilder { Duration = "0.5" };
        b.Signals.Add(new("EEG Fz", "uV", "-3276.8", "3276.7", "-32768", "32767", 5));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 40));
        byte[] Join(params byte[][] parts) => parts.SelectMany(p => p).ToArray();
        b.Records.Add([new short[] { -32768, -1, 0, 1, 32767 },
            Join(EdfBuilder.Tal("+0||"), EdfBuilder.Tal("+0.9~0.25|go|cue|"), EdfBuilder.Tal("+0.1|start|"))]);
        b.Records.Add([new short[] { 10, 20, 30, 40, 50 }, Join(EdfBuilder.Tal("+0.5||"), EdfBuilder.Tal("-0.2|before|"))]);
        b.Records.Add([new short[] { 5, 4, 3, 2, 1 }, EdfBuilder.Tal("+1||extra|")]);
        string path = tmp.File("tal.edf");
        File.WriteAllBytes(path, b.Build());

        var rec = EdfReader.Read(path);
        Assert.Equal(10.0, rec.SampleRate);
        Assert.Equal(15, rec.SampleCount);
        // Resolution (3276.7 + 3276.8) / 65535 = 0.1 per step (Kemp et al. 1992 scaling).
        Assert.Equal(-3276.8, rec.Samples[0][0], 1e-9);
        Assert.Equal(-0.1, rec.Samples[0][1], 1e-9);
        Assert.Equal(0.0, rec.Samples[0][2], 1e-9);
        Assert.Equal(3276.7, rec.Samples[0][4], 1e-9);
        Assert.Equal(5.0, rec.Samples[0][9], 1e-9);
        Assert.Equal(
            new[] { new RecordingEvent(-0.2, 0, "before"), new RecordingEvent(0.1, 0, "start"), new RecordingEvent(0.9, 0.25, "go"),
                    new RecordingEvent(0.9, 0.25, "cue"), new RecordingEvent(1.0, 0, "extra") },
            rec.Events);
        Assert.Empty(rec.Notes);
    }

    [Fact]
    public void Plain_EDF_without_annotations_reads_with_no_events()
    {
        using var tmp = new TempFolder();
        var b = new EdfBuilder { Reserved = "", RecordCountText = "-1" };
        b.Signals.Add(new("C3", "uV", "0", "1000", "0", "1000", 3));
        b.Records.Add([new short[] { 0, 500, 1000 }]);
        b.Records.Add([new short[] { 1, 2, 3 }]);
        string path = tmp.File("plain.edf");
        File.WriteAllBytes(path, b.Build());
        var rec = EdfReader.Read(path);
        Assert.Equal("EDF", EdfReader.ReadHeader(path).FormatName);
        Assert.Equal(2, EdfReader.ReadHeader(path).RecordCount);
        Assert.Equal(new[] { 0.0, 500, 1000, 1, 2, 3 }, rec.Samples[0]);
        Assert.Equal("unknown", rec.Channels[0].Type);
        Assert.Empty(rec.Events);
        Assert.Equal(new DateTime(2021, 5, 17, 13, 45, 10), EdfReader.ReadHeader(path).StartTime);
    }

    [Fact]
    public void Malformed_TAL_names_the_record()
    {
        using var tmp = new TempFolder();
        var b = new EdfBuilder();
        b.Signals.Add(new("Fz", "uV", "-1", "1", "-32768", "32767", 1));
        b.Signals.Add(new("EDF Annotations", "", "-1", "1", "-32768", "32767", 10));
        b.Records.Add([new short[] { 0 }, EdfBuilder.Tal("+0||")]);
        b.Records.Add([new short[] { 0 }, EdfBuilder.Tal("1.0||")]);
        string path = tmp.File("tal.edf");
        File.WriteAllBytes(path, b.Build());
        var e = Assert.Throws<InputException>(() => EdfReader.Read(path));
        Assert.Contains("data record 2", e.Message);
        Assert.Contains("onset '1.0'", e.Message);
    }
    [Fact]
    public void BDF_plus_written_by_EDFlib_gives_its_24_bit_values_and_annotations()
    {
        // Independent writer: EDFlib 1.23 (EDFLIB_FILETYPE_BDFPLUS), see Fixtures/Formats/README.md. BDF stores each
        // sample as a 24-bit little-endian two's-complement integer (BioSemi's BDF description); the version field is
        // 0xFF "BIOSEMI" and BDF+ marks its reserved field "BDF+C". Physical = (digital − digital min) · gain + physical
        // min with the header's limits (Kemp et al. 1992), so the digital values come back by inverting that exactly.
        string path = Fixtures.Path("edflib_bdf.bdf");
        using var doc = System.Text.Json.JsonDocument.Parse(File.ReadAllText(Fixtures.Path("edflib_bdf.json")));
        var root = doc.RootElement;
        var header = EdfReader.ReadHeader(path);
        Assert.True(header.IsBdf);
        Assert.Equal("BDF+C", header.FormatName);
        Assert.Equal(3, header.BytesPerSample);
        var whole = EdfReader.Read(path);
        var segments = EdfSegmentReader.Open(path);
        Assert.Equal(128, whole.SampleRate);
        for (int s = 0; s < 2; s++)
        {
            var expected = root.GetProperty("signals")[s];
            var signal = header.Signals[s];
            Assert.Equal(expected.GetProperty("label").GetString(), signal.Label);
            Assert.Equal(expected.GetProperty("digital_min").GetInt32(), signal.DigitalMinimum);
            Assert.Equal(expected.GetProperty("digital_max").GetInt32(), signal.DigitalMaximum);
            // EDFlib writes the physical limits into 8-character fields: equal to about 1e-6.
            Assert.Equal(expected.GetProperty("physical_max").GetDouble(), signal.PhysicalMaximum, 1e-6 * Math.Abs(signal.PhysicalMaximum));
            var digital = expected.GetProperty("digital").EnumerateArray().Select(d => d.GetInt32()).ToArray();
            int large = s == 0 ? 7_000_000 : 80_000;   // the first signal spans nearly all 24 bits
            Assert.Contains(digital, d => d < -large);
            Assert.Contains(digital, d => d > large);
            var read = new double[2 * digital.Length];
            segments.Read(0, digital.Length, read);
            for (int i = 0; i < digital.Length; i++)
            {
                double physical = whole.Samples[s][i];
                Assert.Equal(physical, read[s * digital.Length + i]);
                Assert.Equal(digital[i], (int)Math.Round((physical - signal.PhysicalMinimum) / signal.Resolution + signal.DigitalMinimum));
            }
        }
        var notes = root.GetProperty("annotations").EnumerateArray().ToArray();
        Assert.Equal(notes.Select(n => n.GetProperty("text").GetString()), whole.Events.Select(e => e.Label));
        Assert.Equal(notes.Select(n => n.GetProperty("onset").GetDouble()), whole.Events.Select(e => Math.Round(e.Onset, 4)));
    }

    [Fact]
    public void BDF_digital_values_are_24_bit_two_s_complement_at_the_limits()
    {
        // Bytes (little-endian) → value: 00 00 80 → −8388608, FF FF 7F → 8388607, FF FF FF → −1, 01 00 00 → 1
        // (two's complement, common practice).
        byte[] bytes = [0x00, 0x00, 0x80, 0xFF, 0xFF, 0x7F, 0xFF, 0xFF, 0xFF, 0x01, 0x00, 0x00];
        Assert.Equal([-8388608, 8388607, -1, 1], Enumerable.Range(0, 4).Select(i => EdfReader.Digital(bytes, i, 3)));
        Assert.Equal([0, -32768], Enumerable.Range(0, 2).Select(i => EdfReader.Digital(new byte[] { 0x00, 0x00, 0x00, 0x80 }, i, 2)));
    }
    [Fact]
    public void A_BDF_file_without_annotations_takes_its_events_from_the_Status_trigger_codes()
    {
        // BioSemi BDF: the "Status" signal's lower 16 bits are the trigger inputs; the upper 8 carry status flags
        // (BioSemi's BDF description, from memory). An event is each change to a new nonzero code, labelled by the code.
        // 1 s records of 4 samples at 4 Hz; the Status upper byte is set throughout (0x3F0000 | code) to show it is masked.
        var b = new EdfBuilder { Bdf = true, Reserved = "24BIT" };
        b.Signals.Add(new("A1", "uV", "-262144", "262143", "-8388608", "8388607", 4));
        b.Signals.Add(new("A2", "uV", "-262144", "262143", "-8388608", "8388607", 4));
        b.Signals.Add(new("Status", "Boolean", "-8388608", "8388607", "-8388608", "8388607", 4));
        int[][] codes = [[0, 12, 12, 0], [0, 0, 7, 7], [12, 0, 0, 0]];   // onsets at 0.25 s (12), 1.5 s (7), 2.0 s (12)
        for (int r = 0; r < codes.Length; r++)
            b.Records.Add([new[] { -5_000_000, 1, -1, 8_000_000 }, new[] { r, r, r, r + 1 }, codes[r].Select(c => 0x3F0000 | c).ToArray()]);
        using var tmp = new TempFolder();
        string path = tmp.File("t.bdf");
        File.WriteAllBytes(path, b.Build());

        var recording = EdfReader.Read(path);
        Assert.Equal(["A1", "A2"], recording.Channels.Select(c => c.Label));
        Assert.Equal([(0.25, "12"), (1.5, "7"), (2.0, "12")], recording.Events.Select(e => (e.Onset, e.Label)));
        Assert.Contains(recording.Notes, n => n.Contains("'Status' signal holds trigger codes", StringComparison.Ordinal));
        // 24-bit values come back: physical = digital · (524287 / 16777215) + offset, so −5000000 maps below −156000.
        Assert.Equal(-5_000_000 * (524287.0 / 16777215) + (-262144 + 8388608 * (524287.0 / 16777215)), recording.Samples[0][0], 6);
        var reader = EdfSegmentReader.Open(path);
        Assert.Equal(recording.Events, reader.Events);
        // Named in the selection, Status is read like any signal (its raw codes, scaled).
        Assert.Equal(["A1", "Status"], EdfReader.Read(path, ["A1", "Status"]).Channels.Select(c => c.Label));
    }
}
