using Coupling.Spectral;

namespace Coupling.Measures;

/// <summary>
/// Per-set data for the pairwise kernels, built once per <see cref="NarrowbandSet"/> and then only read, so that every
/// workspace of the set (one per thread) shares it. Rows are channel-contiguous and padded with zeros to
/// <see cref="Stride"/> channels, a multiple of the kernels' tile width, so that a tile of channels is one aligned
/// vector load and a trial permutation only changes which row is read.
/// </summary>
/// <remarks>
/// Layouts: the per-time-point tables are [time point][trial][channel]; the envelope tables are
/// [trial][time point][channel]. Memory per value of the set, only for the measures asked: 2 doubles for the raw
/// table, 2 for the unit phasors, 1 for the envelope deviation and 3 for AEC-orth (re, im, 1/|z|).
/// </remarks>
internal sealed class PairTables
{
    /// <summary>Channels per row are padded to a multiple of this (two vectors of four doubles).</summary>
    /// <summary>
    /// The envelope correlations of every trial pair, when a surrogate test built them (<see cref="PairwiseKernels.BuildTrialPairs"/>);
    /// shared, like the tables, by every sibling workspace.
    /// </summary>
    public TrialPairTable? TrialPairs { get; set; }

    public const int ChannelMultiple = 8;

    public PairTables(NarrowbandSet set, bool phase, bool cross, bool envelope, bool orthogonal)
    {
        int channels = set.ChannelCount, trials = set.TrialCount, times = set.TimeCount;
        Channels = channels;
        Trials = trials;
        Times = times;
        Stride = (channels + ChannelMultiple - 1) / ChannelMultiple * ChannelMultiple;
        long length = (long)times * trials * Stride;

        if (phase)
        {
            UnitRe = new AlignedArray(length);
            UnitIm = new AlignedArray(length);
        }
        if (cross)
        {
            RawRe = new AlignedArray(length);
            RawIm = new AlignedArray(length);
            InverseRootPower = new AlignedArray((long)times * Stride);
        }
        if (envelope || orthogonal)
        {
            Deviation = new AlignedArray(length);
            if (orthogonal)
            {
                EnvelopeRe = new AlignedArray(length);
                EnvelopeIm = new AlignedArray(length);
                InverseEnvelope = new AlignedArray(length);
            }
        }
        Fill(set);
    }

    /// <summary>
    /// (Re)fills every table from <paramref name="set"/>, which must have the shape the tables were sized for: the
    /// constructor calls it, and a caller that changes a set's values in place calls it again instead of allocating
    /// new tables (padding channels stay zero).
    /// </summary>
    public void Fill(NarrowbandSet set)
    {
        int channels = set.ChannelCount, trials = set.TrialCount, times = set.TimeCount;
        if (channels != Channels || trials != Trials || times != Times)
            throw new ArgumentException($"The set is {times}x{channels}x{trials}; the tables are sized for {Times}x{Channels}x{Trials}.", nameof(set));
        var data = set.Data;
        bool phase = UnitRe is not null, cross = RawRe is not null, orthogonal = EnvelopeRe is not null;
        if (phase || cross)
        {
            for (int t = 0; t < times; t++)
                for (int c = 0; c < channels; c++)
                {
                    long source = ((long)t * channels + c) * trials;
                    double power = 0;
                    for (int n = 0; n < trials; n++)
                    {
                        var z = data[source + n];
                        long target = ((long)t * trials + n) * Stride + c;
                        if (cross)
                        {
                            RawRe![target] = z.Real;
                            RawIm![target] = z.Imaginary;
                            power += z.Real * z.Real + z.Imaginary * z.Imaginary;
                        }
                        if (phase)
                        {
                            Unit(z, out double re, out double im);
                            UnitRe![target] = re;
                            UnitIm![target] = im;
                        }
                    }
                    if (cross)
                        InverseRootPower![(long)t * Stride + c] =
                            power > 0 ? 1 / Math.Sqrt(power) : (power == 0 ? 0 : double.NaN);
                }
        }

        if (Deviation is not null)
        {
            var row = new double[times];
            var unit = new double[times];
            for (int n = 0; n < trials; n++)
                for (int c = 0; c < channels; c++)
                {
                    for (int t = 0; t < times; t++)
                    {
                        var z = data[((long)t * channels + c) * trials + n];
                        double magnitude = Math.Sqrt(z.Real * z.Real + z.Imaginary * z.Imaginary);
                        row[t] = magnitude;
                        if (orthogonal)
                        {
                            long target = ((long)n * times + t) * Stride + c;
                            EnvelopeRe![target] = z.Real;
                            EnvelopeIm![target] = z.Imaginary;
                            InverseEnvelope![target] = magnitude > 0 ? 1 / magnitude : (magnitude == 0 ? 0 : double.NaN);
                        }
                    }
                    PairwiseKernels.CentreAndNormalise(row, unit);
                    for (int t = 0; t < times; t++) Deviation[((long)n * times + t) * Stride + c] = unit[t];
                }
        }
    }

    public int Channels { get; }
    public int Trials { get; }
    public int Times { get; }

    /// <summary>Padded channel count: the length of one row.</summary>
    public int Stride { get; }

    /// <summary>Real part of z/|z| (0 where |z| = 0), [time point][trial][channel].</summary>
    public AlignedArray? UnitRe { get; }

    /// <summary>Imaginary part of z/|z|, [time point][trial][channel].</summary>
    public AlignedArray? UnitIm { get; }

    /// <summary>Real part of z, [time point][trial][channel].</summary>
    public AlignedArray? RawRe { get; }

    /// <summary>Imaginary part of z, [time point][trial][channel].</summary>
    public AlignedArray? RawIm { get; }

    /// <summary>1/sqrt(Σ_n |z_c,n|²) per [time point][channel]; 0 where the power is 0, NaN where it is NaN.</summary>
    public AlignedArray? InverseRootPower { get; }

    /// <summary>
    /// The envelope |z| of each (trial, channel) over the time points minus its mean, divided by the norm of that
    /// difference (all zeros for a constant envelope), [trial][time point][channel]: the dot product of two such rows
    /// is their Pearson r.
    /// </summary>
    public AlignedArray? Deviation { get; }

    /// <summary>Real part of z, [trial][time point][channel].</summary>
    public AlignedArray? EnvelopeRe { get; }

    /// <summary>Imaginary part of z, [trial][time point][channel].</summary>
    public AlignedArray? EnvelopeIm { get; }

    /// <summary>1/|z| (0 where |z| = 0), [trial][time point][channel].</summary>
    public AlignedArray? InverseEnvelope { get; }

    private static void Unit(System.Numerics.Complex z, out double re, out double im)
    {
        double magnitude = Math.Sqrt(z.Real * z.Real + z.Imaginary * z.Imaginary);
        if (magnitude > 0) { re = z.Real / magnitude; im = z.Imaginary / magnitude; }
        else if (magnitude == 0) { re = 0; im = 0; }
        else { re = double.NaN; im = double.NaN; }
    }
}
