using StringModes.Reporting.Colour;

namespace StringModes.Reporting.Tests.Colour;

public class OklabTests
{
    // Ottosson 2020 (https://bottosson.github.io/posts/oklab/) [read]: the reference white maps to L = 1,
    // a = b = 0. The published matrices carry 10 decimals (float32 precision), so 1e-6 is the tolerance.
    [Fact]
    public void SrgbWhite_MapsToLightnessOneAndNoChroma()
    {
        var w = Oklab.FromSrgb(new SrgbColour(1, 1, 1));
        Assert.Equal(1.0, w.L, 1e-6);
        Assert.Equal(0.0, w.A, 1e-6);
        Assert.Equal(0.0, w.B, 1e-6);
    }

    [Fact]
    public void SrgbBlack_MapsToZero()
    {
        var k = Oklab.FromSrgb(new SrgbColour(0, 0, 0));
        Assert.Equal(0.0, k.L, 1e-12);
        Assert.Equal(0.0, k.Chroma, 1e-12);
    }

    // sRGB primaries in Oklab: red (0.62796, 0.22486, 0.12585) [memory; a, b agree with the coloraide
    // documentation's Oklrab red 0.22486, 0.12585 [read]], green (0.86644, −0.23389, 0.17950) and
    // blue (0.45201, −0.03246, −0.31153) [memory]. Tolerance 5e-5: values quoted to 5 decimals.
    [Theory]
    [InlineData(1, 0, 0, 0.62796, 0.22486, 0.12585)]
    [InlineData(0, 1, 0, 0.86644, -0.23389, 0.17950)]
    [InlineData(0, 0, 1, 0.45201, -0.03246, -0.31153)]
    public void SrgbPrimaries_MatchQuotedOklabValues(double r, double g, double b, double l, double a, double bb)
    {
        var c = Oklab.FromSrgb(new SrgbColour(r, g, b));
        Assert.Equal(l, c.L, 5e-5);
        Assert.Equal(a, c.A, 5e-5);
        Assert.Equal(bb, c.B, 5e-5);
    }

    // IEC 61966-2-1: encoded 0.5 decodes to ((0.5 + 0.055)/1.055)^2.4 = 0.2140411 [computed].
    [Fact]
    public void SrgbTransfer_MidGreyDecodesPerStandard()
    {
        Assert.Equal(0.21404114048223255, Oklab.ToLinear(0.5), 1e-12);
        Assert.Equal(0.5, Oklab.FromLinear(Oklab.ToLinear(0.5)), 1e-12);
    }

    // The published forward and inverse matrices are inverses to about 1e-9 (10-decimal rounding);
    // the round trip over random in-gamut colours closes to ~5e-7; 2e-6 is far below 8-bit quantisation (1/255).
    [Fact]
    public void RandomSrgbColours_RoundTripThroughOklab()
    {
        var random = new Random(20260101);
        for (var i = 0; i < 2000; i++)
        {
            var c = new SrgbColour(random.NextDouble(), random.NextDouble(), random.NextDouble());
            var back = Oklab.ToSrgb(Oklab.FromSrgb(c));
            Assert.Equal(c.R, back.R, 2e-6);
            Assert.Equal(c.G, back.G, 2e-6);
            Assert.Equal(c.B, back.B, 2e-6);
        }
    }
}
