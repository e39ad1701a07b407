using OpenCvSharp;
using StringModes.Analysis.Physics;
using StringModes.Video.Synthesis;

namespace StringModes.Video.Tests.Synthesis;

public class ClipSynthesiserTests
{
    private static List<Mat> ReadFrames(string clip)
    {
        using var capture = new VideoCapture(clip, VideoCaptureAPIs.FFMPEG);
        Assert.True(capture.IsOpened(), $"OpenCV could not open {clip}");
        var frames = new List<Mat>();
        while (true)
        {
            var m = new Mat();
            if (!capture.Read(m) || m.Empty()) { m.Dispose(); break; }
            frames.Add(m);
        }
        return frames;
    }

    // Acceptance of the renderer: on a lossless render the intensity centroid of a rendered (moving, blurred)
    // mark equals its exposure-averaged true position to better than 0.01 px. Background-subtracted centroid
    // over a window that holds the whole disc and its blur (common practice for particle centroids; REFERENCES.md §6).
    [Fact]
    public void LosslessRender_MarkCentroidMatchesExposureAveragedTruthWithinOneHundredthPixel()
    {
        // String drawn in the background colour so that only the mark differs from the background.
        var scene = SceneFixtures.Parse(SceneFixtures.Small());
        using var temp = new TempFolder();
        var clip = temp.File("clip.mkv");
        ClipSynthesiser.Run(scene, clip, new SynthesisOptions { Seed = 3 }, "test-scene.json");
        var truth = TruthRow.Load(temp.File("clip.truth-tracks.csv"));
        var frames = ReadFrames(clip);
        Assert.Equal(scene.FrameCount, frames.Count);
        double worst = 0;
        foreach (var k in new[] { 0, 17, 40, 63, 99 })
        {
            using var grey = new Mat();
            Cv2.CvtColor(frames[k], grey, ColorConversionCodes.BGR2GRAY);
            foreach (var row in truth.Where(r => r.Frame == k && r.Mark is >= 1 and <= 5))
            {
                double sx = 0, sy = 0, sm = 0;
                var x0 = (int)Math.Floor(row.XExposure) - 8;
                var y0 = (int)Math.Floor(row.YExposure) - 8;
                for (var y = y0; y <= y0 + 17; y++)
                    for (var x = x0; x <= x0 + 17; x++)
                    {
                        var w = 150.0 - grey.At<byte>(y, x);
                        sx += w * x; sy += w * y; sm += w;
                    }
                var error = Math.Sqrt(Math.Pow(sx / sm - row.XExposure, 2) + Math.Pow(sy / sm - row.YExposure, 2));
                worst = Math.Max(worst, error);
            }
        }
        foreach (var f in frames) f.Dispose();
        Assert.True(worst < 0.01, $"worst centroid error {worst:F4} px");
    }

    // The FFT of a truth track recovers the mode frequencies set by the string law f_n = (n/2L)·√(T/μ)
    // (Mersenne–Taylor; REFERENCES.md §1). T = 11.76798 N, μ = 0.987 g/m, L = 0.80 m → f1 = 68.2452 Hz [computed].
    // Tolerance 0.02 Hz: a 2 s Hann-windowed record zero-padded 32× has 0.016 Hz bins; parabolic interpolation
    // of the log magnitude is far finer than one bin.
    [Fact]
    public void TruthTrack_SpectrumPeaksAtStringLawFrequencies()
    {
        var text = File.ReadAllText(Path.Combine(RepoRoot.Path, "demo-clips", "nylon-bench", "scene.json"))
            .Replace("\"duration_s\": 1.5", "\"duration_s\": 2.0");
        var scene = SceneFile.Parse(text, "scene.json") with { WidthPx = 640 };
        Assert.Equal(68.2452, StringLaw.Fundamental(11.76798, 0.000987, 0.80), 1e-4);
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene with { NoiseDn = 0 }, temp.File("seq"), new SynthesisOptions(), "scene.json");
        var truth = TruthRow.Load(temp.File("seq.truth-tracks.csv"));
        var signal = truth.Where(r => r.Mark == 2).OrderBy(r => r.Frame).Select(r => r.UMid).ToArray();
        var n = signal.Length;
        var padded = new System.Numerics.Complex[1 << (int)Math.Ceiling(Math.Log2(n * 32.0))];
        for (var i = 0; i < n; i++) padded[i] = signal[i] * (0.5 - 0.5 * Math.Cos(2 * Math.PI * i / (n - 1)));
        FftSharp.FFT.Forward(padded);
        var binHz = scene.CaptureFps / padded.Length;
        foreach (var mode in new[] { 1, 2, 3 })
        {
            var expected = mode * 68.2452;
            var centre = (int)Math.Round(expected / binHz);
            var best = Enumerable.Range(centre - 40, 81).MaxBy(i => padded[i].Magnitude);
            double L(int i) => Math.Log(padded[i].Magnitude);
            var delta = 0.5 * (L(best - 1) - L(best + 1)) / (L(best - 1) - 2 * L(best) + L(best + 1));
            Assert.Equal(expected, (best + delta) * binHz, 0.02);
        }
    }

    [Fact]
    public void SameSeed_GivesIdenticalFrames_OtherSeedDiffers()
    {
        var scene = SceneFixtures.Parse(SceneFixtures.Small(noiseDn: 2, textureContrast: 0.2)) with { DurationS = 0.02 };
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("a"), new SynthesisOptions { Seed = 5 }, "s.json");
        ClipSynthesiser.Run(scene, temp.File("b"), new SynthesisOptions { Seed = 5, Threads = 1 }, "s.json");
        ClipSynthesiser.Run(scene, temp.File("c"), new SynthesisOptions { Seed = 6 }, "s.json");
        var a = Directory.GetFiles(temp.File("a")).Order().ToArray();
        var b = Directory.GetFiles(temp.File("b")).Order().ToArray();
        var c = Directory.GetFiles(temp.File("c")).Order().ToArray();
        Assert.Equal(scene.FrameCount, a.Length);
        for (var i = 0; i < a.Length; i++)
        {
            Assert.Equal(File.ReadAllBytes(a[i]), File.ReadAllBytes(b[i]));
            Assert.NotEqual(File.ReadAllBytes(a[i]), File.ReadAllBytes(c[i]));
        }
    }

    // FFV1 must be lossless through OpenCV's writer and reader: the decoded frame equals the PNG of the same render.
    [Fact]
    public void Ffv1Clip_DecodesToTheSamePixelsAsThePngSequence()
    {
        var scene = SceneFixtures.Parse(SceneFixtures.Small(noiseDn: 2, textureContrast: 0.2)) with { DurationS = 0.02 };
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("v.mkv"), new SynthesisOptions { Seed = 2 }, "s.json");
        ClipSynthesiser.Run(scene, temp.File("p"), new SynthesisOptions { Seed = 2 }, "s.json");
        var frames = ReadFrames(temp.File("v.mkv"));
        var pngs = Directory.GetFiles(temp.File("p")).Order().ToArray();
        Assert.Equal(pngs.Length, frames.Count);
        for (var i = 0; i < pngs.Length; i++)
        {
            using var png = Cv2.ImRead(pngs[i], ImreadModes.Color);
            using var diff = new Mat();
            Cv2.Absdiff(png, frames[i], diff);
            Assert.Equal(0, Cv2.CountNonZero(diff.Reshape(1)));
            frames[i].Dispose();
        }
    }

    [Fact]
    public void SixteenBitTiffSequence_KeepsFullDepth()
    {
        var scene = SceneFixtures.Parse(SceneFixtures.Small()) with { DurationS = 0.01 };
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("t"), new SynthesisOptions { SequenceFormat = "tiff16" }, "s.json");
        var files = Directory.GetFiles(temp.File("t"), "*.tif");
        Assert.Equal(scene.FrameCount, files.Length);
        using var image = Cv2.ImRead(files[0], ImreadModes.Unchanged);
        Assert.Equal(MatType.CV_16UC3, image.Type());
        // Background 150 DN → 150 × 257 = 38550 in 16 bits (noise off).
        Assert.Equal(38550, image.At<Vec3w>(5, 5).Item0);
    }
}

internal static class RepoRoot
{
    public static string Path { get; } = Find();

    private static string Find()
    {
        var dir = AppContext.BaseDirectory;
        while (dir is not null && !File.Exists(System.IO.Path.Combine(dir, "StringModes.sln"))) dir = System.IO.Path.GetDirectoryName(dir);
        return dir ?? throw new InvalidOperationException("repository root (StringModes.sln) not found above the test binaries");
    }
}
