using StringModes.Reporting.Colour;
using StringModes.Reporting.Figures;
using StringModes.Reporting.Model;
using StringModes.Reporting.Tests.Support;

namespace StringModes.Reporting.Tests.Figures;

public class DecayFigureTests
{
    internal static ModeDecay[] Decays()
    {
        var t = DemoScenario.Times(300, 100);
        var random = new Random(7);
        return Enumerable.Range(0, 3).Select(m =>
        {
            var env = t.Select(x => DemoScenario.AmplitudesM[m] * Math.Exp(-DemoScenario.DecayRatesPerS[m] * x) * (1 + 0.02 * (random.NextDouble() - 0.5))).ToArray();
            return new ModeDecay(m + 1, t, env,
                new MeasuredValue(DemoScenario.AmplitudesM[m], DemoScenario.AmplitudesM[m] * 0.01),
                new MeasuredValue(DemoScenario.DecayRatesPerS[m], 0.012), -0.6);
        }).ToArray();
    }

    [Fact]
    public void UncertaintyBand_FollowsFirstOrderPropagation()
    {
        // L(t) = c(ln A0 − σt), c = 20/ln10 = 8.685890: u(L) = c·√((u_A/A)² + t²u_σ² − 2tρ(u_A/A)u_σ) [computed].
        var d = new ModeDecay(1, [0.0, 1.0], [1e-3, 0.4e-3], new MeasuredValue(1e-3, 2e-5), new MeasuredValue(0.9, 0.05), 0.5);
        var (t, fit, lower, upper) = DecayFigure.FitLine(d, 0, 2, 1e-3);
        Assert.Equal(0.0, fit[0], 1e-12);
        Assert.Equal(8.685889638 * 0.02, upper[0] - fit[0], 1e-9);
        var c = 20 / Math.Log(10);
        var tEnd = t[^1];
        var expected = c * Math.Sqrt(0.02 * 0.02 + tEnd * tEnd * 0.05 * 0.05 - 2 * tEnd * 0.5 * 0.02 * 0.05);
        Assert.Equal(2.0, tEnd, 1e-12);
        Assert.Equal(expected, fit[^1] - lower[^1], 1e-9);
        Assert.Equal(-c * 0.9 * 2, fit[^1], 1e-9);
    }

    [Fact]
    public void FittedLines_AppearWhereTheFitPutsThem()
    {
        var decays = Decays();
        var figure = DecayFigure.Render(decays);
        using var reader = new FigureReader(figure);
        // Mode 2 (largest A0, reference 0 dB): at t = 2 s the fit is −8.686 × 1.1 × 2 = −19.1 dB [computed];
        // measured envelope (±1 % noise) and dashed fit both pass there in mode 2's colour (or its darker shade).
        var (x, y) = reader.ToPixel(2.0, -20 / Math.Log(10) * 1.1 * 2);
        Assert.True(reader.HasColourNear(x, y, ColourMaps.Category(1), radius: 3), "mode 2 envelope not at the fitted level");
        Assert.Contains("σ = 1.100 ± 0.012 s⁻¹", figure.Svg);
        FigureReader.ParseSvg(figure);
    }
}
