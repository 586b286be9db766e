namespace Coupling.Figures;

/// <summary>A few round tick values for an axis or colour bar: multiples of 1, 2 or 5 times a power of ten.</summary>
internal static class RoundTicks
{
    /// <summary>
    /// The multiples of the smallest step s in {1, 2, 5} x 10^k that puts at most <paramref name="most"/> ticks in
    /// [<paramref name="low"/>, <paramref name="high"/>] (at least one: the value itself when the range is empty).
    /// </summary>
    public static double[] Between(double low, double high, int most = 5)
    {
        if (!(high > low) || !double.IsFinite(low) || !double.IsFinite(high)) return [double.IsFinite(low) ? low : 0];
        double span = high - low;
        double power = Math.Pow(10, Math.Floor(Math.Log10(span / most)));
        foreach (double unit in new[] { 1.0, 2.0, 5.0, 10.0, 20.0 })
        {
            double step = unit * power;
            double first = Math.Ceiling(low / step - 1e-9) * step;
            int count = (int)Math.Floor((high - first) / step + 1e-9) + 1;
            if (count <= most)
                // Round to the step's decimals so that 0.1 + 0.2 prints as 0.3.
                return Enumerable.Range(0, count).Select(i => Math.Round(first + i * step, Math.Max(0, 1 - (int)Math.Floor(Math.Log10(step))))).ToArray();
        }
        return [low, high];
    }

    /// <summary>Tick text: the shortest general form of the value (invariant culture), with -0 written as 0.</summary>
    public static string Label(double v) => (v == 0 ? 0.0 : v).ToString("G4", System.Globalization.CultureInfo.InvariantCulture);
}
