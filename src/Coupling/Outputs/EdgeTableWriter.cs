using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Outputs;

/// <summary>
/// Writes results as one tidy tab-separated table, one row per condition x band x measure x channel pair, with
/// the columns of <see cref="Columns"/>.
/// </summary>
/// <remarks>
/// Every pair is written, significant or not, in the order the results come and, within a result, in
/// <see cref="PairIndex"/> order (channel_a before channel_b in the result's channel order). Numbers are
/// invariant-culture shortest round-trip text ("R"), NaN is NA, infinities are Inf and -Inf; significant is
/// true or false. Text fields holding a tab, quote or line break are double-quoted (RFC 4180 style). Lines end
/// in LF; UTF-8 without a byte-order mark; written atomically. R's <c>read.delim(f)</c> and pandas'
/// <c>read_csv(f, sep="\t")</c> read it with no further options (pandas needs
/// <c>float_precision="round_trip"</c> to get every double back exactly; its default parser can be off in the last digit).
/// </remarks>
public static class EdgeTableWriter
{
    /// <summary>The header row, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
        ["condition", "band", "measure", "channel_a", "channel_b", "value", "z", "p", "p_corrected", "significant",
         .. CorrectionColumns.Names, "ci_low", "ci_high", "value_matched", "unbiased_in_trials"];

    /// <summary>Writes all pairs of <paramref name="results"/> to <paramref name="path"/>.</summary>
    /// <returns>The number of data rows written.</returns>
    /// <exception cref="ArgumentException">A result's arrays do not match its channels.</exception>
    public static int Write(IEnumerable<PairResult> results, string path)
    {
        ArgumentNullException.ThrowIfNull(results);
        return TidyTable.Write(path, Columns, Rows(results));
    }

    private static IEnumerable<IReadOnlyList<string>> Rows(IEnumerable<PairResult> results)
    {
        foreach (var r in results)
        {
            PairResultShape.Check(r);
            int c = r.Channels.Count, family = CorrectionColumns.FamilySize(r.P);
            string unbiased = MeasureCatalog.All.Where(m => MeasureCatalog.Key(m) == r.Measure)
                .Select(m => Statistics.TrialResampling.IsUnbiasedInTrials(m) ? "true" : "false").FirstOrDefault() ?? "NA";
            for (int k = 0; k < r.Value.Length; k++)
            {
                var (a, b) = PairIndex.Channels(k, c);
                yield return
                [
                    r.Condition, r.Band, r.Measure, r.Channels[a], r.Channels[b], TableText.Number(r.Value[k]),
                    TableText.Number(r.Z[k]), TableText.Number(r.P[k]), TableText.Number(r.PCorrected[k]),
                    r.Significant[k] ? "true" : "false",
                    .. CorrectionColumns.Cells(r.Correction, family, k),
                    r.IntervalLow is null ? "NA" : TableText.Number(r.IntervalLow[k]),
                    r.IntervalHigh is null ? "NA" : TableText.Number(r.IntervalHigh[k]),
                    r.ValueMatched is null ? "NA" : TableText.Number(r.ValueMatched[k]),
                    unbiased,
                ];
            }
        }
    }
}
