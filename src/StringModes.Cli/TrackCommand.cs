using StringModes.Video.Output;

namespace StringModes.Cli;

/// <summary><c>stringmodes track CLIP --out DIR</c>: tracking only; writes tracks.csv and the reference frame with the marks.</summary>
internal sealed class TrackCommand(App app)
{
    public static readonly string[] ValueOptions = ["out", "rig", "length", "length-uncertainty", "capture-fps", "readout-ms"];

    public static readonly string[] Flags = ["force", "json"];

    public int Run(string[] args, CancellationToken cancel)
    {
        var a = new ArgumentReader("track", args, ValueOptions, Flags);
        if (a.Positionals.Count != 1) throw a.Usage("give exactly one clip (a video file or a folder of images)");
        var outDir = a.Value("out") ?? throw a.Usage("--out DIR is required");
        var rig = RigSettings.From(a, lengthRequired: false);
        app.OutDir = outDir;
        using var output = new OutputFolder(outDir, a.Flag("force"));
        var tracking = TrackingStep.Run(app, a.Positionals[0], rig, output, cancel);
        TracksCsv.Write(output.File("tracks.csv"), tracking.Tracks);
        var marks = tracking.Marks.Marks.Select(m => m.Position).ToArray();
        using (var reference = OpenCvSharp.Cv2.ImDecode(tracking.ReferenceFramePng, OpenCvSharp.ImreadModes.Color))
            File.WriteAllBytes(output.File("marks-found.png"), Video.Marks.MarkFinder.DiagnosticPng(reference, marks, tracking.Marks.Rejected));
        output.Commit();
        foreach (var w in tracking.Warnings) app.Warn(w);
        var t = tracking.Tracks;
        if (a.Flag("json")) WriteJson(app.Out, a.Positionals[0], outDir, tracking);
        else app.Out.WriteLine(FormattableString.Invariant($"tracked {t.MarkCount} marks (ends included) over {t.FrameCount} frames; wrote {Path.Combine(outDir, "tracks.csv")}"));
        return ExitCodes.Success;
    }

    /// <summary>A machine-readable summary of the tracking run on stdout (fields in docs/output-files.md).</summary>
    private static void WriteJson(TextWriter output, string clip, string outDir, Video.Tracking.TrackingResult tracking)
    {
        var t = tracking.Tracks;
        using var buffer = new MemoryStream();
        using (var w = new System.Text.Json.Utf8JsonWriter(buffer, new System.Text.Json.JsonWriterOptions { Indented = true }))
        {
            static void Number(System.Text.Json.Utf8JsonWriter w, string name, double v)
            {
                if (double.IsFinite(v)) w.WriteNumber(name, v);
                else w.WriteNull(name);
            }
            w.WriteStartObject();
            w.WriteString("tool", "stringmodes " + App.Version);
            w.WriteString("clip", clip);
            w.WriteNumber("frames", t.FrameCount);
            w.WriteNumber("marks_including_ends", t.MarkCount);
            Number(w, "capture_fps", tracking.CaptureFps);
            Number(w, "declared_fps", tracking.DeclaredFps);
            Number(w, "duration_s", t.FrameCount > 1 ? t.TimesS[^1] - t.TimesS[0] : 0);
            w.WriteNumber("width_px", tracking.WidthPx);
            w.WriteNumber("height_px", tracking.HeightPx);
            w.WriteNumber("reference_frame", tracking.Marks.ReferenceFrame);
            w.WriteStartArray("files");
            w.WriteStringValue(Path.Combine(outDir, "tracks.csv"));
            w.WriteStringValue(Path.Combine(outDir, "marks-found.png"));
            w.WriteEndArray();
            w.WriteStartArray("warnings");
            foreach (var warning in tracking.Warnings.Distinct()) w.WriteStringValue(warning);
            w.WriteEndArray();
            w.WriteEndObject();
        }
        output.WriteLine(System.Text.Encoding.UTF8.GetString(buffer.ToArray()));
    }
}
