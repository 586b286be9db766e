namespace Coupling.Spectral;

/// <summary>Shared checks of bands and rates, with messages naming the band and the sampling rate.</summary>
internal static class SpectralChecks
{
    internal static string Describe(Band band) => $"Band '{band.Name}' ({band.Low:G6}-{band.High:G6} Hz)";

    /// <summary>Throws unless 0 &lt; low &lt; high &lt; Nyquist and the rate is positive and finite.</summary>
    internal static void Band(Band band, double sampleRate)
    {
        if (!(sampleRate > 0) || !double.IsFinite(sampleRate))
            throw new InputException($"{Describe(band)}: sampling rate {sampleRate} Hz is not a positive rate.");
        double nyquist = 0.5 * sampleRate;
        if (!double.IsFinite(band.Low) || !double.IsFinite(band.High))
            throw new InputException($"{Describe(band)}: the edges must be finite numbers of Hz.");
        if (!(band.Low > 0))
            throw new InputException($"{Describe(band)}: the low edge must be above 0 Hz (sampling rate {sampleRate:G6} Hz).");
        if (!(band.Low < band.High))
            throw new InputException($"{Describe(band)}: the low edge must be below the high edge (sampling rate {sampleRate:G6} Hz).");
        if (!(band.High < nyquist))
            throw new InputException(
                $"{Describe(band)}: the high edge must be below the Nyquist frequency {nyquist:G6} Hz of the sampling rate {sampleRate:G6} Hz.");
    }

    /// <summary>Smallest power of two at least <paramref name="n"/> (n &gt;= 1).</summary>
    internal static int PowerOfTwoAtLeast(int n)
    {
        if (n > 1 << 30) throw new ArgumentOutOfRangeException(nameof(n), n, "Transform length too large.");
        int size = 1;
        while (size < n) size <<= 1;
        return size;
    }
}
