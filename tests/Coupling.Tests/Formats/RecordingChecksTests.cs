using Coupling.Formats;

namespace Coupling.Tests.Formats;

public class RecordingChecksTests
{
    [Fact]
    public void Only_channels_with_all_samples_equal_are_flat()
    {
        var rec = new Recording("r", 10,
            [new ChannelInfo("a", "EEG", "uV"), new ChannelInfo("b", "EEG", "uV"), new ChannelInfo("c", "EEG", "uV")],
            [new[] { 2.0, 2.0, 2.0 }, new[] { 2.0, 2.0, 2.0000000001 }, new[] { 0.0, 0.0, 0.0 }], []);
        Assert.Equal(["a", "c"], RecordingChecks.FindFlatChannels(rec));
    }

    [Fact]
    public void Flat_channel_reads_without_error()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("flat.csv");
        File.WriteAllText(path, "x,y\n1,0\n1,2\n");
        Assert.Equal(["x"], RecordingChecks.FindFlatChannels(CsvRecording.Read(path, 1)));
    }
}
