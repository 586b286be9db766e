using Coupling.Formats;

namespace Coupling.Tests.Formats;

public class EdfWriterTests
{
    private static Recording Simulated(double rate, int n, IReadOnlyList<RecordingEvent> events)
    {
        var a = new double[n];
        var b = new double[n];
        for (int i = 0; i < n; i++)
        {
            a[i] = 40.0 * Math.Sin(2 * Math.PI * 10 * i / rate) + 3.5;
            b[i] = -0.002 * i + 1e-3 * Math.Cos(i);
        }
        var channels = new[] { new ChannelInfo("EEG Fz", "EEG", "uV"), new ChannelInfo("LFP1", "LFP", "mV") };
        return new Recording("simulated", rate, channels, [a, b], events);
    }

    private static void AssertSamplesWithinOneStep(Recording written, Recording read, EdfHeader header)
    {
        for (int c = 0; c < written.Channels.Count; c++)
        {
            // Quantisation step of EDF's 16-bit scaling (Kemp et al. 1992): (physMax - physMin) / 65535.
            double step = (header.Signals[c].PhysicalMaximum - header.Signals[c].PhysicalMinimum) / 65535;
            for (int i = 0; i < written.SampleCount; i++)
                Assert.True(Math.Abs(written.Samples[c][i] - read.Samples[c][i]) <= step,
                    $"channel {c} sample {i}: {read.Samples[c][i]} vs {written.Samples[c][i]}");
        }
    }

    [Fact]
    public void Round_trip_keeps_samples_within_one_step_and_events_exactly()
    {
        using var tmp = new TempFolder();
        var events = new[]
        {
            new RecordingEvent(0.25, 0, "stim A"), new RecordingEvent(1.0 / 3.0, 0.1 + 0.2, "stim B"),
            new RecordingEvent(2.0000001, 1e-5, "response"), new RecordingEvent(3.75, 0, "stim A"),
        };
        var rec = Simulated(250, 1000, events);
        string path = tmp.File("rt.edf");
        EdfWriter.Write(rec, path, new DateTime(2022, 11, 5, 8, 30, 0));

        var header = EdfReader.ReadHeader(path);
        Assert.Equal("EDF+C", header.FormatName);
        Assert.Equal(1.0, header.RecordDuration);
        Assert.Equal(4, header.RecordCount);
        Assert.Equal(new DateTime(2022, 11, 5, 8, 30, 0), header.StartTime);
        Assert.All(header.Signals, s => Assert.Equal((-32768, 32767), (s.DigitalMinimum, s.DigitalMaximum)));
        Assert.True(header.Signals[^1].IsAnnotation);
        for (int c = 0; c < 2; c++)
        {
            Assert.True(header.Signals[c].PhysicalMinimum <= rec.Samples[c].Min());
            Assert.True(header.Signals[c].PhysicalMaximum >= rec.Samples[c].Max());
        }

        var back = EdfReader.Read(path);
        Assert.Equal(250.0, back.SampleRate);
        Assert.Equal(rec.SampleCount, back.SampleCount);
        Assert.Equal(["EEG Fz", "LFP1"], back.Channels.Select(c => c.Label));
        Assert.Equal(["uV", "mV"], back.Channels.Select(c => c.Unit));
        AssertSamplesWithinOneStep(rec, back, header);
        Assert.Equal(events, back.Events);
        Assert.Empty(back.Notes);
    }

    [Fact]
    public void Data_not_a_whole_number_of_seconds_gets_a_record_duration_that_divides_it()
    {
        using var tmp = new TempFolder();
        var rec = Simulated(1000, 2500, [new RecordingEvent(2.4, 0, "end")]);
        string path = tmp.File("half.edf");
        EdfWriter.Write(rec, path);
        var header = EdfReader.ReadHeader(path);
        // 2500 samples at 1000 Hz: 1 s records would need padding; 1250-sample records of 1.25 s divide the data
        // and are the divisor closest to 1 s (the writer's documented choice).
        Assert.Equal(1.25, header.RecordDuration);
        Assert.Equal(2, header.RecordCount);
        Assert.Equal(2500, header.RecordCount * header.Signals[0].SamplesPerRecord);
        var back = EdfReader.Read(path);
        Assert.Equal(2500, back.SampleCount);
        Assert.Equal(1000.0, back.SampleRate);
        AssertSamplesWithinOneStep(rec, back, header);
    }

    [Fact]
    public void Sample_count_with_no_fitting_divisor_is_padded_and_keeps_every_sample()
    {
        using var tmp = new TempFolder();
        var rec = Simulated(100, 1009, []); // 1009 is prime
        string path = tmp.File("pad.edf");
        EdfWriter.Write(rec, path);
        var header = EdfReader.ReadHeader(path);
        Assert.Equal(1.0, header.RecordDuration);
        Assert.Equal(11, header.RecordCount);
        var back = EdfReader.Read(path);
        Assert.Equal(1100, back.SampleCount);
        AssertSamplesWithinOneStep(rec, back, header);
    }

    [Fact]
    public void Non_integer_rate_is_written_with_a_record_holding_whole_samples()
    {
        using var tmp = new TempFolder();
        double rate = 1000.0 / 3.0;
        var rec = Simulated(rate, 3000, []);
        string path = tmp.File("third.edf");
        EdfWriter.Write(rec, path);
        var header = EdfReader.ReadHeader(path);
        // 300 samples of 1000/3 Hz last 0.9 s: the divisor of 3000 closest to 1 s.
        Assert.Equal(0.9, header.RecordDuration);
        Assert.Equal(3000, header.RecordCount * header.Signals[0].SamplesPerRecord);
        var back = EdfReader.Read(path);
        // The reader's rate is samples per record over the decimal record duration, 300 / 0.9; the writer accepts it
        // only within 1e-12 relative of the recording's rate (a few units in the last place of a double).
        Assert.Equal(rate, back.SampleRate, 1e-12 * rate);
        AssertSamplesWithinOneStep(rec, back, header);
    }

    [Fact]
    public void Many_events_in_few_records_all_come_back()
    {
        using var tmp = new TempFolder();
        var events = Enumerable.Range(0, 300).Select(i => new RecordingEvent(i * 0.01, i % 3 * 0.5, "trial " + (i % 7))).ToArray();
        var rec = Simulated(200, 400, events);
        string path = tmp.File("many.edf");
        EdfWriter.Write(rec, path);
        Assert.Equal(events, EdfReader.Read(path).Events);
    }

    [Fact]
    public void Writing_replaces_an_existing_file_and_leaves_no_temporary_file()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("out.edf");
        File.WriteAllText(path, "old");
        EdfWriter.Write(Simulated(100, 200, []), path);
        Assert.False(File.Exists(path + ".tmp"));
        Assert.Equal(200, EdfReader.Read(path).SampleCount);
    }

    [Fact]
    public void Flat_channel_is_written_with_a_usable_range()
    {
        using var tmp = new TempFolder();
        var rec = new Recording("flat", 10, [new ChannelInfo("Ref", "EEG", "uV")], [Enumerable.Repeat(0.0, 20).ToArray()], []);
        string path = tmp.File("flat.edf");
        EdfWriter.Write(rec, path);
        Assert.All(EdfReader.Read(path).Samples[0], v => Assert.Equal(0.0, v, 2.0 / 65535));
    }

    [Fact]
    public void Label_too_long_for_EDF_is_refused()
    {
        using var tmp = new TempFolder();
        var rec = new Recording("long", 10, [new ChannelInfo("A label of twenty chars", "EEG", "uV")], [new double[10]], []);
        var e = Assert.Throws<InputException>(() => EdfWriter.Write(rec, tmp.File("x.edf")));
        Assert.Contains("16", e.Message);
        Assert.False(File.Exists(tmp.File("x.edf.tmp")));
    }

    [Fact]
    public void NaN_sample_is_refused_with_channel_and_index()
    {
        using var tmp = new TempFolder();
        var data = new double[10];
        data[7] = double.NaN;
        var rec = new Recording("nan", 10, [new ChannelInfo("Cz", "EEG", "uV")], [data], []);
        var e = Assert.Throws<InputException>(() => EdfWriter.Write(rec, tmp.File("x.edf")));
        Assert.Contains("'Cz' sample 7", e.Message);
    }

    /// <summary>The recording behind the committed coupling_written.edf; any change to it or to the writer shows as a byte difference.</summary>
    private static Recording ForEdflib()
    {
        var events = Enumerable.Range(0, 50).Select(i => new RecordingEvent(i * 0.05, i % 2 * 0.25, "ev" + i)).ToArray();
        var a = Enumerable.Range(0, 2500).Select(i => 40 * Math.Sin(i * 0.1)).ToArray();
        var b = Enumerable.Range(0, 2500).Select(i => 1e-3 * i).ToArray();
        return new Recording("probe", 1000, [new ChannelInfo("EEG Fz", "EEG", "uV"), new ChannelInfo("X", "LFP", "mV")], [a, b], events);
    }

    [Fact]
    public void EDFlib_reads_the_writer_output_as_written()
    {
        // Independent reader: EDFlib 1.23 (Debian libedf1) read coupling_written.edf into coupling_written_edflib.json
        // (read_with_edflib.c; Fixtures/Formats/README.md). First: the writer still makes exactly that file.
        var rec = ForEdflib();
        string? regenerate = Environment.GetEnvironmentVariable("COUPLING_FIXTURE_OUT");
        if (regenerate is not null)
        {
            EdfWriter.Write(rec, Path.Combine(regenerate, "coupling_written.edf"));
            return;
        }
        using var tmp = new TempFolder();
        string path = tmp.File("w.edf");
        EdfWriter.Write(rec, path);
        Assert.Equal(File.ReadAllBytes(Fixtures.Path("coupling_written.edf")), File.ReadAllBytes(path));

        using var doc = System.Text.Json.JsonDocument.Parse(File.ReadAllText(Fixtures.Path("coupling_written_edflib.json")));
        var root = doc.RootElement;
        Assert.Equal(1, root.GetProperty("filetype").GetInt32()); // EDFLIB_FILETYPE_EDFPLUS in edflib.h
        var signals = root.GetProperty("signals").EnumerateArray().ToArray();
        Assert.Equal(2, signals.Length); // EDFlib hides the annotation signal
        for (int c = 0; c < 2; c++)
        {
            var s = signals[c];
            Assert.Equal(rec.Channels[c].Label, s.GetProperty("label").GetString()!.Trim());
            Assert.Equal(rec.Channels[c].Unit, s.GetProperty("unit").GetString()!.Trim());
            var physical = EdflibFixture.Doubles(s.GetProperty("physical"));
            Assert.Equal(rec.SampleCount, physical.Length);
            // One digital step of 16-bit EDF (Kemp et al. 1992) from the header EDFlib read.
            double step = (s.GetProperty("physical_max").GetDouble() - s.GetProperty("physical_min").GetDouble()) / 65535;
            for (int i = 0; i < physical.Length; i++)
                Assert.True(Math.Abs(physical[i] - rec.Samples[c][i]) <= step, $"channel {c} sample {i}");
        }
        var annotations = root.GetProperty("annotations").EnumerateArray().ToArray();
        Assert.Equal(rec.Events.Count, annotations.Length);
        for (int i = 0; i < annotations.Length; i++)
        {
            var e = rec.Events[i];
            // EDFlib reports onsets in units of 100 ns (EDFLIB_TIME_DIMENSION 10000000) and durations as the TAL text.
            Assert.Equal((long)Math.Round(e.Onset * 1e7), annotations[i].GetProperty("onset_100ns").GetInt64());
            string duration = annotations[i].GetProperty("duration").GetString()!;
            Assert.Equal(e.Duration, duration.Length == 0 ? 0 : double.Parse(duration, System.Globalization.CultureInfo.InvariantCulture));
            Assert.Equal(e.Label, annotations[i].GetProperty("text").GetString());
        }
    }
}
