using System.Numerics;
using Coupling.Measures;
using Coupling.Statistics;

namespace Coupling.Tests.Measures;

/// <summary>
/// The phase-lag index is a count: per time point |Σ_n sign(Im X_n)| is a whole number, and the window value is the
/// sum of those numbers over N·T (Stam, Nolte, Daffertshofer 2007, Hum Brain Mapp 28:1178-1193, with the window mean of
/// docs/methods.md). These tests compare the kernel bit for bit with a straightforward integer count, on data whose
/// imaginary cross-spectra are exactly 0 in some trials and whose signs cancel exactly at some time points, so that
/// surrogate values tie with the observed one and the exceedance count depends on deciding ties exactly.
/// </summary>
public class PhaseLagIndexCountTests
{
    /// <summary>Σ_t |Σ_n sign(Im(z_a,n · conj(z_b,π(n))))| in integers, straight from the definition.</summary>
    private static long SignCount(Coupling.Spectral.NarrowbandSet set, int a, int b, int[] perm)
    {
        long total = 0;
        for (int t = 0; t < set.TimeCount; t++)
        {
            long sum = 0;
            for (int n = 0; n < set.TrialCount; n++)
                sum += Math.Sign((ReferenceMeasures.Z(set, t, a, n) * Complex.Conjugate(ReferenceMeasures.Z(set, t, b, perm[n]))).Imaginary);
            total += Math.Abs(sum);
        }
        return total;
    }

    /// <summary>Values in {1, i, −1, −i, 0}: every cross product is exactly 0, ±1 or ±i, so Im X_n is exactly 0 often.</summary>
    private static Coupling.Spectral.NarrowbandSet Quantised(int channels, int trials, int times, int seed)
    {
        var random = new Random(seed);
        Complex[] values = [Complex.One, Complex.ImaginaryOne, -Complex.One, -Complex.ImaginaryOne, Complex.Zero];
        return TestSignals.Build(channels, trials, times, (_, _, _) => values[random.Next(random.NextDouble() < 0.1 ? 5 : 4)]);
    }

    [Fact]
    public void The_value_is_the_sign_count_over_trials_times_time_points_in_either_time_order()
    {
        // Ten trials, three time points with sign counts 1, 2 and 3 (the other trials have Im X_n = 0 exactly): the
        // count is 6 and PLI = 6/30 = 0.2. Adding 1/10 + 2/10 + 3/10 in doubles gives 0.6000000000000001 instead, and a
        // different last bit in the reverse order, so a per-time-point 1/N would break the tie between the two orders.
        int[] positive = [1, 2, 3];
        var forward = TestSignals.Build(2, 10, 3, (t, c, n) => c == 0 ? Complex.One : (n < positive[t] ? -Complex.ImaginaryOne : Complex.One));
        var backward = TestSignals.Build(2, 10, 3, (t, c, n) => c == 0 ? Complex.One : (n < positive[2 - t] ? -Complex.ImaginaryOne : Complex.One));
        var identity = TestSignals.Identity(10);
        Assert.Equal(6, SignCount(forward, 0, 1, identity));
        Assert.Equal(6, SignCount(backward, 0, 1, identity));

        double f = PairwiseKernels.ComputeObserved(forward, [Measure.Pli])[0][0];
        double r = PairwiseKernels.ComputeObserved(backward, [Measure.Pli])[0][0];
        Assert.Equal(6 / 30.0, f);
        Assert.Equal(BitConverter.DoubleToInt64Bits(f), BitConverter.DoubleToInt64Bits(r));
    }

    [Theory]
    [InlineData(9, 10, 7, 1)]
    [InlineData(17, 6, 5, 2)]
    [InlineData(3, 30, 11, 3)]
    public void Kernel_values_equal_the_integer_count_exactly_under_any_trial_order(int channels, int trials, int times, int seed)
    {
        var set = Quantised(channels, trials, times, seed);
        var workspace = new PairwiseWorkspace(set, [Measure.Pli, Measure.Wpli]);
        var values = new double[workspace.OutputLength];
        var perm = new int[trials];
        for (int d = -1; d < 20; d++)
        {
            if (d < 0) TestSignals.Identity(trials).CopyTo(perm, 0);
            else TrialShuffle.Generate((ulong)seed, d, perm);
            PairwiseKernels.Compute(workspace, perm, values);
            for (int p = 0; p < workspace.PairCount; p++)
            {
                var (a, b) = PairIndex.Channels(p, channels);
                Assert.Equal(SignCount(set, a, b, perm) / ((double)trials * times), values[p]);
            }
        }
    }

    [Fact]
    public void Surrogate_exceedances_count_ties_exactly()
    {
        // Few trials and quantised phases: many surrogate counts equal the observed one. Ties count as exceedances
        // (Phipson and Smyth 2010, Stat Appl Genet Mol Biol 9:39: b counts draws at or above the observed statistic).
        const int channels = 6, trials = 10, times = 9, draws = 64;
        const ulong seed = 11;
        var set = Quantised(channels, trials, times, seed: 4);
        var result = SurrogateTest.Run(set, [Measure.Pli], draws, seed, "test", maxThreads: 1)[0];
        var identity = TestSignals.Identity(trials);
        var perm = new int[trials];
        int pairs = PairIndex.Count(channels), ties = 0;
        var expected = new int[pairs];
        for (int d = 0; d < draws; d++)
        {
            TrialShuffle.Generate(seed, d, perm);
            for (int p = 0; p < pairs; p++)
            {
                var (a, b) = PairIndex.Channels(p, channels);
                long observed = SignCount(set, a, b, identity), surrogate = SignCount(set, a, b, perm);
                if (surrogate >= observed) expected[p]++;
                if (surrogate == observed) ties++;
            }
        }
        Assert.True(ties > 50, $"only {ties} ties: the data do not exercise them");
        Assert.Equal(expected, result.Exceedances);
    }
}
