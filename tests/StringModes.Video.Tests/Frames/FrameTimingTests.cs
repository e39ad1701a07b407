using StringModes.Video.Frames;

namespace StringModes.Video.Tests.Frames;

public sealed class FrameTimingTests
{
    [Fact]
    public void ConstantRateRoundedToMilliseconds_IsNotVariable()
    {
        var t = Enumerable.Range(0, 300).Select(i => Math.Round(i / 240.0 * 1000) / 1000).ToArray();
        var r = FrameTiming.Analyse(t, 240, null);
        Assert.False(r.IsVariableRate);
        Assert.Equal(0, r.DroppedFrames);
        // Mean of 4 ms / 5 ms rounded steps over 299 steps: within 1% of 240 fps.
        Assert.Equal(240, r.MedianFps, 2.4);
        Assert.Empty(r.Warnings);
    }

    [Fact]
    public void JitteredSteps_AreReportedVariable()
    {
        var rng = new Random(11);
        double t = 0;
        var times = new List<double>();
        for (int i = 0; i < 200; i++)
        {
            times.Add(t);
            t += 1 / 30.0 * (1 + 0.3 * (rng.NextDouble() - 0.5));
        }

        var r = FrameTiming.Analyse(times, 30, null);
        Assert.True(r.IsVariableRate);
        Assert.Contains(r.Warnings, w => w.Contains("variable frame rate"));
    }

    [Fact]
    public void DroppedFrame_IsCounted()
    {
        var t = Enumerable.Range(0, 50).Where(i => i != 20).Select(i => i / 100.0).ToArray();
        var r = FrameTiming.Analyse(t, 100, null);
        Assert.Equal(1, r.DroppedFrames);
        Assert.False(r.IsVariableRate);
    }

    [Fact]
    public void TimestampsDisagreeingWithDeclaredRate_WarnAboutSlowMotion()
    {
        var t = Enumerable.Range(0, 50).Select(i => i / 30.0).ToArray();
        var r = FrameTiming.Analyse(t, 240, null);
        Assert.Contains(r.Warnings, w => w.Contains("capture-fps"));
        Assert.DoesNotContain(FrameTiming.Analyse(t, 30, null).Warnings, w => w.Contains("capture-fps"));
    }
}
