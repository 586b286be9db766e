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
        .. CorrectionColumns.Names,
    ];

    /// <summary>Writes all pairs of <paramref name="results"/> to <paramref name="path"/>.</summary>
    /// <returns>The number of data rows written.</returns>
    /// <exception cref="ArgumentException">A result's arrays do not match its channels.</exception>
    public static int Write(IEnumerable<ContrastPairResult> results, string path)
    {
        ArgumentNullException.ThrowIfNull(results);
        return TidyTable.Write(path, Columns, Rows(results));
    }

    private static IEnumerable<IReadOnlyList<string>> Rows(IEnumerable<ContrastPairResult> results)
    {
        foreach (var r in results)
        {
            PairResultShape.Check(r.AsDifference());
            if (r.ValueA.Length != r.Difference.Length || r.ValueB.Length != r.Difference.Length)
                throw new ArgumentException($"Contrast {r.Contrast}/{r.Band}/{r.Measure}: value arrays differ in length from the differences.");
            int c = r.Channels.Count, family = CorrectionColumns.FamilySize(r.P);
            for (int k = 0; k < r.Difference.Length; k++)
            {
                var (a, b) = PairIndex.Channels(k, c);
                yield return
                [
                    r.Contrast, r.ConditionA, r.ConditionB, r.Band, r.Measure, r.Channels[a], r.Channels[b],
                    TableText.Number(r.ValueA[k]), TableText.Number(r.ValueB[k]), TableText.Number(r.Difference[k]),
                    TableText.Number(r.Z[k]), TableText.Number(r.P[k]), TableText.Number(r.PCorrected[k]),
                    r.Significant[k] ? "true" : "false",
                    .. CorrectionColumns.Cells(r.Correction, family, k),
                ];
            }
        }
    }
}
