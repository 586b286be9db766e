using Coupling.Spectral;

namespace Coupling.Tests.Spectral;

public class ZeroPhaseTests
{
    private static double[] Noise(int n, int seed)
    {
        var random = new Random(seed);
        return Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
    }

    // Oppenheim and Schafer section 5.7: a type I linear-phase FIR applied centred has a real amplitude response,
    // so a sinusoid away from the segment ends comes out as A(f) times itself, with no shift.
    [Theory]
    [InlineData(6.0, 0.7)]
    [InlineData(5.2, -2.1)]
    [InlineData(7.6, 1.9)]
    public void Zero_phase_filtered_pass_band_sinusoid_is_not_shifted(double hz, double phase)
    {
        const double fs = 250;
        var f = FirDesign.BandPass(new Band("theta", 4, 8), fs);
        int n = 3 * f.Length, c = f.DelaySamples;
        var x = Enumerable.Range(0, n).Select(i => Math.Cos(2 * Math.PI * hz * i / fs + phase)).ToArray();
        var y = ZeroPhase.Apply(f, x);
        double gain = f.Response(hz);
        // Interior samples see only real data: y = A(f) x to FFT rounding (~1e-15 times log2 of 4096).
        for (int i = c; i < n - c; i++) Assert.Equal(gain * x[i], y[i], 1e-12);
        // Phase by least-squares projection on cos and sin over whole cycles of the interior.
        double cs = 0, sn = 0;
        for (int i = c; i < n - c; i++)
        {
            double w = 2 * Math.PI * hz * i / fs;
            cs += y[i] * Math.Cos(w);
            sn += y[i] * Math.Sin(w);
        }
        int count = n - 2 * c;
        // The double-frequency cross terms sum to at most 1 / sin(w) each against count / 2: angle error <= ~4 / (w count).
        double leak = 4.0 / (2 * Math.PI * hz / fs * count);
        Assert.Equal(phase, Math.Atan2(-sn, cs), leak);
        // Peaks of input and output fall on the same samples.
        var peaksIn = Peaks(x, c, n - c);
        var peaksOut = Peaks(y, c, n - c);
        Assert.NotEmpty(peaksIn);
        Assert.Equal(peaksIn, peaksOut);
    }

    private static List<int> Peaks(double[] v, int from, int to)
    {
        var peaks = new List<int>();
        for (int i = from + 1; i < to - 1; i++)
            if (v[i] > v[i - 1] && v[i] >= v[i + 1]) peaks.Add(i);
        return peaks;
    }

    [Theory]
    [InlineData(4.0, 8.0, 250.0, 1.0, 60.0, 500)]
    [InlineData(4.0, 8.0, 250.0, 1.0, 60.0, 1501)]
    [InlineData(60.0, 90.0, 200.0, 10.0, 30.0, 333)]
    public void Fft_route_equals_direct_summation(double low, double high, double fs, double tw, double a, int n)
    {
        var f = FirDesign.BandPass(new Band("b", low, high), fs, tw, a);
        var x = Noise(n, 17);
        var direct = new double[n];
        var byFft = new double[n];
        ZeroPhase.ApplyDirect(f, x, direct);
        ZeroPhase.ApplyByFft(f, x, byFft);
        // FFT rounding grows like eps log2(L) times the signal norm; 1e-12 of the largest output is ample.
        double scale = direct.Max(Math.Abs);
        for (int i = 0; i < n; i++) Assert.Equal(direct[i], byFft[i], 1e-12 * scale);
        var chosen = ZeroPhase.Apply(f, x);
        for (int i = 0; i < n; i++) Assert.Equal(direct[i], chosen[i], 1e-12 * scale);
    }

    [Fact]
    public void Output_length_must_equal_input_length()
    {
        var f = FirDesign.BandPass(new Band("b", 60, 90), 200, 10, 30);
        Assert.Throws<ArgumentException>(() => ZeroPhase.Apply(f, new double[10], new double[9]));
    }
}
