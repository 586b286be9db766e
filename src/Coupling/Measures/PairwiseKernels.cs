using Coupling.Spectral;

namespace Coupling.Measures;

/// <summary>
/// All measures for all channel pairs of a <see cref="NarrowbandSet"/> at once, with an optional trial permutation of
/// the second channel of every pair (for trial-shuffle surrogates).
/// </summary>
/// <remarks>
/// <para>Notation. For the pair (a, b), a &lt; b, trials n = 1..N, time point t, and a permutation π of the trials
/// (the identity for observed values), X_n = z_a,n · conj(z_b,π(n)). Every per-time-point measure is summarised over
/// the window as the mean over the set's time points of its per-time-point value.</para>
/// <list type="bullet">
/// <item><b>PLV</b>(t) = |(1/N) Σ_n u_n| with unit phasors u_n = X_n/|X_n|; a trial where either amplitude is exactly
/// zero has no phase and contributes u_n = 0 (N is not reduced). Lachaux, Rodriguez, Martinerie, Varela (1999),
/// Hum Brain Mapp 8:194-208.</item>
/// <item><b>PPC</b>(t) = (|Σ_n u_n|² − N) / (N(N−1)) = (N·PLV² − 1)/(N − 1), the unbiased estimator of PLV² (the mean
/// of cos of the phase-difference differences over all pairs of trials); NaN when N &lt; 2. Vinck, van Wingerden,
/// Womelsdorf, Fries, Pennartz (2010), NeuroImage 51:112-122.</item>
/// <item><b>PLI</b>(t) = |(1/N) Σ_n sign(Im X_n)|, sign(0) = 0. Stam, Nolte, Daffertshofer (2007), Hum Brain Mapp
/// 28:1178-1193.</item>
/// <item><b>wPLI</b>(t) = |Σ_n Im X_n| / Σ_n |Im X_n|, and 0 when the denominator is 0. Vinck, Oostenveld,
/// van Wingerden, Battaglia, Pennartz (2011), NeuroImage 55:1548-1565.</item>
/// <item><b>debiased wPLI²</b>(t) = ((Σ_n Im X_n)² − Σ_n (Im X_n)²) / ((Σ_n |Im X_n|)² − Σ_n (Im X_n)²), and 0 when
/// the denominator is 0 (fewer than two trials with a nonzero imaginary part). Vinck et al. (2011), the debiased
/// estimator of the squared wPLI.</item>
/// <item><b>coherence</b>(t) = |Σ_n X_n|² / (Σ_n |z_a,n|² · Σ_n |z_b,n|²), magnitude-squared coherence across trials;
/// 0 when either power is 0.</item>
/// <item><b>imag-coherency</b>(t) = Im(Σ_n X_n) / sqrt(Σ_n |z_a,n|² · Σ_n |z_b,n|²), signed; 0 when either power is
/// 0. Nolte, Bai, Wheaton, Mari, Vorbach, Hallett (2004), Clin Neurophysiol 115:2292-2307.</item>
/// <item><b>AEC</b>: in each trial n, r_n = Pearson correlation over the window's time points of |z_a,n(t)| and
/// |z_b,π(n)(t)|; combined by Fisher's z: tanh(mean_n atanh(r_n)), with r_n clamped to ±(1 − 1e-12) before atanh so
/// that a perfect correlation gives a finite mean. A constant envelope (zero variance) gives r_n = 0.</item>
/// <item><b>AEC-orth</b>: per time point, b orthogonalised to a, y(t) = Im(z_b(t) · conj(z_a(t)) / |z_a(t)|) (0 where
/// |z_a(t)| = 0); r_ab = Pearson(|y|, |z_a|); likewise a orthogonalised to b gives r_ba = Pearson(|x|, |z_b|); r_n =
/// (r_ab + r_ba)/2, then Fisher-combined across trials as for AEC; zero variance gives r = 0. Exact copies
/// (b = c·a) give an orthogonalised signal that is zero only up to rounding: with c a power of two it is exactly zero
/// and AEC-orth is 0; otherwise it is rounding noise and the value carries no meaning. Hipp, Hawellek, Corbetta,
/// Siegel, Engel (2012), Nat Neurosci 15:884-890.</item>
/// </list>
/// <para>Computation. Per time point the channels x trials block is copied once into split real/imaginary rows (raw
/// and unit-phasor, and the same with the trials of every row permuted); each pair is then a tight loop over two
/// contiguous rows, i.e. the upper triangle of the Hermitian product of the (channels x trials) block with the
/// conjugate transpose of its permuted copy. Because the second factor is permuted the product is not Hermitian, so
/// S_ab is formed for a &lt; b with b permuted. One loop over the raw rows feeds coherence, imaginary coherency, PLI,
/// wPLI and debiased wPLI². Envelope rows are built once per set (see <see cref="PairwiseWorkspace"/>). Non-finite
/// input gives NaN.</para>
/// </remarks>
public static class PairwiseKernels
{
    /// <summary>Bound applied to each Pearson r before atanh in the Fisher combination.</summary>
    public const double FisherClamp = 1 - 1e-12;

    /// <summary>
    /// Computes every measure of <paramref name="workspace"/> for every pair, with the trials of the second channel of
    /// each pair taken in the order <paramref name="permutation"/>.
    /// </summary>
    /// <param name="workspace">Workspace sized for the set and measures.</param>
    /// <param name="permutation">A permutation of 0..N−1: trial n of channel a meets trial permutation[n] of channel b.</param>
    /// <param name="values">Output, length measures x pairs, laid out [measure slot][pair in <see cref="PairIndex"/> order].</param>
    /// <exception cref="ArgumentException">The permutation or the output has the wrong length, or the permutation is not one.</exception>
    public static void Compute(PairwiseWorkspace workspace, ReadOnlySpan<int> permutation, Span<double> values)
    {
        ArgumentNullException.ThrowIfNull(workspace);
        var set = workspace.Set;
        int trials = set.TrialCount;
        if (values.Length != workspace.OutputLength)
            throw new ArgumentException($"Expected {workspace.OutputLength} output values, got {values.Length}.", nameof(values));
        CheckPermutation(permutation, trials, workspace.Seen);

        values.Clear();
        if (workspace.NeedsPhase || workspace.NeedsCross)
        {
            for (int t = 0; t < set.TimeCount; t++)
                AddTimePoint(workspace, set.Block(t), permutation, values);
            double inverseTimes = 1.0 / set.TimeCount;
            foreach (var measure in workspace.Measures)
            {
                if (measure is Measure.Aec or Measure.AecOrth) continue;
                var slice = values.Slice(workspace.Slot[(int)measure] * workspace.PairCount, workspace.PairCount);
                for (int p = 0; p < slice.Length; p++) slice[p] *= inverseTimes;
            }
        }
        if (workspace.NeedsEnvelope)
            AddEnvelopeMeasures(workspace, permutation, values);
    }

    /// <summary>
    /// Convenience: every measure in <paramref name="measures"/> for every pair with the trials in their own order
    /// (the observed values). Allocates a workspace; result[k][pair] holds measures[k].
    /// </summary>
    public static double[][] ComputeObserved(NarrowbandSet set, IReadOnlyList<Measure> measures)
    {
        var workspace = new PairwiseWorkspace(set, measures);
        var identity = new int[set.TrialCount];
        for (int n = 0; n < identity.Length; n++) identity[n] = n;
        var flat = new double[workspace.OutputLength];
        Compute(workspace, identity, flat);
        var result = new double[measures.Count][];
        for (int k = 0; k < measures.Count; k++)
            result[k] = flat.AsSpan(k * workspace.PairCount, workspace.PairCount).ToArray();
        return result;
    }

    private static void CheckPermutation(ReadOnlySpan<int> permutation, int trials, bool[] seen)
    {
        if (permutation.Length != trials)
            throw new ArgumentException($"Expected a permutation of {trials} trials, got {permutation.Length} entries.", nameof(permutation));
        Array.Clear(seen);
        foreach (int n in permutation)
        {
            if ((uint)n >= (uint)trials || seen[n])
                throw new ArgumentException($"Not a permutation of 0..{trials - 1}.", nameof(permutation));
            seen[n] = true;
        }
    }

    private static void AddTimePoint(PairwiseWorkspace w, ReadOnlySpan<System.Numerics.Complex> block,
        ReadOnlySpan<int> permutation, Span<double> values)
    {
        int channels = w.Set.ChannelCount, trials = w.Set.TrialCount, pairs = w.PairCount;
        int[] slot = w.Slot;

        // One pass over the block: split rows, unit phasors, powers; the same rows with trials permuted.
        for (int c = 0; c < channels; c++)
        {
            int row = c * trials;
            double power = 0;
            for (int n = 0; n < trials; n++)
            {
                var z = block[row + n];
                var zp = block[row + permutation[n]];
                if (w.NeedsCross)
                {
                    w.RawRe[row + n] = z.Real; w.RawIm[row + n] = z.Imaginary;
                    w.RawRePermuted[row + n] = zp.Real; w.RawImPermuted[row + n] = zp.Imaginary;
                    power += z.Real * z.Real + z.Imaginary * z.Imaginary;
                }
                if (w.NeedsPhase)
                {
                    Unit(z, out w.UnitRe[row + n], out w.UnitIm[row + n]);
                    Unit(zp, out w.UnitRePermuted[row + n], out w.UnitImPermuted[row + n]);
                }
            }
            if (w.NeedsCross) w.Power[c] = power;
        }

        int plv = slot[(int)Measure.Plv], ppc = slot[(int)Measure.Ppc], pli = slot[(int)Measure.Pli];
        int wpli = slot[(int)Measure.Wpli], debiased = slot[(int)Measure.WpliDebiased];
        int coherence = slot[(int)Measure.Coherence], imag = slot[(int)Measure.ImagCoherency];
        double count = trials;
        double ppcScale = 1.0 / (count * (count - 1));

        int pair = 0;
        for (int a = 0; a < channels - 1; a++)
        {
            int rowA = a * trials;
            for (int b = a + 1; b < channels; b++, pair++)
            {
                int rowB = b * trials;
                if (w.NeedsPhase)
                {
                    DotConjugate(w.UnitRe.AsSpan(rowA, trials), w.UnitIm.AsSpan(rowA, trials),
                        w.UnitRePermuted.AsSpan(rowB, trials), w.UnitImPermuted.AsSpan(rowB, trials),
                        out double sr, out double si);
                    double squared = sr * sr + si * si;
                    if (plv >= 0) values[plv * pairs + pair] += Math.Sqrt(squared) / count;
                    if (ppc >= 0) values[ppc * pairs + pair] += trials < 2 ? double.NaN : (squared - count) * ppcScale;
                }
                if (w.NeedsCross)
                {
                    var aRe = w.RawRe.AsSpan(rowA, trials);
                    var aIm = w.RawIm.AsSpan(rowA, trials);
                    var bRe = w.RawRePermuted.AsSpan(rowB, trials);
                    var bIm = w.RawImPermuted.AsSpan(rowB, trials);
                    double cr, ci;
                    if (w.NeedsLag)
                    {
                        CrossAndLag(aRe, aIm, bRe, bIm, out cr, out ci, out double signSum, out double absSum, out double squareSum);
                        if (pli >= 0) values[pli * pairs + pair] += Math.Abs(signSum) / count;
                        if (wpli >= 0) values[wpli * pairs + pair] += absSum > 0 ? Math.Abs(ci) / absSum : (double.IsNaN(absSum) ? double.NaN : 0);
                        if (debiased >= 0)
                        {
                            double denominator = absSum * absSum - squareSum;
                            values[debiased * pairs + pair] += denominator > 0
                                ? (ci * ci - squareSum) / denominator
                                : (double.IsNaN(denominator) ? double.NaN : 0);
                        }
                    }
                    else
                    {
                        DotConjugate(aRe, aIm, bRe, bIm, out cr, out ci);
                    }
                    double powers = w.Power[a] * w.Power[b];
                    if (coherence >= 0)
                        values[coherence * pairs + pair] += powers > 0 ? (cr * cr + ci * ci) / powers : (double.IsNaN(powers) ? double.NaN : 0);
                    if (imag >= 0)
                        values[imag * pairs + pair] += powers > 0 ? ci / Math.Sqrt(powers) : (double.IsNaN(powers) ? double.NaN : 0);
                }
            }
        }
    }

    private static void Unit(System.Numerics.Complex z, out double re, out double im)
    {
        double magnitude = Math.Sqrt(z.Real * z.Real + z.Imaginary * z.Imaginary);
        if (magnitude > 0) { re = z.Real / magnitude; im = z.Imaginary / magnitude; }
        else if (magnitude == 0) { re = 0; im = 0; }
        else { re = double.NaN; im = double.NaN; }
    }

    /// <summary>Σ x_n · conj(y_n) over two split complex rows.</summary>
    private static void DotConjugate(ReadOnlySpan<double> xRe, ReadOnlySpan<double> xIm,
        ReadOnlySpan<double> yRe, ReadOnlySpan<double> yIm, out double re, out double im)
    {
        double sr = 0, si = 0;
        for (int n = 0; n < xRe.Length; n++)
        {
            sr += xRe[n] * yRe[n] + xIm[n] * yIm[n];
            si += xIm[n] * yRe[n] - xRe[n] * yIm[n];
        }
        re = sr; im = si;
    }

    /// <summary>Σ X_n, Σ sign(Im X_n), Σ |Im X_n| and Σ (Im X_n)² with X_n = x_n · conj(y_n), in one loop.</summary>
    private static void CrossAndLag(ReadOnlySpan<double> xRe, ReadOnlySpan<double> xIm,
        ReadOnlySpan<double> yRe, ReadOnlySpan<double> yIm,
        out double re, out double im, out double signSum, out double absSum, out double squareSum)
    {
        double sr = 0, si = 0, sign = 0, abs = 0, square = 0;
        for (int n = 0; n < xRe.Length; n++)
        {
            // Two rounded products, no fused multiply-add: for an exact copy y = c·x (c a power of two, or c = 1 in a
            // duplicated channel) the two products are equal and Im X_n is exactly 0, so sign(Im X_n) = 0 and PLI is 0.
            // A fused form would leave the rounding error of one product, whose sign is arbitrary.
            double imaginary = xIm[n] * yRe[n] - xRe[n] * yIm[n];
            sr += xRe[n] * yRe[n] + xIm[n] * yIm[n];
            si += imaginary;
            sign += imaginary > 0 ? 1 : imaginary < 0 ? -1 : imaginary == 0 ? 0 : double.NaN;
            abs += Math.Abs(imaginary);
            square += imaginary * imaginary;
        }
        re = sr; im = si; signSum = sign; absSum = abs; squareSum = square;
    }

    private static void AddEnvelopeMeasures(PairwiseWorkspace w, ReadOnlySpan<int> permutation, Span<double> values)
    {
        var tables = w.Tables!;
        int channels = w.Set.ChannelCount, trials = w.Set.TrialCount, times = w.Set.TimeCount, pairs = w.PairCount;
        int aec = w.Slot[(int)Measure.Aec], orth = w.Slot[(int)Measure.AecOrth];
        var unit = tables.UnitDeviation;
        for (int n = 0; n < trials; n++)
        {
            int baseA = n * tables.Stride, baseB = permutation[n] * tables.Stride;
            int pair = 0;
            for (int a = 0; a < channels - 1; a++)
            {
                int rowA = baseA + a * times;
                var unitA = unit.AsSpan(rowA, times);
                for (int b = a + 1; b < channels; b++, pair++)
                {
                    int rowB = baseB + b * times;
                    var unitB = unit.AsSpan(rowB, times);
                    if (aec >= 0)
                        values[aec * pairs + pair] += FisherZ(Dot(unitA, unitB));
                    if (orth >= 0)
                        values[orth * pairs + pair] += FisherZ(OrthogonalizedCorrelation(tables, rowA, rowB, unitA, unitB, w.OrthA, w.OrthB));
                }
            }
        }
        if (aec >= 0) FinishFisher(values.Slice(aec * pairs, pairs), trials);
        if (orth >= 0) FinishFisher(values.Slice(orth * pairs, pairs), trials);
    }

    /// <summary>Turns sums of atanh(r_n) over the trials into tanh of their mean.</summary>
    private static void FinishFisher(Span<double> sums, int trials)
    {
        for (int p = 0; p < sums.Length; p++) sums[p] = Math.Tanh(sums[p] / trials);
    }

    /// <summary>(r_ab + r_ba)/2 of one trial: see the type's remarks.</summary>
    private static double OrthogonalizedCorrelation(EnvelopeTables tables, int rowA, int rowB,
        ReadOnlySpan<double> unitA, ReadOnlySpan<double> unitB, double[] orthA, double[] orthB)
    {
        int times = tables.Times;
        var re = tables.Re!; var im = tables.Im!; var envelope = tables.Envelope;
        // y: |b orthogonalised to a|, paired with |z_a|; x: |a orthogonalised to b|, paired with |z_b|.
        var y = orthA.AsSpan(0, times);
        var x = orthB.AsSpan(0, times);
        for (int t = 0; t < times; t++)
        {
            double q = Math.Abs(im[rowB + t] * re[rowA + t] - re[rowB + t] * im[rowA + t]);
            double envA = envelope[rowA + t], envB = envelope[rowB + t];
            y[t] = envA > 0 ? q / envA : (envA == 0 ? 0 : double.NaN);
            x[t] = envB > 0 ? q / envB : (envB == 0 ? 0 : double.NaN);
        }
        return 0.5 * (CorrelationWithUnit(y, unitA) + CorrelationWithUnit(x, unitB));
    }

    /// <summary>Pearson r of <paramref name="values"/> with a row already centred and scaled to unit norm.</summary>
    private static double CorrelationWithUnit(ReadOnlySpan<double> values, ReadOnlySpan<double> unit)
    {
        double mean = 0;
        for (int t = 0; t < values.Length; t++) mean += values[t];
        mean /= values.Length;
        double cross = 0, squares = 0;
        for (int t = 0; t < values.Length; t++)
        {
            double d = values[t] - mean;
            cross += d * unit[t];
            squares += d * d;
        }
        if (squares > 0) return cross / Math.Sqrt(squares);
        return double.IsNaN(squares) ? double.NaN : 0;
    }

    private static double Dot(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        double sum = 0;
        for (int t = 0; t < x.Length; t++) sum += x[t] * y[t];
        return sum;
    }

    private static double FisherZ(double r) => Math.Atanh(Math.Clamp(r, -FisherClamp, FisherClamp));

    /// <summary>
    /// Writes (x − mean(x)) / ‖x − mean(x)‖ into <paramref name="unit"/>; all zeros when x is constant, NaN when x
    /// holds NaN.
    /// </summary>
    internal static void CentreAndNormalise(ReadOnlySpan<double> x, Span<double> unit)
    {
        double mean = 0;
        for (int t = 0; t < x.Length; t++) mean += x[t];
        mean /= x.Length;
        double squares = 0;
        for (int t = 0; t < x.Length; t++)
        {
            double d = x[t] - mean;
            unit[t] = d;
            squares += d * d;
        }
        if (squares > 0)
        {
            double scale = 1 / Math.Sqrt(squares);
            for (int t = 0; t < x.Length; t++) unit[t] *= scale;
        }
        else if (!double.IsNaN(squares))
        {
            unit.Clear();
        }
    }
}
