using StringModes.Reporting.Colour;

namespace StringModes.Reporting.Tests.Colour;

public class ColourMapsTests
{
    private const int Steps = 512;

    [Fact]
    public void SequentialMap_RenderedLightnessRisesStrictly()
    {
        // Lightness of the colours actually rendered (after sRGB clamping and 8-bit rounding is not applied).
        var previous = double.NegativeInfinity;
        for (var i = 0; i <= Steps; i++)
        {
            var l = Oklab.FromSrgb(ColourMaps.Sequential.Sample(i / (double)Steps)).L;
            Assert.True(l > previous, $"lightness not rising at step {i}: {l} after {previous}");
            previous = l;
        }

        Assert.True(Oklab.FromSrgb(ColourMaps.Sequential.Sample(1)).L - Oklab.FromSrgb(ColourMaps.Sequential.Sample(0)).L > 0.7);
    }

    [Fact]
    public void SequentialMap_StepsArePerceptuallyEven()
    {
        // Arc-length parametrisation: every step's Oklab distance within 10% of the mean step (table quantisation).
        var d = Enumerable.Range(0, 64)
            .Select(i => ColourMaps.Sequential.SampleOklab(i / 64.0).DistanceTo(ColourMaps.Sequential.SampleOklab((i + 1) / 64.0)))
            .ToArray();
        var mean = d.Average();
        Assert.All(d, x => Assert.InRange(x, 0.9 * mean, 1.1 * mean));
    }

    [Fact]
    public void DivergingMap_LightnessIsSymmetricVShapeAroundZero()
    {
        var map = ColourMaps.Diverging;
        for (var i = 0; i <= Steps / 2; i++)
        {
            var t = i / (double)Steps;
            var left = Oklab.FromSrgb(map.Sample(t)).L;
            var right = Oklab.FromSrgb(map.Sample(1 - t)).L;
            // Symmetric to 2e-3 (quantisation of the 1025-entry table and sRGB clamping of near-white).
            Assert.Equal(left, right, 2e-3);
            if (i > 0)
            {
                Assert.True(left > Oklab.FromSrgb(map.Sample((i - 1) / (double)Steps)).L, $"not brightening towards the centre at {t}");
            }
        }

        Assert.True(Oklab.FromSrgb(map.Sample(0.5)).L > 0.95);
        // The two signs must be told apart by hue: blue-ish (b < 0) below zero, red-ish (a > 0) above.
        Assert.True(map.SampleOklab(0.05).B < -0.05);
        Assert.True(map.SampleOklab(0.95).A > 0.05);
    }

    [Fact]
    public void Anchors_LieInsideSrgbGamut()
    {
        foreach (var map in new[] { ColourMaps.Sequential, ColourMaps.Diverging })
        {
            foreach (var a in map.Anchors)
            {
                Assert.True(Oklab.ToSrgb(a).IsInGamut(1e-6), $"{map.Name} anchor {a} outside sRGB");
            }

            // Between anchors the Oklab path may leave the gamut slightly; clamping must not move any
            // rendered colour by more than 0.01 in Oklab (about a just-noticeable difference).
            for (var i = 0; i <= Steps; i++)
            {
                var t = i / (double)Steps;
                Assert.True(map.SampleOklab(t).DistanceTo(Oklab.FromSrgb(map.Sample(t))) < 0.01, $"{map.Name} clips at {t}");
            }
        }
    }

    [Fact]
    public void Invert_RecoversFractionFromEightBitColour()
    {
        foreach (var t in new[] { 0.0, 0.13, 0.5, 0.77, 1.0 })
        {
            var (r, g, b) = ColourMaps.Sequential.Sample(t).ToBytes();
            var (back, distance) = ColourMaps.Sequential.Invert(SrgbColour.FromBytes(r, g, b));
            // 8-bit rounding moves a colour by < 0.005 in Oklab; the map spans ~1.1, so < 1% in fraction.
            Assert.Equal(t, back, 0.01);
            Assert.True(distance < 0.01);
        }
    }

    [Fact]
    public void FirstEightCategoryColours_AreDistinct()
    {
        var colours = Enumerable.Range(0, 8).Select(i => Oklab.FromSrgb(ColourMaps.Category(i))).ToArray();
        for (var i = 0; i < colours.Length; i++)
        {
            for (var j = i + 1; j < colours.Length; j++)
            {
                Assert.True(colours[i].DistanceTo(colours[j]) > 0.04, $"categories {i} and {j} too similar");
            }
        }
    }
}
