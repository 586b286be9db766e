namespace Coupling.Outputs;

/// <summary>How the value of pair (b, a) relates to the stored value of pair (a, b), a &lt; b.</summary>
public static class MeasureSymmetry
{
    /// <summary>
    /// True for measures whose value changes sign when the two channels swap places: imaginary coherency
    /// ("imag-coherency"), Im C_ba = -Im C_ab. Every other measure key is taken as symmetric.
    /// </summary>
    /// <remarks>
    /// Nolte G, Bai O, Wheaton L, Mari Z, Vorbach S, Hallett M (2004). Identifying true brain interaction from EEG
    /// data using the imaginary part of coherency. Clinical Neurophysiology 115:2292-2307. PLV, PPC, PLI, wPLI
    /// (as |E{Im S}| / E{|Im S|}), coherence and envelope correlations are symmetric in the two channels.
    /// </remarks>
    /// <param name="measureKey">Measure key as in <see cref="Results.PairResult.Measure"/>.</param>
    public static bool IsAntisymmetric(string measureKey) =>
        string.Equals(measureKey, "imag-coherency", StringComparison.OrdinalIgnoreCase);
}
