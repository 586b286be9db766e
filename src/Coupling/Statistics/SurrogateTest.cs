using Coupling.Measures;
using Coupling.Spectral;

namespace Coupling.Statistics;

/// <summary>
/// Trial-shuffle surrogate test of every measure for every channel pair: the trials of the second channel of each
/// pair are put in a random order, which keeps each channel's own signal (including anything locked to the stimulus,
/// which is the same in every trial) and destroys only the trial-by-trial correspondence between the two channels.
/// Coupling that is merely a shared stimulus-locked response therefore survives the shuffle and is not significant;
/// what is significant is coupling that goes beyond it, trial by trial. This holds only for a response that is the
/// same in every trial: one whose latency or amplitude varies from trial to trial, shared by the channels, is itself
/// trial-by-trial coupling and makes every measure significant (Truccolo et al. 2002, Clin Neurophysiol
/// 113:206-226); see <see cref="EvokedShare"/>.
/// </summary>
/// <remarks>
/// <para>Draw d (0..M−1) uses the trial order <see cref="TrialShuffle.Generate"/>(seed, d); one order serves all pairs
/// and measures of that draw. Per measure and pair the draws are summarised as they come (running mean and variance,
/// the counts of draws below and above the observed value); the draws themselves are never stored. The tail of each
/// measure is <see cref="MeasureCatalog.TailOf"/>: one-sided upper, p = (b + 1)/(M + 1) with b the draws at or above
/// the observed value, the exact p-value of a permutation test with randomly drawn permutations (Phipson and Smyth
/// 2010, "Permutation p-values should never be zero", Stat Appl Genet Mol Biol 9(1):39), in [1/(M+1), 1]; or, for the
/// signed measures, two-sided against the null itself, p = min(1, 2 · min of the two one-sided p-values), whatever the
/// null's centre (a stimulus-locked response with a lag between the channels, or a shared envelope, moves it away from
/// 0). z is rank-based: the normal deviate of the observed value's mid-rank among the draws (<see cref="PermutationP"/>),
/// signed, NaN where the observed value is NaN.</para>
/// <para>Determinism: draws are processed in fixed chunks of <see cref="DrawsPerChunk"/>, each chunk summarised on
/// its own and the chunk summaries merged in chunk order, so the result is the same to the last bit whatever the
/// number of threads.</para>
/// </remarks>
public static class SurrogateTest
{
    /// <summary>Draws per chunk of work. Part of the definition of the result's rounding: changing it changes the last bits.</summary>
    public const int DrawsPerChunk = ChunkedDraws.DrawsPerChunk;

    /// <summary>Runs the test.</summary>
    /// <param name="set">The narrowband signals of one condition in one band.</param>
    /// <param name="measures">The measures to test, each at most once.</param>
    /// <param name="draws">Number of surrogates M, at least 1.</param>
    /// <param name="seed">Seed of the trial orders.</param>
    /// <param name="condition">Name of the condition, used in error messages.</param>
    /// <param name="maxThreads">Upper bound on worker threads; null uses every core.</param>
    /// <param name="progress">Told the number of draws finished so far after each chunk, from the worker threads
    /// (reports from different threads may arrive out of order; the largest is the count).</param>
    /// <param name="cancellationToken">Stops the run between chunks with <see cref="OperationCanceledException"/>.</param>
    /// <returns>One result per measure, in the order of <paramref name="measures"/>.</returns>
    /// <exception cref="InputException">Fewer than 1 draw, fewer than 2 trials, or fewer distinct trial orders (N!) than
    /// draws; the message names the condition, the number of trials and the number of surrogates asked.</exception>
    /// <exception cref="ArgumentException">No measures or a measure listed twice.</exception>
    public static IReadOnlyList<SurrogateResult> Run(NarrowbandSet set, IReadOnlyList<Measure> measures, int draws,
        ulong seed, string condition, int? maxThreads = null, IProgress<int>? progress = null,
        CancellationToken cancellationToken = default) =>
        RunObserved(set, measures, draws, seed, condition, maxThreads, progress, cancellationToken, null);

    /// <summary>As the public <c>Run</c>, with <paramref name="observer"/> seeing every draw's values (cells measure-major, pairs in PairIndex order).</summary>
    internal static IReadOnlyList<SurrogateResult> RunObserved(NarrowbandSet set, IReadOnlyList<Measure> measures, int draws,
        ulong seed, string condition, int? maxThreads, IProgress<int>? progress, CancellationToken cancellationToken,
        IDrawObserver? observer)
    {
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(measures);
        ArgumentNullException.ThrowIfNull(condition);
        if (maxThreads is < 1) throw new ArgumentOutOfRangeException(nameof(maxThreads), maxThreads, "At least one thread.");
        CheckFeasible(set.TrialCount, draws, condition);

        var prototype = new PairwiseWorkspace(set, measures);
        int slots = measures.Count, pairs = prototype.PairCount, cells = prototype.OutputLength;
        int trials = set.TrialCount;

        var identity = new int[trials];
        for (int n = 0; n < trials; n++) identity[n] = n;
        var observed = new double[cells];
        PairwiseKernels.Compute(prototype, identity, observed);
        NullAccumulator total;
        try
        {
            // With more draws than trials, the envelope correlations of all N² trial pairs cost less than N per draw.
            if (TrialPairTable.Pays(trials, measures.Count(PairwiseKernels.IsEnvelope), pairs, draws))
                PairwiseKernels.BuildTrialPairs(prototype, maxThreads, cancellationToken);
            // The draws of a chunk are computed together, time point by time point, so that the rows of one time
            // point are read from memory once for all of them (PairwiseKernels.ComputeTogether); each draw's values
            // are the same bits as when it is computed alone.
            total = ChunkedDraws.RunChunks(draws, observed, new Worker(prototype),
                () => new Worker(prototype.CreateSibling()),
                (worker, start, end, sink) =>
                {
                    for (int group = start; group < end; group += worker.Workspaces.Length)
                    {
                        int count = Math.Min(worker.Workspaces.Length, end - group);
                        for (int i = 0; i < count; i++) TrialShuffle.Generate(seed, group + i, worker.Permutations[i]);
                        PairwiseKernels.ComputeTogether(worker.Workspaces.AsSpan(0, count), worker.Permutations.AsSpan(0, count),
                            worker.Values.AsSpan(0, count));
                        for (int i = 0; i < count; i++) sink(group + i, worker.Values[i]);
                    }
                },
                maxThreads, progress, cancellationToken, observer);
        }
        finally
        {
            PairwiseKernels.ReleaseTrialPairs(prototype);
        }

        var results = new SurrogateResult[slots];
        for (int k = 0; k < slots; k++)
        {
            var n = total.Summarise(k, pairs, draws, observed, MeasureCatalog.TailOf(measures[k]));
            results[k] = new SurrogateResult(measures[k], draws, observed.AsSpan(k * pairs, pairs).ToArray(), n.Mean, n.Sd,
                n.Exceedances, n.P, n.Z);
        }
        return results;
    }

    /// <summary>
    /// Checks that <paramref name="trials"/> trials allow <paramref name="draws"/> surrogate draws: at least one draw,
    /// at least 2 trials, and at least as many distinct trial orders (N!) as draws.
    /// </summary>
    /// <exception cref="InputException">The message names the condition, the trials and the surrogates asked.</exception>
    public static void CheckFeasible(int trials, int draws, string condition)
    {
        if (draws < 1)
            throw new InputException($"condition '{condition}': the number of surrogates must be at least 1, but {draws} were asked.");
        if (trials < 2)
            throw new InputException(
                $"condition '{condition}' has {trials} trial{(trials == 1 ? "" : "s")}: trial shuffling needs at least 2, but {draws} surrogates were asked.");
        // N! >= M? Multiply up until the product reaches M (no overflow: it stops by then).
        long orders = 1;
        for (int k = 2; k <= trials && orders < draws; k++) orders *= k;
        if (orders < draws)
            throw new InputException(
                $"condition '{condition}' has {trials} trials: at most {orders} distinct trial orders, but {draws} surrogates were asked.");
    }

    /// <summary>
    /// One thread's workspaces, trial orders and values: one of each per draw computed together, up to a chunk's draws
    /// while their sums take at most <see cref="TogetherBytes"/> (fewer at hundreds of channels).
    /// </summary>
    private sealed class Worker
    {
        private const long TogetherBytes = 16L << 20;

        public Worker(PairwiseWorkspace workspace)
        {
            long sums = (long)workspace.Measures.Count * workspace.Tables.Stride * workspace.Tables.Stride * sizeof(double);
            Workspaces = new PairwiseWorkspace[(int)Math.Clamp(TogetherBytes / sums, 1, ChunkedDraws.DrawsPerChunk)];
            Workspaces[0] = workspace;
            for (int i = 1; i < Workspaces.Length; i++) Workspaces[i] = workspace.CreateSibling();
            Permutations = Workspaces.Select(w => new int[w.Set.TrialCount]).ToArray();
            Values = Workspaces.Select(w => new double[w.OutputLength]).ToArray();
        }

        public PairwiseWorkspace[] Workspaces { get; }
        public int[][] Permutations { get; }
        public double[][] Values { get; }
    }
}
