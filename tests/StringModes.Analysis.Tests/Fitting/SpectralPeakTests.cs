using System.Numerics;
using StringModes.Analysis.Fitting;

namespace StringModes.Analysis.Tests.Fitting;

public class SpectralPeakTests
{
    // REFERENCES.md section 5 [computed]: N = 64, complex tone at bin 10.3 -> Jacobsen 10.299781 (Jacobsen &
    // Kootsookos 2007 [read]); with Candan's tan(pi/N)/(pi/N) correction 10.300022. Tolerance: half a unit in the
    // sixth decimal as quoted.
    [Fact]
    public void ComplexToneAtBin10Point3_JacobsenAndCandanMatchCheckValues()
    {
        const int n = 64;
        var x = new Complex[n];
        for (var i = 0; i < n; i++) x[i] = Complex.FromPolarCoordinates(1, 2 * Math.PI * 10.3 * i / n);
        FftSharp.FFT.Forward(x);
        var delta = SpectralPeak.Jacobsen(x[9], x[10], x[11]);
        Assert.Equal(10.299781, 10 + delta, 0.5e-6);
        Assert.Equal(10.300022, 10 + SpectralPeak.CandanCorrected(delta, n), 0.5e-6);
    }

    // The seed must land well inside the fit's basin: within 0.02 of a DFT bin (1/T) for a clean damped real tone,
    // whose negative-frequency image is far away (10+ bins) under the Hann window.
    [Theory]
    [InlineData(47.3, 0.0)]
    [InlineData(101.77, 1.5)]
    [InlineData(12.05, 0.3)]
    public void HannZeroPaddedPeak_SeedsWithinTwoHundredthsOfABin(double frequencyHz, double decayPerS)
    {
        const double rate = 500, duration = 2;
        var samples = Enumerable.Range(0, (int)(rate * duration)).Select(i => Math.Exp(-decayPerS * i / rate) * Math.Cos(2 * Math.PI * frequencyHz * i / rate + 0.4)).ToArray();
        var peak = SpectralPeak.Strongest(samples, rate, 1 / duration);
        Assert.Equal(frequencyHz, peak.FrequencyHz, 0.02 / duration);
        Assert.True(peak.PeakToMedianPower > 1e3);
    }

    [Fact]
    public void WhiteNoise_PeakToMedianStaysBelowDetectionThreshold()
    {
        var random = new Random(7);
        foreach (var trial in Enumerable.Range(0, 20))
        {
            var samples = Enumerable.Range(0, 1000).Select(_ => random.NextDouble() - 0.5).ToArray();
            var peak = SpectralPeak.Strongest(samples, 240, 0.25);
            Assert.True(peak.PeakToMedianPower < new ModeFitOptions().DetectionThreshold, $"trial {trial}: {peak.PeakToMedianPower}");
        }
    }
}

/// <summary>The half-size real-input FFT against FftSharp's full complex FFT of the same zero-padded samples.</summary>
public class RealPowerTests
{
    // Tolerance 1e-10 of the largest power: both are FFTs of the same data in double precision (rounding ~1e-14
    // relative per stage over 15 stages), so only rounding can separate them.
    [Theory]
    [InlineData(1000, 8192)]
    [InlineData(37, 64)]
    public void MatchesFullComplexFft(int n, int size)
    {
        var random = new Random(3);
        var x = new double[n];
        for (var i = 0; i < n; i++) x[i] = Math.Sin(0.37 * i) + random.NextDouble() - 0.5;
        var full = new System.Numerics.Complex[size];
        for (var i = 0; i < n; i++) full[i] = x[i];
        FftSharp.FFT.Forward(full);
        var power = SpectralPeak.RealPower(x, size);
        Assert.Equal(size / 2 + 1, power.Length);
        var largest = power.Max();
        for (var k = 0; k <= size / 2; k++)
            Assert.True(Math.Abs(power[k] - full[k].Magnitude * full[k].Magnitude) <= 1e-10 * largest, $"bin {k}: {power[k]} vs {full[k].Magnitude * full[k].Magnitude}");
    }
}
