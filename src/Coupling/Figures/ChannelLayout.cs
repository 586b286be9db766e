using Coupling.Results;
using ScottPlot;

namespace Coupling.Figures;

/// <summary>Where a network figure draws each channel, and how the places were chosen.</summary>
/// <remarks>
/// In order of preference: the positions of the input (an electrodes file) when every channel has one, drawn as
/// given with x to the right and y to the front; else the 10-20/10-10 position (<see cref="StandardPositions"/>) of
/// every channel whose label is one, on a head seen from above, with the other channels in rows below the head;
/// else, when no label is standard, an even grid in channel order, left to right and top to bottom.
/// </remarks>
internal sealed class ChannelLayout
{
    private ChannelLayout(Coordinates[] points, ChannelLayoutKind kind, int standard, string? note)
    {
        Points = points;
        Kind = kind;
        StandardCount = standard;
        Note = note;
    }

    /// <summary>One point per channel, in channel order.</summary>
    public Coordinates[] Points { get; }

    /// <summary>How the points were chosen.</summary>
    public ChannelLayoutKind Kind { get; }

    /// <summary>Number of channels at a standard position (head layout only).</summary>
    public int StandardCount { get; }

    /// <summary>A note for the figure when the layout needs one, else null.</summary>
    public string? Note { get; }

    /// <summary>Radius of the head outline in the head layout (the nasion-inion level).</summary>
    public const double HeadRadius = 1.0;

    /// <summary>The layout of <paramref name="result"/>'s channels.</summary>
    public static ChannelLayout For(PairResult result) =>
        For(result.Channels, result.Positions);

    /// <summary>The layout of <paramref name="channels"/> with the input's positions, where known.</summary>
    public static ChannelLayout For(IReadOnlyList<string> channels, IReadOnlyList<Formats.ChannelPosition?>? positions)
    {
        int n = channels.Count;
        if (positions is not null && positions.Count == n && n > 0 && positions.All(p => p.HasValue))
            return new ChannelLayout(positions.Select(p => new Coordinates(p!.Value.X, p.Value.Y)).ToArray(), ChannelLayoutKind.Electrodes, 0, null);

        string? partial = positions is not null && positions.Any(p => p.HasValue)
            ? "not every channel has a position in the input: standard positions used instead"
            : null;
        var points = new Coordinates[n];
        var unknown = new List<int>();
        for (int i = 0; i < n; i++)
        {
            if (StandardPositions.TryGet(channels[i], out double x, out double y)) points[i] = new Coordinates(x, y);
            else unknown.Add(i);
        }
        if (unknown.Count == n)
        {
            var grid = Grid(n, columns: (int)Math.Ceiling(Math.Sqrt(n)), top: 0, spacing: 1);
            return new ChannelLayout(grid, ChannelLayoutKind.Even, 0,
                partial ?? "no channel has a position or a 10-20/10-10 label: channels in channel order");
        }

        // Unknown labels in rows of up to eight under the head, in channel order.
        const int perRow = 8;
        var rows = Grid(unknown.Count, Math.Min(perRow, unknown.Count), top: -HeadRadius - 0.32, spacing: 0.27);
        for (int k = 0; k < unknown.Count; k++) points[unknown[k]] = rows[k];
        string? note = unknown.Count == 0 ? partial
            : $"{unknown.Count} channel{(unknown.Count == 1 ? "" : "s")} without a 10-20/10-10 position: in a row below the head";
        return new ChannelLayout(points, ChannelLayoutKind.Head, n - unknown.Count, note);
    }

    /// <summary><paramref name="count"/> points in rows of <paramref name="columns"/>, centred on x = 0, the first row at <paramref name="top"/>.</summary>
    private static Coordinates[] Grid(int count, int columns, double top, double spacing)
    {
        var points = new Coordinates[count];
        for (int k = 0; k < count; k++)
        {
            int row = k / columns, column = k % columns;
            int inRow = Math.Min(columns, count - row * columns);
            points[k] = new Coordinates((column - (inRow - 1) / 2.0) * spacing, top - row * spacing);
        }
        return points;
    }
}
