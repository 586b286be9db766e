namespace Coupling.Artefacts;

/// <summary>The kinds of warning <see cref="ArtefactFlags"/> raises from a run's results.</summary>
public enum ArtefactKind
{
    /// <summary>Significant for PLV or coherence but for none of the lag-insensitive phase measures: possibly a zero-lag
    /// component (volume conduction, a common reference).</summary>
    ZeroLag,
    /// <summary>Both channels carry a strong stimulus-locked response and the evoked response was kept.</summary>
    SharedEvoked,
    /// <summary>Significant for an amplitude-weighted measure, with significantly correlated envelopes, but not for the
    /// amplitude-free phase measures (PLV, PPC): possibly driven by amplitude.</summary>
    AmplitudeDriven,
    /// <summary>A channel whose band power lies far above or below that of the other channels.</summary>
    PowerOutlier,
}
