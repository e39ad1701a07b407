using StringModes.Reporting.Colour;
using StringModes.Reporting.Figures;
using StringModes.Reporting.Tests.Support;

namespace StringModes.Reporting.Tests.Figures;

public class SpaceTimeHeatmapTests
{
    [Fact]
    public void Displacement_ReadsBackWithSignAndFixedEndsAreZero()
    {
        var field = DemoScenario.Field();
        var figure = SpaceTimeHeatmap.Render(field);
        using var reader = new FigureReader(figure);
        var plot = figure.PlotAreaPx;
        var bar = Assert.NotNull(figure.ColourBarAreaPx);
        Assert.True(reader.DistinctColours(plot) > 100, "heatmap area looks blank");

        // Colour-bar limit: peak |u| = 1.81 mm → nice ceiling 2 mm (steps of 0.5). At t = 0 and s = L/2 the
        // scenario gives u = 0.6 − 0.35 + 0.08 = 0.33 mm [computed]; at s = 0.3 L it gives a positive value too.
        var limitMm = 2.0;
        double ReadMm(double timeS, double positionM)
        {
            var x = plot.LeftPx + (timeS - field.TimesS[0]) / (field.TimesS[^1] - field.TimesS[0]) * plot.WidthPx;
            var y = plot.BottomPx - positionM / DemoScenario.LengthM * plot.HeightPx;
            var (fraction, distance) = reader.MapValue(ColourMaps.Diverging, x, y);
            Assert.True(distance < 0.01);
            return (fraction - 0.5) * 2 * limitMm;
        }

        // Tolerance 0.05 mm: 8-bit colour quantisation of a 4 mm span (< 0.03 mm) plus the nearest-sample column.
        Assert.Equal(DemoScenario.Displacement(DemoScenario.LengthM / 2, 0) * 1e3, ReadMm(0.0002, DemoScenario.LengthM / 2), 0.05);
        // Near the fixed end the figure interpolates linearly from zero at s = 0 to the first mark at L/10.
        var firstMarkMm = DemoScenario.Displacement(DemoScenario.LengthM / 10, 0.02) * 1e3;
        Assert.Equal(firstMarkMm * 0.006 / (DemoScenario.LengthM / 10), ReadMm(0.02, 0.006), 0.05);
        // Half a fundamental period later mode 1 has reversed; mode 2 has not.
        var halfPeriod = 0.5 / DemoScenario.FundamentalHz;
        Assert.Equal(DemoScenario.Displacement(DemoScenario.LengthM / 4, halfPeriod) * 1e3, ReadMm(halfPeriod, DemoScenario.LengthM / 4), 0.08);
    }

    [Fact]
    public void Svg_ParsesAndHasColourBarLabelInMillimetres()
    {
        var figure = SpaceTimeHeatmap.Render(DemoScenario.Field(), timeRangeS: (0, 0.05));
        FigureReader.ParseSvg(figure);
        Assert.Contains("Displacement (mm)", figure.Svg);
        Assert.Contains("Position along string (mm)", figure.Svg);
    }
}
