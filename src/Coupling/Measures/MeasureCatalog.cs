namespace Coupling.Measures;

/// <summary>
/// Facts about each <see cref="Measure"/>: its key in plans and outputs, the input it reads, whether its values can be
/// negative and which tail the surrogate test uses.
/// </summary>
/// <remarks>
/// Keys are short lowercase forms of the measures' published names:
/// <c>plv, ppc, pli, wpli, wpli-debiased, coherence, imag-coherency, aec, aec-orth</c>.
/// Test tails: for imaginary coherency, AEC and AEC-orth, whose sign carries the direction of the coupling (lead or lag,
/// correlation or anticorrelation), the test is two-sided against the surrogate null itself (twice the smaller one-sided
/// p-value), not on |value|: a stimulus-locked response with a lag between channels, or a shared envelope, moves that
/// null away from 0. For every other measure
/// larger means more coupling and the test is one-sided on the value itself; this includes PPC and debiased wPLI²,
/// which are unbiased estimators and so can come out below zero under no coupling, where a negative value is
/// evidence of nothing.
/// </remarks>
public static class MeasureCatalog
{
    private static readonly IReadOnlyList<Measure> AllMeasures = Array.AsReadOnly(Enum.GetValues<Measure>());

    /// <summary>Every measure, in enum order.</summary>
    public static IReadOnlyList<Measure> All => AllMeasures;

    /// <summary>The key of <paramref name="measure"/> as used in plans and outputs (e.g. <c>wpli-debiased</c>).</summary>
    public static string Key(Measure measure) => measure switch
    {
        Measure.Plv => "plv",
        Measure.Ppc => "ppc",
        Measure.Pli => "pli",
        Measure.Wpli => "wpli",
        Measure.WpliDebiased => "wpli-debiased",
        Measure.Coherence => "coherence",
        Measure.ImagCoherency => "imag-coherency",
        Measure.Aec => "aec",
        Measure.AecOrth => "aec-orth",
        _ => throw new ArgumentOutOfRangeException(nameof(measure), measure, "Unknown measure."),
    };

    /// <summary>
    /// The measure whose key is <paramref name="key"/> (surrounding white space and letter case are ignored).
    /// </summary>
    /// <param name="key">The key to look up.</param>
    /// <param name="source">Where the key was read (file and field), put in front of the error message; may be null.</param>
    /// <exception cref="InputException">The key names no measure; the message lists the allowed keys.</exception>
    public static Measure Parse(string key, string? source = null)
    {
        ArgumentNullException.ThrowIfNull(key);
        string wanted = key.Trim();
        foreach (var measure in AllMeasures)
            if (string.Equals(Key(measure), wanted, StringComparison.OrdinalIgnoreCase))
                return measure;
        string where = string.IsNullOrEmpty(source) ? "" : source + ": ";
        throw new InputException(
            $"{where}unknown measure '{key}'; expected one of: {string.Join(", ", AllMeasures.Select(Key))}.");
    }

    /// <summary>What <paramref name="measure"/> reads from the narrowband signals.</summary>
    public static MeasureInput InputOf(Measure measure) => measure switch
    {
        Measure.Plv or Measure.Ppc => MeasureInput.Phase,
        Measure.Pli or Measure.Wpli or Measure.WpliDebiased or Measure.Coherence or Measure.ImagCoherency
            => MeasureInput.CrossSpectrum,
        Measure.Aec => MeasureInput.Envelope,
        Measure.AecOrth => MeasureInput.Envelope | MeasureInput.CrossSpectrum,
        _ => throw new ArgumentOutOfRangeException(nameof(measure), measure, "Unknown measure."),
    };

    /// <summary>
    /// Whether values of <paramref name="measure"/> can be negative: true for PPC and debiased wPLI² (unbiased
    /// estimators that scatter around zero without coupling) and for imaginary coherency, AEC and AEC-orth
    /// (signed by definition).
    /// </summary>
    public static bool IsSigned(Measure measure) => measure switch
    {
        Measure.Ppc or Measure.WpliDebiased or Measure.ImagCoherency or Measure.Aec or Measure.AecOrth => true,
        Measure.Plv or Measure.Pli or Measure.Wpli or Measure.Coherence => false,
        _ => throw new ArgumentOutOfRangeException(nameof(measure), measure, "Unknown measure."),
    };

    /// <summary>
    /// The tail of the surrogate test of <paramref name="measure"/>: <see cref="TestTail.TwoSided"/> for imaginary
    /// coherency, AEC and AEC-orth, <see cref="TestTail.Upper"/> for the rest (see the type's remarks).
    /// </summary>
    public static TestTail TailOf(Measure measure) => measure switch
    {
        Measure.ImagCoherency or Measure.Aec or Measure.AecOrth => TestTail.TwoSided,
        Measure.Plv or Measure.Ppc or Measure.Pli or Measure.Wpli or Measure.WpliDebiased or Measure.Coherence
            => TestTail.Upper,
        _ => throw new ArgumentOutOfRangeException(nameof(measure), measure, "Unknown measure."),
    };
}
