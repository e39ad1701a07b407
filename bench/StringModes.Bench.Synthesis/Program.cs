using System.Diagnostics;
using System.Globalization;
using StringModes.Video.Synthesis;

// Rendering-speed benchmark: frames per second at 1280×720 with 8 sub-frames, rendering only (no encoding)
// and rendering plus lossless FFV1 encoding. Usage: dotnet run -c Release --project bench/StringModes.Bench.Synthesis [frames]
var frames = args.Length > 0 ? int.Parse(args[0], CultureInfo.InvariantCulture) : 240;
const string sceneText = """
{
  "description": "benchmark scene (invented): 11 marks on a 1.0 m string, 1280x720, 8 sub-frames",
  "string": { "length_m": 1.0, "fundamental_hz": 18, "pluck": { "position_fraction": 0.2, "peak_m": 0.004, "mode_count": 6 },
              "decay": { "s0_per_s": 0.5 } },
  "image": { "width_px": 1280, "height_px": 720, "end0_px": [90, 360], "end1_px": [1190, 380] },
  "marks": { "count": 11, "radius_px": 5 },
  "camera": { "capture_fps": 240, "duration_s": 10, "exposure_s": 0.001, "subframes": 8, "noise_dn": 2 }
}
""";
var scene = SceneFile.Parse(sceneText, "bench-scene.json");
var background = BackgroundPainter.Paint(scene);
foreach (var threads in new[] { 1, Environment.ProcessorCount }.Distinct())
{
    var renderers = Enumerable.Range(0, threads).Select(_ => new SceneRenderer(scene, background)).ToArray();
    var buffers = Enumerable.Range(0, threads).Select(_ => new float[background.Length]).ToArray();
    var clock = Stopwatch.StartNew();
    for (var start = 0; start < frames; start += threads)
        Parallel.For(0, Math.Min(threads, frames - start), i => renderers[i].Render(start + i, 1, buffers[i]));
    Console.WriteLine(FormattableString.Invariant($"render only, {threads} thread(s): {frames / clock.Elapsed.TotalSeconds:F1} frames/s at 1280x720, 8 sub-frames ({renderers[0].BandPixelCount} band pixels)"));
}
var dir = Directory.CreateTempSubdirectory("stringmodes-bench-");
try
{
    var clip = Path.Combine(dir.FullName, "bench.mkv");
    var shortScene = scene with { DurationS = frames / scene.CaptureFps };
    var result = ClipSynthesiser.Run(shortScene, clip, new SynthesisOptions(), "bench-scene.json");
    Console.WriteLine(FormattableString.Invariant($"render + FFV1 encode + truth files: {result.Frames / result.RenderSeconds:F1} frames/s"));
}
finally
{
    dir.Delete(true);
}
