using System.Diagnostics;
using OpenCvSharp;
using StringModes.Video.Frames;
using StringModes.Video.Tests.Support;

namespace StringModes.Video.Tests.Frames;

public sealed class VideoFileSourceTests
{
    private static SyntheticStringScene Scene() => new(160, 120);

    [Fact]
    public void LosslessMkv_ReadsEveryFrameExactlyWithTimestamps()
    {
        using var dir = new FixtureFolder();
        string clip = dir.File("a.mkv");
        var scene = Scene();
        FixtureFolder.WriteClip(clip, "FFV1", scene, 30, 50);
        using var expected = new Mat();
        var rng = new Random(7);
        using var src = FrameSources.Open(clip);
        int n = 0;
        while (src.Read())
        {
            scene.Render(n / 50.0, 0, 0, rng, expected);
            // FFV1 is lossless and the BGR→grey round trip of a grey image is exact.
            using (var d = Diff(src.Grey, expected))
            {
                Assert.Equal(0, Cv2.CountNonZero(d));
            }

            // Container timestamps are stored in milliseconds by the muxer: 1 ms tolerance.
            Assert.Equal(n / 50.0, src.TimeS, 1e-3);
            Assert.Equal(n, src.FrameIndex);
            n++;
        }

        Assert.Equal(30, n);
        Assert.Equal(50, src.DeclaredFps, 1e-6);
        Assert.Empty(src.Warnings);
    }

    private static Mat Diff(Mat a, Mat b)
    {
        var d = new Mat();
        Cv2.Absdiff(a, b, d);
        return d;
    }

    [Fact]
    public void CaptureFpsOverride_ScalesTimestampsToCaptureRate()
    {
        using var dir = new FixtureFolder();
        string clip = dir.File("slow.avi");
        FixtureFolder.WriteClip(clip, "MJPG", Scene(), 12, 30);
        using var src = FrameSources.Open(clip, new FrameSourceOptions { CaptureFps = 240 });
        var times = new List<double>();
        while (src.Read())
        {
            times.Add(src.TimeS);
        }

        Assert.Equal(12, times.Count);
        // 30 fps playback of a 240 fps capture: each step is 1/240 s (timestamps rounded to 1 ms × 30/240).
        for (int i = 0; i < times.Count; i++)
        {
            Assert.Equal(i / 240.0, times[i], 2e-4);
        }
    }

    [Fact]
    public void RegionOfInterest_DeliversThatRectangleOnly()
    {
        using var dir = new FixtureFolder();
        string clip = dir.File("roi.mkv");
        FixtureFolder.WriteClip(clip, "FFV1", Scene(), 3, 25);
        using var full = FrameSources.Open(clip);
        using var part = FrameSources.Open(clip, new FrameSourceOptions { Region = new RegionOfInterest(10, 20, 64, 48) });
        Assert.True(full.Read());
        Assert.True(part.Read());
        Assert.Equal(new Size(64, 48), part.Grey.Size());
        Assert.Equal(160, part.FrameWidth);
        using var d = Diff(part.Grey, new Mat(full.Grey, new Rect(10, 20, 64, 48)));
        Assert.Equal(0, Cv2.CountNonZero(d));
        Assert.Throws<InputException>(() => FrameSources.Open(clip, new FrameSourceOptions { Region = new RegionOfInterest(150, 0, 64, 48) }));
    }

    [Fact]
    public void MissingGarbageAndEmptyFiles_ThrowInputExceptionNamingTheFile()
    {
        using var dir = new FixtureFolder();
        string missing = dir.File("none.mp4");
        var e1 = Assert.Throws<InputException>(() => FrameSources.Open(missing));
        Assert.Contains("none.mp4", e1.Message);

        string garbage = dir.File("garbage.mp4");
        var bytes = new byte[4096];
        new Random(3).NextBytes(bytes);
        File.WriteAllBytes(garbage, bytes);
        var e2 = Assert.Throws<InputException>(() => FrameSources.Open(garbage));
        Assert.Contains("garbage.mp4", e2.Message);

        string empty = dir.File("empty.mkv");
        File.WriteAllBytes(empty, []);
        Assert.Throws<InputException>(() => FrameSources.Open(empty));
        Assert.DoesNotContain('\n', e2.Message);
    }

    [Fact]
    public void TruncatedClip_YieldsFramesUpToTheDamageWithWarning()
    {
        using var dir = new FixtureFolder();
        string clip = dir.File("cut.avi");
        FixtureFolder.WriteClip(clip, "MJPG", Scene(), 40, 25);
        var bytes = File.ReadAllBytes(clip);
        File.WriteAllBytes(clip, bytes[..(bytes.Length * 55 / 100)]);
        using var src = FrameSources.Open(clip);
        int n = 0;
        while (src.Read())
        {
            n++;
        }

        Assert.InRange(n, 5, 30);
        Assert.Contains(src.Warnings, w => w.Contains("truncated"));
    }

    [Fact]
    public void VariableRateH264FromFfmpeg_KeepsTruePresentationTimestamps()
    {
        // Debian ffmpeg encodes H.264 (OpenCV's bundled FFmpeg only decodes it); the CI set-up installs it.
        using var dir = new FixtureFolder();
        string lossless = dir.File("src.mkv");
        FixtureFolder.WriteClip(lossless, "FFV1", Scene(), 20, 50);
        string vfr = dir.File("vfr.mkv");
        // Frames 0–9 at 50 fps, then 25 fps: t = N/50 for N < 10, else 0.2 + (N−10)/25.
        RunFfmpeg($"-y -loglevel error -i {lossless} -vf \"setpts='if(lt(N,10),N/50,0.2+(N-10)/25)/TB'\" -fps_mode passthrough -c:v libx264 -preset ultrafast -crf 10 {vfr}");
        using var src = FrameSources.Open(vfr);
        var times = new List<double>();
        while (src.Read())
        {
            times.Add(src.TimeS);
        }

        Assert.Equal(20, times.Count);
        for (int i = 0; i < 20; i++)
        {
            double expected = i < 10 ? i / 50.0 : 0.2 + (i - 10) / 25.0;
            Assert.Equal(expected, times[i], 1.5e-3);
        }

        var report = FrameTiming.Analyse(times, src.DeclaredFps, null);
        Assert.True(report.IsVariableRate);
    }

    internal static void RunFfmpeg(string args)
    {
        var psi = new ProcessStartInfo("ffmpeg", args) { RedirectStandardError = true, UseShellExecute = false };
        using var p = Process.Start(psi) ?? throw new InvalidOperationException("ffmpeg is required for this test (apt-get install ffmpeg)");
        string err = p.StandardError.ReadToEnd();
        p.WaitForExit();
        Assert.True(p.ExitCode == 0, "ffmpeg failed: " + err);
    }
}
