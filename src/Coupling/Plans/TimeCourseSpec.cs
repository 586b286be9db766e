namespace Coupling.Plans;

/// <summary>Time-resolved connectivity over the trial span: the <c>spectrum.time</c> key.</summary>
/// <param name="Width">Width of each sliding bin, s; 0 for single time points (method morlet only).</param>
/// <param name="Step">Distance between bin centres, s.</param>
/// <param name="Baseline">Baseline span whose bins' mean is subtracted; null for no baseline change.</param>
public sealed record TimeCourseSpec(double Width, double Step, TimeRange? Baseline);
