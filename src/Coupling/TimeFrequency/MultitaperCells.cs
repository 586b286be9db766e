using System.Numerics;
using Coupling.Spectral;
using Coupling.Trials;

namespace Coupling.TimeFrequency;

/// <summary>Time-frequency cells from multitaper Fourier coefficients with DPSS tapers, one segment per time bin.</summary>
/// <remarks>
/// For the segment x[0..L-1] of a trial and channel inside a bin (L = bin width x rate samples), with its mean removed
/// (common practice: the even tapers have a nonzero sum and would pass a constant offset), the coefficient of taper k
/// at frequency f is X_k(f) = sum_s h_k[s] x[s] exp(-2 pi i f s / fs), h_k the k-th DPSS taper of length L and
/// NW = W L / fs for the half-bandwidth W in Hz, with K = floor(2 NW) - 1 tapers (Thomson 1982, Proc. IEEE
/// 70(9):1055-1096; Percival and Walden 1993, chapter 7). Each (trial, taper) is one observation of the cell, so
/// cross-spectral measures are the multitaper estimates averaged over trials and tapers (coherence as in Mitra and
/// Pesaran 1999, Biophys. J. 76(2):691-708, eq. 7). The phase reference is the segment's first sample, the same for
/// every channel and trial, so it cancels in every measure. A bin that is a single time point has no segment and is
/// refused; so is a segment too short for one taper (NW &lt; 1).
/// </remarks>
public static class MultitaperCells
{
    /// <summary>
    /// The measures offered with multitaper: those that weigh each observation's cross-spectrum by its amplitude
    /// (coherence, imaginary coherency, wPLI). Phase-only measures (PLV, PPC, PLI) would weigh every taper alike, and
    /// the odd-order tapers carry almost none of a spectral line at the cell's frequency (their sum is zero), so their
    /// phase is that of leakage; the debiased wPLI² assumes independent observations, which the tapers of one trial
    /// are only approximately; the envelope correlations need time courses, and a cell has one coefficient per taper.
    /// </summary>
    public static readonly IReadOnlyList<Measures.Measure> Measures =
        [Coupling.Measures.Measure.Coherence, Coupling.Measures.Measure.ImagCoherency, Coupling.Measures.Measure.Wpli];

    /// <summary>The band of a cell at <paramref name="frequency"/>: f ± W.</summary>
    public static Band BandOf(double frequency, double halfBandwidthHz) =>
        new(MorletCells.FrequencyName(frequency), frequency - halfBandwidthHz, frequency + halfBandwidthHz);

    /// <summary>The tapers used for a segment of <paramref name="length"/> samples.</summary>
    /// <exception cref="InputException">NW = W L / fs is below 1.</exception>
    public static DpssTapers TapersFor(int length, double halfBandwidthHz, double sampleRate)
    {
        double nw = halfBandwidthHz * length / sampleRate;
        if (nw < 1)
            throw new InputException(
                $"a segment of {length / sampleRate:G4} s at half-bandwidth {halfBandwidthHz:G4} Hz gives NW = {nw:G3}; multitaper needs NW >= 1 (a longer segment or a wider half-bandwidth).");
        return DpssTapers.Create(length, nw, DpssTapers.DefaultCount(nw));
    }

    /// <summary>Builds the cells.</summary>
    /// <param name="trials">Trials of one condition (the channels to analyse only).</param>
    /// <param name="frequencies">Frequencies, Hz.</param>
    /// <param name="halfBandwidthHz">Half-bandwidth W of the tapers, Hz.</param>
    /// <param name="bins">Time bins (spans, not points) inside the trial span.</param>
    /// <exception cref="InputException">A point bin, a bin outside the trial span, or NW &lt; 1.</exception>
    public static TimeFrequencyCells Build(TrialSet trials, IReadOnlyList<double> frequencies, double halfBandwidthHz,
        IReadOnlyList<TimeBin> bins)
    {
        double rate = trials.SampleRate;
        int nC = trials.ChannelCount, nN = trials.TrialCount;
        var sets = new NarrowbandSet[frequencies.Count * bins.Count];
        int observationsPerTrial = 0;
        var tapersByLength = new Dictionary<int, DpssTapers>();
        for (int bi = 0; bi < bins.Count; bi++)
        {
            var bin = bins[bi];
            if (bin.IsPoint) throw new InputException("multitaper needs time bins of a positive width.");
            int first = trials.PadSamples + (int)Math.Round((bin.Start - trials.SpanStart) * rate);
            int length = (int)Math.Round((bin.End - bin.Start) * rate);
            if (first < trials.PadSamples || first + length > trials.SampleCount - trials.PadSamples)
                throw new InputException($"time bin {bin.Start:G6}..{bin.End:G6} s lies outside the trial span.");
            if (!tapersByLength.TryGetValue(length, out var tapers))
                tapersByLength[length] = tapers = TapersFor(length, halfBandwidthHz, rate);
            if (observationsPerTrial != 0 && observationsPerTrial != tapers.Count)
                throw new InputException("every time bin must give the same number of tapers; use bins of one width.");
            int nK = observationsPerTrial = tapers.Count;
            var phasors = Phasors(frequencies, length, rate);
            var data = new Complex[frequencies.Count][];
            for (int fi = 0; fi < frequencies.Count; fi++) data[fi] = new Complex[nC * nN * nK];
            var segment = new double[length];
            var tapered = new double[length];
            for (int n = 0; n < nN; n++)
                for (int c = 0; c < nC; c++)
                {
                    trials.Trial(n, c).Slice(first, length).CopyTo(segment);
                    double mean = segment.Average();
                    for (int s = 0; s < length; s++) segment[s] -= mean;
                    for (int k = 0; k < nK; k++)
                    {
                        var h = tapers.Tapers[k];
                        for (int s = 0; s < length; s++) tapered[s] = h[s] * segment[s];
                        for (int fi = 0; fi < frequencies.Count; fi++)
                        {
                            var e = phasors[fi];
                            double re = 0, im = 0;
                            for (int s = 0; s < length; s++) { re += tapered[s] * e[s].Real; im += tapered[s] * e[s].Imaginary; }
                            data[fi][(c * nN + n) * nK + k] = new Complex(re, im);
                        }
                    }
                }
            for (int fi = 0; fi < frequencies.Count; fi++)
                sets[fi * bins.Count + bi] = new NarrowbandSet(BandOf(frequencies[fi], halfBandwidthHz), trials.Channels, nN * nK,
                    [bin.Centre], data[fi]);
        }
        return new TimeFrequencyCells(frequencies, bins, nN, observationsPerTrial, sets);
    }

    /// <summary>exp(-2 pi i f s / fs) for s = 0..L-1, per frequency.</summary>
    private static Complex[][] Phasors(IReadOnlyList<double> frequencies, int length, double rate) =>
        frequencies.Select(f => Enumerable.Range(0, length)
            .Select(s => Complex.FromPolarCoordinates(1, -2 * Math.PI * f * s / rate)).ToArray()).ToArray();
}
