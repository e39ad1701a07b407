using StringModes.Analysis.Geometry;
using StringModes.Analysis.Modal;
using StringModes.Analysis.Physics;
using StringModes.Analysis.Tests.TestData;

namespace StringModes.Analysis.Tests.Modal;

public class ModalProjectorTests
{
    private static readonly StringMotion FiveModes = new(0.65,
    [
        new ModeComponent(1, 100, 1.0, 2e-3, 0.1), new ModeComponent(2, 200, 1.5, -8e-4, 0.7), new ModeComponent(3, 300, 2.0, 3e-4, 1.1),
        new ModeComponent(4, 400, 2.5, 1e-4, 2.0), new ModeComponent(5, 500, 3.0, 5e-5, 2.5),
    ]);

    // Marks at s_i = iL/(N+1) with M = N make the design the type-I discrete sine transform, whose columns are
    // orthogonal with equal norms (Britanak, Yip & Rao, Discrete Cosine and Sine Transforms, 2007 [memory]):
    // condition number 1. Noise-free data must then return the amplitudes to rounding (1e-12 of the largest).
    [Fact]
    public void EquallySpacedMarksAllModes_RecoverAmplitudesExactlyWithUnitCondition()
    {
        var coords = SyntheticStrings.Sample(FiveModes, marks: 5, fps: 1000, durationS: 0.05, noiseM: 0, seed: 1);
        var modal = ModalProjector.Project(coords);
        Assert.Equal([1, 2, 3, 4, 5], modal.ModeNumbers);
        Assert.Equal(1.0, modal.ConditionNumber, 1e-12);
        Assert.True(modal.ResidualRmsM < 1e-15);
        Span<double> truth = stackalloc double[5];
        for (var f = 0; f < modal.FrameCount; f++)
        {
            Assert.True(modal.ValidFrame[f]);
            FiveModes.ModalCoordinates(modal.TimesS[f], truth);
            for (var j = 0; j < 5; j++) Assert.Equal(truth[j], modal.AmplitudeM[f, j], 2e-15);
        }
    }

    [Fact]
    public void MissingMarkWithSpareMarks_FrameStaysValidAndExact()
    {
        var coords = SyntheticStrings.Sample(FiveModes, marks: 9, fps: 1000, durationS: 0.02, noiseM: 0, seed: 2);
        coords.DisplacementM[3, 4] = double.NaN;
        coords.Weight[7, 2] = 0;
        coords.DisplacementM[7, 2] = 1.0; // weight 0: the value must be ignored
        var modal = ModalProjector.Project(coords, new ModalProjectionOptions { MaxModes = 5 });
        Assert.True(modal.ValidFrame[3] && modal.ValidFrame[7]);
        Span<double> truth = stackalloc double[5];
        foreach (var f in new[] { 3, 7 })
        {
            FiveModes.ModalCoordinates(modal.TimesS[f], truth);
            for (var j = 0; j < 5; j++) Assert.Equal(truth[j], modal.AmplitudeM[f, j], 1e-14);
        }
    }

    [Fact]
    public void FewerMarksThanModesInAFrame_FrameMarkedInvalidWithoutNaN()
    {
        var coords = SyntheticStrings.Sample(FiveModes, marks: 5, fps: 1000, durationS: 0.02, noiseM: 0, seed: 3);
        coords.DisplacementM[4, 1] = double.NaN;
        var modal = ModalProjector.Project(coords);
        Assert.Equal(5, modal.ModeCount);
        Assert.False(modal.ValidFrame[4]);
        Assert.Equal(modal.FrameCount - 1, modal.ValidFrameCount);
        Assert.Contains(modal.Warnings, w => w.Contains("fewer usable marks"));
        foreach (var a in modal.AmplitudeM) Assert.True(double.IsFinite(a));
    }

    [Fact]
    public void MoreModesAskedThanMarks_LimitsToMarkCountWithWarning()
    {
        var coords = SyntheticStrings.Sample(FiveModes, marks: 3, fps: 1000, durationS: 0.01, noiseM: 0, seed: 4);
        var modal = ModalProjector.Project(coords, new ModalProjectionOptions { MaxModes = 8 });
        Assert.Equal(3, modal.ModeCount);
        Assert.Contains(modal.Warnings, w => w.Contains("only 3 marks"));
    }

    // Mode 5 with three marks at s_i = iL/4: sin(5πi/4) = sin(2πi - 3πi/4) = -sin(3πi/4), so mode 5 is seen as
    // minus mode 3 (DST-I aliasing, mode 2(N+1) - n folds onto mode n). Its energy lands in the highest resolved mode.
    [Fact]
    public void StrongModeAboveTheMarkCount_GivesAliasingWarning()
    {
        var motion = new StringMotion(0.65, [new ModeComponent(1, 100, 0, 1e-3, 0), new ModeComponent(5, 500, 0, 1e-3, 0)]);
        var modal = ModalProjector.Project(SyntheticStrings.Sample(motion, marks: 3, fps: 2000, durationS: 0.05, noiseM: 0, seed: 5));
        Assert.Contains(modal.Warnings, w => w.Contains("aliasing"));
        var clean = ModalProjector.Project(SyntheticStrings.Sample(FiveModes, marks: 7, fps: 2000, durationS: 0.05, noiseM: 0, seed: 5));
        Assert.DoesNotContain(clean.Warnings, w => w.Contains("aliasing"));
    }

    [Fact]
    public void ClusteredMarks_AutomaticModeCountStopsAtConditionLimit()
    {
        // Four marks bunched near one end: the higher mode shapes are nearly collinear there.
        var positions = new[] { 0.01, 0.02, 0.03, 0.04 };
        var options = new ModalProjectionOptions();
        var coords = new StringCoordinates(0.65, positions, [0.0], new double[1, 4], new double[,] { { 1, 1, 1, 1 } });
        var modal = ModalProjector.Project(coords, options);
        Assert.InRange(modal.ModeCount, 1, 3);
        Assert.True(ModalProjector.DesignConditionNumber(positions, 0.65, modal.ModeCount) < options.ConditionLimit);
        Assert.True(ModalProjector.DesignConditionNumber(positions, 0.65, modal.ModeCount + 1) >= options.ConditionLimit);
        Assert.Contains(modal.Warnings, w => w.Contains("limited to"));
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-1.0)]
    [InlineData(double.NaN)]
    public void BadLength_ReturnsNoModesAndAWarning(double length)
    {
        var coords = new StringCoordinates(length, [0.1], [0.0, 0.001], new double[2, 1], new double[,] { { 1 }, { 1 } });
        var modal = ModalProjector.Project(coords);
        Assert.Equal(0, modal.ModeCount);
        Assert.Single(modal.Warnings);
    }

    [Fact]
    public void NoMeasuredSamples_ReturnsNoModesAndAWarning()
    {
        var u = new double[3, 2];
        for (var f = 0; f < 3; f++) { u[f, 0] = double.NaN; u[f, 1] = double.NaN; }
        var modal = ModalProjector.Project(new StringCoordinates(0.65, [0.2, 0.4], [0, 0.01, 0.02], u, new double[3, 2]));
        Assert.Equal(0, modal.ModeCount);
        Assert.Contains(modal.Warnings, w => w.Contains("no mark was measured"));
    }
}
