using Coupling.Spectral;

namespace Coupling.Measures;

/// <summary>
/// Per-set data for the envelope measures, built once per <see cref="NarrowbandSet"/> and shared read-only by every
/// workspace of that set: the values re-laid trial-major, [trial][channel][time point], so that the time course of
/// one channel in one trial is contiguous.
/// </summary>
internal sealed class EnvelopeTables
{
    public EnvelopeTables(NarrowbandSet set, bool keepComplex)
    {
        int channels = set.ChannelCount, trials = set.TrialCount, times = set.TimeCount;
        Times = times;
        Stride = channels * times;
        var data = set.Data;
        int length = checked(channels * trials * times);
        Envelope = new double[length];
        UnitDeviation = new double[length];
        if (keepComplex)
        {
            Re = new double[length];
            Im = new double[length];
        }
        for (int t = 0; t < times; t++)
            for (int c = 0; c < channels; c++)
            {
                int source = (t * channels + c) * trials;
                for (int n = 0; n < trials; n++)
                {
                    var z = data[source + n];
                    int target = (n * channels + c) * times + t;
                    Envelope[target] = Math.Sqrt(z.Real * z.Real + z.Imaginary * z.Imaginary);
                    if (keepComplex)
                    {
                        Re![target] = z.Real;
                        Im![target] = z.Imaginary;
                    }
                }
            }
        for (int row = 0; row < channels * trials; row++)
            PairwiseKernels.CentreAndNormalise(
                Envelope.AsSpan(row * times, times), UnitDeviation.AsSpan(row * times, times));
    }

    /// <summary>Number of time points (length of one row).</summary>
    public int Times { get; }

    /// <summary>Distance between the rows of consecutive trials (channels x time points).</summary>
    public int Stride { get; }

    /// <summary>|z| per [trial][channel][time point].</summary>
    public double[] Envelope { get; }

    /// <summary>
    /// The envelope of each (trial, channel) row minus its mean over time, divided by the Euclidean norm of that
    /// difference; all zeros where the envelope is constant. The dot product of two such rows is their Pearson r.
    /// </summary>
    public double[] UnitDeviation { get; }

    /// <summary>Real parts per [trial][channel][time point], or null when no measure needs them.</summary>
    public double[]? Re { get; }

    /// <summary>Imaginary parts per [trial][channel][time point], or null when no measure needs them.</summary>
    public double[]? Im { get; }
}
