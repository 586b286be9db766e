namespace Coupling.Tests.Statistics;

/// <summary>
/// Draws of the trial-shuffle null of a PLV: the length of the mean of N unit phasors with independent uniform phases
/// (PLV of independent channels). Phases are drawn from 4096 equally spaced angles (a table of cosines and sines) so
/// that the hundreds of thousands of draws the tail checks need stay cheap; observed value and draws come from the same
/// law, which is all the checks require.
/// </summary>
internal static class NullPlvSampler
{
    private const int Angles = 4096;
    private static readonly double[] Cos = Enumerable.Range(0, Angles).Select(k => Math.Cos(2 * Math.PI * k / Angles)).ToArray();
    private static readonly double[] Sin = Enumerable.Range(0, Angles).Select(k => Math.Sin(2 * Math.PI * k / Angles)).ToArray();

    public static double Draw(Random random, int trials)
    {
        double re = 0, im = 0;
        for (int n = 0; n < trials; n++)
        {
            int k = random.Next(Angles);
            re += Cos[k];
            im += Sin[k];
        }
        return Math.Sqrt(re * re + im * im) / trials;
    }
}
