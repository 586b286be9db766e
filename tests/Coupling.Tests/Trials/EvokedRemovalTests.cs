using Coupling.Trials;

namespace Coupling.Tests.Trials;

/// <summary>
/// EvokedRemoval subtracts the trial mean per channel and sample: what is left has zero mean over trials, and a
/// response identical in every trial disappears, leaving the induced residual x_n − mean_m x_m of the rest
/// (common practice: the induced part is the trial minus the evoked average).
/// </summary>
public sealed class EvokedRemovalTests
{
    private const int Trials = 16, Channels = 3, Samples = 64;

    private static TrialSet Set(double[] data) =>
        new("cue", ["A", "B", "C"], 100, Trials, Samples, 4, -0.2, data, Enumerable.Repeat(0.0, Trials).ToArray(), []);

    private static double[] Noise(int seed)
    {
        var rng = new Random(seed);
        return Enumerable.Range(0, Trials * Channels * Samples).Select(_ => 2 * rng.NextDouble() - 1).ToArray();
    }

    private static double Response(int c, int s) => (c + 1) * 50 * Math.Sin(2 * Math.PI * 10 * s / 100.0) * Math.Exp(-s / 30.0);

    [Fact]
    public void The_trial_mean_of_every_channel_and_sample_becomes_zero()
    {
        var set = Set(Noise(3));
        EvokedRemoval.SubtractInPlace(set);
        for (int c = 0; c < Channels; c++)
            for (int s = 0; s < Samples; s++)
            {
                double sum = 0;
                for (int n = 0; n < Trials; n++) sum += set.Trial(n, c)[s];
                // Values are below 2 in size: the sum of 16 rounded residuals stays within 16 · 2 · 2^-52 ≈ 1e-14 of zero.
                Assert.True(Math.Abs(sum) < 1e-13, $"channel {c}, sample {s}: trial sum {sum}");
            }
    }

    [Fact]
    public void A_response_identical_in_every_trial_is_removed_leaving_the_induced_residual()
    {
        var noise = Noise(5);
        var withResponse = noise.ToArray();
        for (int n = 0; n < Trials; n++)
            for (int c = 0; c < Channels; c++)
                for (int s = 0; s < Samples; s++) withResponse[(n * Channels + c) * Samples + s] += Response(c, s);
        var a = Set(withResponse);
        var b = Set(noise.ToArray());
        EvokedRemoval.SubtractInPlace(a);
        EvokedRemoval.SubtractInPlace(b);
        // The response is at most 150 in size: adding and removing it rounds at 150 · 2^-52 ≈ 3e-14 a few times.
        for (int i = 0; i < a.Data.Length; i++) Assert.True(Math.Abs(a.Data[i] - b.Data[i]) < 1e-12, $"index {i}: {a.Data[i]} vs {b.Data[i]}");
        // and the residual is the noise minus its own trial mean, not the noise itself (the subtraction did happen).
        Assert.Contains(Enumerable.Range(0, noise.Length), i => Math.Abs(b.Data[i] - noise[i]) > 1e-3);
    }

    [Fact]
    public void Trials_that_are_all_the_same_become_zero_up_to_rounding()
    {
        var data = new double[Trials * Channels * Samples];
        for (int n = 0; n < Trials; n++)
            for (int c = 0; c < Channels; c++)
                for (int s = 0; s < Samples; s++) data[(n * Channels + c) * Samples + s] = Response(c, s);
        Assert.Contains(data, v => Math.Abs(v) > 10);
        var set = Set(data);
        EvokedRemoval.SubtractInPlace(set);
        // Only rounding is left: a running sum of N values errs by at most (N − 1) u Σ|x| (Higham 2002, Accuracy and
        // Stability of Numerical Algorithms, 2nd ed., eq. 4.4), so the mean of 16 copies of |x| <= 150 errs by at most
        // 15 · 2^-53 · 150 ≈ 2.5e-13.
        Assert.All(set.Data, v => Assert.True(Math.Abs(v) <= 15 * Math.Pow(2, -53) * 150, $"residual {v}"));
    }

    [Fact]
    public void Subtracting_a_given_mean_is_the_same_as_subtracting_the_sets_own_and_another_shape_is_refused()
    {
        var own = Set(Noise(7));
        var given = Set(Noise(7));
        EvokedRemoval.SubtractInPlace(own);
        EvokedRemoval.SubtractInPlace(given, EvokedRemoval.Mean(given));
        Assert.Equal(own.Data, given.Data);

        var other = new TrialSet("cue", ["A", "B"], 100, 1, Samples, 4, -0.2, new double[2 * Samples], [0.0], []);
        Assert.Throws<ArgumentException>(() => EvokedRemoval.SubtractInPlace(own, other));
        Assert.Throws<ArgumentException>(() => EvokedRemoval.SubtractInPlace(own, own));
    }
}
