using System.Numerics;
using Coupling.Spectral;
using MathNet.Numerics.IntegralTransforms;

namespace Coupling.Tests.Spectral;

public class PowerOfTwoFftTests
{
    // A radix-2 transform with directly computed twiddles has a relative rms error of order ε·log2(n) (Gentleman and
    // Sande 1966, "Fast Fourier transforms: for fun and profit", AFIPS 29:563-578); 1e-13 of the input norm leaves a
    // wide margin at n ≤ 4096 (log2 n ≤ 12, ε = 2.2e-16).
    private const double Tolerance = 1e-13;

    private static double[] Random(int n, int seed)
    {
        var random = new Random(seed);
        return Enumerable.Range(0, n).Select(_ => random.NextDouble() - 0.5).ToArray();
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(4)]
    [InlineData(8)]
    [InlineData(16)]
    [InlineData(64)]
    [InlineData(256)]
    public void Forward_equals_the_definition(int n)
    {
        double[] re = Random(n, 1), im = Random(n, 2);
        var expected = new Complex[n];
        for (int k = 0; k < n; k++)
            for (int j = 0; j < n; j++)
                expected[k] += new Complex(re[j], im[j]) * Complex.FromPolarCoordinates(1, -2 * Math.PI * ((long)j * k % n) / n);
        PowerOfTwoFft.Of(n).Forward(re, im);
        double scale = Math.Sqrt(n) * Tolerance * n;
        for (int k = 0; k < n; k++)
        {
            Assert.Equal(expected[k].Real, re[k], scale);
            Assert.Equal(expected[k].Imaginary, im[k], scale);
        }
    }

    [Theory]
    [InlineData(512)]
    [InlineData(4096)]
    [InlineData(8192)]
    public void Forward_and_inverse_agree_with_MathNet(int n)
    {
        // MathNet.Numerics (a general-purpose reference library), FourierOptions.Matlab: unnormalised forward,
        // 1/n inverse, exp(−2πi jk/n) in the forward direction.
        double[] re = Random(n, 3), im = Random(n, 4);
        var reference = re.Zip(im, (a, b) => new Complex(a, b)).ToArray();
        double norm = Math.Sqrt(n * reference.Sum(z => z.Magnitude * z.Magnitude));
        Fourier.Forward(reference, FourierOptions.Matlab);
        var fft = PowerOfTwoFft.Of(n);
        fft.Forward(re, im);
        for (int k = 0; k < n; k++)
        {
            Assert.Equal(reference[k].Real, re[k], Tolerance * norm);
            Assert.Equal(reference[k].Imaginary, im[k], Tolerance * norm);
        }
        Fourier.Inverse(reference, FourierOptions.Matlab);
        fft.Inverse(re, im);
        for (int k = 0; k < n; k++)
        {
            Assert.Equal(reference[k].Real, re[k] / n, Tolerance * norm / Math.Sqrt(n));
            Assert.Equal(reference[k].Imaginary, im[k] / n, Tolerance * norm / Math.Sqrt(n));
        }
    }

    [Theory]
    [InlineData(8, 8)]
    [InlineData(8, 5)]
    [InlineData(64, 64)]
    [InlineData(1024, 777)]
    [InlineData(4096, 2810)]
    public void The_real_transform_gives_the_non_negative_half_of_the_complex_one(int n, int samples)
    {
        var x = Random(samples, 5);
        double[] re = new double[n], im = new double[n];
        x.CopyTo(re, 0);
        var fft = PowerOfTwoFft.Of(n);
        fft.Forward(re, im);
        double[] realRe = new double[n], realIm = new double[n];
        fft.ForwardReal(x, realRe, realIm);
        double norm = Math.Sqrt(n * x.Sum(v => v * v));
        for (int k = 0; k <= n / 2; k++)
        {
            Assert.Equal(re[k], realRe[k], Tolerance * norm);
            Assert.Equal(im[k], realIm[k], Tolerance * norm);
        }
    }
}
