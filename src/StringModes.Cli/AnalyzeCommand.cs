using System.Globalization;
using StringModes.Analysis;
using StringModes.Analysis.Geometry;
using StringModes.Reporting.Data;
using StringModes.Shared;
using StringModes.Video.Output;
using StringModes.Video.Tracking;

namespace StringModes.Cli;

/// <summary>
/// <c>stringmodes analyze CLIP</c>: frames → marks → tracks → string coordinates → modal coordinates → mode fits →
/// string properties → results.json, modes.csv, tracks.csv, figures and report.html, all written as one folder.
/// </summary>
internal sealed class AnalyzeCommand(App app)
{
    public static readonly string[] ValueOptions = ["out", "rig", "length", "length-uncertainty", "linear-density", "linear-density-uncertainty",
        "capture-fps", "readout-ms", "max-modes", "harmonic-k"];

    public static readonly string[] Flags = ["force", "json"];

    public int Run(string[] args, CancellationToken cancel)
    {
        var a = new ArgumentReader("analyze", args, ValueOptions, Flags);
        if (a.Positionals.Count != 1) throw a.Usage("give exactly one clip (a video file or a folder of images)");
        var clip = a.Positionals[0];
        var outDir = a.Value("out") ?? throw a.Usage("--out DIR is required: the folder for results.json, report.html and the rest");
        var rig = RigSettings.From(a, lengthRequired: true);
        var maxModes = (int)(a.Integer("max-modes", 1, 64) ?? 0);
        var k = a.Number("harmonic-k", 0.1, 10) ?? 2;
        app.OutDir = outDir;

        using var output = new OutputFolder(outDir, a.Flag("force"));
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var tracking = TrackingStep.Run(app, clip, rig, output, cancel);
        app.Timing(tracking.LumaOnly ? "tracking (decode of the luma plane, mark finding, tracking)" : "tracking (decode in colour, mark finding, tracking)", clock.Elapsed);
        clock.Restart();
        var warnings = new List<string>(tracking.Warnings);
        warnings.AddRange(rig.Notes);
        var window = AnalysisWindow.Choose(tracking.Tracks);
        warnings.AddRange(window.Notes);
        cancel.ThrowIfCancellationRequested();

        var coordinates = StringFrame.Build(tracking.Tracks, rig.Length!.Value.Value, rig.ReadoutS, tracking.HeightPx, window.FirstFrame, window.LastFrame, rig.Rig.Plane);
        var result = ModalAnalysis.Run(coordinates, new ModalAnalysisOptions
        {
            MaxModes = maxModes,
            LengthM = rig.Length,
            LinearDensity = rig.LinearDensity,
            HarmonicCheckCoverageFactor = k,
        });
        warnings.AddRange(result.Warnings);
        app.Timing("numeric stages (window, string coordinates, projection, fits, string model)", clock.Elapsed);
        clock.Restart();
        if (!result.IsAnalysisPossible)
            throw new CliException(ExitCodes.AnalysisImpossible, $"{clip}: {result.Error}");
        cancel.ThrowIfCancellationRequested();

        var settings = new List<KeyValuePair<string, string>>
        {
            new("length", Format(rig.Length.Value.Value, rig.Length.Value.StandardUncertainty, "m")),
            new("capture_fps", double.IsNaN(tracking.CaptureFps) ? "from timestamps" : tracking.CaptureFps.ToString("G6", CultureInfo.InvariantCulture)),
            new("readout_s", rig.ReadoutS.ToString("G6", CultureInfo.InvariantCulture)),
            new("max_modes", maxModes == 0 ? "automatic" : maxModes.ToString(CultureInfo.InvariantCulture)),
            new("harmonic_check_coverage_factor", k.ToString("G4", CultureInfo.InvariantCulture)),
            new("rig_file", a.Value("rig") ?? "none"),
            new("reference_frame", tracking.Marks.ReferenceFrame.ToString(CultureInfo.InvariantCulture)),
            new("plane", rig.Rig.Plane is null ? "none: the image is taken as square to the rig" : "homography from four points of the rig file (plane_image_px → plane_m)"),
        };
        var t = tracking.Tracks;
        var input = new InputSummary(clip, t.FrameCount, 1 / MedianStep(t.TimesS), tracking.DeclaredFps, t.TimesS[^1] - t.TimesS[0],
            tracking.WidthPx, tracking.HeightPx, t.MarkCount, settings);
        var distinctWarnings = warnings.Distinct().ToList();

        TracksCsv.Write(output.File("tracks.csv"), t);
        AtomicFile.WriteAllText(output.File("modes.csv"), ModesCsv.Format(result.Modal));
        AtomicFile.Write(output.File("results.json"), s => ResultsJson.Write(s, App.Version, input, result, distinctWarnings));
        File.WriteAllBytes(output.File("reference-frame.png"), tracking.ReferenceFramePng);
        var report = ReportMapping.Build(clip, rig.Rig.Description, tracking, window, coordinates, result, distinctWarnings, settings);
        try { Reporting.Html.ReportWriter.Write(report, output.Staging); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new CliException(ExitCodes.OutputNotWritable, $"{outDir}: the report could not be written ({e.Message})");
        }
        output.Commit();
        app.Timing("outputs (data files, figures, report)", clock.Elapsed);

        foreach (var w in distinctWarnings) app.Warn(w);
        if (a.Flag("json")) app.Out.Write(File.ReadAllText(Path.Combine(outDir, "results.json")));
        else Summary.Write(app.Out, result, outDir);
        return ExitCodes.Success;
    }

    private static string Format(double v, double u, string unit)
        => u > 0 ? string.Create(CultureInfo.InvariantCulture, $"{v:G6} ± {u:G2} {unit}") : string.Create(CultureInfo.InvariantCulture, $"{v:G6} {unit} (no uncertainty given)");

    internal static double MedianStep(double[] times)
    {
        if (times.Length < 2) return double.NaN;
        var steps = new double[times.Length - 1];
        for (var i = 0; i < steps.Length; i++) steps[i] = times[i + 1] - times[i];
        Array.Sort(steps);
        return steps[steps.Length / 2];
    }
}
