using StringModes.Analysis.Geometry;
using StringModes.Analysis.Physics;
using StringModes.Analysis.StringModel;
using StringModes.Analysis.Tests.TestData;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Tests;

public class ModalAnalysisTests
{
    private const double SteelLength = 0.62, SteelF0 = 261.63;
    private static readonly double SteelMu = StringLaw.LinearDensityOfRoundCord(7850, 1.0e-3);
    private static readonly double SteelB = StringLaw.InharmonicityOfRoundWire(200e9, 1.0e-3, StringLaw.Tension(SteelMu, SteelLength, SteelF0), SteelLength);

    // REFERENCES.md section 2 steel wire [computed] as an invented high-speed-camera scenario: 7 marks, 4000 fps,
    // 1 s, pluck at 0.27 L with 1 mm peak, mark noise 1e-6 m. With exact L and mu the project brief asks for a
    // tension error <= 2e-4 relative; the harmonic check must flag the stiffness with f2/f1 > 2.
    [Fact]
    public void StiffSteelWire_TensionWithinTwoPartsInTenThousandAndHarmonicCheckFlagsStiffness()
    {
        var motion = SyntheticStrings.Plucked(SteelLength, SteelF0, SteelB, count: 5, peakM: 1e-3, pluckFraction: 0.27, decayRate1PerS: 1.5);
        var coords = SyntheticStrings.Sample(motion, marks: 7, fps: 4000, durationS: 1, noiseM: 1e-6, seed: 21);
        var result = ModalAnalysis.Run(coords, new ModalAnalysisOptions
        {
            LengthM = Measured.Exact(SteelLength),
            LinearDensityKgPerM = Measured.Exact(SteelMu),
        });
        Assert.True(result.IsAnalysisPossible, result.Error);
        var s = result.String!;
        var trueTension = StringLaw.Tension(SteelMu, SteelLength, SteelF0);
        Assert.True(Math.Abs(s.TensionN!.Value.Value / trueTension - 1) <= 2e-4, $"tension {s.TensionN} vs {trueTension}");
        Assert.False(s.InharmonicityAssumed);
        Assert.Equal(SteelB, s.Inharmonicity.Value, 0.05 * SteelB);
        Assert.False(s.SecondHarmonic!.Passes);
        Assert.True(s.SecondHarmonic.DeviationInUncertainties > 0);
        Assert.Contains(result.Warnings, w => w.Contains("above 2"));
        Assert.Empty(FiniteScan.NonFinite(result));
    }

    [Fact]
    public void IdealString_HarmonicCheckPassesAndTensionIsRecovered()
    {
        const double length = 0.65, mu = 1.2e-3, tension = 60;
        var f0 = StringLaw.Fundamental(tension, mu, length);
        var motion = SyntheticStrings.Plucked(length, f0, 0, count: 4, peakM: 2e-3, pluckFraction: 0.3, decayRate1PerS: 1.0);
        var coords = SyntheticStrings.Sample(motion, marks: 5, fps: 1000, durationS: 2, noiseM: 1e-6, seed: 22);
        var result = ModalAnalysis.Run(coords, new ModalAnalysisOptions
        {
            LengthM = new Measured(length, 0.0005),
            LinearDensityKgPerM = Measured.WithRelativeUncertainty(mu, 0.005),
        });
        var s = result.String!;
        Assert.True(s.SecondHarmonic!.Passes, $"f2/f1 deviation {s.SecondHarmonic.DeviationInUncertainties}");
        Assert.Equal(tension, s.TensionN!.Value.Value, tension * 2e-4);
        // The budget names linear density as the dominant input (0.5 % against 2·0.077 % for the length).
        Assert.Equal("linear density", s.TensionBudget[0].Name);
        Assert.Equal(tension * Math.Sqrt(0.005 * 0.005 + Math.Pow(2 * 0.0005 / length, 2)), s.TensionN.Value.StandardUncertainty, tension * 1e-4);
        Assert.Empty(FiniteScan.NonFinite(result));
    }

    // 960 fps puts modes 2 and 3 of the steel wire (523.7 and 786.3 Hz) above the 480 Hz Nyquist frequency.
    [Fact]
    public void ModesAboveHalfTheFrameRate_AreReportedAsAliasesAndLeftOutOfTheStringModel()
    {
        var motion = SyntheticStrings.Plucked(SteelLength, SteelF0, SteelB, count: 3, peakM: 1e-3, pluckFraction: 0.27, decayRate1PerS: 1.5);
        var coords = SyntheticStrings.Sample(motion, marks: 5, fps: 960, durationS: 2, noiseM: 1e-6, seed: 23);
        var result = ModalAnalysis.Run(coords, new ModalAnalysisOptions { LinearDensityKgPerM = Measured.Exact(SteelMu) });
        Assert.Contains(result.Warnings, w => w.Contains("mode 2") && w.Contains("alias"));
        Assert.Equal([1], result.String!.ModesUsed);
        Assert.True(result.String.InharmonicityAssumed);
    }

    [Fact]
    public void NoiseOnly_AnalysisNotPossibleWithClearErrorAndNoNaN()
    {
        var quiet = new StringMotion(0.65, [new ModeComponent(1, 100, 1, 0, 0)]);
        var coords = SyntheticStrings.Sample(quiet, marks: 5, fps: 500, durationS: 2, noiseM: 1e-6, seed: 24);
        var result = ModalAnalysis.Run(coords, new ModalAnalysisOptions { LinearDensityKgPerM = Measured.Exact(1e-3) });
        Assert.False(result.IsAnalysisPossible);
        Assert.Contains("no vibration", result.Error);
        Assert.Null(result.String);
        Assert.Empty(FiniteScan.NonFinite(result));
    }

    [Fact]
    public void MoreModesThanMarks_AnalysisProceedsWithWarning()
    {
        var motion = SyntheticStrings.Plucked(0.65, 100, 0, count: 3, peakM: 2e-3, pluckFraction: 0.3, decayRate1PerS: 1.0);
        var coords = SyntheticStrings.Sample(motion, marks: 3, fps: 1000, durationS: 1, noiseM: 1e-6, seed: 25);
        var result = ModalAnalysis.Run(coords, new ModalAnalysisOptions { MaxModes = 8 });
        Assert.True(result.IsAnalysisPossible);
        Assert.Equal(3, result.Modal.ModeCount);
        Assert.Contains(result.Warnings, w => w.Contains("only 3 marks"));
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-1e-3)]
    [InlineData(double.NaN)]
    public void InvalidLinearDensity_TensionLeftOutWithWarningAndNoNaN(double mu)
    {
        var motion = SyntheticStrings.Plucked(0.65, 100, 0, count: 3, peakM: 2e-3, pluckFraction: 0.3, decayRate1PerS: 1.0);
        var coords = SyntheticStrings.Sample(motion, marks: 5, fps: 1000, durationS: 1, noiseM: 1e-6, seed: 26);
        var result = ModalAnalysis.Run(coords, new ModalAnalysisOptions { LinearDensityKgPerM = new Measured(mu, 1e-6) });
        Assert.True(result.IsAnalysisPossible);
        Assert.Null(result.String!.TensionN);
        Assert.Contains(result.Warnings, w => w.Contains("linear density must be a positive finite number"));
        Assert.Empty(FiniteScan.NonFinite(result));
    }

    [Fact]
    public void InvalidLength_AnalysisNotPossibleWithoutThrowing()
    {
        var coords = new StringCoordinates(double.NaN, [0.2], [0, 0.001], new double[2, 1], new double[,] { { 1 }, { 1 } });
        var result = ModalAnalysis.Run(coords);
        Assert.False(result.IsAnalysisPossible);
        Assert.Contains("length", result.Error);
        Assert.Empty(FiniteScan.NonFinite(result));
    }

    // Two periods of a 20 Hz fundamental in a 0.1 s window: fitted with a warning, higher modes too, no NaN.
    [Fact]
    public void WindowOfAFewPeriods_WarnsAndStaysFinite()
    {
        var motion = SyntheticStrings.Plucked(0.65, 20, 0, count: 3, peakM: 2e-3, pluckFraction: 0.3, decayRate1PerS: 1.0);
        var coords = SyntheticStrings.Sample(motion, marks: 5, fps: 500, durationS: 0.12, noiseM: 1e-6, seed: 27);
        var result = ModalAnalysis.Run(coords, new ModalAnalysisOptions { LinearDensityKgPerM = Measured.Exact(1e-3) });
        Assert.Contains(result.Warnings, w => w.Contains("mode 1") && w.Contains("periods"));
        Assert.Empty(FiniteScan.NonFinite(result));
    }

    [Fact]
    public void FiniteScan_FindsNonFiniteValuesNestedInResults()
    {
        Assert.NotEmpty(FiniteScan.NonFinite(new StringEstimate([], new Measured(double.NaN, 0), default, true, 0, [], null, null, null, null, null, [], null, [])));
        Assert.NotEmpty(FiniteScan.NonFinite(new HarmonicRatio(2, new Measured(1, double.PositiveInfinity))));
    }
}
