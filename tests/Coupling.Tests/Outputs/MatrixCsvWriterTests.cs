using Coupling.Measures;
using Coupling.Outputs;

namespace Coupling.Tests.Outputs;

public class MatrixCsvWriterTests
{
    [Fact]
    public void Three_files_with_plain_predictable_names_are_written()
    {
        using var dir = new TempFolder();
        var paths = MatrixCsvWriter.Write(SampleResults.FourChannels(), dir.Path);
        Assert.Equal(["rest_alpha_plv_p.csv", "rest_alpha_plv_p_corrected.csv", "rest_alpha_plv_value.csv"], dir.Entries());
        Assert.Equal(3, paths.Count);
        Assert.All(paths, p => Assert.True(File.Exists(p)));
    }

    [Fact]
    public void Names_are_sanitised_for_file_systems()
    {
        Assert.Equal("eyes-closed", OutputNames.Sanitise("eyes closed"));
        Assert.Equal("low-theta", OutputNames.Sanitise("low_theta"));
        Assert.Equal("a-b", OutputNames.Sanitise("../a//b/"));
        Assert.Equal("unnamed", OutputNames.Sanitise("  "));
        Assert.Equal("wpli-debiased", OutputNames.Sanitise("wpli-debiased"));
        var r = SampleResults.FourChannels() with { Condition = "go/no go", Band = "β 13–30" };
        Assert.Equal("go-no-go_13-30_plv", OutputNames.Stem(r));
    }

    [Fact]
    public void Matrices_parse_back_symmetric_with_labels_and_an_NA_diagonal()
    {
        using var dir = new TempFolder();
        var r = SampleResults.Grid(5, (a, b) => b == a + 1);
        MatrixCsvWriter.Write(r, dir.Path);
        var sources = new[] { ("_value.csv", r.Value), ("_p.csv", r.P), ("_p_corrected.csv", r.PCorrected) };
        foreach (var (suffix, perPair) in sources)
        {
            var rows = TableParsing.Read(dir["task_theta_wpli" + suffix], ',');
            Assert.Equal(6, rows.Count);
            Assert.Equal(["channel", "Ch1", "Ch2", "Ch3", "Ch4", "Ch5"], rows[0]);
            for (int a = 0; a < 5; a++)
            {
                Assert.Equal(r.Channels[a], rows[1 + a][0]);
                Assert.Equal(6, rows[1 + a].Length);
                Assert.Equal("NA", rows[1 + a][1 + a]);
                for (int b = 0; b < 5; b++)
                {
                    if (a == b) continue;
                    double expected = perPair[PairIndex.Of(Math.Min(a, b), Math.Max(a, b), 5)];
                    Assert.Equal(expected, TableParsing.Number(rows[1 + a][1 + b]));
                }
            }
        }
    }

    [Fact]
    public void Imaginary_coherency_changes_sign_below_the_diagonal()
    {
        // Im C_ba = -Im C_ab: Nolte et al. (2004), Clin Neurophysiol 115:2292, eq. 1 (coherency is Hermitian).
        using var dir = new TempFolder();
        var r = SampleResults.Grid(4, (_, _) => true, measure: "imag-coherency", signed: true);
        MatrixCsvWriter.Write(r, dir.Path);
        var value = TableParsing.Read(dir["task_theta_imag-coherency_value.csv"], ',');
        var p = TableParsing.Read(dir["task_theta_imag-coherency_p.csv"], ',');
        for (int a = 0; a < 4; a++)
            for (int b = a + 1; b < 4; b++)
            {
                Assert.Equal(r.Value[PairIndex.Of(a, b, 4)], TableParsing.Number(value[1 + a][1 + b]));
                Assert.Equal(-r.Value[PairIndex.Of(a, b, 4)], TableParsing.Number(value[1 + b][1 + a]));
                Assert.Equal(p[1 + a][1 + b], p[1 + b][1 + a]);
            }
    }

    [Fact]
    public void NaN_values_are_written_as_NA()
    {
        using var dir = new TempFolder();
        MatrixCsvWriter.Write(SampleResults.FourChannels(), dir.Path);
        string[] lines = File.ReadAllLines(dir["rest_alpha_plv_value.csv"]);
        Assert.Equal("channel,Pz,Cz,Fz,Oz", lines[0]);
        Assert.Equal("Cz,0.5,NA,0.9,NA", lines[2]); // Cz-Oz is NaN in the sample
    }
}
