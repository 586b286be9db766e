using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;
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
/// 28:1178-1193. Its window mean is computed as the exact whole number Σ_t |Σ_n sign(Im X_n)| over N·T (one division),
/// so equal sign counts give equal values and surrogate ties are decided exactly.</item>
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
/// <para>Computation. The set is re-laid once (see <see cref="PairTables"/>, shared by all workspaces of the set) into
/// channel-contiguous rows: per time point and trial the real and imaginary parts (raw and unit-phasor) of all
/// channels, per trial and time point the envelope deviations. For one time point the cross sums of all pairs are the
/// upper triangle of the complex matrix product of the (channels x trials) block with the conjugate transpose of its
/// trial-permuted copy; because the second factor is permuted the product is not Hermitian, so S_ab is formed for
/// a &lt; b with b permuted. It is computed as a real, register-tiled product over split real/imaginary rows (tiles of
/// 4 x 8 pairs, vectors of four doubles, fused multiply-adds), only over tiles that hold a pair a &lt; b; the
/// permutation only chooses which row of the table the second factor reads, so no data is copied per draw. PLV and PPC
/// come from the unit-phasor product, coherence and imaginary coherency from the raw product. PLI, wPLI and debiased
/// wPLI² are not bilinear; they run the same tiling with a vector loop over the trials. AEC is, per trial, the same
/// kind of product of the envelope deviations over the time points, followed by a vectorised atanh; AEC-orth the
/// same tiling over the orthogonalised envelopes, with one-pass sums Σy, Σy², Σy·u for each Pearson r. Results equal
/// the definitions above up to rounding (about 1e-15 relative on unit-scale data; the tests allow 1e-12). Non-finite
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
        Prepare(workspace, permutation, values);
        var set = workspace.Set;
        int trials = set.TrialCount;
        if (workspace.NeedsPhase || workspace.NeedsCross)
        {
            for (int t = 0; t < set.TimeCount; t++)
                AddTimePoint(workspace, t, permutation);
            Extract(workspace, values, static (sum, scale) => sum * scale, 1.0 / set.TimeCount, envelope: false);
        }
        if (workspace.NeedsEnvelope)
        {
            if (workspace.Tables.TrialPairs is { } table)
            {
                AddEnvelopeFromTable(workspace, table, permutation, values);
                return;
            }
            for (int n = 0; n < trials; n++)
                AddTrial(workspace, n, permutation[n]);
            Extract(workspace, values, static (sum, scale) => Math.Tanh(sum * scale), 1.0 / trials, envelope: true);
        }
    }

    /// <summary>
    /// Computes the envelope correlations of every trial pair (n, m) once (<see cref="TrialPairTable"/>) and attaches
    /// them to the workspace's tables, so that this workspace and its siblings add up table rows instead of computing
    /// trial pairs in every draw. Same values to the last bit.
    /// </summary>
    internal static void BuildTrialPairs(PairwiseWorkspace prototype, int? maxThreads, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(prototype);
        var envelope = EnvelopeSlots(prototype);
        int trials = prototype.Set.TrialCount, pairs = prototype.PairCount;
        var table = new TrialPairTable(trials, envelope.Length, pairs);
        prototype.Tables.TrialPairs = table;
        var options = new ParallelOptions { MaxDegreeOfParallelism = maxThreads ?? -1, CancellationToken = cancellationToken };
        Parallel.For(0, trials, options, () => prototype.CreateSibling(), (n, _, scratch) =>
        {
            for (int m = 0; m < trials; m++)
            {
                foreach (int k in envelope) scratch.Dense[k]!.Clear();
                AddTrial(scratch, n, m);
                for (int e = 0; e < envelope.Length; e++)
                    CopyPairs(scratch, scratch.Dense[envelope[e]]!, table.Row(n, m, e));
            }
            return scratch;
        }, _ => { });
    }

    /// <summary>Detaches and frees the trial-pair table of <paramref name="workspace"/>'s tables, if any.</summary>
    internal static void ReleaseTrialPairs(PairwiseWorkspace workspace)
    {
        ArgumentNullException.ThrowIfNull(workspace);
        var table = workspace.Tables.TrialPairs;
        workspace.Tables.TrialPairs = null;
        table?.Dispose();
    }

    /// <summary>sums[p] += row[p] for every p (elementwise, so the same bits as one addition at a time).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void AddInPlace(Span<double> sums, ReadOnlySpan<double> row)
    {
        int p = 0;
        for (; p <= sums.Length - Vector256<double>.Count; p += Vector256<double>.Count)
            (Vector256.Create(sums.Slice(p, Vector256<double>.Count)) + Vector256.Create(row.Slice(p, Vector256<double>.Count)))
                .CopyTo(sums.Slice(p, Vector256<double>.Count));
        for (; p < sums.Length; p++) sums[p] += row[p];
    }

    /// <summary>The output slots of the envelope measures, in slot order.</summary>
    private static int[] EnvelopeSlots(PairwiseWorkspace w) =>
        Enumerable.Range(0, w.Measures.Count).Where(k => IsEnvelope(w.Measures[k])).ToArray();

    /// <summary>Whether <paramref name="measure"/> reads the envelopes (AEC, AEC-orth: summed per trial, not per time point).</summary>
    internal static bool IsEnvelope(Measure measure) => MeasureCatalog.InputOf(measure).HasFlag(MeasureInput.Envelope);

    /// <summary>Copies the pairs a &lt; b of a dense sum array into the table, in <see cref="PairIndex"/> order.</summary>
    private static void CopyPairs(PairwiseWorkspace w, AlignedArray dense, Span<double> target)
    {
        int channels = w.Set.ChannelCount, stride = w.Tables.Stride, pair = 0;
        for (int a = 0; a < channels - 1; a++)
        {
            var source = dense.Slice((long)a * stride + a + 1, channels - a - 1);
            source.CopyTo(target.Slice(pair, source.Length));
            pair += source.Length;
        }
    }

    /// <summary>
    /// The envelope measures of one draw from the trial-pair table: per measure and pair, Σ_n atanh r(n, π(n)) in trial
    /// order, then tanh of the mean, as <see cref="Extract"/> does with sums computed on the spot.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void AddEnvelopeFromTable(PairwiseWorkspace w, TrialPairTable table, ReadOnlySpan<int> permutation, Span<double> values)
    {
        int pairs = w.PairCount, trials = table.Trials;
        double scale = 1.0 / trials;
        int e = 0;
        for (int k = 0; k < w.Measures.Count; k++)
        {
            if (!IsEnvelope(w.Measures[k])) continue;
            var sums = values.Slice(k * pairs, pairs);
            sums.Clear();
            for (int n = 0; n < trials; n++) AddInPlace(sums, table.Row(n, permutation[n], e));
            for (int p = 0; p < pairs; p++) sums[p] = Math.Tanh(sums[p] * scale);
            e++;
        }
    }

    /// <summary>
    /// <see cref="Compute"/> for several draws at once: <paramref name="values"/>[i] receives what
    /// <c>Compute(workspaces[i], permutations[i], values[i])</c> would, to the last bit. The draws go through the time
    /// points (and trials) together, so the rows of one time point are read from memory once and then from the cache
    /// for every draw.
    /// </summary>
    /// <param name="workspaces">One workspace per draw, all of the same set and measures (siblings).</param>
    /// <param name="permutations">One trial permutation per draw.</param>
    /// <param name="values">One output per draw, as for <see cref="Compute"/>.</param>
    /// <exception cref="ArgumentException">The spans differ in length, the workspaces are not of one set and measure
    /// list, or a permutation or output has the wrong length.</exception>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void ComputeTogether(ReadOnlySpan<PairwiseWorkspace> workspaces, ReadOnlySpan<int[]> permutations,
        ReadOnlySpan<double[]> values)
    {
        if (permutations.Length != workspaces.Length || values.Length != workspaces.Length)
            throw new ArgumentException("Expected one permutation and one output per workspace.", nameof(permutations));
        if (workspaces.Length == 0) return;
        var first = workspaces[0];
        for (int i = 0; i < workspaces.Length; i++)
        {
            var w = workspaces[i];
            ArgumentNullException.ThrowIfNull(w);
            if (!ReferenceEquals(w.Tables, first.Tables) || !w.Measures.SequenceEqual(first.Measures))
                throw new ArgumentException("The workspaces must be siblings (one set, one measure list).", nameof(workspaces));
            Prepare(w, permutations[i], values[i]);
        }
        var set = first.Set;
        if (first.NeedsPhase || first.NeedsCross)
        {
            for (int t = 0; t < set.TimeCount; t++)
                for (int i = 0; i < workspaces.Length; i++)
                    AddTimePoint(workspaces[i], t, permutations[i]);
            for (int i = 0; i < workspaces.Length; i++)
                Extract(workspaces[i], values[i], static (sum, scale) => sum * scale, 1.0 / set.TimeCount, envelope: false);
        }
        if (first.NeedsEnvelope && first.Tables.TrialPairs is { } table)
        {
            for (int i = 0; i < workspaces.Length; i++)
                AddEnvelopeFromTable(workspaces[i], table, permutations[i], values[i]);
        }
        else if (first.NeedsEnvelope)
        {
            for (int n = 0; n < set.TrialCount; n++)
                for (int i = 0; i < workspaces.Length; i++)
                    AddTrial(workspaces[i], n, permutations[i][n]);
            for (int i = 0; i < workspaces.Length; i++)
                Extract(workspaces[i], values[i], static (sum, scale) => Math.Tanh(sum * scale), 1.0 / set.TrialCount, envelope: true);
        }
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

    /// <summary>Checks one draw's permutation and output length, and clears its output and the workspace's sums.</summary>
    private static void Prepare(PairwiseWorkspace workspace, ReadOnlySpan<int> permutation, Span<double> values)
    {
        ArgumentNullException.ThrowIfNull(workspace);
        if (values.Length != workspace.OutputLength)
            throw new ArgumentException($"Expected {workspace.OutputLength} output values, got {values.Length}.", nameof(values));
        CheckPermutation(permutation, workspace.Set.TrialCount, workspace.Seen);
        values.Clear();
        foreach (var dense in workspace.Dense) dense?.Clear();
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

    /// <summary>Turns the dense per-slot sums into per-pair values: the mean over time points, or tanh of the mean atanh.</summary>
    private static void Extract(PairwiseWorkspace w, Span<double> values, Func<double, double, double> finish, double scale, bool envelope)
    {
        int channels = w.Set.ChannelCount, pairs = w.PairCount, stride = w.Tables.Stride;
        // The PLI sums hold Σ_t |Σ_n sign(Im X_n)|, a whole number below 2^53 and so exact in a double: the value is
        // that count over N·T, one correctly rounded division, so equal counts give equal values (exact ties).
        double signCounts = (double)w.Set.TrialCount * w.Set.TimeCount;
        for (int k = 0; k < w.Measures.Count; k++)
        {
            bool isEnvelope = IsEnvelope(w.Measures[k]);
            if (isEnvelope != envelope) continue;
            bool counts = w.Measures[k] == Measure.Pli;
            var dense = w.Dense[k]!;
            var slice = values.Slice(k * pairs, pairs);
            int pair = 0;
            for (int a = 0; a < channels - 1; a++)
            {
                var row = dense.Slice((long)a * stride, stride);
                for (int b = a + 1; b < channels; b++, pair++)
                    slice[pair] = counts ? row[b] / signCounts : finish(row[b], scale);
            }
        }
    }

    /// <summary>Adds the per-time-point values of time point <paramref name="t"/> to the dense sums.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void AddTimePoint(PairwiseWorkspace w, int t, ReadOnlySpan<int> permutation)
    {
        var tables = w.Tables;
        int channels = tables.Channels, stride = tables.Stride, trials = tables.Trials;
        long timeBase = (long)t * trials * stride;
        double count = trials;
        var slot = w.Slot;
        Vectors24 sums = default;
        long sliceLength = (long)trials * stride;
        bool prefetch = t + 1 < tables.Times;
        if (w.NeedsPhase)
        {
            if (prefetch && !WideTileKernels.Enabled)
            {
                tables.UnitRe!.Prefetch(timeBase + sliceLength, sliceLength);
                tables.UnitIm!.Prefetch(timeBase + sliceLength, sliceLength);
            }
            var plv = w.DenseOf(Measure.Plv);
            var ppc = w.DenseOf(Measure.Ppc);
            var inverseCount = Vector256.Create(1 / count);
            var countVector = Vector256.Create(count);
            var ppcScale = Vector256.Create(trials < 2 ? double.NaN : 1 / (count * (count - 1)));
            ref double re = ref tables.UnitRe!.Start;
            ref double im = ref tables.UnitIm!.Start;
            if (WideTileKernels.Enabled)
            {
                Wide16 wide = default;
                var inverseCount8 = Vector512.Create(1 / count);
                var countVector8 = Vector512.Create(count);
                var ppcScale8 = Vector512.Create(trials < 2 ? double.NaN : 1 / (count * (count - 1)));
                for (int b0 = 0; b0 < channels; b0 += WideTileKernels.Columns)
                    for (int a0 = 0; a0 < Math.Min(b0 + WideTileKernels.Columns, channels) - 1; a0 += WideTileKernels.ComplexRows)
                    {
                        // The diagonal tile of each column block reads every row's line of those columns in trial order: it
                        // asks for the same lines of the next time point (see the tile).
                        nint ahead = prefetch && a0 == b0 ? (nint)sliceLength : 0;
                        WideTileKernels.ComplexMagnitudeTile(ref re, ref im, timeBase, stride, permutation, a0, b0, ahead, ref wide);
                        for (int r = 0; r < WideTileKernels.ComplexRows; r++)
                        {
                            var real = wide[r];
                            var imaginary = wide[8 + r];
                            var squared = real * real + imaginary * imaginary;
                            nuint offset = (nuint)((a0 + r) * stride + b0);
                            if (plv is not null) AddTo(plv, offset, Vector512.Sqrt(squared) * inverseCount8);
                            if (ppc is not null) AddTo(ppc, offset, (squared - countVector8) * ppcScale8);
                        }
                    }
            }
            else
            for (int b0 = 0; b0 < channels; b0 += TileKernels.ComplexColumns)
                for (int a0 = 0; a0 < Math.Min(b0 + TileKernels.ComplexColumns, channels) - 1; a0 += TileKernels.ComplexRows)
                {
                    TileKernels.ComplexMagnitudeTile(ref re, ref im, timeBase, stride, permutation, a0, b0, ref sums);
                    for (int r = 0; r < TileKernels.ComplexRows; r++)
                        for (int v = 0; v < 2; v++)
                        {
                            int i = 2 * r + v;
                            var real = sums[i];
                            var imaginary = sums[8 + i];
                            var squared = real * real + imaginary * imaginary;
                            nuint offset = (nuint)((a0 + r) * stride + b0 + 4 * v);
                            if (plv is not null) AddTo(plv, offset, Vector256.Sqrt(squared) * inverseCount);
                            if (ppc is not null) AddTo(ppc, offset, (squared - countVector) * ppcScale);
                        }
                }
        }
        if (w.NeedsCross)
        {
            if (prefetch && !WideTileKernels.Enabled)
            {
                tables.RawRe!.Prefetch(timeBase + sliceLength, sliceLength);
                tables.RawIm!.Prefetch(timeBase + sliceLength, sliceLength);
            }
            var coherence = w.DenseOf(Measure.Coherence);
            var imag = w.DenseOf(Measure.ImagCoherency);
            ref double re = ref tables.RawRe!.Start;
            ref double im = ref tables.RawIm!.Start;
            ref double weight = ref tables.InverseRootPower!.Start;
            nint weightBase = (nint)t * stride;
            if ((coherence is not null || imag is not null) && WideTileKernels.Enabled)
            {
                Wide24 wide = default;
                for (int b0 = 0; b0 < channels; b0 += WideTileKernels.Columns)
                    for (int a0 = 0; a0 < Math.Min(b0 + WideTileKernels.Columns, channels) - 1; a0 += WideTileKernels.ComplexRows)
                    {
                        nint ahead = prefetch && a0 == b0 ? (nint)sliceLength : 0;
                        WideTileKernels.ComplexTile(ref re, ref im, timeBase, stride, permutation, a0, b0, ahead, ref wide);
                        var weightB = Vector512.LoadUnsafe(ref weight, (nuint)(weightBase + b0));
                        for (int r = 0; r < WideTileKernels.ComplexRows; r++)
                        {
                            var real = wide[r];
                            var imaginary = wide[8 + r] - wide[16 + r];
                            var both = Vector512.Create(Unsafe.Add(ref weight, weightBase + a0 + r)) * weightB;
                            nuint offset = (nuint)((a0 + r) * stride + b0);
                            if (coherence is not null) AddTo(coherence, offset, (real * real + imaginary * imaginary) * (both * both));
                            if (imag is not null) AddTo(imag, offset, imaginary * both);
                        }
                    }
            }
            else if (coherence is not null || imag is not null)
                for (int b0 = 0; b0 < channels; b0 += TileKernels.ComplexColumns)
                    for (int a0 = 0; a0 < Math.Min(b0 + TileKernels.ComplexColumns, channels) - 1; a0 += TileKernels.ComplexRows)
                    {
                        TileKernels.ComplexTile(ref re, ref im, timeBase, stride, permutation, a0, b0, ref sums);
                        for (int r = 0; r < TileKernels.ComplexRows; r++)
                        {
                            var weightA = Vector256.Create(Unsafe.Add(ref weight, weightBase + a0 + r));
                            for (int v = 0; v < 2; v++)
                            {
                                int i = 2 * r + v;
                                var real = sums[i];
                                var imaginary = sums[8 + i] - sums[16 + i];
                                var both = weightA * Vector256.LoadUnsafe(ref weight, (nuint)(weightBase + b0 + 4 * v));
                                nuint offset = (nuint)((a0 + r) * stride + b0 + 4 * v);
                                if (coherence is not null) AddTo(coherence, offset, (real * real + imaginary * imaginary) * (both * both));
                                if (imag is not null) AddTo(imag, offset, imaginary * both);
                            }
                        }
                    }
            if (w.NeedsLag)
                AddLag(w, ref re, ref im, timeBase, permutation, prefetch ? (nint)sliceLength : 0);
        }
    }

    private static void AddLag(PairwiseWorkspace w, ref double re, ref double im, long timeBase, ReadOnlySpan<int> permutation, nint ahead)
    {
        bool signs = w.DenseOf(Measure.Pli) is not null, squares = w.DenseOf(Measure.WpliDebiased) is not null;
        bool sum = squares || w.DenseOf(Measure.Wpli) is not null;
        if (squares) { if (signs) AddLag<LagAll>(w, ref re, ref im, timeBase, permutation, ahead); else AddLag<LagSumSquares>(w, ref re, ref im, timeBase, permutation, ahead); }
        else if (sum) { if (signs) AddLag<LagSumSigns>(w, ref re, ref im, timeBase, permutation, ahead); else AddLag<LagSum>(w, ref re, ref im, timeBase, permutation, ahead); }
        else AddLag<LagSigns>(w, ref re, ref im, timeBase, permutation, ahead);
    }

    /// <summary>The lag measures of one time point, with the tile forming only the sums they need.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void AddLag<TSums>(PairwiseWorkspace w, ref double re, ref double im, long timeBase, ReadOnlySpan<int> permutation, nint ahead)
        where TSums : struct, ILagSums
    {
        var tables = w.Tables;
        int channels = tables.Channels, stride = tables.Stride;
        var pli = w.DenseOf(Measure.Pli);
        var wpli = w.DenseOf(Measure.Wpli);
        var debiased = w.DenseOf(Measure.WpliDebiased);
        if (WideTileKernels.Enabled)
        {
            Wide16 wide = default;
            for (int b0 = 0; b0 < channels; b0 += WideTileKernels.Columns)
                for (int a0 = 0; a0 < Math.Min(b0 + WideTileKernels.Columns, channels) - 1; a0 += WideTileKernels.LagRows)
                {
                    WideTileKernels.LagTile<TSums>(ref re, ref im, timeBase, stride, permutation, a0, b0, a0 == b0 ? ahead : 0, ref wide);
                    for (int r = 0; r < WideTileKernels.LagRows; r++)
                    {
                        // The finishing is per tile, not per trial: two halves through the four-wide form cost little.
                        nuint offset = (nuint)((a0 + r) * stride + b0);
                        AddLagSums(pli, wpli, debiased, offset, wide[r].GetLower(), wide[4 + r].GetLower(), wide[8 + r].GetLower(), wide[12 + r].GetLower());
                        AddLagSums(pli, wpli, debiased, offset + 4, wide[r].GetUpper(), wide[4 + r].GetUpper(), wide[8 + r].GetUpper(), wide[12 + r].GetUpper());
                    }
                }
            return;
        }
        Vectors16 sums = default;
        for (int b0 = 0; b0 < channels; b0 += TileKernels.LagColumns)
            for (int a0 = 0; a0 < Math.Min(b0 + TileKernels.LagColumns, channels) - 1; a0 += TileKernels.LagRows)
            {
                TileKernels.LagTile<TSums>(ref re, ref im, timeBase, stride, permutation, a0, b0, ref sums);
                for (int i = 0; i < 4; i++)
                {
                    int r = i / 2, v = i % 2;
                    AddLagSums(pli, wpli, debiased, (nuint)((a0 + r) * stride + b0 + 4 * v), sums[i], sums[4 + i], sums[8 + i], sums[12 + i]);
                }
            }
    }

    /// <summary>
    /// Adds one vector of pairs' lag measures of one time point from their sums: Σ Im X_n, Σ |Im X_n|, Σ (Im X_n)² and
    /// Σ sign(Im X_n). A NaN term makes the absolute sum NaN; then every lag measure is NaN. Where the absolute sum is
    /// 0 (no nonzero imaginary part) wPLI is 0, which is the absolute sum itself. PLI: the whole-number sign count
    /// |Σ_n sign(Im X_n)| of this time point is added as it is, so the sum over time points stays an exact integer (no
    /// 1/N rounding that depends on the order).
    /// </summary>
    private static void AddLagSums(AlignedArray? pli, AlignedArray? wpli, AlignedArray? debiased, nuint offset,
        Vector256<double> sum, Vector256<double> absolute, Vector256<double> squares, Vector256<double> sign)
    {
        if (pli is not null)
            AddTo(pli, offset, Vector256.ConditionalSelect(Vector256.Equals(absolute, absolute), Vector256.Abs(sign), absolute));
        if (wpli is not null)
            AddTo(wpli, offset, Vector256.ConditionalSelect(Vector256.GreaterThan(absolute, Vector256<double>.Zero), Vector256.Abs(sum) / absolute, absolute));
        if (debiased is not null)
        {
            var denominator = absolute * absolute - squares;
            AddTo(debiased, offset, Vector256.ConditionalSelect(Vector256.GreaterThan(denominator, Vector256<double>.Zero),
                (sum * sum - squares) / denominator,
                Vector256.ConditionalSelect(Vector256.Equals(denominator, denominator), Vector256<double>.Zero, denominator)));
        }
    }

    /// <summary>Adds the Fisher-transformed per-trial correlations of trial <paramref name="trial"/> (channel a) with trial <paramref name="partner"/> (channel b).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void AddTrial(PairwiseWorkspace w, int trial, int partner)
    {
        var tables = w.Tables;
        int channels = tables.Channels, stride = tables.Stride, times = tables.Times;
        nint xBase = (nint)trial * times * stride, yBase = (nint)partner * times * stride;
        Vectors24 sums = default;
        var aec = w.DenseOf(Measure.Aec);
        var orth = w.DenseOf(Measure.AecOrth);
        ref double u = ref tables.Deviation!.Start;
        if (aec is not null)
            for (int b0 = 0; b0 < channels; b0 += TileKernels.DotColumns)
                for (int a0 = 0; a0 < Math.Min(b0 + TileKernels.DotColumns, channels) - 1; a0 += TileKernels.DotRows)
                {
                    TileKernels.DotTile(ref u, xBase + a0, yBase + b0, stride, times, ref sums);
                    for (int i = 0; i < 8; i++)
                        AddTo(aec, (nuint)((a0 + i / 2) * stride + b0 + 4 * (i % 2)), FisherZ(sums[i]));
                }
        if (orth is not null)
        {
            ref double re = ref tables.EnvelopeRe!.Start;
            ref double im = ref tables.EnvelopeIm!.Start;
            ref double inverse = ref tables.InverseEnvelope!.Start;
            var inverseTimes = Vector256.Create(1.0 / times);
            var half = Vector256.Create(0.5);
            for (int b0 = 0; b0 < channels; b0 += TileKernels.OrthogonalColumns)
                for (int a0 = 0; a0 < Math.Min(b0 + TileKernels.OrthogonalColumns, channels) - 1; a0 += TileKernels.OrthogonalRows)
                {
                    TileKernels.OrthogonalTile(ref re, ref im, ref inverse, ref u, xBase + a0, yBase + b0, stride, times, ref sums);
                    for (int r = 0; r < TileKernels.OrthogonalRows; r++)
                    {
                        var rab = Correlation(sums[6 * r], sums[6 * r + 1], sums[6 * r + 2], inverseTimes);
                        var rba = Correlation(sums[6 * r + 3], sums[6 * r + 4], sums[6 * r + 5], inverseTimes);
                        AddTo(orth, (nuint)((a0 + r) * stride + b0), FisherZ(half * (rab + rba)));
                    }
                }
        }
    }

    /// <summary>
    /// Pearson r of a series with a unit-norm, zero-mean one from Σy, Σy² and Σy·u: Σy·u / sqrt(Σy² − (Σy)²/T); 0 when
    /// that variance is not positive, NaN when it is NaN.
    /// </summary>
    private static Vector256<double> Correlation(Vector256<double> sum, Vector256<double> squares, Vector256<double> cross,
        Vector256<double> inverseTimes)
    {
        var variance = squares - sum * sum * inverseTimes;
        return Vector256.ConditionalSelect(Vector256.GreaterThan(variance, Vector256<double>.Zero),
            cross / Vector256.Sqrt(variance),
            Vector256.ConditionalSelect(Vector256.Equals(variance, variance), Vector256<double>.Zero, variance));
    }

    /// <summary>atanh of r clamped to ±<see cref="FisherClamp"/>, as ½·log((1 + r)/(1 − r)); NaN stays NaN.</summary>
    private static Vector256<double> FisherZ(Vector256<double> r)
    {
        var bound = Vector256.Create(FisherClamp);
        var clamped = Vector256.Min(Vector256.Max(r, -bound), bound);
        var one = Vector256.Create(1.0);
        var z = Vector256.Create(0.5) * Vector256.Log((one + clamped) / (one - clamped));
        return Vector256.ConditionalSelect(Vector256.Equals(r, r), z, r);
    }

    private static void AddTo(AlignedArray dense, nuint offset, Vector256<double> value)
    {
        ref double start = ref dense.Start;
        (Vector256.LoadUnsafe(ref start, offset) + value).StoreUnsafe(ref start, offset);
    }

    private static void AddTo(AlignedArray dense, nuint offset, Vector512<double> value)
    {
        ref double start = ref dense.Start;
        (Vector512.LoadUnsafe(ref start, offset) + value).StoreUnsafe(ref start, offset);
    }

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
