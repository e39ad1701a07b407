using StringModes.Analysis.Fitting;

namespace StringModes.Analysis.Tests.Fitting;

public class CramerRaoBoundTests
{
    // REFERENCES.md section 5 [computed] from Rife & Boorstyn 1974 [read, citation]: N = 64, eta = 10 dB ->
    // std >= 2.1398e-3 rad/sample. Tolerance: half a unit in the last quoted digit.
    [Fact]
    public void RealTone64SamplesTenDecibels_MatchesRifeBoorstynValue()
        => Assert.Equal(2.1398e-3, CramerRaoBound.RealToneFrequencyRadPerSample(64, 10), 0.5e-7);

    // REFERENCES.md section 5 [computed], context Yao & Pandit 1995 [memory]: N = 256, sigma^2 = 0.1, A = 1:
    // alpha = 0 -> 3.57633e-8; alpha = 0.01 -> 4.73494e-7. Tolerance: half a unit in the sixth significant digit.
    [Theory]
    [InlineData(0.0, 3.57633e-8)]
    [InlineData(0.01, 4.73494e-7)]
    public void DampedComplexExponential_MatchesCheckValues(double alpha, double expected)
        => Assert.Equal(expected, CramerRaoBound.DampedComplexExponentialVariance(256, alpha, 0.1, 1), expected * 1e-5);

    // The numeric bound for the real model with sigma = 0 approaches Rife & Boorstyn's closed form for large N
    // (the extra offset parameter and the real-signal cross terms change it by O(1/N)); tolerance 1 %.
    [Fact]
    public void NumericBoundForUndampedTone_AgreesWithClosedForm()
    {
        const int n = 1000;
        const double rate = 500, noise = 0.01, amplitude = 1;
        var times = Enumerable.Range(0, n).Select(i => i / rate).ToArray();
        var b = CramerRaoBound.DampedSinusoid(times, 37.3, 0, amplitude, 0.2, noise);
        var closed = CramerRaoBound.RealToneFrequencyRadPerSample(n, amplitude * amplitude / (2 * noise * noise)) * rate / (2 * Math.PI);
        Assert.Equal(closed, b.FrequencyHz, closed * 0.01);
    }
}
