using StringModes.Reporting.Colour;
using StringModes.Reporting.Figures;
using StringModes.Reporting.Model;
using StringModes.Reporting.Tests.Support;

namespace StringModes.Reporting.Tests.Figures;

public class ModeAmplitudeHeatmapTests
{
    [Fact]
    public void DominantModeTwo_IsTheBrightestRowAndLevelsReadBackInDecibels()
    {
        var series = DemoScenario.Envelopes();
        var figure = ModeAmplitudeHeatmap.Render(series);
        using var reader = new FigureReader(figure);
        Assert.Equal(1200, reader.Width);
        Assert.Equal(700, reader.Height);

        var plot = figure.PlotAreaPx;
        var modes = series.ModeNumbers.Length;
        var rowHeight = plot.HeightPx / modes;
        var x = plot.LeftPx + 4; // first columns: t ≈ 0
        var levelsDb = new double[modes];
        for (var m = 0; m < modes; m++)
        {
            // Mode m is drawn m rows up from the bottom of the plot.
            var y = plot.BottomPx - (m + 0.5) * rowHeight;
            var (fraction, distance) = reader.MapValue(ColourMaps.Sequential, x, y);
            Assert.True(distance < 0.01, $"row {m} colour is not on the sequential map (distance {distance})");
            levelsDb[m] = -60 + 60 * fraction;
        }

        Assert.Equal(1, Array.IndexOf(levelsDb, levelsDb.Max()));
        for (var m = 0; m < modes; m++)
        {
            // Expected level 20·log10(A_n/A_max) at t = 0, from the scenario; the first column shows the
            // sample nearest its centre (t ≤ 0.01 s, < 0.4 dB of decay), colour quantisation adds < 0.7 dB.
            var expected = Math.Max(-60, 20 * Math.Log10(DemoScenario.AmplitudesM[m] / DemoScenario.AmplitudesM[1]));
            Assert.Equal(expected, levelsDb[m], 1.5);
        }
    }

    [Fact]
    public void DecayingMode_RowDarkensAlongTime()
    {
        var series = DemoScenario.Envelopes();
        var figure = ModeAmplitudeHeatmap.Render(series);
        using var reader = new FigureReader(figure);
        var plot = figure.PlotAreaPx;
        var y = plot.BottomPx - 1.5 * plot.HeightPx / 6; // mode 2
        var early = reader.MapValue(ColourMaps.Sequential, plot.LeftPx + 4, y).Fraction;
        var late = reader.MapValue(ColourMaps.Sequential, plot.RightPx - 4, y).Fraction;
        // σ = 1.1 /s over 3 s: 20·log10(e^(−3.3)) = −28.7 dB [computed]; tolerance 1.5 dB as above.
        Assert.Equal(-28.66, 60 * (late - early), 1.5);
    }

    [Fact]
    public void ColourBar_ShowsTheFullSequentialMapFromTopToBottom()
    {
        var figure = ModeAmplitudeHeatmap.Render(DemoScenario.Envelopes());
        using var reader = new FigureReader(figure);
        var bar = Assert.NotNull(figure.ColourBarAreaPx);
        var x = (bar.LeftPx + bar.RightPx) / 2;
        var previous = 2.0;
        for (var i = 0; i <= 20; i++)
        {
            var y = bar.TopPx + 2 + i * (bar.HeightPx - 4) / 20;
            var (fraction, distance) = reader.MapValue(ColourMaps.Sequential, x, y);
            Assert.True(distance < 0.01);
            Assert.True(fraction < previous + 0.005, "colour bar must run from the maximum at the top to the floor at the bottom");
            previous = fraction;
        }

        Assert.True(reader.MapValue(ColourMaps.Sequential, x, bar.TopPx + 2).Fraction > 0.97);
        Assert.True(reader.MapValue(ColourMaps.Sequential, x, bar.BottomPx - 2).Fraction < 0.03);
    }

    [Fact]
    public void Svg_IsWellFormedXmlOfTheSameSizeWithText()
    {
        var figure = ModeAmplitudeHeatmap.Render(DemoScenario.Envelopes(), analysisWindowS: (0.2, 2.5));
        var doc = FigureReader.ParseSvg(figure);
        Assert.Equal("1200", doc.Root!.Attribute("width")?.Value);
        Assert.Equal("700", doc.Root!.Attribute("height")?.Value);
        Assert.Contains("Mode amplitude over time", figure.Svg);
        Assert.Contains(doc.Descendants(), e => e.Name.LocalName == "image");
    }

    [Fact]
    public void ScaleTwo_DoublesPngSizeAndLayout()
    {
        var figure = ModeAmplitudeHeatmap.Render(DemoScenario.Envelopes(), options: new FigureOptions { Scale = 2 });
        using var reader = new FigureReader(figure);
        Assert.Equal(2400, reader.Width);
        Assert.Equal(1400, reader.Height);
        Assert.Equal(2 * 104, figure.PlotAreaPx.LeftPx, 1e-9);
    }

    [Fact]
    public void EnvelopeFromModalCoordinates_RecoversSinusoidAmplitude()
    {
        // √2 × RMS of A·cos over whole periods equals A [computed]; window 0.1 s = 11 periods of 110 Hz,
        // sampled at 4 kHz, so the partial-period error is < 1 %.
        var t = DemoScenario.Times(2000, 4000);
        var a = t.Select(x => 2e-3 * Math.Cos(2 * Math.PI * 110 * x)).ToArray();
        var env = ModeAmplitudeSeries.FromModalCoordinates([1], t, [a], 0.1);
        Assert.Equal(2e-3, env.AmplitudeM[0][1000], 2e-5);
    }
}
