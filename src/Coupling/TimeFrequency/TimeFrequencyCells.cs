using Coupling.Spectral;

namespace Coupling.TimeFrequency;

/// <summary>
/// The complex spectral estimates of one condition's trials at every frequency x time bin: one
/// <see cref="NarrowbandSet"/> per cell whose "trials" are the observations of the cell. With Morlet wavelets an
/// observation is a trial and a cell's time points are the wavelet outputs inside the bin; with multitaper an
/// observation is one taper of one trial (trial-major: observation n K + k is taper k of trial n) at one time point.
/// </summary>
public sealed class TimeFrequencyCells
{
    private readonly NarrowbandSet[] _sets;

    /// <summary>Creates the cells; <paramref name="sets"/> is frequency-major (cell f, b at f * bins + b).</summary>
    /// <exception cref="ArgumentException">Shapes disagree.</exception>
    public TimeFrequencyCells(IReadOnlyList<double> frequencies, IReadOnlyList<TimeBin> bins, int trialCount,
        int observationsPerTrial, NarrowbandSet[] sets)
    {
        if (sets.Length != frequencies.Count * bins.Count)
            throw new ArgumentException($"Expected {frequencies.Count}x{bins.Count} cells, got {sets.Length}.", nameof(sets));
        if (trialCount < 1 || observationsPerTrial < 1)
            throw new ArgumentException("At least one trial and one observation per trial.", nameof(trialCount));
        foreach (var s in sets)
            if (s.TrialCount != trialCount * observationsPerTrial || !s.Channels.SequenceEqual(sets[0].Channels, StringComparer.Ordinal))
                throw new ArgumentException("Every cell must hold the same channels and trials x observations per trial.", nameof(sets));
        Frequencies = frequencies;
        Bins = bins;
        TrialCount = trialCount;
        ObservationsPerTrial = observationsPerTrial;
        _sets = sets;
    }

    /// <summary>Frequencies, Hz.</summary>
    public IReadOnlyList<double> Frequencies { get; }

    /// <summary>Time bins.</summary>
    public IReadOnlyList<TimeBin> Bins { get; }

    /// <summary>Channel labels.</summary>
    public IReadOnlyList<string> Channels => _sets[0].Channels;

    /// <summary>Number of trials.</summary>
    public int TrialCount { get; }

    /// <summary>Observations each trial contributes to a cell (1 for wavelets, the number of tapers for multitaper).</summary>
    public int ObservationsPerTrial { get; }

    /// <summary>Number of cells, frequencies x bins.</summary>
    public int CellCount => _sets.Length;

    /// <summary>The estimates of frequency <paramref name="f"/> in bin <paramref name="b"/>.</summary>
    public NarrowbandSet Cell(int f, int b) => _sets[f * Bins.Count + b];

    /// <summary>The estimates of cell <paramref name="index"/> (frequency-major).</summary>
    public NarrowbandSet Cell(int index) => _sets[index];
}
