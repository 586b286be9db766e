using Coupling.Measures;
using Coupling.Spectral;

namespace Coupling.Statistics;

/// <summary>
/// The observed values of every measure for every channel pair, with no test: what a run with <c>surrogates: 0</c>
/// reports. The results have the shapes of the tested ones, with 0 draws and NaN for every null statistic, p and z.
/// </summary>
/// <remarks>The values are exactly those of the tested path: <see cref="PairwiseKernels.Compute"/> with the trials in
/// their own order, as <see cref="SurrogateTest.Run"/> and <see cref="ConditionContrast"/> compute them.</remarks>
public static class ValuesOnly
{
    /// <summary>The observed value per measure and pair of one condition in one band; p, z and the null summary are NaN.</summary>
    /// <param name="set">The narrowband signals of one condition in one band.</param>
    /// <param name="measures">The measures, each at most once.</param>
    public static IReadOnlyList<SurrogateResult> Compute(NarrowbandSet set, IReadOnlyList<Measure> measures)
    {
        var (observed, pairs) = Observed(set, measures);
        return measures.Select((m, k) => new SurrogateResult(m, 0, observed.AsSpan(k * pairs, pairs).ToArray(),
            Missing(pairs), Missing(pairs), new int[pairs], Missing(pairs), Missing(pairs))).ToArray();
    }

    /// <summary>The value per measure and pair in each of two conditions and their difference A − B; p, z and the null summary are NaN.</summary>
    /// <param name="a">Narrowband signals of condition A in one band.</param>
    /// <param name="b">Narrowband signals of condition B in the same band.</param>
    /// <param name="measures">The measures, each at most once.</param>
    public static IReadOnlyList<ContrastResult> Compare(NarrowbandSet a, NarrowbandSet b, IReadOnlyList<Measure> measures)
    {
        var (valueA, pairs) = Observed(a, measures);
        var (valueB, _) = Observed(b, measures);
        return measures.Select((m, k) =>
        {
            var va = valueA.AsSpan(k * pairs, pairs).ToArray();
            var vb = valueB.AsSpan(k * pairs, pairs).ToArray();
            return new ContrastResult(m, 0, va, vb, va.Zip(vb, (x, y) => x - y).ToArray(),
                Missing(pairs), Missing(pairs), new int[pairs], Missing(pairs), Missing(pairs));
        }).ToArray();
    }

    private static (double[] Values, int Pairs) Observed(NarrowbandSet set, IReadOnlyList<Measure> measures)
    {
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(measures);
        var workspace = new PairwiseWorkspace(set, measures);
        var identity = Enumerable.Range(0, set.TrialCount).ToArray();
        var values = new double[workspace.OutputLength];
        PairwiseKernels.Compute(workspace, identity, values);
        return (values, workspace.PairCount);
    }

    private static double[] Missing(int n)
    {
        var a = new double[n];
        Array.Fill(a, double.NaN);
        return a;
    }
}
