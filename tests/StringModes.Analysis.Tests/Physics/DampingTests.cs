using StringModes.Analysis.Physics;

namespace StringModes.Analysis.Tests.Physics;

public class DampingTests
{
    // REFERENCES.md section 4 [computed] from the relations in Rao, Mechanical Vibrations [memory]:
    // zeta = 0.01, f_n = 100 Hz -> delta = 0.0628350, Q = 50, eta = 0.02, sigma = 6.28319 1/s, T60 = 1.09940 s;
    // zeta = 0.1 -> delta = 0.631484. Tolerances: half a unit in the last quoted digit.
    [Fact]
    public void TextbookConversions_AgreeWithTabulatedValues()
    {
        Assert.Equal(0.0628350, Damping.LogarithmicDecrement(0.01), 0.5e-7);
        Assert.Equal(0.631484, Damping.LogarithmicDecrement(0.1), 0.5e-6);
        Assert.Equal(50.0, Damping.QualityFactor(0.01), 1e-12);
        Assert.Equal(0.02, Damping.LossFactor(0.01), 1e-15);
        var sigma = Damping.DecayRateFromNatural(0.01, 100);
        Assert.Equal(6.28319, sigma, 0.5e-5);
        Assert.Equal(1.09940, Damping.T60(sigma), 0.5e-5);
    }

    [Fact]
    public void LogDecrementRoundTrip_ReturnsDampingRatio()
    {
        foreach (var zeta in new[] { 1e-4, 0.01, 0.1, 0.5 })
            Assert.Equal(zeta, Damping.DampingRatioFromLogDecrement(Damping.LogarithmicDecrement(zeta)), 1e-14);
    }

    [Fact]
    public void DampedFrequencyAndDecay_GiveTheNaturalDampingRatio()
    {
        var fn = 100.0; var zeta = 0.05;
        var sigma = Damping.DecayRateFromNatural(zeta, fn);
        var fd = fn * Math.Sqrt(1 - zeta * zeta);
        Assert.Equal(zeta, Damping.DampingRatio(sigma, fd), 1e-14);
        Assert.Equal(fn, Damping.NaturalFrequency(fd, sigma), 1e-11);
    }
}
