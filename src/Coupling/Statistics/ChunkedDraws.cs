using System.Collections.Concurrent;

namespace Coupling.Statistics;

/// <summary>
/// Runs the draws of a resampling test in fixed chunks of <see cref="DrawsPerChunk"/>, in parallel, each chunk summarised
/// on its own (<see cref="NullAccumulator"/>) and the chunk summaries merged in chunk order, so the result is the same to
/// the last bit whatever the number of threads. Shared by the trial-shuffle and the condition-label tests.
/// </summary>
internal static class ChunkedDraws
{
    /// <summary>Draws per chunk of work. Part of the definition of the result's rounding: changing it changes the last bits.</summary>
    public const int DrawsPerChunk = 8;

    private const int ChunksPerWave = 32;

    /// <summary>
    /// Bound on the memory of one wave's chunk summaries (20 bytes per cell each): with many pairs and measures a wave
    /// holds fewer chunks (at least two per worker thread), so the summaries kept alive do not grow to hundreds of MB.
    /// The result does not depend on it: chunks are always merged in chunk order.
    /// </summary>
    private const long WaveBytes = 64L << 20;

    /// <summary>
    /// Runs draws 0..<paramref name="draws"/>−1. <paramref name="draw"/> computes draw d with a worker (one thread at a
    /// time per worker) and returns the values of every cell; workers are made by <paramref name="createWorker"/> as
    /// threads need them, after <paramref name="first"/> (if given) is used. <paramref name="observer"/>, if given, sees
    /// every draw's values too.
    /// </summary>
    public static NullAccumulator Run<TWorker>(int draws, double[] observed, TWorker? first,
        Func<TWorker> createWorker, Func<TWorker, int, double[]> draw, int? maxThreads, IProgress<int>? progress,
        CancellationToken cancellationToken, IDrawObserver? observer = null)
        where TWorker : class
    {
        ArgumentNullException.ThrowIfNull(draw);
        return RunChunks(draws, observed, first, createWorker, (worker, start, end, sink) =>
        {
            for (int d = start; d < end; d++) sink(d, draw(worker, d));
        }, maxThreads, progress, cancellationToken, observer);
    }

    /// <summary>
    /// As <see cref="Run{TWorker}"/>, with <paramref name="drawChunk"/> computing the draws start..end−1 of one chunk
    /// together (so that they can share what they read) and handing each draw's values to the sink in draw order; the
    /// sink summarises them before the next is handed over, so the same array may be handed over again.
    /// </summary>
    public static NullAccumulator RunChunks<TWorker>(int draws, double[] observed, TWorker? first,
        Func<TWorker> createWorker, Action<TWorker, int, int, Action<int, double[]>> drawChunk, int? maxThreads,
        IProgress<int>? progress, CancellationToken cancellationToken, IDrawObserver? observer = null)
        where TWorker : class
    {
        int cells = observed.Length;
        int chunks = (draws + DrawsPerChunk - 1) / DrawsPerChunk;
        int threads = maxThreads ?? Environment.ProcessorCount;
        long byMemory = WaveBytes / (20L * Math.Max(1, cells));
        int perWave = (int)Math.Min(ChunksPerWave, Math.Max(byMemory, 2L * threads));
        var wave = new NullAccumulator[Math.Min(perWave, chunks)];
        for (int i = 0; i < wave.Length; i++) wave[i] = new NullAccumulator(cells);
        var total = new NullAccumulator(cells);
        var workers = new ConcurrentBag<TWorker>();
        if (first is not null) workers.Add(first);
        var options = new ParallelOptions
        {
            MaxDegreeOfParallelism = maxThreads ?? -1,
            CancellationToken = cancellationToken,
        };
        int done = 0;

        for (int start0 = 0; start0 < chunks; start0 += wave.Length)
        {
            int count = Math.Min(wave.Length, chunks - start0);
            int waveStart = start0;
            Parallel.For(0, count, options, i =>
            {
                int chunk = waveStart + i;
                var worker = workers.TryTake(out var w) ? w : createWorker();
                var accumulator = wave[i];
                accumulator.Reset();
                int start = chunk * DrawsPerChunk, end = Math.Min(draws, start + DrawsPerChunk);
                drawChunk(worker, start, end, (d, values) =>
                {
                    accumulator.Add(values, observed);
                    observer?.Observe(d, values);
                });
                workers.Add(worker);
                int finished = Interlocked.Add(ref done, end - start);
                progress?.Report(finished);
            });
            for (int i = 0; i < count; i++) total.Merge(wave[i]);
        }
        return total;
    }
}
