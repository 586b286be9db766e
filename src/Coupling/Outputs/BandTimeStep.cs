namespace Coupling.Outputs;

/// <summary>The spacing of the analysed time points of one band.</summary>
/// <param name="Band">Band name.</param>
/// <param name="Samples">Step in samples.</param>
/// <param name="Seconds">Step in seconds.</param>
public sealed record BandTimeStep(string Band, int Samples, double Seconds);
