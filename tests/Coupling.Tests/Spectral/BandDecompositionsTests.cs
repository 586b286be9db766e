using Coupling.Spectral;

namespace Coupling.Tests.Spectral;

public class BandDecompositionsTests
{
    [Theory]
    [InlineData("fir-hilbert")]
    [InlineData("morlet")]
    public void Band_above_Nyquist_is_rejected_naming_the_band_and_rate(string method)
    {
        var e = Assert.Throws<InputException>(() => BandDecompositions.Create(method, new Band("high-gamma", 70, 150), 250));
        Assert.Contains("'high-gamma'", e.Message);
        Assert.Contains("250 Hz", e.Message);
        Assert.Contains("Nyquist", e.Message);
    }

    [Theory]
    [InlineData(0, 4)]
    [InlineData(-1, 4)]
    [InlineData(8, 8)]
    [InlineData(9, 8)]
    public void Band_with_misplaced_edges_is_rejected(double low, double high)
    {
        foreach (var method in new[] { "fir-hilbert", "morlet" })
        {
            var e = Assert.Throws<InputException>(() => BandDecompositions.Create(method, new Band("odd", low, high), 250));
            Assert.Contains("'odd'", e.Message);
        }
    }

    [Fact]
    public void Unknown_method_is_rejected_naming_it()
    {
        var e = Assert.Throws<InputException>(() => BandDecompositions.Create("wavelet", new Band("theta", 4, 8), 250));
        Assert.Contains("'wavelet'", e.Message);
    }

    [Fact]
    public void Options_reach_the_built_decomposition()
    {
        var options = new BandDecompositionOptions(TransitionHz: 2, AttenuationDb: 40, Cycles: 6);
        var fir = BandDecompositions.Create("fir-hilbert", new Band("alpha", 8, 12), 500, options);
        Assert.Equal(2, fir.Info.Parameters["transition_hz"]);
        Assert.Equal(40, fir.Info.Parameters["attenuation_db"]);
        var morlet = BandDecompositions.Create("morlet", new Band("alpha", 8, 12), 500, options);
        Assert.Equal(6, morlet.Info.Parameters["cycles"]);
        Assert.IsType<FirHilbertDecomposition>(fir);
        Assert.IsType<MorletDecomposition>(morlet);
    }
}
