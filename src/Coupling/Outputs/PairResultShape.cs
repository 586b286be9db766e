using Coupling.Measures;
using Coupling.Results;

namespace Coupling.Outputs;

/// <summary>Checks that a <see cref="PairResult"/> is internally consistent and lays its pairs out as matrices.</summary>
internal static class PairResultShape
{
    /// <summary>Throws when the per-pair arrays do not match the channel count, or labels repeat.</summary>
    public static void Check(PairResult r)
    {
        ArgumentNullException.ThrowIfNull(r);
        int c = r.Channels.Count;
        int n = PairIndex.Count(c);
        void Length(int actual, string name)
        {
            if (actual != n)
                throw new ArgumentException(
                    $"Result {r.Condition}/{r.Band}/{r.Measure}: {name} holds {actual} values, expected {n} for {c} channels.");
        }
        Length(r.Value.Length, nameof(r.Value));
        Length(r.Z.Length, nameof(r.Z));
        Length(r.P.Length, nameof(r.P));
        Length(r.PCorrected.Length, nameof(r.PCorrected));
        Length(r.Significant.Length, nameof(r.Significant));
        if (r.Positions is not null && r.Positions.Count != c)
            throw new ArgumentException(
                $"Result {r.Condition}/{r.Band}/{r.Measure}: {r.Positions.Count} positions for {c} channels.");
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (string label in r.Channels)
            if (!seen.Add(label))
                throw new ArgumentException($"Result {r.Condition}/{r.Band}/{r.Measure}: channel label '{label}' occurs twice.");
    }

    /// <summary>
    /// A channels x channels matrix of <paramref name="perPair"/> with NaN on the diagonal. The lower triangle
    /// mirrors the upper one, negated when <paramref name="antisymmetric"/> is set.
    /// </summary>
    public static double[,] Matrix(double[] perPair, int channels, bool antisymmetric)
    {
        var m = new double[channels, channels];
        for (int a = 0; a < channels; a++)
        {
            m[a, a] = double.NaN;
            for (int b = a + 1; b < channels; b++)
            {
                double v = perPair[PairIndex.Of(a, b, channels)];
                m[a, b] = v;
                m[b, a] = antisymmetric ? -v : v;
            }
        }
        return m;
    }
}
