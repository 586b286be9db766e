namespace Coupling.TimeFrequency;

/// <summary>
/// A span of time, in seconds relative to each event onset, over which connectivity is summarised (start inclusive,
/// end exclusive). A bin with <see cref="End"/> equal to <see cref="Start"/> stands for the single time point nearest
/// to <see cref="Start"/>.
/// </summary>
/// <param name="Start">Start, s.</param>
/// <param name="End">End, s; equal to <paramref name="Start"/> for a single time point.</param>
public sealed record TimeBin(double Start, double End)
{
    /// <summary>Middle of the bin, s, rounded to 1e-9 s: the time a table or figure shows for it.</summary>
    public double Centre => Math.Round(0.5 * (Start + End), 9);

    /// <summary>Whether the bin is one time point rather than a span.</summary>
    public bool IsPoint => End == Start;

    /// <summary>
    /// Bins of <paramref name="width"/> seconds (or single time points when it is 0) whose centres step by
    /// <paramref name="step"/> seconds from the first that fits inside <paramref name="start"/>..<paramref name="end"/>.
    /// </summary>
    /// <exception cref="InputException">Not even one bin fits.</exception>
    public static IReadOnlyList<TimeBin> Sliding(double start, double end, double width, double step)
    {
        if (!(step > 0)) throw new InputException($"time bins: step {step} s must be positive.");
        if (!(width >= 0)) throw new InputException($"time bins: width {width} s must not be negative.");
        var bins = new List<TimeBin>();
        // Centres on the grid start + w/2 + i * step, rounded to 1e-9 s so that decimal inputs give the times a reader
        // expects (0.7, not 0.7000000000000001); 1e-9 s also absorbs that rounding at the span's end.
        for (int i = 0; ; i++)
        {
            double centre = Math.Round(start + 0.5 * width + i * step, 9);
            if (width > 0 ? centre + 0.5 * width > end + 1e-9 : centre >= end - 1e-9) break;
            bins.Add(width > 0
                ? new TimeBin(Math.Round(centre - 0.5 * width, 9), Math.Round(centre + 0.5 * width, 9))
                : new TimeBin(centre, centre));
        }
        if (bins.Count == 0)
            throw new InputException($"time bins: no bin of width {width} s fits between {start} s and {end} s.");
        return bins;
    }
}
