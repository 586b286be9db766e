using Coupling.Formats;

namespace Coupling.Simulation;

/// <summary>
/// The invented ten-electrode montage: two rows of five electrodes on a flat grid, left row L1..L5 and right row
/// R1..R5, numbered front to back. Positions are in millimetres, x to the right, y to the front, z = 0.
/// </summary>
internal static class Montage
{
    /// <summary>Channel labels in recording order.</summary>
    public static readonly string[] Labels = ["L1", "L2", "L3", "L4", "L5", "R1", "R2", "R3", "R4", "R5"];

    /// <summary>Theta pair: L1 leads, R4 follows.</summary>
    public const string ThetaA = "L1", ThetaB = "R4";

    /// <summary>Beta pair: L2 leads, R5 follows (coupled in one condition only).</summary>
    public const string BetaA = "L2", BetaB = "R5";

    /// <summary>Zero-lag alpha mixing pair: L4 gain 1, L5 the smaller gain.</summary>
    public const string MixA = "L4", MixB = "L5";

    /// <summary>Gamma pair sharing only an amplitude envelope.</summary>
    public const string EnvelopeA = "R1", EnvelopeB = "L3";

    /// <summary>Pair carrying the same stimulus-locked response.</summary>
    public const string EvokedA = "R2", EvokedB = "R3";

    /// <summary>Index of a label in <see cref="Labels"/>.</summary>
    public static int IndexOf(string label) => Array.IndexOf(Labels, label);

    /// <summary>The channels with their positions: rows at x = -2 and +2 mm, electrodes 2 mm apart from y = +4 (front) to -4 mm.</summary>
    public static ChannelInfo[] Channels()
    {
        var channels = new ChannelInfo[Labels.Length];
        for (int i = 0; i < Labels.Length; i++)
        {
            double x = Labels[i][0] == 'L' ? -2.0 : 2.0;
            int row = Labels[i][1] - '1';
            double y = 4.0 - 2.0 * row;
            channels[i] = new ChannelInfo(Labels[i], "EEG", "uV", new ChannelPosition(x, y, 0.0));
        }
        return channels;
    }
}
