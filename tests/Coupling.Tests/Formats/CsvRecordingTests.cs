using Coupling.Formats;

namespace Coupling.Tests.Formats;

public class CsvRecordingTests
{
    [Fact]
    public void Columns_become_channels_and_rows_samples()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("a.csv");
        File.WriteAllText(path, "Fz,\"Cz\",Pz\n1,2,3\n-0.5,1e-3,4.25\n\n");
        var rec = CsvRecording.Read(path, 250);
        Assert.Equal(["Fz", "Cz", "Pz"], rec.Channels.Select(c => c.Label));
        Assert.Equal(250.0, rec.SampleRate);
        Assert.Equal(new[] { 1.0, -0.5 }, rec.Samples[0]);
        Assert.Equal(new[] { 2.0, 0.001 }, rec.Samples[1]);
        Assert.Equal(new[] { 3.0, 4.25 }, rec.Samples[2]);
        Assert.Empty(rec.Events);
    }

    [Theory]
    [InlineData("NaN")]
    [InlineData("Infinity")]
    [InlineData("-Infinity")]
    public void Non_finite_cell_names_line_column_channel_and_sample(string cell)
    {
        using var tmp = new TempFolder();
        string path = tmp.File("nan.csv");
        File.WriteAllText(path, $"Fz,Cz\n1,2\n3,4\n5,{cell}\n");
        var e = Assert.Throws<InputException>(() => CsvRecording.Read(path, 100));
        Assert.Contains(path, e.Message);
        Assert.Contains("line 4, column 2 (channel 'Cz', sample 2)", e.Message);
    }

    [Fact]
    public void Empty_or_bad_cell_and_short_row_are_refused_with_the_line()
    {
        using var tmp = new TempFolder();
        string path = tmp.File("bad.csv");
        File.WriteAllText(path, "Fz,Cz\n1,\n");
        Assert.Contains("line 2, column 2", Assert.Throws<InputException>(() => CsvRecording.Read(path, 100)).Message);
        File.WriteAllText(path, "Fz,Cz\n1,2\n1,2x\n");
        Assert.Contains("'2x' is not a number", Assert.Throws<InputException>(() => CsvRecording.Read(path, 100)).Message);
        File.WriteAllText(path, "Fz,Cz\n1\n");
        Assert.Contains("line 2: 1 cells", Assert.Throws<InputException>(() => CsvRecording.Read(path, 100)).Message);
        File.WriteAllText(path, "Fz,Fz\n1,2\n");
        Assert.Contains("repeats", Assert.Throws<InputException>(() => CsvRecording.Read(path, 100)).Message);
    }
}
