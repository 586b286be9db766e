namespace Coupling.Results;

/// <summary>
/// What one condition's narrowband signals in one band look like beyond the pair measures: per channel the mean power
/// and the stimulus locking (inter-trial phase consistency), and per channel pair the phase of the window-mean coherency
/// with the time lag it stands for at the band centre. A plain record for the report and the artefact flags.
/// </summary>
/// <param name="Condition">Condition name.</param>
/// <param name="Band">Band name.</param>
/// <param name="CentreHz">Band centre (arithmetic mean of the edges), Hz, at which phases are turned into lags.</param>
/// <param name="Trials">Number of trials the values come from.</param>
/// <param name="Channels">Channel labels.</param>
/// <param name="Power">Per channel: mean of |z|² over the window's time points and the trials (squared recording unit).</param>
/// <param name="StimulusLocking">Per channel: mean over the window's time points of |(1/N) Σ_n z_n/|z_n||, 0 to 1.</param>
/// <param name="CoherencyPhase">Per pair (<see cref="Measures.PairIndex"/> order): phase of the window-mean coherency in
/// radians, (−π, π]; positive when the first channel leads. NaN when the mean coherency is 0.</param>
/// <param name="LagMs">Per pair: <paramref name="CoherencyPhase"/> as a time lag at the band centre, milliseconds.</param>
public sealed record BandSignalSummary(
    string Condition,
    string Band,
    double CentreHz,
    int Trials,
    IReadOnlyList<string> Channels,
    double[] Power,
    double[] StimulusLocking,
    double[] CoherencyPhase,
    double[] LagMs);
