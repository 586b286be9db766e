using Coupling.Measures;
using Coupling.Outputs;
using Coupling.Results;

namespace Coupling.Tests.Outputs;

public class EdgeTableWriterTests
{
    [Fact]
    public void The_table_parses_back_to_every_pair_of_every_result_bit_for_bit()
    {
        using var dir = new TempFolder();
        var results = new[]
        {
            SampleResults.FourChannels(),
            SampleResults.Grid(6, (a, b) => a == 0, measure: "imag-coherency", signed: true),
        };
        // Values that need all 17 significant digits to round-trip (IEEE 754 binary64).
        results[1].Value[3] = 0.1 + 0.2;
        results[1].Z[4] = Math.PI * 1e-300;
        results[1].P[5] = double.Epsilon;
        results[1].Value[6] = double.PositiveInfinity;
        results[1].Z[7] = double.NegativeInfinity;

        int written = EdgeTableWriter.Write(results, dir["edges.tsv"]);
        var rows = TableParsing.Read(dir["edges.tsv"], '\t');

        Assert.Equal(6 + 15, written);
        Assert.Equal(EdgeTableWriter.Columns, rows[0]);
        Assert.Equal(["condition", "band", "measure", "channel_a", "channel_b", "value", "z", "p", "p_corrected", "significant",
            "correction", "family_size", "p_source", "component", "ci_low", "ci_high", "value_matched", "unbiased_in_trials"], rows[0]);
        Assert.Equal(1 + written, rows.Count);
        int line = 1;
        foreach (var r in results)
        {
            for (int k = 0; k < r.Value.Length; k++, line++)
            {
                var f = rows[line];
                var (a, b) = PairIndex.Channels(k, r.Channels.Count);
                Assert.Equal([r.Condition, r.Band, r.Measure, r.Channels[a], r.Channels[b]], f[..5]);
                Assert.Equal(r.Value[k], TableParsing.Number(f[5]));
                Assert.Equal(r.Z[k], TableParsing.Number(f[6]));
                Assert.Equal(r.P[k], TableParsing.Number(f[7]));
                Assert.Equal(r.PCorrected[k], TableParsing.Number(f[8]));
                Assert.Equal(r.Significant[k] ? "true" : "false", f[9]);
            }
        }
    }

    [Fact]
    public void Missing_values_are_written_as_NA_and_numbers_in_invariant_form()
    {
        using var dir = new TempFolder();
        EdgeTableWriter.Write([SampleResults.FourChannels()], dir["e.tsv"]);
        string[] lines = File.ReadAllLines(dir["e.tsv"]);
        // Pair 4 is Cz-Oz, all NaN in the sample.
        // A result with no correction details, intervals or matched values: those columns are NA too; plv is biased in N.
        Assert.Equal("rest\talpha\tplv\tCz\tOz\tNA\tNA\tNA\tNA\tfalse\tNA\tNA\tNA\tNA\tNA\tNA\tNA\tfalse", lines[1 + 4]);
        Assert.Equal("rest\talpha\tplv\tPz\tFz\t-0.3\t-3.5\t0.002\t0.004\ttrue\tNA\tNA\tNA\tNA\tNA\tNA\tNA\tfalse", lines[1 + 1]);
        Assert.DoesNotContain(File.ReadAllText(dir["e.tsv"]), ch => ch == ',' || ch == '\r');
    }

    [Fact]
    public void Labels_with_tabs_or_quotes_are_quoted_and_read_back_unchanged()
    {
        using var dir = new TempFolder();
        var r = SampleResults.FourChannels() with { Condition = "go\tno \"go\"", Channels = ["P z", "C\"z", "F\tz", "Oz"] };
        EdgeTableWriter.Write([r], dir["q.tsv"]);
        var rows = TableParsing.Read(dir["q.tsv"], '\t');
        Assert.Equal(7, rows.Count);
        Assert.All(rows.Skip(1), f => Assert.Equal(EdgeTableWriter.Columns.Count, f.Length));
        Assert.Equal("go\tno \"go\"", rows[1][0]);
        Assert.Equal(["C\"z", "F\tz"], rows[1 + 3][3..5]);
    }

    [Fact]
    public void An_empty_set_of_results_gives_the_header_alone()
    {
        using var dir = new TempFolder();
        Assert.Equal(0, EdgeTableWriter.Write(Array.Empty<PairResult>(), dir["h.tsv"]));
        Assert.Equal(string.Join('\t', EdgeTableWriter.Columns) + "\n", File.ReadAllText(dir["h.tsv"]));
    }

    [Fact]
    public void A_malformed_result_leaves_no_file()
    {
        using var dir = new TempFolder();
        var bad = SampleResults.FourChannels() with { P = [0.5] };
        Assert.Throws<ArgumentException>(() => EdgeTableWriter.Write([SampleResults.FourChannels(), bad], dir["x.tsv"]));
        Assert.Empty(dir.Entries());
    }
}
