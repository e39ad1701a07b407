using OpenCvSharp;

namespace StringModes.Video.Tests.Support;

/// <summary>A temporary folder for fixture clips, deleted on dispose.</summary>
internal sealed class FixtureFolder : IDisposable
{
    public FixtureFolder()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "stringmodes-tests-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public string File(string name) => System.IO.Path.Combine(Path, name);

    /// <summary>Writes <paramref name="frames"/> frames of the scene at <paramref name="fps"/> with OpenCV's encoder; returns the truth.</summary>
    public static (double X, double Y)[][] WriteClip(string path, string fourcc, SyntheticStringScene scene, int frames, double fps,
        double exposureS = 0, double noiseDn = 0, int seed = 7, double quality = -1)
    {
        var rng = new Random(seed);
        using var grey = new Mat();
        using var bgr = new Mat();
        var truth = new (double X, double Y)[frames][];
        int[] prms = quality > 0 ? [(int)VideoWriterProperties.Quality, (int)quality] : [];
        using var writer = new VideoWriter(path, VideoCaptureAPIs.FFMPEG, FourCC.FromString(fourcc), fps, new Size(scene.Width, scene.Height), prms);
        if (!writer.IsOpened())
        {
            throw new InvalidOperationException($"cannot open writer for {path} ({fourcc})");
        }

        for (int k = 0; k < frames; k++)
        {
            truth[k] = scene.Render(k / fps, exposureS, noiseDn, rng, grey);
            Cv2.CvtColor(grey, bgr, ColorConversionCodes.GRAY2BGR);
            writer.Write(bgr);
        }

        return truth;
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Path, true);
        }
        catch (IOException)
        {
        }
    }
}
