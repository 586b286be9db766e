namespace Coupling.Measures;

/// <summary>The connectivity measures the program computes.</summary>
public enum Measure
{
    /// <summary>Phase-locking value (Lachaux et al. 1999).</summary>
    Plv,
    /// <summary>Pairwise phase consistency (Vinck et al. 2010).</summary>
    Ppc,
    /// <summary>Phase-lag index (Stam et al. 2007).</summary>
    Pli,
    /// <summary>Weighted phase-lag index (Vinck et al. 2011).</summary>
    Wpli,
    /// <summary>Debiased estimator of the squared weighted phase-lag index (Vinck et al. 2011).</summary>
    WpliDebiased,
    /// <summary>Magnitude-squared coherence.</summary>
    Coherence,
    /// <summary>Imaginary part of coherency (Nolte et al. 2004).</summary>
    ImagCoherency,
    /// <summary>Amplitude-envelope correlation.</summary>
    Aec,
    /// <summary>Amplitude-envelope correlation of orthogonalized signals (Hipp et al. 2012).</summary>
    AecOrth,
}
