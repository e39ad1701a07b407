using StringModes.Reporting.Colour;
using StringModes.Reporting.Figures;
using StringModes.Reporting.Model;
using StringModes.Reporting.Tests.Support;

namespace StringModes.Reporting.Tests.Figures;

public class HarmonicRatioFigureTests
{
    // Stiff steel string of REFERENCES.md §2 [computed]: B = 3.88453e-4, f1..f4 = 261.6808, 523.6664,
    // 786.2608, 1049.7672 Hz → ratios 1, 1.0005826, 1.0015519, 1.0029080.
    internal static HarmonicRatioPoint[] Points() =>
    [
        new(1, new MeasuredValue(1, 0)),
        new(2, new MeasuredValue(523.6664 / (2 * 261.6808), 0.00012)),
        new(3, new MeasuredValue(786.2608 / (3 * 261.6808), 0.00015)),
        new(4, new MeasuredValue(1049.7672 / (4 * 261.6808), 0.0002)),
    ];

    [Fact]
    public void Points_SitAtTheirRatiosAndIdealLineAtOne()
    {
        var figure = HarmonicRatioFigure.Render(Points(), inharmonicity: 3.88453e-4);
        using var reader = new FigureReader(figure);
        foreach (var p in Points())
        {
            var (x, y) = reader.ToPixel(p.ModeNumber, p.Ratio.Value);
            Assert.True(reader.HasColourNear(x, y, ColourMaps.Category(0), radius: 2), $"no point for mode {p.ModeNumber}");
        }

        // Ideal line at 1 (grey dashes) between modes 3 and 4, where no point or error bar is.
        var (x1, y1) = reader.ToPixel(3.5, 1.0);
        var grey = SrgbColour.FromBytes(0x7a, 0x7f, 0x88);
        Assert.True(Enumerable.Range(-12, 25).Any(dx => reader.ColourDistance(x1 + dx, y1, grey) < 0.04), "ideal line at 1 missing");
        // Stiff-string curve at n = 4 passes through the measured point (same formula, REFERENCES.md §2).
        Assert.Equal(1.0029080, Points()[3].Ratio.Value, 1e-6);
        FigureReader.ParseSvg(figure);
        Assert.Contains("B = 3.88 × 10⁻⁴", figure.Svg);
    }
}
