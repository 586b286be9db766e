namespace Coupling.Reports;

/// <summary>
/// The published source of every measure, test and processing step the methods paragraph names: a short in-text
/// citation and the full reference, as in docs/methods.md.
/// </summary>
public static class MethodSources
{
    /// <summary>A source: the in-text citation and the full reference.</summary>
    /// <param name="Citation">Author-year citation, e.g. "Lachaux et al. 1999".</param>
    /// <param name="Reference">Full reference: authors, year, title, journal, volume and pages.</param>
    public sealed record Source(string Citation, string Reference);

    private static readonly Dictionary<string, Source> Sources = new(StringComparer.Ordinal)
    {
        ["plv"] = new("Lachaux et al. 1999", "Lachaux JP, Rodriguez E, Martinerie J, Varela FJ (1999). Measuring phase synchrony in brain signals. Hum Brain Mapp 8:194-208."),
        ["ppc"] = new("Vinck et al. 2010", "Vinck M, van Wingerden M, Womelsdorf T, Fries P, Pennartz CMA (2010). The pairwise phase consistency: a bias-free measure of rhythmic neuronal synchronization. NeuroImage 51:112-122."),
        ["pli"] = new("Stam et al. 2007", "Stam CJ, Nolte G, Daffertshofer A (2007). Phase lag index: assessment of functional connectivity from multi channel EEG and MEG with diminished bias from common sources. Hum Brain Mapp 28:1178-1193."),
        ["wpli"] = new("Vinck et al. 2011", "Vinck M, Oostenveld R, van Wingerden M, Battaglia F, Pennartz CMA (2011). An improved index of phase-synchronization for electrophysiological data in the presence of volume-conduction, noise and sample-size bias. NeuroImage 55:1548-1565."),
        ["coherence"] = new("Bendat & Piersol 2010", "Bendat JS, Piersol AG (2010). Random Data: Analysis and Measurement Procedures, 4th ed. Wiley."),
        ["imag-coherency"] = new("Nolte et al. 2004", "Nolte G, Bai O, Wheaton L, Mari Z, Vorbach S, Hallett M (2004). Identifying true brain interaction from EEG data using the imaginary part of coherency. Clin Neurophysiol 115:2292-2307."),
        ["aec"] = new("Hipp et al. 2012", "Hipp JF, Hawellek DJ, Corbetta M, Siegel M, Engel AK (2012). Large-scale cortical correlation structure of spontaneous oscillatory activity. Nat Neurosci 15:884-890."),
        ["kaiser"] = new("Kaiser 1974", "Kaiser JF (1974). Nonrecursive digital filter design using the I0-sinh window function. Proc IEEE Int Symp Circuits Syst, 20-23."),
        ["hilbert"] = new("Marple 1999", "Marple SL (1999). Computing the discrete-time analytic signal via FFT. IEEE Trans Signal Process 47:2600-2603."),
        ["morlet"] = new("Tallon-Baudry et al. 1996", "Tallon-Baudry C, Bertrand O, Delpuech C, Pernier J (1996). Stimulus specificity of phase-locked and non-phase-locked 40 Hz visual responses in human. J Neurosci 16:4240-4249."),
        ["permutation-p"] = new("Phipson & Smyth 2010", "Phipson B, Smyth GK (2010). Permutation p-values should never be zero: calculating exact p-values when permutations are randomly drawn. Stat Appl Genet Mol Biol 9:39."),
        ["fdr-bh"] = new("Benjamini & Hochberg 1995", "Benjamini Y, Hochberg Y (1995). Controlling the false discovery rate: a practical and powerful approach to multiple testing. J R Stat Soc B 57:289-300."),
        ["benjamini-yekutieli"] = new("Benjamini & Yekutieli 2001", "Benjamini Y, Yekutieli D (2001). The control of the false discovery rate in multiple testing under dependency. Ann Stat 29:1165-1188."),
        ["max-statistic"] = new("Nichols & Holmes 2002", "Nichols TE, Holmes AP (2002). Nonparametric permutation tests for functional neuroimaging: a primer with examples. Hum Brain Mapp 15:1-25."),
        ["network-based"] = new("Zalesky et al. 2010", "Zalesky A, Fornito A, Bullmore ET (2010). Network-based statistic: identifying differences in brain networks. NeuroImage 53:1197-1207."),
        ["pareto-tail"] = new("Knijnenburg et al. 2009", "Knijnenburg TA, Wessels LFA, Reinders MJT, Shmulevich I (2009). Fewer permutations, more accurate P-values. Bioinformatics 25:i161-i168."),
        ["label-permutation"] = new("Maris & Oostenveld 2007", "Maris E, Oostenveld R (2007). Nonparametric statistical testing of EEG- and MEG-data. J Neurosci Methods 164:177-190."),
        ["slepian"] = new("Slepian 1978", "Slepian D (1978). Prolate spheroidal wave functions, Fourier analysis, and uncertainty V: the discrete case. Bell Syst Tech J 57:1371-1430."),
        ["thomson"] = new("Thomson 1982", "Thomson DJ (1982). Spectrum estimation and harmonic analysis. Proc IEEE 70:1055-1096."),
        ["fisher-z"] = new("Fisher 1915", "Fisher RA (1915). Frequency distribution of the values of the correlation coefficient in samples from an indefinitely large population. Biometrika 10:507-521."),
    };

    /// <summary>
    /// The source of <paramref name="key"/>: a measure key (<c>wpli-debiased</c> shares the wPLI paper, <c>aec-orth</c> the
    /// orthogonalization paper that also defines the plain AEC used here) or one of kaiser, hilbert, morlet,
    /// permutation-p, fdr-bh, benjamini-yekutieli, max-statistic, network-based, pareto-tail, label-permutation, fisher-z,
    /// slepian (DPSS tapers), thomson (the multitaper method), cluster-permutation (the cluster test over frequency x time,
    /// from the same paper as label-permutation).
    /// </summary>
    /// <exception cref="ArgumentException">No source is recorded for the key.</exception>
    public static Source Of(string key) => key switch
    {
        "wpli-debiased" => Sources["wpli"],
        "aec-orth" => Sources["aec"],
        "cluster-permutation" => Sources["label-permutation"],
        _ => Sources.TryGetValue(key, out var s) ? s : throw new ArgumentException($"No source recorded for '{key}'.", nameof(key)),
    };
}
