using Coupling.Measures;

namespace Coupling.Tests.Measures;

public class MeasureCatalogTests
{
    [Fact]
    public void Every_measure_has_its_plain_key_and_parses_back_from_it()
    {
        // The keys are fixed by the project's naming rules (short lowercase forms of the published names).
        string[] keys = ["plv", "ppc", "pli", "wpli", "wpli-debiased", "coherence", "imag-coherency", "aec", "aec-orth"];
        Assert.Equal(keys, MeasureCatalog.All.Select(MeasureCatalog.Key));
        foreach (var measure in MeasureCatalog.All)
        {
            Assert.Equal(measure, MeasureCatalog.Parse(MeasureCatalog.Key(measure)));
            Assert.Equal(measure, MeasureCatalog.Parse(" " + MeasureCatalog.Key(measure).ToUpperInvariant() + " "));
        }
    }

    [Fact]
    public void An_unknown_key_is_refused_with_the_allowed_keys_and_the_place_it_came_from()
    {
        var error = Assert.Throws<InputException>(() => MeasureCatalog.Parse("phase-sync", "plan.yaml, measures[2]"));
        Assert.StartsWith("plan.yaml, measures[2]: ", error.Message);
        Assert.Contains("'phase-sync'", error.Message);
        foreach (var measure in MeasureCatalog.All) Assert.Contains(MeasureCatalog.Key(measure), error.Message);
    }

    [Fact]
    public void Inputs_signs_and_tails_follow_the_definitions()
    {
        // Inputs: PLV/PPC read phases only; the lag indices and coherences read cross products of raw values;
        // AEC reads envelopes; AEC-orth reads envelopes and the raw values it orthogonalises (Hipp et al. 2012).
        Assert.Equal(MeasureInput.Phase, MeasureCatalog.InputOf(Measure.Plv));
        Assert.Equal(MeasureInput.Phase, MeasureCatalog.InputOf(Measure.Ppc));
        Assert.Equal(MeasureInput.CrossSpectrum, MeasureCatalog.InputOf(Measure.Wpli));
        Assert.Equal(MeasureInput.CrossSpectrum, MeasureCatalog.InputOf(Measure.ImagCoherency));
        Assert.Equal(MeasureInput.Envelope, MeasureCatalog.InputOf(Measure.Aec));
        Assert.Equal(MeasureInput.Envelope | MeasureInput.CrossSpectrum, MeasureCatalog.InputOf(Measure.AecOrth));

        Measure[] signed = [Measure.Ppc, Measure.WpliDebiased, Measure.ImagCoherency, Measure.Aec, Measure.AecOrth];
        Measure[] twoSided = [Measure.ImagCoherency, Measure.Aec, Measure.AecOrth];
        foreach (var measure in MeasureCatalog.All)
        {
            Assert.Equal(signed.Contains(measure), MeasureCatalog.IsSigned(measure));
            Assert.Equal(twoSided.Contains(measure) ? TestTail.TwoSided : TestTail.Upper, MeasureCatalog.TailOf(measure));
        }
    }
}
