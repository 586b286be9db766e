using Coupling.Formats;

namespace Coupling.Tests.Formats;

public class SidecarTests
{
    // Column names and the "n/a" convention per the BIDS specification (events.tsv, channels.tsv, electrodes.tsv).

    [Fact]
    public void Events_tsv_reads_onset_duration_and_trial_type_with_na_duration_as_zero()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("events.tsv");
        File.WriteAllText(path, "onset\tduration\ttrial_type\tresponse_time\n3.5\tn/a\tgo\t0.4\n1.25\t0.5\tstop\tn/a\n");
        var events = EventsTsv.Read(path);
        Assert.Equal(new[] { new RecordingEvent(1.25, 0.5, "stop"), new RecordingEvent(3.5, 0, "go") }, events);
    }

    [Fact]
    public void Bad_events_tsv_line_names_file_line_and_column()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("events.tsv");
        File.WriteAllText(path, "onset\tduration\ttrial_type\n1\t0\tgo\n2.x\t0\tgo\n");
        var e = Assert.Throws<InputException>(() => EventsTsv.Read(path));
        Assert.Contains(path, e.Message);
        Assert.Contains("line 3, column 'onset'", e.Message);

        File.WriteAllText(path, "onset\ttrial_type\n1\tgo\n");
        Assert.Contains("missing required column 'duration'", Assert.Throws<InputException>(() => EventsTsv.Read(path)).Message);

        File.WriteAllText(path, "onset\tduration\ttrial_type\n1\t-1\tgo\n");
        Assert.Contains("line 2, column 'duration'", Assert.Throws<InputException>(() => EventsTsv.Read(path)).Message);
    }

    [Fact]
    public void Sidecars_replace_types_units_positions_and_events_and_drop_bad_channels()
    {
        using var tmp = new TempFolder();
        File.WriteAllText(tmp.File("channels.tsv"), "name\ttype\tunits\tstatus\nA1\tseeg\tuV\tgood\nA2\tSEEG\tuV\tbad\nZ9\tMISC\tV\tn/a\n");
        File.WriteAllText(tmp.File("electrodes.tsv"), "name\tx\ty\tz\nA1\t1.5\t-2\t30\nA3\tn/a\tn/a\tn/a\n");
        var rec = new Recording("r", 100,
            [new ChannelInfo("A1", "unknown", "unknown"), new ChannelInfo("A2", "unknown", "unknown"), new ChannelInfo("A3", "unknown", "unknown")],
            [new double[] { 1, 2 }, new double[] { 3, 4 }, new double[] { 5, 6 }], [new RecordingEvent(0, 0, "old")]);
        var events = new[] { new RecordingEvent(1, 0, "b"), new RecordingEvent(0.5, 0, "a") };

        var applied = RecordingSidecars.Apply(rec, events, ChannelsTsv.Read(tmp.File("channels.tsv")), ElectrodesTsv.Read(tmp.File("electrodes.tsv")));

        Assert.Equal(["A1", "A3"], applied.Channels.Select(c => c.Label));
        Assert.Equal(new ChannelInfo("A1", "SEEG", "uV", new ChannelPosition(1.5, -2, 30)), applied.Channels[0]);
        Assert.Equal(new ChannelInfo("A3", "unknown", "unknown"), applied.Channels[1]);
        Assert.Equal(new[] { 5.0, 6 }, applied.Samples[1]);
        Assert.Equal(new[] { "a", "b" }, applied.Events.Select(e => e.Label));
        Assert.Contains(applied.Notes, n => n.Contains("'A2'") && n.Contains("bad"));
        Assert.Contains(applied.Notes, n => n.Contains("Z9"));
        Assert.Contains(applied.Notes, n => n.Contains("not listed") && n.Contains("A3"));

        Assert.Equal(3, RecordingSidecars.Apply(rec, channels: ChannelsTsv.Read(tmp.File("channels.tsv")), keepBad: true).Channels.Count);
    }

    [Fact]
    public void Channels_tsv_with_an_unknown_status_is_refused()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("channels.tsv");
        File.WriteAllText(path, "name\ttype\tunits\tstatus\nA1\tEEG\tuV\tnoisy\n");
        Assert.Contains("line 2, column 'status'", Assert.Throws<InputException>(() => ChannelsTsv.Read(path)).Message);
    }

    [Fact]
    public void Sidecars_are_found_by_the_longest_matching_BIDS_prefix()
    {
        using var tmp = new TempFolder();
        string recording = tmp.File("sub-01_ses-1_task-rest_run-1_ieeg.edf");
        File.WriteAllText(recording, "");
        File.WriteAllText(tmp.File("sub-01_ses-1_task-rest_run-1_events.tsv"), "");
        File.WriteAllText(tmp.File("sub-01_ses-1_task-rest_run-1_channels.tsv"), "");
        File.WriteAllText(tmp.File("sub-01_ses-1_electrodes.tsv"), "");
        File.WriteAllText(tmp.File("electrodes.tsv"), "");
        var found = RecordingSidecars.FindBesides(recording);
        Assert.Equal(tmp.File("sub-01_ses-1_task-rest_run-1_events.tsv"), found.Events);
        Assert.Equal(tmp.File("sub-01_ses-1_task-rest_run-1_channels.tsv"), found.Channels);
        Assert.Equal(tmp.File("sub-01_ses-1_electrodes.tsv"), found.Electrodes);

        string plain = tmp.File("session.edf");
        Assert.Equal(new SidecarFiles(null, null, tmp.File("electrodes.tsv")), RecordingSidecars.FindBesides(plain));
    }
}
