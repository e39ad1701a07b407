using StringModes.Analysis.Physics;

namespace StringModes.Analysis.Tests.Physics;

public class StringLawTests
{
    // NCERT Physics Part II (class XI), exercise 15.14, worked solution [read]:
    // f1 = 45 Hz, string mass 3.5e-2 kg, mu = 4.0e-2 kg/m -> L = 0.875 m, c = 78.75 m/s, T = 248.06 N.
    // Tolerance 1e-4 relative: the book rounds T to five significant figures.
    [Fact]
    public void NcertWorkedExample_TensionAndWaveSpeedMatchTheBook()
    {
        const double mu = 4.0e-2, f1 = 45.0;
        var length = 3.5e-2 / mu;
        Assert.Equal(0.875, length, 12);
        Assert.Equal(78.75, StringLaw.WaveSpeed(length, f1), 10);
        Assert.Equal(248.06, StringLaw.Tension(mu, length, f1), 248.06 * 1e-4);
        Assert.Equal(f1, StringLaw.Fundamental(248.0625, mu, length), 1e-9);
    }

    // A 1 % rise in tension raises f by sqrt(1.01) - 1 = 0.499 % (any college physics text) [read].
    [Fact]
    public void OnePercentMoreTension_RaisesPitchByHalfAPercent()
    {
        var ratio = StringLaw.Fundamental(101, 1e-3, 0.65) / StringLaw.Fundamental(100, 1e-3, 0.65);
        Assert.Equal(0.00499, ratio - 1, 5e-6);
    }

    // REFERENCES.md section 2 [computed] from Fletcher 1964: steel E = 200 GPa, rho = 7850 kg/m^3, d = 1.0 mm,
    // L = 0.62 m, f0 = 261.63 Hz -> mu = 6.16538 g/m, T = 648.900 N, B = 3.88453e-4, EI = 9.81748e-3 N m^2,
    // f1..f4 = 261.6808, 523.6664, 786.2608, 1049.7672 Hz. Tolerances: half a unit in the last quoted digit.
    [Fact]
    public void SteelWireExample_MatchesFletcherStiffStringValues()
    {
        var mu = StringLaw.LinearDensityOfRoundCord(7850, 1.0e-3);
        Assert.Equal(6.16538e-3, mu, 0.5e-8);
        var t = StringLaw.Tension(mu, 0.62, 261.63);
        Assert.Equal(648.900, t, 0.0005);
        var b = StringLaw.InharmonicityOfRoundWire(200e9, 1.0e-3, t, 0.62);
        Assert.Equal(3.88453e-4, b, 0.5e-9);
        Assert.Equal(9.81748e-3, StringLaw.BendingStiffness(b, t, 0.62), 0.5e-8);
        double[] expected = [261.6808, 523.6664, 786.2608, 1049.7672];
        for (var n = 1; n <= 4; n++)
            Assert.Equal(expected[n - 1], StringLaw.ModeFrequency(n, 261.63, b), 0.00005);
    }

    // Fourier sine series of a triangle: a pluck at the middle has no even modes and A_1 = 8h/pi^2
    // (any text on the plucked string; common practice).
    [Fact]
    public void PluckAtMiddle_HasNoEvenModesAndEightOverPiSquaredFundamental()
    {
        Assert.Equal(8 * 0.002 / (Math.PI * Math.PI), Pluck.TriangularAmplitude(1, 0.5, 0.002), 1e-15);
        Assert.Equal(0.0, Pluck.TriangularAmplitude(2, 0.5, 0.002), 1e-18);
        var motion = new StringMotion(0.5, Enumerable.Range(1, 400).Select(n => new ModeComponent(n, n, 0, Pluck.TriangularAmplitude(n, 0.25, 0.002), 0)));
        // The series converges to the triangle: at the pluck point its value is the peak. The truncated tail is bounded by
        // sum_{n>N} 2h/(n^2 pi^2 p(1-p)) < 2h/(pi^2 p(1-p) N) = 5.4e-6 m for N = 400, p = 1/4.
        Assert.Equal(0.002, motion.Displacement(0.125, 0), 5.4e-6);
    }
}
