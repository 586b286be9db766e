using System.Numerics;
using Coupling.Measures;
using Coupling.Spectral;
using Coupling.TimeFrequency;
using MathNet.Numerics.Distributions;

namespace Coupling.Statistics;

/// <summary>
/// Cluster-based permutation test of the difference in one measure of one channel pair between two conditions over a
/// frequency x time map, with family-wise error control over the whole map.
/// </summary>
/// <remarks>
/// <para>Maris, E. and Oostenveld, R. (2007), "Nonparametric statistical testing of EEG- and MEG-data", J. Neurosci.
/// Methods 164(1), 177-190. Map statistic per cell: d = value in A - value in B. The trials of both conditions are pooled
/// and relabelled at random, keeping the two counts (a label permutation; the taper observations of a trial move with
/// it); draw j's order is <see cref="TrialShuffle.Generate"/> of the seed and j, the first N_A trials forming A.</para>
/// <para>Each cell's d is standardised by the mean and standard deviation of d at that cell over the observed map and the
/// M permuted maps together (z = (d - mean) / sd), so cells with different spreads (low and high frequencies, bins
/// with more or fewer time points) weigh alike, and the standardisation is the same symmetric function of all M + 1
/// labellings, which keeps them exchangeable under the null hypothesis. Cluster-forming threshold: |z| &gt; z* with
/// z* the standard normal quantile 1 - alpha/2 for the pointwise level alpha (two-sided). A cluster is a set of
/// supra-threshold cells of one sign connected through shared edges (neighbouring frequencies at the same bin, or
/// neighbouring bins at the same frequency); its mass is the sum of its z. The test statistic of a map is the largest
/// |mass| of its clusters (0 without one); an observed cluster's p-value is (1 + #{j : max |mass| of draw j &gt;=
/// |mass|}) / (M + 1), which controls the family-wise error rate over all cells and clusters at any level
/// (Maris and Oostenveld 2007, section 4; Phipson and Smyth 2010 for the +1).</para>
/// <para>With evoked removal, every labelling (the observed one and each permutation alike) centres each of its two
/// groups on the group's own mean: per cell, channel, time point and taper index, the mean over the group's trials is
/// subtracted from the group's observations before the measure is computed. Removing each condition's mean before
/// pooling instead would leave the observed groups centred on themselves (residuals of N trials, which behave like
/// N - 1) and every permuted group on a mixture of both conditions' means, so at unequal trial counts the observed map
/// would not be exchangeable with the permuted ones (the argument of <see cref="ConditionContrast"/>). Wavelet
/// convolution of a segment less its own mean, and multitaper coefficients of a segment less its own mean, are linear
/// in the trial and the same for every trial, so the cells' group mean is the transform of the group's mean trial and
/// centring the cells equals removing the group's mean from the recorded trials before the transform, up to rounding.</para>
/// <para>The result depends only on the data, the seed and M, not on the number of threads.</para>
/// </remarks>
public static class TimeFrequencyClusterTest
{
    /// <summary>Runs the test.</summary>
    /// <param name="a">Cells of condition A: exactly two channels (the pair).</param>
    /// <param name="b">Cells of condition B: same channels, frequencies, bins, time points and observations per trial.</param>
    /// <param name="measure">The measure whose difference is tested.</param>
    /// <param name="conditionA">Name of condition A.</param>
    /// <param name="conditionB">Name of condition B.</param>
    /// <param name="draws">Number of label permutations M.</param>
    /// <param name="seed">Seed of the permutations.</param>
    /// <param name="threshold">Two-sided pointwise level of the cluster-forming threshold, 0 &lt; alpha &lt; 1 (e.g. 0.05).</param>
    /// <param name="maxThreads">Upper bound on worker threads; null for every core.</param>
    /// <param name="cancellationToken">Stops the draws.</param>
    /// <param name="progress">Told the number of cells finished (through every labelling), from the worker threads.</param>
    /// <param name="subtractEvoked">Whether each group of every labelling has its own trial mean removed (see remarks);
    /// <paramref name="a"/> and <paramref name="b"/> then hold the cells of the trials as recorded.</param>
    /// <exception cref="InputException">Too few trials for the draws asked, or a threshold out of range.</exception>
    /// <exception cref="ArgumentException">The cells of A and B do not match, or do not hold two channels.</exception>
    public static ClusterTestResult Run(TimeFrequencyCells a, TimeFrequencyCells b, Measure measure, string conditionA,
        string conditionB, int draws, ulong seed, double threshold, int? maxThreads = null, CancellationToken cancellationToken = default,
        IProgress<int>? progress = null, bool subtractEvoked = false)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        Check(a, b);
        if (!(threshold > 0 && threshold < 1))
            throw new InputException($"cluster test: the cluster-forming threshold {threshold} must lie between 0 and 1.");
        ConditionContrast.CheckFeasible(a.TrialCount, b.TrialCount, draws, $"{conditionA}-vs-{conditionB}");

        int cells = a.CellCount, nF = a.Frequencies.Count, nB = a.Bins.Count;
        var pooled = Enumerable.Range(0, cells).Select(i => Pool(a.Cell(i), b.Cell(i))).ToArray();
        // Every labelling first (row 0 the observed one), then cell by cell through all of them, so that one thread holds
        // the kernel workspaces of one cell only.
        int total = a.TrialCount + b.TrialCount;
        var orders = new int[draws + 1][];
        orders[0] = Enumerable.Range(0, total).ToArray();
        for (int d = 0; d < draws; d++) TrialShuffle.Generate(seed, d, orders[d + 1] = new int[total]);
        var maps = new double[(long)(draws + 1) * cells];
        var options = new ParallelOptions { MaxDegreeOfParallelism = maxThreads ?? -1, CancellationToken = cancellationToken };
        int finished = 0;
        Parallel.For(0, cells, options, cell =>
        {
            var splitter = new Splitter(pooled[cell], a.TrialCount, a.ObservationsPerTrial, measure, subtractEvoked);
            for (int r = 0; r <= draws; r++) maps[(long)r * cells + cell] = splitter.Difference(orders[r]);
            progress?.Report(Interlocked.Increment(ref finished));
        });

        var z = Standardise(maps, cells, draws + 1);
        double zThreshold = Normal.InvCDF(0, 1, 1 - threshold / 2);
        var labels = new int[cells];
        var largest = new double[draws];
        for (int d = 0; d < draws; d++)
        {
            var found = FindClusters(z.AsSpan((d + 1) * cells, cells), nF, nB, zThreshold, labels);
            largest[d] = found.Count == 0 ? 0 : found.Max(c => Math.Abs(c.Mass));
        }
        var observed = FindClusters(z.AsSpan(0, cells), nF, nB, zThreshold, labels);
        var order = Enumerable.Range(0, observed.Count).OrderByDescending(i => Math.Abs(observed[i].Mass)).ToArray();
        var renumber = new int[observed.Count + 1];
        var clusters = new List<TimeFrequencyCluster>();
        for (int rank = 0; rank < order.Length; rank++)
        {
            var c = observed[order[rank]];
            renumber[order[rank] + 1] = rank + 1;
            int exceed = largest.Count(m => m >= Math.Abs(c.Mass));
            var members = Enumerable.Range(0, cells).Where(i => labels[i] == order[rank] + 1).ToArray();
            clusters.Add(new TimeFrequencyCluster(rank + 1, Math.Sign(c.Mass), c.Mass, members.Length, (1.0 + exceed) / (draws + 1),
                members.Min(i => a.Frequencies[i / nB]), members.Max(i => a.Frequencies[i / nB]),
                members.Min(i => a.Bins[i % nB].Centre), members.Max(i => a.Bins[i % nB].Centre)));
        }
        for (int i = 0; i < cells; i++) labels[i] = renumber[labels[i]];
        return new ClusterTestResult(a.Channels[0], a.Channels[1], MeasureCatalog.Key(measure), conditionA, conditionB,
            a.TrialCount, b.TrialCount, a.Frequencies, a.Bins.Select(x => x.Centre).ToArray(), maps.AsSpan(0, cells).ToArray(),
            z.AsSpan(0, cells).ToArray(), labels, clusters, draws, threshold, zThreshold, subtractEvoked);
    }

    /// <summary>
    /// Labels the clusters of <paramref name="z"/> (frequency-major, <paramref name="frequencies"/> x <paramref name="bins"/>):
    /// maximal sets of cells with |z| &gt; <paramref name="threshold"/> of one sign, connected through shared edges.
    /// Writes the 1-based cluster number of each cell (0 for none) into <paramref name="labels"/> and returns each
    /// cluster's signed mass (sum of z) and size, in order of discovery (frequency-major scan). Non-finite z is never
    /// supra-threshold.
    /// </summary>
    public static List<(double Mass, int Cells)> FindClusters(ReadOnlySpan<double> z, int frequencies, int bins, double threshold, Span<int> labels)
    {
        labels.Clear();
        var found = new List<(double, int)>();
        var stack = new Stack<int>();
        for (int start = 0; start < z.Length; start++)
        {
            if (labels[start] != 0 || !(Math.Abs(z[start]) > threshold)) continue;
            int sign = Math.Sign(z[start]), id = found.Count + 1, size = 0;
            double mass = 0;
            labels[start] = id;
            stack.Push(start);
            while (stack.Count > 0)
            {
                int i = stack.Pop();
                mass += z[i];
                size++;
                int f = i / bins, t = i % bins;
                Span<int> neighbours = [f > 0 ? i - bins : -1, f < frequencies - 1 ? i + bins : -1, t > 0 ? i - 1 : -1, t < bins - 1 ? i + 1 : -1];
                foreach (int j in neighbours)
                    if (j >= 0 && labels[j] == 0 && Math.Abs(z[j]) > threshold && Math.Sign(z[j]) == sign)
                    {
                        labels[j] = id;
                        stack.Push(j);
                    }
            }
            found.Add((mass, size));
        }
        return found;
    }

    /// <summary>(d - mean) / sd per cell over all <paramref name="maps"/> rows (sample sd, n - 1); 0 where sd is 0.</summary>
    private static double[] Standardise(double[] maps, int cells, int rows)
    {
        var z = new double[maps.Length];
        for (int i = 0; i < cells; i++)
        {
            double mean = 0;
            for (int r = 0; r < rows; r++) mean += maps[(long)r * cells + i];
            mean /= rows;
            double squares = 0;
            for (int r = 0; r < rows; r++) { double e = maps[(long)r * cells + i] - mean; squares += e * e; }
            double sd = Math.Sqrt(squares / (rows - 1));
            for (int r = 0; r < rows; r++) z[(long)r * cells + i] = sd > 0 ? (maps[(long)r * cells + i] - mean) / sd : 0;
        }
        return z;
    }

    private static void Check(TimeFrequencyCells a, TimeFrequencyCells b)
    {
        if (a.Channels.Count != 2 || !a.Channels.SequenceEqual(b.Channels, StringComparer.Ordinal))
            throw new ArgumentException("Both conditions' cells must hold the same two channels (the pair).", nameof(b));
        if (!a.Frequencies.SequenceEqual(b.Frequencies) || !a.Bins.SequenceEqual(b.Bins) || a.ObservationsPerTrial != b.ObservationsPerTrial)
            throw new ArgumentException("Both conditions' cells must share frequencies, bins and observations per trial.", nameof(b));
        for (int i = 0; i < a.CellCount; i++)
            if (!a.Cell(i).Times.SequenceEqual(b.Cell(i).Times))
                throw new ArgumentException("Both conditions' cells must hold the same time points.", nameof(b));
    }

    /// <summary>The observations of <paramref name="a"/> followed by those of <paramref name="b"/>, per row (time point x channel).</summary>
    private static NarrowbandSet Pool(NarrowbandSet a, NarrowbandSet b)
    {
        int na = a.TrialCount, nb = b.TrialCount, n = na + nb, rows = a.TimeCount * a.ChannelCount;
        var data = new Complex[(long)rows * n];
        for (int r = 0; r < rows; r++)
        {
            a.Data.AsSpan(r * na, na).CopyTo(data.AsSpan(r * n, na));
            b.Data.AsSpan(r * nb, nb).CopyTo(data.AsSpan(r * n + na, nb));
        }
        return new NarrowbandSet(a.Band, a.Channels, n, a.Times, data);
    }

    /// <summary>One cell's buffers: the two groups' observations and kernel workspaces.</summary>
    private sealed class Splitter
    {
        private readonly NarrowbandSet _pooled;
        private readonly int _trialsA, _perTrial;
        private readonly bool _centre;
        private readonly PairwiseWorkspace _a, _b;
        private readonly int[] _identityA, _identityB;
        private readonly double[] _valueA = new double[1], _valueB = new double[1];

        public Splitter(NarrowbandSet pooled, int trialsA, int perTrial, Measure measure, bool centre)
        {
            _pooled = pooled;
            _centre = centre;
            _trialsA = trialsA;
            _perTrial = perTrial;
            int countA = trialsA * perTrial, countB = pooled.TrialCount - countA;
            _a = Workspace(pooled, countA, measure);
            _b = Workspace(pooled, countB, measure);
            _identityA = Enumerable.Range(0, countA).ToArray();
            _identityB = Enumerable.Range(0, countB).ToArray();
        }

        private static PairwiseWorkspace Workspace(NarrowbandSet shape, int observations, Measure measure) =>
            new(new NarrowbandSet(shape.Band, shape.Channels, observations, shape.Times,
                new Complex[(long)shape.TimeCount * shape.ChannelCount * observations]), [measure]);

        /// <summary>
        /// Value in A minus value in B, trial order[j] going to A for j &lt; N_A and to B after; with centring, each
        /// group's own trial mean removed first.
        /// </summary>
        public double Difference(ReadOnlySpan<int> order)
        {
            var setA = _a.Set;
            var setB = _b.Set;
            int n = _pooled.TrialCount, na = setA.TrialCount, nb = setB.TrialCount, k = _perTrial;
            int rows = _pooled.TimeCount * _pooled.ChannelCount;
            for (int r = 0; r < rows; r++)
            {
                var source = _pooled.Data.AsSpan(r * n, n);
                var targetA = setA.Data.AsSpan(r * na, na);
                var targetB = setB.Data.AsSpan(r * nb, nb);
                for (int j = 0; j < order.Length; j++)
                    source.Slice(order[j] * k, k).CopyTo(j < _trialsA ? targetA.Slice(j * k, k) : targetB.Slice((j - _trialsA) * k, k));
                if (_centre)
                {
                    CentreInPlace(targetA, k);
                    CentreInPlace(targetB, k);
                }
            }
            _a.Reload();
            _b.Reload();
            PairwiseKernels.Compute(_a, _identityA, _valueA);
            PairwiseKernels.Compute(_b, _identityB, _valueB);
            return _valueA[0] - _valueB[0];
        }

        /// <summary>
        /// Subtracts from one row of a group (trial-major: observation n K + k is taper k of trial n) the mean over the
        /// group's trials of each taper index k.
        /// </summary>
        private static void CentreInPlace(Span<Complex> row, int perTrial)
        {
            int trials = row.Length / perTrial;
            for (int k = 0; k < perTrial; k++)
            {
                Complex sum = Complex.Zero;
                for (int n = 0; n < trials; n++) sum += row[n * perTrial + k];
                var mean = sum / trials;
                for (int n = 0; n < trials; n++) row[n * perTrial + k] -= mean;
            }
        }
    }
}
