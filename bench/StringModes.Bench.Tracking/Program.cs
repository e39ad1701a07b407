using System.Diagnostics;
using System.Globalization;
using OpenCvSharp;
using StringModes.Video.Synthesis;
using StringModes.Video.Tracking;

// Tracking accuracy and throughput on synthesised clips with known truth. Prints, per case, the RMS position error
// against the exposure-averaged truth (moving marks, frames where the mark is visible and tracked), lost samples,
// identity swaps (a tracked position nearer another mark's truth than its own), and the tracking/decode throughput ratio.
// Usage: dotnet run -c Release --project bench/StringModes.Bench.Tracking [seconds [case-name-part]]
if (args.Length == 2 && args[0] == "decode")
{
    // Decode-only timing of a clip through the same OpenCV FFmpeg decoder the tracker uses (for bench/performance.sh).
    var decodeClock = Stopwatch.StartNew();
    var decoded = 0;
    using (var capture = new VideoCapture(args[1], VideoCaptureAPIs.FFMPEG))
    using (var m = new Mat())
        while (capture.Read(m) && !m.Empty()) decoded++;
    Console.WriteLine(FormattableString.Invariant($"decode {decoded} frames {decodeClock.Elapsed.TotalSeconds:F3} s"));
    return;
}
var seconds = args.Length > 0 ? double.Parse(args[0], CultureInfo.InvariantCulture) : 1.0;
string Scene(string camera, int w = 1280, int h = 720, string extra = "") => $$"""
{
  "description": "tracking benchmark (invented): 1.1 m string, 9 marks",
  "string": { "length_m": 1.1, "fundamental_hz": 31, "pluck": { "position_fraction": 0.27, "peak_m": 0.006, "mode_count": 3 },
              "decay": { "s0_per_s": 0.4, "s2_s": 0.0002 } },
  "image": { "width_px": {{w}}, "height_px": {{h}}, "end0_px": [80, {{h / 2}}], "end1_px": [{{w - 80}}, {{h / 2 + 25}}] },
  "marks": { "count": 9, "radius_px": 5, "colour_rgb": [30, 30, 35] },
  "background": { "colour_rgb": [170, 165, 150], "texture_contrast": 0.15 },
  "camera": { {{camera}}, "duration_s": {{seconds.ToString(CultureInfo.InvariantCulture)}} }
  {{extra}}
}
""";
var cases = new (string Name, string Scene, string Clip)[]
{
    ("lossless FFV1, 1 ms exposure, noise 2 DN", Scene("\"capture_fps\": 240, \"exposure_s\": 0.001, \"noise_dn\": 2"), "a.mkv"),
    ("MPEG-4 q95, 1 ms exposure, noise 2 DN", Scene("\"capture_fps\": 240, \"exposure_s\": 0.001, \"noise_dn\": 2"), "b.mp4"),
    ("lossless FFV1, 1/250 s exposure, noise 2 DN", Scene("\"capture_fps\": 240, \"exposure_s\": 0.004, \"subframes\": 16, \"noise_dn\": 2"), "c.mkv"),
    ("lossless FFV1, 0.3 s release exposed 1/240 s, then 1 ms", Scene("\"capture_fps\": 240, \"exposure_s\": 0.001, \"noise_dn\": 2", extra: ", \"release\": { \"duration_s\": 0.3, \"exposure_s\": 0.0041666, \"subframes\": 16 }"), "e.mkv"),
    ("lossless FFV1, mark hidden 10 frames", Scene("\"capture_fps\": 240, \"exposure_s\": 0.001, \"noise_dn\": 2", extra: ", \"occluders\": [ { \"rect_px\": [560, 300, 60, 140], \"from_s\": 0.2, \"to_s\": 0.24166 } ]"), "d.mkv"),
};
var dir = Directory.CreateTempSubdirectory("stringmodes-bench-tracking-").FullName;
try
{
    // Optional second argument: run only the cases whose name contains it.
    foreach (var (name, text, file) in cases.Where(c => args.Length < 2 || c.Name.Contains(args[1], StringComparison.Ordinal)))
    {
        var scene = SceneFile.Parse(text, "bench.json");
        var clip = Path.Combine(dir, file);
        ClipSynthesiser.Run(scene, clip, new SynthesisOptions { Seed = 7 }, "bench.json");
        var truth = File.ReadLines(Path.ChangeExtension(clip, null) + ".truth-tracks.csv").Skip(1).Select(l => l.Split(','))
            .Select(f => (Frame: int.Parse(f[0], CultureInfo.InvariantCulture), Mark: int.Parse(f[2], CultureInfo.InvariantCulture),
                X: double.Parse(f[6], CultureInfo.InvariantCulture), Y: double.Parse(f[7], CultureInfo.InvariantCulture), Visible: f[10] == "1"))
            .ToDictionary(r => (r.Frame, r.Mark));

        var decode = Stopwatch.StartNew();
        using (var capture = new VideoCapture(clip, VideoCaptureAPIs.FFMPEG))
        using (var m = new Mat())
            while (capture.Read(m) && !m.Empty()) { }
        var decodeS = decode.Elapsed.TotalSeconds;
        var clock = Stopwatch.StartNew();
        var result = ClipTracker.Track(clip, new TrackingOptions());
        var trackS = clock.Elapsed.TotalSeconds;
        var t = result.Tracks;
        double sum = 0;
        int n = 0, lost = 0, swaps = 0, hiddenReacquireWorst = 0;
        var marks = scene.MarkFractions.Length + 2;
        if (t.MarkCount != marks) { Console.WriteLine($"{name}: found {t.MarkCount} marks, expected {marks}"); continue; }
        for (var i = 1; i < marks - 1; i++)
        {
            var hiddenEnd = -1;
            for (var k = 0; k < t.FrameCount; k++)
            {
                var r = truth[(k, i)];
                if (!r.Visible) { hiddenEnd = k; continue; }
                if (t.Quality[k, i] <= 0)
                {
                    lost++;
                    if (hiddenEnd >= 0) hiddenReacquireWorst = Math.Max(hiddenReacquireWorst, k - hiddenEnd);
                    continue;
                }
                var dx = t.XPx[k, i] - r.X;
                var dy = t.YPx[k, i] - r.Y;
                var own = dx * dx + dy * dy;
                foreach (var j in new[] { i - 1, i + 1 })
                {
                    var o = truth[(k, j)];
                    if (Math.Pow(t.XPx[k, i] - o.X, 2) + Math.Pow(t.YPx[k, i] - o.Y, 2) < own) swaps++;
                }
                sum += own;
                n++;
            }
        }
        var windowStart = t.TimesS[StringModes.Analysis.Geometry.AnalysisWindow.Choose(t).FirstFrame];
        var release = scene.ReleaseDurationS > 0 ? FormattableString.Invariant($"; analysis window starts at {windowStart:F3} s ({windowStart - scene.ReleaseDurationS:+0.000;-0.000} s from the release end; target within 0.05 s)") : "";
        Console.WriteLine(FormattableString.Invariant(
            $"{name}{release}: RMS error {Math.Sqrt(sum / n):F4} px over {n} samples; lost {lost}; swaps {swaps}; frames to reacquire after reappearing {hiddenReacquireWorst}; tracking/decode throughput {decodeS / trackS:F2} (decode {t.FrameCount / decodeS:F0} fps, tracking {t.FrameCount / trackS:F0} fps incl. its own decode)"));
    }
}
finally
{
    Directory.Delete(dir, true);
}
