using System.Globalization;
using System.Text;
using System.Text.Json;
using StringModes.Analysis.Physics;
using StringModes.Shared;
using StringModes.Video.Output;

namespace StringModes.Video.Synthesis;

/// <summary>Options of one synthesis run.</summary>
public sealed record SynthesisOptions
{
    /// <summary>Seed of the sensor noise; default 1. The same seed gives identical frames.</summary>
    public long Seed { get; init; } = 1;

    /// <summary>Frame rate written into the container in frames/s; default: the capture rate. A lower value makes a slow-motion file.</summary>
    public double? ContainerFps { get; init; }

    /// <summary>Image-sequence format for a folder output: "png" (default) or "tiff16".</summary>
    public string? SequenceFormat { get; init; }

    /// <summary>Encoder quality 1–100 for lossy formats; default 95.</summary>
    public int Quality { get; init; } = 95;

    /// <summary>Worker threads for rendering; default: processor count.</summary>
    public int Threads { get; init; } = Environment.ProcessorCount;
}

/// <summary>What a synthesis run wrote.</summary>
public sealed record SynthesisResult(string ClipPath, string TruthPath, string TruthTracksPath, int Frames, double RenderSeconds, ClipFormat Format);

/// <summary>
/// Renders a <see cref="Scene"/> into a clip plus its ground truth: <c>CLIP.truth.json</c> (every parameter, per-mode
/// f_n, σ_n, ζ_n, A_n, mark rest positions, pixel scale) and <c>CLIP.truth-tracks.csv</c> (true position of every mark in
/// every frame at mid-exposure and averaged over the exposure, at its row's time under a rolling shutter).
/// </summary>
public static class ClipSynthesiser
{
    /// <summary>Path stem for the truth files: the clip path without its extension.</summary>
    public static string TruthStem(string clipPath)
    {
        var trimmed = clipPath.TrimEnd('/', '\\');
        return Path.Combine(Path.GetDirectoryName(trimmed) ?? "", Path.GetFileNameWithoutExtension(trimmed));
    }

    /// <summary>The hidden path a clip for <paramref name="clipPath"/> is written to before it is moved into place (for clean-up after a forced exit).</summary>
    public static string TemporaryPath(string clipPath) => ClipWriter.TemporaryPathFor(clipPath);

    /// <summary>Renders and writes the clip and truth files; nothing is left behind if it fails or is cancelled.</summary>
    public static SynthesisResult Run(Scene scene, string clipPath, SynthesisOptions options, string sceneFileName,
        IProgress<double>? progress = null, CancellationToken cancel = default)
    {
        var format = ClipFormats.FromPath(clipPath, options.SequenceFormat);
        var containerFps = options.ContainerFps ?? scene.CaptureFps;
        var stopwatch = System.Diagnostics.Stopwatch.StartNew();
        var background = BackgroundPainter.Paint(scene);
        var threads = Math.Max(1, options.Threads);
        var renderers = Enumerable.Range(0, threads).Select(_ => new SceneRenderer(scene, background)).ToArray();
        var buffers = Enumerable.Range(0, threads).Select(_ => new float[background.Length]).ToArray();
        var frames = scene.FrameCount;
        using (var writer = new ClipWriter(clipPath, format, scene.WidthPx, scene.HeightPx, containerFps, options.Quality))
        {
            for (var start = 0; start < frames; start += threads)
            {
                cancel.ThrowIfCancellationRequested();
                var count = Math.Min(threads, frames - start);
                Parallel.For(0, count, new ParallelOptions { MaxDegreeOfParallelism = threads },
                    i => renderers[i].Render(start + i, options.Seed, buffers[i]));
                for (var i = 0; i < count; i++) writer.Write(buffers[i]);
                progress?.Report((start + count) / (double)frames);
            }
            var stem = TruthStem(clipPath);
            var truthPath = stem + ".truth.json";
            var tracksPath = stem + ".truth-tracks.csv";
            AtomicFile.WriteAllText(tracksPath, TruthTracksCsv(scene, renderers[0]));
            AtomicFile.Write(truthPath, s => WriteTruthJson(s, scene, options, containerFps, format, clipPath, sceneFileName));
            writer.Commit();
            return new SynthesisResult(clipPath, truthPath, tracksPath, frames, stopwatch.Elapsed.TotalSeconds, format);
        }
    }

    private static string TruthTracksCsv(Scene scene, SceneRenderer renderer)
    {
        var sb = new StringBuilder();
        sb.Append("frame,time_s,mark,row_time_s,x_mid_px,y_mid_px,x_exposure_px,y_exposure_px,u_mid_m,u_exposure_m,visible\n");
        var last = scene.MarkFractions.Length + 1;
        for (var k = 0; k < scene.FrameCount; k++)
        {
            var t = k / scene.CaptureFps;
            void Still(int mark, PixelPoint p)
            {
                var rowTime = t + p.Y / scene.HeightPx * scene.ReadoutS;
                Row(k, t, mark, rowTime, p, p, 0, 0, true);
            }
            void Row(int frame, double time, int mark, double rowTime, PixelPoint mid, PixelPoint avg, double u, double ua, bool visible)
                => sb.Append(CultureInfo.InvariantCulture,
                    $"{frame},{F(time)},{mark},{F(rowTime)},{P(mid.X)},{P(mid.Y)},{P(avg.X)},{P(avg.Y)},{M(u)},{M(ua)},{(visible ? 1 : 0)}\n");
            Still(0, scene.End0);
            for (var i = 0; i < scene.MarkFractions.Length; i++)
            {
                var truth = renderer.Truth(k, i);
                Row(k, t, i + 1, truth.RowTimeS, truth.MidExposure, truth.ExposureAveraged, truth.DisplacementM, truth.ExposureAveragedDisplacementM, truth.Visible);
            }
            Still(last, scene.End1);
        }
        return sb.ToString();
    }

    private static string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    // Positions to 1e-6 px and displacements to 1e-12 m: far below any tracker's resolution, and half the file size of round-trip digits.
    private static string P(double v) => v.ToString("0.######", CultureInfo.InvariantCulture);

    private static string M(double v) => v.ToString("0.############", CultureInfo.InvariantCulture);

    private static void WriteTruthJson(Stream stream, Scene scene, SynthesisOptions options, double containerFps, ClipFormat format, string clipPath, string sceneFileName)
    {
        var geometry = new StringGeometry(scene);
        using var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true });
        void Num(string name, double v)
        {
            if (double.IsFinite(v)) w.WriteNumber(name, v);
            else w.WriteNull(name);
        }
        void Point(string name, PixelPoint p)
        {
            w.WriteStartArray(name);
            w.WriteNumberValue(p.X);
            w.WriteNumberValue(p.Y);
            w.WriteEndArray();
        }
        w.WriteStartObject();
        w.WriteString("generator", "stringmodes synth");
        w.WriteString("scene_file", Path.GetFileName(sceneFileName));
        w.WriteString("description", scene.Description);
        w.WriteString("clip", Path.GetFileName(clipPath.TrimEnd('/', '\\')));
        w.WriteString("format", format.ToString().ToLowerInvariant());
        w.WriteNumber("seed", options.Seed);
        w.WriteString("time_convention", "frame k is at t = k / capture_fps, the middle of row 0's exposure; row y is exposed around t + (y / height_px) * readout_s");
        w.WriteString("transverse_convention", "positive displacement is the end0->end1 axis turned 90 degrees counter-clockwise as seen in the image");

        w.WriteStartObject("string");
        Num("length_m", scene.Motion.LengthM);
        Num("linear_density_kg_per_m", scene.LinearDensityKgPerM);
        Num("tension_n", scene.TensionN);
        Num("fundamental_hz", scene.FundamentalHz);
        Num("inharmonicity", scene.Inharmonicity);
        Num("wave_speed_m_per_s", StringLaw.WaveSpeed(scene.Motion.LengthM, scene.FundamentalHz));
        Num("bending_stiffness_n_m2", double.IsNaN(scene.TensionN) ? double.NaN : StringLaw.BendingStiffness(scene.Inharmonicity, scene.TensionN, scene.Motion.LengthM));
        w.WriteEndObject();

        w.WriteStartArray("modes");
        foreach (var m in scene.Motion.Modes)
        {
            var zeta = Damping.DampingRatio(m.DecayRatePerS, m.FrequencyHz);
            w.WriteStartObject();
            w.WriteNumber("n", m.N);
            Num("frequency_hz", m.FrequencyHz);
            Num("decay_rate_per_s", m.DecayRatePerS);
            Num("damping_ratio", zeta);
            Num("q_factor", zeta > 0 ? Damping.QualityFactor(zeta) : double.NaN);
            Num("amplitude_m", m.AmplitudeM);
            Num("phase_rad", m.PhaseRad);
            Num("harmonic_ratio", m.FrequencyHz / (m.N * StringLaw.ModeFrequency(1, scene.FundamentalHz, scene.Inharmonicity)));
            w.WriteEndObject();
        }
        w.WriteEndArray();

        w.WriteStartObject("camera");
        Num("capture_fps", scene.CaptureFps);
        Num("container_fps", containerFps);
        w.WriteNumber("frames", scene.FrameCount);
        Num("duration_s", scene.FrameCount / scene.CaptureFps);
        Num("exposure_s", scene.ExposureS);
        w.WriteNumber("subframes", scene.Subframes);
        Num("readout_s", scene.ReadoutS);
        Num("noise_dn", scene.NoiseDn);
        Num("release_duration_s", scene.ReleaseDurationS);
        Num("release_exposure_s", scene.ReleaseExposureS);
        Num("flicker_fraction", scene.FlickerFraction);
        Num("flicker_hz", scene.FlickerHz);
        w.WriteEndObject();

        w.WriteStartObject("image");
        w.WriteNumber("width_px", scene.WidthPx);
        w.WriteNumber("height_px", scene.HeightPx);
        Point("end0_px", scene.End0);
        Point("end1_px", scene.End1);
        Num("pixels_per_metre", geometry.PixelsPerMetre);
        Point("transverse_direction", new PixelPoint(geometry.NormalX, geometry.NormalY));
        w.WriteEndObject();

        w.WriteStartArray("marks");
        void Mark(int index, double fraction, PixelPoint rest, double radius, bool end)
        {
            w.WriteStartObject();
            w.WriteNumber("mark", index);
            w.WriteBoolean("end", end);
            Num("position_fraction", fraction);
            Num("position_m", fraction * scene.Motion.LengthM);
            Point("rest_px", rest);
            Num("radius_px", radius);
            w.WriteEndObject();
        }
        Mark(0, 0, scene.End0, scene.EndRadiusPx, true);
        for (var i = 0; i < scene.MarkFractions.Length; i++)
            Mark(i + 1, scene.MarkFractions[i], geometry.RestPosition(scene.MarkFractions[i]), scene.MarkRadiusPx, false);
        Mark(scene.MarkFractions.Length + 1, 1, scene.End1, scene.EndRadiusPx, true);
        w.WriteEndArray();

        w.WriteStartArray("occluders");
        foreach (var o in scene.Occluders)
        {
            w.WriteStartObject();
            w.WriteStartArray("rect_px");
            foreach (var v in new[] { o.XPx, o.YPx, o.WidthPx, o.HeightPx }) w.WriteNumberValue(v);
            w.WriteEndArray();
            Num("from_s", o.FromS);
            Num("to_s", o.ToS);
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteEndObject();
    }
}
