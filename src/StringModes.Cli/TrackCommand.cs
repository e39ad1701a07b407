using StringModes.Video.Output;

namespace StringModes.Cli;

/// <summary><c>stringmodes track CLIP --out DIR</c>: tracking only; writes tracks.csv and the reference frame with the marks.</summary>
internal sealed class TrackCommand(App app)
{
    public static readonly string[] ValueOptions = ["out", "rig", "length", "length-uncertainty", "capture-fps", "readout-ms"];

    public static readonly string[] Flags = ["force"];

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
        app.Out.WriteLine(FormattableString.Invariant($"tracked {t.MarkCount} marks (ends included) over {t.FrameCount} frames; wrote {Path.Combine(outDir, "tracks.csv")}"));
        return ExitCodes.Success;
    }
}
