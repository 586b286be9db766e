using Coupling.Formats;

namespace Coupling.Tests.Formats;

public class RecordingSummaryTests
{
    [Fact]
    public void Summary_of_the_EDFlib_header_lists_every_signal_at_its_rate_and_the_event_counts()
    {
        string path = Fixtures.Path(EdflibFixture.EdfName);
        var summary = RecordingSummary.Describe(EdfReader.ReadHeader(path), EdfReader.ReadEvents(path));
        Assert.Equal("EDF+C", summary.FormatName);
        Assert.Equal(4.0, summary.Duration);
        Assert.Equal(8, summary.RecordCount);
        Assert.Equal(new[] { 200.0, 200, 50 }, summary.Channels.Select(c => c.SampleRate));
        Assert.Equal(new[] { 800L, 800, 200 }, summary.Channels.Select(c => c.SampleCount));
        Assert.Equal(new[] { new EventCount("artifact", 1), new EventCount("response", 1), new EventCount("stim A", 2), new EventCount("stim B", 1) },
            summary.EventCounts);

        var lines = summary.Format();
        Assert.Contains("format: EDF+C", lines);
        Assert.Contains("start: 2021-03-04 09:08:07", lines);
        Assert.Contains("duration: 4 s (8 records of 0.5 s)", lines);
        Assert.Contains(lines, l => l.Contains("Resp belt") && l.Contains("50") && l.Contains("mV"));
        Assert.Contains("events: 5 (4 labels)", lines);
    }

    [Fact]
    public void Summary_of_a_recording_uses_its_rate_and_notes()
    {
        var rec = new Recording("sim", 100, [new ChannelInfo("a", "LFP", "mV")], [new double[250]],
            [new RecordingEvent(0, 0, "x")], ["left out: b"]);
        var lines = RecordingSummary.Describe(rec, "CSV").Format();
        Assert.Contains("duration: 2.5 s", lines);
        Assert.Contains("start: unknown", lines);
        Assert.Contains(lines, l => l.Contains("LFP") && l.Contains("250"));
        Assert.Contains("  left out: b", lines);
    }

    [Fact]
    public void Sidecars_set_channel_types_units_and_event_counts_and_are_named_in_the_notes()
    {
        // BIDS channels.tsv (name, type, units, status) and events.tsv (onset, duration, trial_type).
        using var dir = new TempFolder();
        File.WriteAllText(dir.File("channels.tsv"), "name\ttype\tunits\tstatus\na\tSEEG\tuV\tgood\nb\tSEEG\tuV\tbad\n");
        File.WriteAllText(dir.File("events.tsv"), "onset\tduration\ttrial_type\n0.5\t0\tgo\n1.0\tn/a\tgo\n1.5\t0\tstop\n");
        var rec = new Recording("sim", 100, [new ChannelInfo("a", "unknown", "unknown"), new ChannelInfo("b", "unknown", "unknown")],
            [new double[250], new double[250]], [new RecordingEvent(0, 0, "x")]);
        var summary = RecordingSummary.Describe(rec, "EDF+C")
            .WithSidecars(new SidecarFiles(dir.File("events.tsv"), dir.File("channels.tsv"), null));
        Assert.Equal(["SEEG", "SEEG"], summary.Channels.Select(c => c.Type));
        Assert.Equal(["uV", "uV"], summary.Channels.Select(c => c.Unit));
        Assert.Equal([new EventCount("go", 2), new EventCount("stop", 1)], summary.EventCounts);
        Assert.Contains("Channel types and units from channels.tsv.", summary.Notes);
        Assert.Contains("Events from events.tsv.", summary.Notes);
        Assert.Contains(summary.Notes, n => n.Contains("bad") && n.EndsWith(": b.", StringComparison.Ordinal));
    }
}
