using StringModes.Reporting.Figures;

namespace StringModes.Reporting.Tests.Figures;

public class NiceTicksTests
{
    // Hand-worked with the 1–2–5 rule (Heckbert 1990 restricted to 1, 2, 5): range/(target−1) rounded up.
    [Theory]
    [InlineData(0.0, 3.0, 7, 0.5, 0.0, 3.0, 7)]      // 0.5 → ticks 0, 0.5, …, 3
    [InlineData(-60.0, 0.0, 7, 10.0, -60.0, 0.0, 7)] // 10 → −60 … 0
    [InlineData(0.013, 0.087, 6, 0.02, 0.02, 0.08, 4)]
    [InlineData(98.0, 1003.0, 6, 200.0, 200.0, 1000.0, 5)]
    public void Range_GivesOneTwoFiveStepsInside(double min, double max, int target, double step, double first, double last, int count)
    {
        var t = NiceTicks.Generate(min, max, target);
        Assert.Equal(step, t.Step, 1e-12);
        Assert.Equal(first, t.Values[0], 1e-12);
        Assert.Equal(last, t.Values[^1], 1e-12);
        Assert.Equal(count, t.Values.Length);
    }

    [Theory]
    [InlineData(0.5, 1, "2.5", 2.5)]
    [InlineData(10, 0, "\u221260", -60)]
    [InlineData(0.02, 2, "0.00", -1e-17)]
    [InlineData(0.001, 3, "1.001", 1.001)]
    public void Labels_UseStepDecimalsAndTypographicMinus(double step, int decimals, string expected, double value)
    {
        Assert.Equal(decimals, NiceTicks.DecimalsFor(step));
        Assert.Equal(expected, NiceTicks.FormatTick(value, decimals));
    }

    [Fact]
    public void EmptyOrNonFiniteRange_IsWidenedToSomethingDrawable()
    {
        Assert.Equal((4.5, 5.5), NiceTicks.SafeRange(5, 5));
        Assert.Equal((0.0, 1.0), NiceTicks.SafeRange(double.NaN, 3));
        Assert.NotEmpty(NiceTicks.Generate(7, 7).Values);
    }
}
