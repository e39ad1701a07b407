using StringModes.Reporting.Colour;
using StringModes.Reporting.Figures;
using StringModes.Reporting.Model;
using StringModes.Reporting.Tests.Support;

namespace StringModes.Reporting.Tests.Figures;

public class SpectrumFigureTests
{
    /// <summary>Lorentzian magnitude peaks of the demo scenario's modes 1–3 on 0..500 Hz, 4001 bins.</summary>
    internal static ModeSpectrum[] Spectra()
    {
        var f = Enumerable.Range(0, 4001).Select(i => i * 0.125).ToArray();
        return Enumerable.Range(0, 3).Select(m =>
        {
            var n = m + 1;
            var fn = n * DemoScenario.FundamentalHz + 0.013 * n;
            var width = DemoScenario.DecayRatesPerS[m] / (2 * Math.PI);
            var mag = f.Select(x => DemoScenario.AmplitudesM[m] * width / Math.Sqrt((x - fn) * (x - fn) + width * width) + 1e-9).ToArray();
            return new ModeSpectrum(n, f, mag, [new SpectrumPeak(fn, 0.0021 * n, $"n = {n}")]);
        }).ToArray();
    }

    [Fact]
    public void FittedPeaks_AreMarkedInTheModeColourAndLabelledWithFrequency()
    {
        var spectra = Spectra();
        var figure = SpectrumFigure.Render(spectra);
        using var reader = new FigureReader(figure);
        Assert.Equal((1200, 700), (reader.Width, reader.Height));
        var reference = spectra.SelectMany(s => s.Magnitude).Max();
        for (var k = 0; k < spectra.Length; k++)
        {
            var peak = spectra[k].Peaks[0];
            var levelDb = 20 * Math.Log10(spectra[k].Magnitude.Max() / reference);
            var (x, y) = reader.ToPixel(peak.FrequencyHz, levelDb);
            // Triangle drawn 4..16 px above the peak, filled with the mode's category colour.
            Assert.True(reader.HasColourNear(x, y - 11, ColourMaps.Category(k), radius: 2), $"no marker for mode {k + 1}");
        }

        // Labels: frequency rounded to the uncertainty's two digits (110.013 ± 0.0021 → 110.0130).
        Assert.Contains("n = 1: 110.0130 Hz", figure.Svg);
        Assert.Contains("n = 2: 220.0260 Hz", figure.Svg);
        FigureReader.ParseSvg(figure);
    }

    [Fact]
    public void AwayFromPeaks_TheCurveSitsLow()
    {
        var spectra = Spectra();
        var figure = SpectrumFigure.Render(spectra);
        using var reader = new FigureReader(figure);
        // At 165 Hz, mode 1's Lorentzian is 0.6 mm × 0.127/55 → −55 dB re 1.2 mm [computed]; the pixel at
        // 0 dB above it must be background, while mode 1's colour appears near −55 dB.
        var (x, yTop) = reader.ToPixel(165, -3);
        Assert.False(reader.HasColourNear(x, yTop, ColourMaps.Category(0), radius: 1));
        var expectedDb = 20 * Math.Log10(spectra[0].Magnitude[1320] / spectra.SelectMany(s => s.Magnitude).Max());
        var (_, yCurve) = reader.ToPixel(165, expectedDb);
        Assert.True(reader.HasColourNear(x, yCurve, ColourMaps.Category(0), radius: 3));
    }
}
