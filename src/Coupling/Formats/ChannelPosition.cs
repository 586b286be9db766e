namespace Coupling.Formats;

/// <summary>A sensor position in the input's own coordinate frame (units as the input states them).</summary>
/// <param name="X">First coordinate.</param>
/// <param name="Y">Second coordinate.</param>
/// <param name="Z">Third coordinate (0 for flat layouts).</param>
public readonly record struct ChannelPosition(double X, double Y, double Z);
