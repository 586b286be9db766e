using Coupling.Formats;

namespace Coupling.Simulation;

/// <summary>A generated recording together with the ground truth built into it.</summary>
/// <param name="Recording">The continuous recording: samples in microvolts, one event per trial, channel positions set.</param>
/// <param name="Truth">What the recording truly contains.</param>
public sealed record SimulatedScenario(Recording Recording, GroundTruth Truth);
