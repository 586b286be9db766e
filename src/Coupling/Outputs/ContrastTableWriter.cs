using System.Text;
using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Outputs;

/// <summary>
/// Writes condition contrasts as one tidy tab-separated table, one row per contrast x band x measure x channel pair,
/// with the columns of <see cref="Columns"/>.
/// </summary>
/// <remarks>
/// The conventions are those of <see cref="EdgeTableWriter"/>: every pair is written in <see cref="PairIndex"/> order;
/// numbers are invariant-culture shortest round-trip text, NaN is NA; significant is true or false; text fields are
/// quoted when needed; LF line ends, UTF-8 without a byte-order mark, written atomically.
/// </remarks>
public static class ContrastTableWriter
{
    /// <summary>The header row, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
    [
        "contrast", "condition_a", "condition_b", "band", "measure", "channel_a", "channel_b",
        "value_a", "value_b", "difference", "z", "p", "p_corrected", "significant",
    ];

    /// <summary>Writes all pairs of <paramref name="results"/> to <paramref name="path"/>.</summary>
    /// <returns>The number of data rows written.</returns>
    /// <exception cref="ArgumentException">A result's arrays do not match its channels.</exception>
    public static int Write(IEnumerable<ContrastPairResult> results, string path)
    {
        ArgumentNullException.ThrowIfNull(results);
        using var stream = AtomicFile.Create(path);
        int rows = 0;
        using (var w = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true) { NewLine = "\n" })
        {
            w.Write(string.Join('\t', Columns));
            w.Write('\n');
            var sb = new StringBuilder();
            foreach (var r in results)
            {
                PairResultShape.Check(r.AsDifference());
                if (r.ValueA.Length != r.Difference.Length || r.ValueB.Length != r.Difference.Length)
                    throw new ArgumentException($"Contrast {r.Contrast}/{r.Band}/{r.Measure}: value arrays differ in length from the differences.");
                int c = r.Channels.Count;
                string head = string.Join('\t', new[] { r.Contrast, r.ConditionA, r.ConditionB, r.Band, r.Measure }.Select(f => TableText.Field(f, '\t'))) + "\t";
                for (int k = 0; k < r.Difference.Length; k++)
                {
                    var (a, b) = PairIndex.Channels(k, c);
                    sb.Clear();
                    sb.Append(head)
                      .Append(TableText.Field(r.Channels[a], '\t')).Append('\t')
                      .Append(TableText.Field(r.Channels[b], '\t')).Append('\t')
                      .Append(TableText.Number(r.ValueA[k])).Append('\t')
                      .Append(TableText.Number(r.ValueB[k])).Append('\t')
                      .Append(TableText.Number(r.Difference[k])).Append('\t')
                      .Append(TableText.Number(r.Z[k])).Append('\t')
                      .Append(TableText.Number(r.P[k])).Append('\t')
                      .Append(TableText.Number(r.PCorrected[k])).Append('\t')
                      .Append(r.Significant[k] ? "true" : "false").Append('\n');
                    w.Write(sb);
                    rows++;
                }
            }
        }
        stream.Commit();
        return rows;
    }
}
