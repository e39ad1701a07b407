using StringModes.Video.Tests.Support;
using StringModes.Video.Tracking;
using Xunit.Abstractions;

namespace StringModes.Video.Tests.Tracking;

public sealed class ClipTrackerTests(ITestOutputHelper output)
{
    /// <summary>RMS 2-D position error over marks [firstMark, lastMark] (default: the moving marks) and frames from fromFrame.</summary>
    internal static double RmsError(TrackingResult r, (double X, double Y)[][] truth, int fromFrame = 0, int firstMark = 1, int lastMark = -1)
    {
        double s = 0;
        int n = 0;
        int last = lastMark < 0 ? truth[0].Length - 2 : lastMark;
        for (int k = fromFrame; k < truth.Length; k++)
        {
            for (int m = firstMark; m <= last; m++)
            {
                double dx = r.Tracks.XPx[k, m] - truth[k][m].X, dy = r.Tracks.YPx[k, m] - truth[k][m].Y;
                s += dx * dx + dy * dy;
                n++;
            }
        }

        return Math.Sqrt(s / n);
    }

    [Fact]
    public void LosslessClip_TracksWithinTwoHundredthsOfAPixel()
    {
        using var dir = new FixtureFolder();
        string clip = dir.File("lossless.mkv");
        var scene = new SyntheticStringScene(320, 240);
        var truth = FixtureFolder.WriteClip(clip, "FFV1", scene, 60, 240);
        var r = ClipTracker.Track(clip, new TrackingOptions());
        Assert.Equal(60, r.Tracks.FrameCount);
        Assert.Equal(scene.MarkCount, r.Tracks.MarkCount);
        double rms = RmsError(r, truth);
        double ends = Math.Max(RmsError(r, truth, 0, 0, 0), RmsError(r, truth, 0, scene.MarkCount - 1, scene.MarkCount - 1));
        output.WriteLine($"RMS moving {rms:0.0000} px, ends {ends:0.0000} px");
        // Accuracy target for lossless clips (issue): ≤ 0.02 px RMS on the moving marks against the rendered centres.
        Assert.True(rms <= 0.02, $"RMS {rms} px");
        // Ends carry a small static bias along the string (the string leaves them on one side only): ≤ 0.05 px.
        Assert.True(ends <= 0.05, $"ends RMS {ends} px");
        Assert.All(Enumerable.Range(0, 60), k => Assert.True(r.Tracks.Quality[k, 2] > 0.9));
    }

    [Fact]
    public void NoisyMpeg4Clip_TracksWithinFiveHundredthsOfAPixel()
    {
        using var dir = new FixtureFolder();
        string clip = dir.File("noisy.mp4");
        var scene = new SyntheticStringScene(320, 240);
        var truth = FixtureFolder.WriteClip(clip, "mp4v", scene, 60, 240, noiseDn: 2);
        var r = ClipTracker.Track(clip, new TrackingOptions());
        double rms = RmsError(r, truth);
        output.WriteLine($"RMS {rms:0.0000} px");
        // Issue target for noise σ = 2 DN in high-quality MPEG-4: ≤ 0.05 px (OpenCV's default MPEG-4 quality).
        Assert.True(rms <= 0.05, $"RMS {rms} px");
    }

    [Fact]
    public void HiddenMark_IsReacquiredWithinThreeFramesWithoutSwaps()
    {
        using var dir = new FixtureFolder();
        string clip = dir.File("hidden.mkv");
        const double fps = 240;
        // Mark 2 hidden for frames 20–29.
        var scene = new SyntheticStringScene(320, 240) { Hidden = [(2, 19.5 / fps, 29.5 / fps)] };
        var truth = FixtureFolder.WriteClip(clip, "FFV1", scene, 60, fps);
        var r = ClipTracker.Track(clip, new TrackingOptions());
        for (int k = 20; k < 30; k++)
        {
            Assert.Equal(0, r.Tracks.Quality[k, 2]);
        }

        // Reappears at frame 30: measured again by frame 32 at the latest (issue: within 3 frames).
        int back = Enumerable.Range(30, 30).First(k => r.Tracks.Quality[k, 2] > 0);
        Assert.InRange(back, 30, 32);
        for (int k = 0; k < 60; k++)
        {
            for (int m = 0; m < scene.MarkCount; m++)
            {
                if (r.Tracks.Quality[k, m] > 0)
                {
                    // No identity swap: every measurement lies within 0.5 px of its own mark.
                    Assert.True(Math.Abs(r.Tracks.YPx[k, m] - truth[k][m].Y) < 0.5 && Math.Abs(r.Tracks.XPx[k, m] - truth[k][m].X) < 0.5, $"frame {k} mark {m}");
                }
            }
        }

        Assert.Contains(r.Warnings, w => w.Contains("mark 2 was not measured"));
    }

    [Fact]
    public void ExposureBlurOneTwoHundredFiftieth_TracksWithinFifteenHundredthsOfAPixel()
    {
        using var dir = new FixtureFolder();
        string clip = dir.File("blur.mkv");
        // Faster motion so the 4 ms exposure smears marks by several pixels: 6 px at 20 Hz peaks near 0.75 px/ms.
        var scene = new SyntheticStringScene(320, 240) { ExposureSteps = 16, Modes = [(6, 20, 0.3, 0.4), (2, 41, 0.5, 1.1)] };
        var truth = FixtureFolder.WriteClip(clip, "FFV1", scene, 60, 240, exposureS: 1 / 250.0, noiseDn: 1);
        var r = ClipTracker.Track(clip, new TrackingOptions());
        double rms = RmsError(r, truth);
        output.WriteLine($"RMS blur {rms:0.0000} px");
        // Issue target with 1/250 s exposure blur: ≤ 0.15 px RMS against the exposure-averaged centres.
        Assert.True(rms <= 0.15, $"RMS {rms} px");
    }
}
