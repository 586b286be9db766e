using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;

namespace Coupling.Statistics;

/// <summary>
/// Permutation test of a difference in connectivity between two conditions, for every measure and channel pair: the
/// statistic is Δ = value in A − value in B of the window-summarised measure; its null distribution comes from pooling
/// the trials of both conditions and reassigning the condition labels at random, keeping the group sizes N_A and N_B.
/// </summary>
/// <remarks>
/// <para>Under the null hypothesis that the trials of A and B are exchangeable (the same distribution of trial data in
/// both conditions), every split of the pooled trials into groups of N_A and N_B is as likely as the observed one, so
/// the observed Δ is one draw from the distribution of Δ over the splits (Maris and Oostenveld 2007, "Nonparametric
/// statistical testing of EEG- and MEG-data", J Neurosci Methods 164:177-190; Nichols and Holmes 2002, "Nonparametric
/// permutation tests for functional neuroimaging: a primer with examples", Hum Brain Mapp 15:1-25). Keeping N_A and
/// N_B fixed matters because PLV, coherence and the other non-debiased measures are biased upward by an amount that
/// depends on the trial count: every split has the same counts, so the same bias enters the observed and the
/// permuted Δ, and the test stays exact even when N_A ≠ N_B. That bias also means the null of Δ is not centred at 0
/// when N_A ≠ N_B, so the test is two-sided against the null itself, not on |Δ|.</para>
/// <para>Draw d (0..M−1) takes the permutation <see cref="TrialShuffle.Generate"/>(seed, d) of the N_A + N_B pooled
/// trials (A's trials first, then B's) and gives its first N_A entries to A and the rest to B: each N_A-subset is then
/// equally likely. Both groups' measures are computed as observed values (<see cref="PairwiseKernels.Compute"/> with
/// the trials in their own order). Two-sided against the null itself (<see cref="PermutationP.TwoSided"/>): with
/// b_upper the draws with Δ ≥ Δ_observed and b_lower those with Δ ≤ Δ_observed, p = min(1, 2 · min(b_upper + 1,
/// b_lower + 1)/(M + 1)) (Phipson and Smyth 2010, "Permutation p-values should never be zero", Stat Appl Genet Mol
/// Biol 9(1):39, for each one-sided p); the exceedance count reported is the smaller of b_upper and b_lower; z is the
/// rank-based normal deviate of <see cref="PermutationP.RankZ"/>. With evoked removal, every group of every split is
/// centred on its own trial mean (see <see cref="Run(NarrowbandSet, NarrowbandSet, IReadOnlyList{Measure}, int, ulong, string, bool, int?, IProgress{int}?, CancellationToken)"/>).
/// Draws are run in fixed chunks merged in chunk order, so the result does not depend on the thread count.</para>
/// <para>Memory: the pooled set (the two sets' data once more) plus, per worker thread, the data and kernel tables of
/// one split.</para>
/// </remarks>
public static class ConditionContrast
{
    /// <summary>Runs the test on the trials as they are (no evoked removal).</summary>
    /// <param name="a">Narrowband signals of condition A in one band.</param>
    /// <param name="b">Narrowband signals of condition B in the same band: same channels and time points.</param>
    /// <param name="measures">The measures to test, each at most once.</param>
    /// <param name="draws">Number of label permutations M, at least 1.</param>
    /// <param name="seed">Seed of the permutations.</param>
    /// <param name="contrast">Name of the contrast, used in error messages.</param>
    /// <param name="maxThreads">Upper bound on worker threads; null uses every core.</param>
    /// <param name="progress">Told the number of draws finished so far after each chunk, from the worker threads.</param>
    /// <param name="cancellationToken">Stops the run between chunks with <see cref="OperationCanceledException"/>.</param>
    /// <returns>One result per measure, in the order of <paramref name="measures"/>.</returns>
    /// <exception cref="InputException">Fewer than 1 draw, fewer than 2 trials in a condition, or fewer distinct splits
    /// C(N_A + N_B, N_A) than draws; the message names the contrast.</exception>
    /// <exception cref="ArgumentException">The sets differ in channels or time points; no measures or a measure listed twice.</exception>
    public static IReadOnlyList<ContrastResult> Run(NarrowbandSet a, NarrowbandSet b, IReadOnlyList<Measure> measures, int draws,
        ulong seed, string contrast, int? maxThreads = null, IProgress<int>? progress = null,
        CancellationToken cancellationToken = default) =>
        RunObserved(a, b, measures, draws, seed, contrast, maxThreads, progress, cancellationToken, null);

    /// <summary>
    /// Runs the test, optionally removing the evoked response inside every group: with
    /// <paramref name="subtractEvoked"/>, <paramref name="a"/> and <paramref name="b"/> hold the narrowband signals of
    /// the trials as recorded, and each group's own trial mean (per channel and time point) is subtracted from its
    /// trials before its measures are computed, for the observed conditions and for both groups of every split alike.
    /// </summary>
    /// <remarks>
    /// Removing the mean per original condition before pooling would leave the observed groups centred on their own
    /// mean (residuals of N trials that behave like N − 1) and the permuted groups on a mixture of the two conditions'
    /// means, so the groups would no longer be exchangeable and the test would reject too often at unequal trial counts.
    /// Centring every group of every split the same way keeps them exchangeable under the null hypothesis. Band isolation
    /// is linear and the same for every trial, so subtracting the trial mean of the narrowband signals equals subtracting
    /// the trial mean of the recorded trials before band isolation (up to rounding).
    /// </remarks>
    /// <param name="a">Narrowband signals of condition A.</param>
    /// <param name="b">Narrowband signals of condition B.</param>
    /// <param name="measures">The measures to test, each at most once.</param>
    /// <param name="draws">Number of label permutations M, at least 1.</param>
    /// <param name="seed">Seed of the permutations.</param>
    /// <param name="contrast">Name of the contrast, used in error messages.</param>
    /// <param name="subtractEvoked">Whether to subtract each group's trial mean from its trials.</param>
    /// <param name="maxThreads">Upper bound on worker threads; null uses every core.</param>
    /// <param name="progress">Told the number of draws finished so far after each chunk, from the worker threads.</param>
    /// <param name="cancellationToken">Stops the run between chunks with <see cref="OperationCanceledException"/>.</param>
    /// <returns>One result per measure, in the order of <paramref name="measures"/>.</returns>
    /// <exception cref="InputException">Fewer than 1 draw, fewer than 2 trials in a condition, or fewer distinct splits
    /// C(N_A + N_B, N_A) than draws; the message names the contrast.</exception>
    /// <exception cref="ArgumentException">The sets differ in channels or time points; no measures or a measure listed twice.</exception>
    public static IReadOnlyList<ContrastResult> Run(NarrowbandSet a, NarrowbandSet b, IReadOnlyList<Measure> measures, int draws,
        ulong seed, string contrast, bool subtractEvoked, int? maxThreads = null, IProgress<int>? progress = null,
        CancellationToken cancellationToken = default) =>
        RunObserved(a, b, measures, draws, seed, contrast, maxThreads, progress, cancellationToken, null, subtractEvoked);

    /// <summary>
    /// As the public <c>Run</c>, with <paramref name="observer"/> seeing every draw's differences (cells measure-major,
    /// pairs in PairIndex order) and <paramref name="subtractEvoked"/> removing each group's trial mean inside every draw.
    /// </summary>
    internal static IReadOnlyList<ContrastResult> RunObserved(NarrowbandSet a, NarrowbandSet b, IReadOnlyList<Measure> measures, int draws,
        ulong seed, string contrast, int? maxThreads, IProgress<int>? progress, CancellationToken cancellationToken,
        IDrawObserver? observer, bool subtractEvoked = false)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(measures);
        ArgumentNullException.ThrowIfNull(contrast);
        if (maxThreads is < 1) throw new ArgumentOutOfRangeException(nameof(maxThreads), maxThreads, "At least one thread.");
        if (!a.Channels.SequenceEqual(b.Channels, StringComparer.Ordinal))
            throw new ArgumentException("Both conditions must have the same channels in the same order.", nameof(b));
        if (!a.Times.SequenceEqual(b.Times))
            throw new ArgumentException("Both conditions must have the same time points.", nameof(b));
        CheckFeasible(a.TrialCount, b.TrialCount, draws, contrast);

        var groupA = subtractEvoked ? Centred(a) : a;
        var groupB = subtractEvoked ? Centred(b) : b;
        var observedA = new Worker(groupA, measures);
        var observedB = new Worker(groupB, measures);
        int slots = measures.Count, pairs = PairIndex.Count(a.ChannelCount), cells = slots * pairs;
        var valueA = observedA.Compute(groupA);
        var valueB = observedB.Compute(groupB);
        var difference = new double[cells];
        for (int i = 0; i < cells; i++) difference[i] = valueA[i] - valueB[i];

        var pooled = Pool(a, b);
        int countA = a.TrialCount;
        var total = ChunkedDraws.Run<SplitWorker>(draws, difference, null,
            () => new SplitWorker(pooled, countA, measures, subtractEvoked),
            (worker, d) => worker.Draw(seed, d),
            maxThreads, progress, cancellationToken, observer);

        var results = new ContrastResult[slots];
        for (int k = 0; k < slots; k++)
        {
            var n = total.Summarise(k, pairs, draws, difference, TestTail.TwoSided);
            results[k] = new ContrastResult(measures[k], draws, valueA.AsSpan(k * pairs, pairs).ToArray(),
                valueB.AsSpan(k * pairs, pairs).ToArray(), difference.AsSpan(k * pairs, pairs).ToArray(), n.Mean, n.Sd,
                n.Exceedances, n.P, n.Z);
        }
        return results;
    }

    /// <summary>A copy of <paramref name="set"/> with, per time point and channel, the mean over its trials subtracted.</summary>
    private static NarrowbandSet Centred(NarrowbandSet set)
    {
        var data = set.Data.ToArray();
        CentreInPlace(data, set.TrialCount);
        return new NarrowbandSet(set.Band, set.Channels, set.TrialCount, set.Times, data);
    }

    /// <summary>Subtracts from each row of <paramref name="trials"/> values (one time point of one channel) the row's mean.</summary>
    private static void CentreInPlace(Span<Complex> data, int trials)
    {
        for (int start = 0; start < data.Length; start += trials)
        {
            var row = data.Slice(start, trials);
            Complex sum = Complex.Zero;
            foreach (var v in row) sum += v;
            var mean = sum / trials;
            for (int n = 0; n < row.Length; n++) row[n] -= mean;
        }
    }

    /// <summary>
    /// Checks that conditions of <paramref name="trialsA"/> and <paramref name="trialsB"/> trials allow
    /// <paramref name="draws"/> label permutations: at least one draw, at least 2 trials in each condition, and at least
    /// as many distinct splits, C(N_A + N_B, N_A), as draws.
    /// </summary>
    /// <exception cref="InputException">The message names the contrast, the trial counts and the permutations asked.</exception>
    public static void CheckFeasible(int trialsA, int trialsB, int draws, string contrast)
    {
        if (draws < 1)
            throw new InputException($"contrast '{contrast}': the number of surrogates must be at least 1, but {draws} were asked.");
        if (trialsA < 2 || trialsB < 2)
            throw new InputException(
                $"contrast '{contrast}' has {trialsA} and {trialsB} trials: each condition needs at least 2.");
        // C(n, k) >= M? Build C(n-k+i, i) for i = 1..k, exact in integers, and stop once it reaches M (no overflow:
        // each step multiplies a value below M by at most n).
        int n = trialsA + trialsB, k = Math.Min(trialsA, trialsB);
        long splits = 1;
        for (int i = 1; i <= k && splits < draws; i++) splits = splits * (n - k + i) / i;
        if (splits < draws)
            throw new InputException(
                $"contrast '{contrast}' has {trialsA} and {trialsB} trials: at most {splits} distinct splits of the pooled trials, but {draws} surrogates were asked.");
    }

    /// <summary>The trials of <paramref name="a"/> followed by those of <paramref name="b"/>, in one set.</summary>
    private static NarrowbandSet Pool(NarrowbandSet a, NarrowbandSet b)
    {
        int na = a.TrialCount, nb = b.TrialCount, n = na + nb, channels = a.ChannelCount;
        var data = new Complex[(long)a.TimeCount * channels * n];
        for (int t = 0; t < a.TimeCount; t++)
            for (int c = 0; c < channels; c++)
            {
                var row = data.AsSpan((t * channels + c) * n, n);
                a.Row(t, c).CopyTo(row);
                b.Row(t, c).CopyTo(row[na..]);
            }
        return new NarrowbandSet(a.Band, a.Channels, n, a.Times, data);
    }

    /// <summary>Observed-style computation of one set's measures.</summary>
    private sealed class Worker(NarrowbandSet shape, IReadOnlyList<Measure> measures)
    {
        private readonly int[] _identity = Enumerable.Range(0, shape.TrialCount).ToArray();
        private readonly double[] _values = new double[measures.Count * PairIndex.Count(shape.ChannelCount)];

        private PairwiseWorkspace? _workspace;

        /// <summary>
        /// The measures of <paramref name="set"/> (same trial count as the shape), into this worker's buffer; a set whose
        /// values changed in place since the last call is re-read into the same tables instead of new ones.
        /// </summary>
        public double[] Compute(NarrowbandSet set)
        {
            if (_workspace is null || !ReferenceEquals(_workspace.Set, set)) _workspace = new PairwiseWorkspace(set, measures);
            else _workspace.Reload();
            PairwiseKernels.Compute(_workspace, _identity, _values);
            return _values;
        }
    }

    /// <summary>One thread's buffers: the permutation, the two groups' data and the Δ of a draw.</summary>
    private sealed class SplitWorker
    {
        private readonly NarrowbandSet _pooled;
        private readonly int _countA;
        private readonly int[] _permutation;
        private readonly Complex[] _dataA, _dataB;
        private readonly NarrowbandSet _setA, _setB;
        private readonly Worker _workerA, _workerB;
        private readonly double[] _difference;

        private readonly bool _centre;

        public SplitWorker(NarrowbandSet pooled, int countA, IReadOnlyList<Measure> measures, bool centre)
        {
            _pooled = pooled;
            _centre = centre;
            _countA = countA;
            int countB = pooled.TrialCount - countA, cells = pooled.TimeCount * pooled.ChannelCount;
            _permutation = new int[pooled.TrialCount];
            _dataA = new Complex[(long)cells * countA];
            _dataB = new Complex[(long)cells * countB];
            _setA = new NarrowbandSet(pooled.Band, pooled.Channels, countA, pooled.Times, _dataA);
            _setB = new NarrowbandSet(pooled.Band, pooled.Channels, countB, pooled.Times, _dataB);
            _workerA = new Worker(_setA, measures);
            _workerB = new Worker(_setB, measures);
            _difference = new double[measures.Count * PairIndex.Count(pooled.ChannelCount)];
        }

        public double[] Draw(ulong seed, int draw)
        {
            TrialShuffle.Generate(seed, draw, _permutation);
            int n = _pooled.TrialCount, countB = n - _countA, rows = _pooled.TimeCount * _pooled.ChannelCount;
            var data = _pooled.Data;
            for (int r = 0; r < rows; r++)
            {
                int source = r * n, targetA = r * _countA, targetB = r * countB;
                for (int j = 0; j < _countA; j++) _dataA[targetA + j] = data[source + _permutation[j]];
                for (int j = 0; j < countB; j++) _dataB[targetB + j] = data[source + _permutation[_countA + j]];
            }
            if (_centre)
            {
                CentreInPlace(_dataA, _countA);
                CentreInPlace(_dataB, countB);
            }
            var valuesA = _workerA.Compute(_setA);
            var valuesB = _workerB.Compute(_setB);
            for (int i = 0; i < _difference.Length; i++) _difference[i] = valuesA[i] - valuesB[i];
            return _difference;
        }
    }
}
