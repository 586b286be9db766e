using Coupling.Statistics;
using Coupling.TimeFrequency;
using ScottPlot;

namespace Coupling.Figures;

/// <summary>Draws time-frequency maps of one pair as heatmaps (PNG and SVG): a condition's values (or change from baseline), or a
/// cluster test's standardised difference with its significant clusters marked.</summary>
/// <remarks>
/// Time runs along x (bin centres, s), frequency up y (one row per computed frequency, labelled with a few of them).
/// Colours: the perceptually uniform Viridis map (van der Walt and Smith 2015, matplotlib) from 0 to the largest value
/// for non-negative values, the diverging, perceptually uniform cmocean Balance map (Thyng et al. 2016, Oceanography
/// 29(3):9-13) symmetric about zero for signed values, changes and z (<see cref="FigureColours"/>); NaN cells are white.
/// The colour bar is titled and carries a few round ticks (<see cref="FigureStyle.AddColourBar"/>).
/// </remarks>
public static class TimeFrequencyFigure
{
    /// <summary>Writes the map of <paramref name="values"/>: the change from baseline when it has one and <paramref name="change"/> is set, else the values.</summary>
    /// <param name="values">One pair, condition and measure over frequency x time.</param>
    /// <param name="paths">Output paths (.png, .svg); each written atomically.</param>
    /// <param name="change">Draw the change from baseline (needs <see cref="TimeFrequencyValues.Change"/>).</param>
    /// <param name="width">Image width in pixels (at least 200).</param>
    /// <param name="height">Image height in pixels (at least 200).</param>
    public static void Save(TimeFrequencyValues values, IReadOnlyList<string> paths, bool change = false, int width = 900, int height = 600)
    {
        var shown = change ? values.Change ?? throw new ArgumentException("No baseline change to draw.", nameof(change)) : values.Values;
        string label = change ? $"{values.Measure} change from baseline" : values.Measure;
        bool signed = change || FigureStyle.IsSigned(values.Measure, shown.Where(double.IsFinite));
        using var plot = FigureStyle.NewPlot();
        Draw(plot, values.Frequencies, values.Times, shown, signed, label);
        plot.Title($"{values.ChannelA} – {values.ChannelB} · {values.Condition} · {label}", FigureStyle.TitleSize(width));
        FigureStyle.Save(plot, paths, width, height);
    }

    /// <summary>Writes the cluster test's z map; cells of clusters with p at most <paramref name="level"/> carry a dot.</summary>
    /// <param name="result">The test.</param>
    /// <param name="paths">Output paths (.png, .svg); each written atomically.</param>
    /// <param name="level">Cluster p-value at or below which a cluster is marked (e.g. 0.05).</param>
    /// <param name="width">Image width in pixels (at least 200).</param>
    /// <param name="height">Image height in pixels (at least 200).</param>
    public static void SaveClusters(ClusterTestResult result, IReadOnlyList<string> paths, double level = 0.05, int width = 900, int height = 600)
    {
        using var plot = FigureStyle.NewPlot();
        Draw(plot, result.Frequencies, result.Times, result.Z, signed: true, $"z of {result.Measure} difference");
        int nF = result.Frequencies.Count, nT = result.Times.Count;
        var marked = new List<Coordinates>();
        for (int i = 0; i < result.Labels.Length; i++)
            if (result.Labels[i] > 0 && result.Clusters[result.Labels[i] - 1].P <= level)
                marked.Add(new Coordinates(X(result.Times, i % nT), i / nT));
        if (marked.Count > 0)
            plot.Add.Markers(marked.ToArray(), MarkerShape.FilledCircle, (float)Math.Clamp(300.0 / Math.Max(nF, nT), 3, 10), FigureStyle.Ink);
        int significant = result.Clusters.Count(c => c.P <= level);
        string note = significant == 0
            ? $"no cluster with p ≤ {level:0.###} ({result.Draws} permutations)"
            : $"{significant} cluster{(significant > 1 ? "s" : "")} with p ≤ {level:0.###} dotted ({result.Draws} permutations)";
        plot.Title($"{result.ChannelA} – {result.ChannelB} · {result.ConditionA} − {result.ConditionB} · {result.Measure}\n{note}",
            FigureStyle.TitleSize(width));
        FigureStyle.Save(plot, paths, width, height);
    }

    /// <summary>x of bin <paramref name="t"/>: its centre in s, or the bin index when there is one bin.</summary>
    private static double X(IReadOnlyList<double> times, int t) => times.Count == 1 ? 0 : times[t];

    private static ScottPlot.Plottables.Heatmap Draw(Plot plot, IReadOnlyList<double> frequencies, IReadOnlyList<double> times,
        double[] values, bool signed, string label)
    {
        int nF = frequencies.Count, nT = times.Count;
        var grid = new double[nF, nT];
        for (int f = 0; f < nF; f++)
            for (int t = 0; t < nT; t++)
                grid[nF - 1 - f, t] = values[f * nT + t]; // row 0 is drawn at the top: highest frequency first
        var finite = values.Where(double.IsFinite).ToArray();
        double top = finite.Length == 0 ? 1 : finite.Max(Math.Abs);
        if (top == 0) top = 1;
        var heatmap = plot.Add.Heatmap(grid);
        heatmap.Colormap = signed ? FigureColours.Signed : FigureColours.Magnitude;
        heatmap.ManualRange = signed ? new ScottPlot.Range(-top, top) : new ScottPlot.Range(0, top);
        heatmap.NaNCellColor = Colors.White;
        double half = nT > 1 ? 0.5 * (times[^1] - times[0]) / (nT - 1) : 0.5;
        double left = X(times, 0), right = X(times, nT - 1);
        // Rectangle gives the outer edges: half a bin beyond the first and last centres, half a row beyond the frequency rows.
        heatmap.Rectangle = new CoordinateRect(left - half, right + half, -0.5, nF - 0.5);

        FigureStyle.AddColourBar(plot, heatmap, label);

        if (nT > 1) SpectrumFigure.SetRoundTicks(plot.Axes.Bottom, times[0] - half, times[^1] + half);
        else plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual([0.0], [times[0].ToString("G4", System.Globalization.CultureInfo.InvariantCulture)]);
        plot.Axes.Bottom.MinorTickStyle.Length = 0;
        int every = Math.Max(1, (int)Math.Ceiling(nF / 8.0));
        var rows = Enumerable.Range(0, nF).Where(f => f % every == 0).ToArray();
        plot.Axes.Left.TickGenerator = new ScottPlot.TickGenerators.NumericManual(
            rows.Select(f => (double)f).ToArray(), rows.Select(f => frequencies[f].ToString("G4", System.Globalization.CultureInfo.InvariantCulture)).ToArray());
        plot.Axes.Left.MinorTickStyle.Length = 0;
        plot.Axes.Bottom.Label.Text = "time (s)";
        plot.Axes.Left.Label.Text = "frequency (Hz)";
        plot.Axes.SetLimits(left - half, right + half, -0.5, nF - 0.5);
        return heatmap;
    }
}
