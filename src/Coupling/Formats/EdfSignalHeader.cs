namespace Coupling.Formats;

/// <summary>The header fields of one EDF/EDF+ signal, as stored in the file (text fields trimmed).</summary>
/// <param name="Label">Signal label (16 characters in the file), e.g. "EEG Fpz-Cz" or "EDF Annotations".</param>
/// <param name="Transducer">Transducer type (80 characters), e.g. "AgAgCl electrode".</param>
/// <param name="PhysicalDimension">Physical dimension (8 characters), e.g. "uV".</param>
/// <param name="PhysicalMinimum">Physical value that corresponds to <paramref name="DigitalMinimum"/>.</param>
/// <param name="PhysicalMaximum">Physical value that corresponds to <paramref name="DigitalMaximum"/>.</param>
/// <param name="DigitalMinimum">Smallest digital value the signal may take (-32768 to 32767).</param>
/// <param name="DigitalMaximum">Largest digital value the signal may take; greater than <paramref name="DigitalMinimum"/>.</param>
/// <param name="Prefiltering">Prefiltering text (80 characters), e.g. "HP:0.1Hz LP:75Hz".</param>
/// <param name="SamplesPerRecord">Number of samples of this signal in each data record.</param>
/// <param name="Reserved">The signal's reserved field (32 characters).</param>
/// <param name="SampleRate">Sampling rate in Hz: samples per record divided by the record duration (0 when the record duration is 0).</param>
public sealed record EdfSignalHeader(
    string Label,
    string Transducer,
    string PhysicalDimension,
    double PhysicalMinimum,
    double PhysicalMaximum,
    int DigitalMinimum,
    int DigitalMaximum,
    string Prefiltering,
    int SamplesPerRecord,
    string Reserved,
    double SampleRate)
{
    /// <summary>The label EDF+ reserves for annotation signals.</summary>
    public const string AnnotationLabel = "EDF Annotations";

    /// <summary>True for an EDF+ or BDF+ annotation signal (label "EDF Annotations" or "BDF Annotations"), which carries text, not samples.</summary>
    public bool IsAnnotation => IsAnnotationLabel(Label);

    /// <summary>The label of a BDF+ file's annotation signal (BDF+ follows EDF+ with "BDF" in place of "EDF").</summary>
    public const string BdfAnnotationLabel = "BDF Annotations";

    /// <summary>Whether <paramref name="label"/> (trimmed) names an annotation signal: "EDF Annotations" or "BDF Annotations".</summary>
    public static bool IsAnnotationLabel(string label) =>
        string.Equals(label, AnnotationLabel, StringComparison.Ordinal) || string.Equals(label, BdfAnnotationLabel, StringComparison.Ordinal);

    /// <summary>
    /// Physical units per digital step: (physical max - physical min) / (digital max - digital min).
    /// This is the quantisation resolution the header states.
    /// </summary>
    public double Resolution => (PhysicalMaximum - PhysicalMinimum) / ((double)DigitalMaximum - DigitalMinimum);
}
