namespace Coupling.Formats;

/// <summary>
/// The header of an EDF, EDF+, BDF or BDF+ file: the fixed 256-byte part and one <see cref="EdfSignalHeader"/> per signal.
/// </summary>
/// <remarks>
/// Field layout per Kemp B, Värri A, Rosa AC, Nielsen KD, Gade J (1992) "A simple format for exchange of digitized
/// polygraphic recordings", Electroencephalography and Clinical Neurophysiology 82:391-393, and the EDF+ additions
/// of Kemp B, Olivan J (2003) "European data format 'plus' (EDF+), an EDF alike standard format for the exchange of
/// physiological data", Clinical Neurophysiology 114:1755-1761. BDF (BioSemi) is the same layout with 24-bit samples:
/// its version field is byte 0xFF followed by "BIOSEMI", and BDF+ marks its reserved field "BDF+C" or "BDF+D" as EDF+
/// does with "EDF+C" and "EDF+D" (BioSemi, "BDF file format" description; EDFlib's BDF+ writer follows it).
/// </remarks>
/// <param name="Source">The file the header was read from.</param>
/// <param name="Version">Version field (8 characters; "0" for EDF and EDF+, "BIOSEMI" for BDF after its leading 0xFF byte).</param>
/// <param name="PatientId">Local patient identification (80 characters, trimmed).</param>
/// <param name="RecordingId">Local recording identification (80 characters, trimmed).</param>
/// <param name="StartTime">Start date and time of the recording (dd.mm.yy and hh.mm.ss fields; years 85-99 are 1985-1999,
/// 00-84 are 2000-2084; an EDF+ "Startdate dd-MMM-yyyy" in the recording id gives the year where it is valid).</param>
/// <param name="HeaderBytes">Number of bytes in the header: 256 * (signal count + 1).</param>
/// <param name="Reserved">Reserved field (44 characters, trimmed): starts with "EDF+C" or "EDF+D" for EDF+, "BDF+C" or
/// "BDF+D" for BDF+ ("24BIT" in plain BDF files).</param>
/// <param name="RecordCount">Number of data records. Where the file says -1 (unknown), the number of whole records the file holds.</param>
/// <param name="RecordDuration">Duration of one data record in seconds (any positive number, e.g. 0.5; 0 only for annotation-only files).</param>
/// <param name="Signals">The signals, in file order, including any "EDF Annotations" signals.</param>
public sealed record EdfHeader(
    string Source,
    string Version,
    string PatientId,
    string RecordingId,
    DateTime StartTime,
    int HeaderBytes,
    string Reserved,
    int RecordCount,
    double RecordDuration,
    IReadOnlyList<EdfSignalHeader> Signals)
{
    /// <summary>Bytes per sample: 2 (16-bit EDF) or 3 (24-bit BDF).</summary>
    public int BytesPerSample { get; init; } = 2;

    /// <summary>True for a 24-bit BDF or BDF+ file.</summary>
    public bool IsBdf => BytesPerSample == 3;

    private string Family => IsBdf ? "BDF" : "EDF";

    /// <summary>True when the reserved field marks the file as EDF+ or BDF+ (continuous or discontinuous).</summary>
    public bool IsEdfPlus => Reserved.StartsWith(Family + "+C", StringComparison.Ordinal) || IsDiscontinuous;

    /// <summary>True for an EDF+D or BDF+D (discontinuous) file, whose records need not follow each other in time.</summary>
    public bool IsDiscontinuous => Reserved.StartsWith(Family + "+D", StringComparison.Ordinal);

    /// <summary>"EDF+C", "EDF+D", "EDF", "BDF+C", "BDF+D" or "BDF".</summary>
    public string FormatName => Family + (IsDiscontinuous ? "+D" : IsEdfPlus ? "+C" : "");

    /// <summary>Bytes in one data record: <see cref="BytesPerSample"/> per sample, summed over all signals.</summary>
    public long RecordBytes => Signals.Sum(s => (long)BytesPerSample * s.SamplesPerRecord);

    /// <summary>Recorded duration in seconds: record count times record duration.</summary>
    public double Duration => RecordCount * RecordDuration;
}
