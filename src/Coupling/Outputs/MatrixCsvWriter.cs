using System.Text;
using Coupling.Results;

namespace Coupling.Outputs;

/// <summary>
/// Writes a result as three channel x channel CSV matrices: <c>&lt;stem&gt;_value.csv</c>, <c>&lt;stem&gt;_p.csv</c>
/// and <c>&lt;stem&gt;_p_corrected.csv</c> with the stem from <see cref="OutputNames.Stem"/>.
/// </summary>
/// <remarks>
/// Layout: the first row is <c>channel</c> followed by the channel labels; each following row is one channel's
/// label followed by its values, so R's <c>read.csv(f, row.names = 1, check.names = FALSE)</c> and pandas'
/// <c>read_csv(f, index_col = 0)</c> give the matrix with labels. Row a, column b holds pair (a, b); the matrix
/// is symmetric, except that the value matrix of an antisymmetric measure (<see cref="MeasureSymmetry"/>) holds
/// the negated value below the diagonal. The diagonal (a channel with itself) is not computed and written as NA,
/// as are NaN values. Numbers are invariant-culture shortest round-trip text; lines end in LF; files are
/// UTF-8 without a byte-order mark, each written atomically.
/// </remarks>
public static class MatrixCsvWriter
{
    /// <summary>Suffixes of the three files, in the order they are written.</summary>
    public static IReadOnlyList<string> Suffixes { get; } = ["_value.csv", "_p.csv", "_p_corrected.csv"];

    /// <summary>Writes the three matrices of <paramref name="result"/> into <paramref name="folder"/> and returns their paths.</summary>
    /// <exception cref="ArgumentException">The result's arrays do not match its channels.</exception>
    public static IReadOnlyList<string> Write(PairResult result, string folder)
    {
        PairResultShape.Check(result);
        ArgumentException.ThrowIfNullOrEmpty(folder);
        int c = result.Channels.Count;
        string stem = OutputNames.Stem(result);
        bool anti = MeasureSymmetry.IsAntisymmetric(result.Measure);
        var matrices = new[]
        {
            PairResultShape.Matrix(result.Value, c, anti),
            PairResultShape.Matrix(result.P, c, antisymmetric: false),
            PairResultShape.Matrix(result.PCorrected, c, antisymmetric: false),
        };
        var paths = new string[matrices.Length];
        for (int i = 0; i < matrices.Length; i++)
        {
            paths[i] = Path.Combine(folder, stem + Suffixes[i]);
            AtomicFile.WriteAllText(paths[i], Format(result.Channels, matrices[i]));
        }
        return paths;
    }

    private static string Format(IReadOnlyList<string> channels, double[,] m)
    {
        var sb = new StringBuilder();
        sb.Append("channel");
        foreach (string label in channels) sb.Append(',').Append(TableText.Field(label, ','));
        sb.Append('\n');
        for (int a = 0; a < channels.Count; a++)
        {
            sb.Append(TableText.Field(channels[a], ','));
            for (int b = 0; b < channels.Count; b++) sb.Append(',').Append(TableText.Number(m[a, b]));
            sb.Append('\n');
        }
        return sb.ToString();
    }
}
