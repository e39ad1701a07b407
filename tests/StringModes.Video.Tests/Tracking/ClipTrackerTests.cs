using StringModes.Video.Synthesis;
using StringModes.Video.Tests.Synthesis;
using StringModes.Video.Tracking;

namespace StringModes.Video.Tests.Tracking;

/// <summary>Phone-style and lab inputs are all tracked against the synthesiser's truth.</summary>
public class ClipTrackerTests
{
    private static string Scene => SceneFixtures.Small(noiseDn: 2, textureContrast: 0.12, stringColour: "[215, 210, 195]");

    private static (double RmsPx, int Lost, int Frames) Compare(TrackingResult result, string truthCsv)
    {
        var truth = TruthRow.Load(truthCsv).ToDictionary(r => (r.Frame, r.Mark));
        double sum = 0;
        int n = 0, lost = 0;
        var t = result.Tracks;
        for (var k = 0; k < t.FrameCount; k++)
            for (var i = 1; i < t.MarkCount - 1; i++)
            {
                if (t.Quality[k, i] <= 0) { lost++; continue; }
                var r = truth[(k, i)];
                sum += Math.Pow(t.XPx[k, i] - r.XExposure, 2) + Math.Pow(t.YPx[k, i] - r.YExposure, 2);
                n++;
            }
        return (Math.Sqrt(sum / Math.Max(1, n)), lost, t.FrameCount);
    }

    // Lossy phone codecs: tolerance 0.1 px RMS. The issue's 0.05 px target is for high-quality MPEG-4 at 720p
    // (bench/StringModes.Bench.Tracking); these 320×120 fixtures are encoded at CRF 18, a common "visually lossless"
    // setting (common practice), and small marks suffer more from chroma subsampling.
    [Theory]
    [InlineData("libx264", "h264.mp4")]
    [InlineData("libx265", "hevc.mp4")]
    public void PhoneCodecClip_IsTrackedCompletelyAndAccurately(string codec, string file)
    {
        var scene = SceneFixtures.Parse(Scene);
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("seq"), new SynthesisOptions { Seed = 4 }, "s.json");
        Ffmpeg.Run($"-framerate 400 -i {temp.File("seq")}/frame_%06d.png -c:v {codec} -crf 18 -pix_fmt yuv420p {(codec == "libx265" ? "-x265-params log-level=error" : "")} {temp.File(file)}");
        var result = ClipTracker.Track(temp.File(file), new TrackingOptions { ReferenceTimeS = 0.1 });
        var (rms, lost, frames) = Compare(result, temp.File("seq.truth-tracks.csv"));
        Assert.Equal(scene.FrameCount, frames);
        Assert.Equal(0, lost);
        Assert.True(rms < 0.1, $"{codec}: RMS {rms:F4} px");
    }

    // A slow-motion container: captured at 400 fps, declared 25 fps. With the capture rate stated, frame k is at
    // k/400 s (1e-9 s covers floating-point rounding of the container's timestamps).
    [Fact]
    public void SlowMotionContainer_WithCaptureRate_GetsTheCaptureTimeBase()
    {
        var scene = SceneFixtures.Parse(Scene);
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("slow.mkv"), new SynthesisOptions { Seed = 4, ContainerFps = 25 }, "s.json");
        var result = ClipTracker.Track(temp.File("slow.mkv"), new TrackingOptions { CaptureFps = 400, ReferenceTimeS = 0.1 });
        for (var k = 0; k < result.Tracks.FrameCount; k++) Assert.Equal(k / 400.0, result.Tracks.TimesS[k], 1e-9);
        Assert.Contains(result.Warnings, w => w.Contains("slow motion"));
        var (rms, lost, _) = Compare(result, temp.File("slow.truth-tracks.csv"));
        Assert.Equal(0, lost);
        Assert.True(rms < 0.05, $"RMS {rms:F4} px");
    }

    // Without the capture rate a file declaring ≤ 60 fps gets the slow-motion warning.
    [Fact]
    public void LowDeclaredRate_WithoutCaptureRate_WarnsAboutSlowMotion()
    {
        var scene = SceneFixtures.Parse(Scene) with { DurationS = 0.1 };
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("slow.mkv"), new SynthesisOptions { ContainerFps = 30 }, "s.json");
        var result = ClipTracker.Track(temp.File("slow.mkv"), new TrackingOptions { ReferenceTimeS = 0.5 });
        Assert.Contains(result.Warnings, w => w.Contains("--capture-fps"));
    }

    // Lab camera: 16-bit TIFF sequence. On this small fixture (marks of radius 4.3 px with a light string through
    // them, textured background, σ = 2 DN) the tracker measures about 0.011 px RMS (the 720p bench, 0.011 px; the
    // thresholded centroid alone, 0.048 px); the 0.03 px tolerance catches a broken 16-bit path, which loses marks or
    // errs by tenths of a pixel, and a refinement that no longer applies.
    [Fact]
    public void SixteenBitTiffSequence_IsTrackedAccurately()
    {
        var scene = SceneFixtures.Parse(Scene);
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("tiff"), new SynthesisOptions { Seed = 4, SequenceFormat = "tiff16" }, "s.json");
        var result = ClipTracker.Track(temp.File("tiff"), new TrackingOptions { CaptureFps = 400, ReferenceTimeS = 0.1 });
        var (rms, lost, frames) = Compare(result, temp.File("tiff.truth-tracks.csv"));
        Assert.Equal(scene.FrameCount, frames);
        Assert.Equal(0, lost);
        Assert.True(rms < 0.03, $"RMS {rms:F4} px");
    }

    // Pixel-locking: noise-free sharp discs (radius 4.3 px, the light string through them) on a plain background,
    // against the synthesiser's truth, whose exact-area discs (DiscCoverage) have an unthresholded intensity centroid
    // at the true centre to about 0.003 px (measured). A thresholded centroid errs by 0.049 px RMS here (up to
    // ±0.02 px with the sub-pixel phase across the motion, 0.02–0.05 px where the string crosses the edge); the
    // tapered coverage centroid by 0.008 px (the pixel-locking left at this radius, the worst of 3–7 px). Tolerance
    // 0.015 px: between the two, with room for the exposure and rounding of 8-bit frames.
    [Fact]
    public void SharpDiscsAtEverySubPixelPhase_ShowNoPixelLocking()
    {
        var scene = SceneFixtures.Parse(SceneFixtures.Small(stringColour: "[215, 210, 195]"));
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("sharp.mkv"), new SynthesisOptions { Seed = 4 }, "s.json");
        var result = ClipTracker.Track(temp.File("sharp.mkv"), new TrackingOptions { CaptureFps = 400, ReferenceTimeS = 0.1 });
        var (rms, lost, _) = Compare(result, temp.File("sharp.truth-tracks.csv"));
        Assert.Equal(0, lost);
        Assert.True(rms < 0.015, $"RMS {rms:F4} px");
    }

    // Occlusion: a mark hidden for 10 frames is measured again within 3 frames of reappearing, with no identity swap.
    [Fact]
    public void MarkHiddenForTenFrames_IsReacquiredWithinThreeFrames()
    {
        var scene = SceneFixtures.Parse(Scene.Replace("\"background\"", "\"occluders\": [ { \"rect_px\": [150, 20, 30, 80], \"from_s\": 0.1, \"to_s\": 0.1249 } ], \"background\""));
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("occ"), new SynthesisOptions { Seed = 4 }, "s.json");
        var truth = TruthRow.Load(temp.File("occ.truth-tracks.csv"));
        var hidden = truth.Where(r => !r.Visible).Select(r => r.Frame).Distinct().Order().ToArray();
        Assert.Equal(10, hidden.Length);
        var mark = truth.First(r => !r.Visible).Mark;
        var result = ClipTracker.Track(temp.File("occ"), new TrackingOptions { CaptureFps = 400, ReferenceTimeS = 0.02 });
        var back = Enumerable.Range(hidden[^1] + 1, 20).First(k => result.Tracks.Quality[k, mark] > 0);
        Assert.True(back - hidden[^1] <= 3, $"reacquired {back - hidden[^1]} frames after reappearing");
        var (rms, _, _) = Compare(result, temp.File("occ.truth-tracks.csv"));
        Assert.True(rms < 0.05, $"RMS {rms:F4} px (a swap would give errors of tens of pixels)");
    }
}
