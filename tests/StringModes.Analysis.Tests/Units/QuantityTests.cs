using StringModes.Analysis.Units;

namespace StringModes.Analysis.Tests.Units;

public class QuantityTests
{
    // Conversion factors: SI prefixes (BIPM SI Brochure, 9th ed.); inch = 0.0254 m and foot = 0.3048 m exactly,
    // pound = 0.45359237 kg exactly (international yard and pound agreement, 1959); standard gravity 9.80665 m/s²
    // (3rd CGPM, 1901). Tolerance 1e-12 relative: each is a single multiplication in double precision.
    public static TheoryData<string, Dimension, double> Conversions => new()
    {
        { "0.65", Dimension.Length, 0.65 },
        { "65cm", Dimension.Length, 0.65 },
        { " 650 mm ", Dimension.Length, 0.65 },
        { "254um", Dimension.Length, 254e-6 },
        { "25.5in", Dimension.Length, 0.6477 },
        { "2ft", Dimension.Length, 0.6096 },
        { "1.2g/m", Dimension.LinearDensity, 1.2e-3 },
        { "0.012 g/cm", Dimension.LinearDensity, 1.2e-3 },
        { "1.2mg/mm", Dimension.LinearDensity, 1.2e-3 },
        { "0.0012 g/mm", Dimension.LinearDensity, 1.2e-3 },
        { "3.5e-2kg/m", Dimension.LinearDensity, 0.035 },
        { "35g", Dimension.Mass, 0.035 },
        { "350mg", Dimension.Mass, 3.5e-4 },
        { "7.85g/cm3", Dimension.Density, 7850 },
        { "1140 kg/m3", Dimension.Density, 1140 },
        { "240fps", Dimension.Frequency, 240 },
        { "1.5kHz", Dimension.Frequency, 1500 },
        { "30ms", Dimension.Time, 0.03 },
        { "250us", Dimension.Time, 250e-6 },
        { "73N", Dimension.Force, 73 },
        { "1lbf", Dimension.Force, 4.4482216152605 },
        { "10kgf", Dimension.Force, 98.0665 },
        { "1.2kN", Dimension.Force, 1200 },
        { "200GPa", Dimension.Modulus, 200e9 },
        { "1.5MPa", Dimension.Modulus, 1.5e6 },
        { "-3cm", Dimension.Length, -0.03 },
    };

    [Theory]
    [MemberData(nameof(Conversions))]
    public void ValueWithAcceptedUnit_ParsesToSi(string text, Dimension dimension, double expected)
    {
        Assert.True(Quantity.TryParse(text, dimension, out var si, out var error), error);
        Assert.Equal("", error);
        Assert.Equal(expected, si, Math.Abs(expected) * 1e-12);
    }

    [Theory]
    [InlineData("", Dimension.Length)]
    [InlineData("   ", Dimension.Length)]
    [InlineData("NaN", Dimension.Length)]
    [InlineData("Infinity", Dimension.Frequency)]
    [InlineData("1e999", Dimension.Length)]
    [InlineData("cm", Dimension.Length)]
    [InlineData("65 furlong", Dimension.Length)]
    [InlineData("1.2g/m", Dimension.Length)]
    [InlineData("65mm/s", Dimension.Length)]
    [InlineData("240 Mhz", Dimension.Frequency)]
    public void MalformedOrWrongDimension_IsRejectedWithOneLineMessageNamingUnits(string text, Dimension dimension)
    {
        Assert.False(Quantity.TryParse(text, dimension, out var si, out var error));
        Assert.Equal(0.0, si);
        Assert.NotEmpty(error);
        Assert.DoesNotContain('\n', error);
        Assert.Contains(Quantity.SiUnit(dimension), error);
    }

    [Fact]
    public void UnknownUnit_MessageListsEveryAcceptedUnit()
    {
        Assert.False(Quantity.TryParse("3 oz/in", Dimension.LinearDensity, out _, out var error));
        foreach (var unit in Quantity.AcceptedUnits(Dimension.LinearDensity)) Assert.Contains(unit, error);
    }
}
