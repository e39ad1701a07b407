using System.Diagnostics;
using System.Globalization;
using StringModes.Video.Frames;
using StringModes.Video.Tests.Support;
using StringModes.Video.Tracking;

// Tracking accuracy, reacquisition, throughput and allocation figures on rendered clips with known truth.
// Usage: dotnet run -c Release --project bench/StringModes.Bench.Tracking [frames]
int frames = args.Length > 0 ? int.Parse(args[0], CultureInfo.InvariantCulture) : 480;
const double fps = 240;
using var dir = new FixtureFolder();

SyntheticStringScene Scene720(int exposureSteps = 1, (int, double, double)[]? hidden = null) => new(1280, 720, seed: 3)
{
    MarkRadiusPx = 5,
    StringWidthPx = 2,
    Modes = [(15, 9.7, 0.4, 0.4), (5, 19.6, 0.7, 1.1), (2, 29.8, 1.0, 2.0)],
    ExposureSteps = exposureSteps,
    Hidden = hidden ?? [],
};

static (double Moving, double Ends) Rms(TrackingResult r, (double X, double Y)[][] truth)
{
    double sm = 0, se = 0;
    int nm = 0, ne = 0, marks = truth[0].Length;
    for (int k = 0; k < truth.Length; k++)
    {
        for (int m = 0; m < marks; m++)
        {
            double e = Math.Pow(r.Tracks.XPx[k, m] - truth[k][m].X, 2) + Math.Pow(r.Tracks.YPx[k, m] - truth[k][m].Y, 2);
            if (!double.IsFinite(e)) continue;
            if (m == 0 || m == marks - 1) { se += e; ne++; } else { sm += e; nm++; }
        }
    }

    return (Math.Sqrt(sm / nm), Math.Sqrt(se / ne));
}

void Accuracy(string name, string file, string fourcc, SyntheticStringScene scene, double exposureS, double noise)
{
    var truth = FixtureFolder.WriteClip(dir.File(file), fourcc, scene, frames, fps, exposureS, noise);
    var r = ClipTracker.Track(dir.File(file), new TrackingOptions());
    var (m, e) = Rms(r, truth);
    Console.WriteLine($"{name,-44} RMS moving marks {m:0.0000} px, ends {e:0.0000} px, window {r.Window.StartFrame}-{r.Window.EndFrame}");
}

Console.WriteLine($"1280x720, {frames} frames at {fps} fps, 4 moving marks r = 5 px, textured background");
Accuracy("lossless FFV1, no noise", "a.mkv", "FFV1", Scene720(), 0, 0);
Accuracy("lossless FFV1, noise 2 DN", "b.mkv", "FFV1", Scene720(), 0, 2);
Accuracy("MPEG-4 part 2 (OpenCV default quality), 2 DN", "c.mp4", "mp4v", Scene720(), 0, 2);
Accuracy("MJPEG, 2 DN", "d.avi", "MJPG", Scene720(), 0, 2);
Accuracy("FFV1, 1/250 s exposure blur, 2 DN", "e.mkv", "FFV1", Scene720(16), 1 / 250.0, 2);

// Reacquisition and identity: mark 2 hidden for frames 100–109.
{
    var scene = Scene720(1, [(2, 99.5 / fps, 109.5 / fps)]);
    var truth = FixtureFolder.WriteClip(dir.File("h.mkv"), "FFV1", scene, Math.Min(frames, 200), fps, 0, 2);
    var r = ClipTracker.Track(dir.File("h.mkv"), new TrackingOptions());
    int back = Enumerable.Range(110, r.Tracks.FrameCount - 110).FirstOrDefault(k => r.Tracks.Quality[k, 2] > 0, -1);
    int swaps = 0;
    for (int k = 0; k < r.Tracks.FrameCount; k++)
        for (int m = 0; m < scene.MarkCount; m++)
            if (r.Tracks.Quality[k, m] > 0 && Math.Abs(r.Tracks.YPx[k, m] - truth[k][m].Y) + Math.Abs(r.Tracks.XPx[k, m] - truth[k][m].X) > 2) swaps++;
    Console.WriteLine($"hidden 10 frames: reacquired {back - 110} frame(s) after reappearing; measurements off their own mark by > 2 px: {swaps}");
}

// Throughput: decode-only (grey plane delivered) against decode + tracking, same clip, best of 3.
{
    string clip = dir.File("c.mp4");
    double decode = double.MaxValue, track = double.MaxValue;
    for (int rep = 0; rep < 3; rep++)
    {
        var sw = Stopwatch.StartNew();
        using (var src = FrameSources.Open(clip))
            while (src.Read()) { }
        decode = Math.Min(decode, sw.Elapsed.TotalSeconds);
        sw.Restart();
        ClipTracker.Track(clip, new TrackingOptions());
        track = Math.Min(track, sw.Elapsed.TotalSeconds);
    }

    Console.WriteLine($"throughput: decode-only {frames / decode:0} fps, tracking {frames / track:0} fps, ratio {decode / track:0.000}");

    // Allocation per frame: difference between two clip lengths divided by the frame difference.
    GC.Collect();
    long a0 = GC.GetTotalAllocatedBytes(true);
    ClipTracker.Track(clip, new TrackingOptions { MaxFrames = frames / 4 });
    long a1 = GC.GetTotalAllocatedBytes(true);
    ClipTracker.Track(clip, new TrackingOptions { MaxFrames = frames });
    long a2 = GC.GetTotalAllocatedBytes(true);
    double perFrame = ((a2 - a1) - (a1 - a0)) / (double)(frames - frames / 4);
    Console.WriteLine($"managed allocation per extra frame: {perFrame:0} B (track storage for 6 marks is 3·6·8 = 144 B, list growth amortised)");
    Console.WriteLine($"process peak working set: {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576.0:0} MiB");
}
