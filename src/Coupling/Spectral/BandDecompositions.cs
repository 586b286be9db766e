namespace Coupling.Spectral;

/// <summary>Builds a band decomposition by method name.</summary>
public static class BandDecompositions
{
    /// <summary>Method name of <see cref="FirHilbertDecomposition"/>.</summary>
    public const string FirHilbert = "fir-hilbert";

    /// <summary>Method name of <see cref="MorletDecomposition"/>.</summary>
    public const string Morlet = "morlet";

    /// <summary>
    /// "fir-hilbert": <see cref="FirDesign.BandPass(Band, double, double, double)"/> with the options' transition and
    /// attenuation (or their defaults) in a <see cref="FirHilbertDecomposition"/>; "morlet":
    /// <see cref="MorletDecomposition.Create"/> with the options' cycles (or the default rule). Options the method
    /// does not use are ignored.
    /// </summary>
    /// <param name="method">"fir-hilbert" or "morlet" (case-sensitive).</param>
    /// <param name="band">The band.</param>
    /// <param name="sampleRate">Sampling rate in Hz.</param>
    /// <param name="options">Settings; null for all defaults.</param>
    /// <exception cref="InputException">Unknown method, or a band or setting that does not fit.</exception>
    public static IBandDecomposition Create(string method, Band band, double sampleRate, BandDecompositionOptions? options = null)
    {
        options ??= BandDecompositionOptions.Defaults;
        switch (method)
        {
            case FirHilbert:
                SpectralChecks.Band(band, sampleRate);
                var filter = FirDesign.BandPass(band, sampleRate,
                    options.TransitionHz ?? FirDesign.DefaultTransitionHz(band, sampleRate),
                    options.AttenuationDb ?? FirDesign.DefaultAttenuationDb);
                return new FirHilbertDecomposition(filter);
            case Morlet:
                return MorletDecomposition.Create(band, sampleRate, options.Cycles);
            default:
                throw new InputException($"{SpectralChecks.Describe(band)}: unknown band method '{method}'; expected '{FirHilbert}' or '{Morlet}'.");
        }
    }
}
