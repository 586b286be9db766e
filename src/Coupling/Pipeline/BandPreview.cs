using Coupling.Spectral;

namespace Coupling.Pipeline;

/// <summary>How one band of a plan will be isolated.</summary>
/// <param name="Band">Band name.</param>
/// <param name="Method">Decomposition method (<c>fir-hilbert</c> or <c>morlet</c>).</param>
/// <param name="KernelSamples">Length of the band-pass filter (taps) or of the wavelet's support, in samples.</param>
/// <param name="KernelSeconds">The same length in seconds.</param>
/// <param name="PadSamples">Padding at each end of a trial that the decomposition needs.</param>
/// <param name="TimeStep">Samples between analysed time points.</param>
/// <param name="Info">Every parameter of the design, as the manifest records it.</param>
public sealed record BandPreview(string Band, string Method, int KernelSamples, double KernelSeconds, int PadSamples, int TimeStep, DecompositionInfo Info);
