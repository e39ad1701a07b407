using OpenCvSharp;

namespace StringModes.Cli.Tests.Reliability;

/// <summary>One bad input and what the command must do with it.</summary>
/// <param name="Name">Short unique name (also the output folder's name).</param>
/// <param name="Class">The bad-input class it belongs to.</param>
/// <param name="Fed">What was fed, in words.</param>
/// <param name="Args">The command line; <c>{out}</c> stands for the output folder (or clip, for synth).</param>
/// <param name="Expected">The documented exit code (src/StringModes.Cli/ExitCodes.cs).</param>
/// <param name="Names">Text the message must contain: the offending file, field or option.</param>
/// <param name="Warning">For an input that must still be analysed (exit 0): text a warning must contain (with <paramref name="Names"/>); null when none is due.</param>
/// <param name="Unprivileged">Run without root's permission override (for mode-000 files).</param>
/// <param name="Diagnostic">A file a failure writes on purpose into a new output folder (the marks picture).</param>
internal sealed record CorpusCase(string Name, string Class, string Fed, string[] Args, int Expected, string Names,
    string? Warning = null, bool Unprivileged = false, string? Diagnostic = null)
{
    public string Command => Args[0];
}

/// <summary>
/// The bad-input corpus of docs/reliability.md: every class of issue #6 (plus the bad-input lists of #3 and #4),
/// generated from one small good clip by <see cref="CorpusInputs"/>. The expected exit codes are the documented ones:
/// 2 usage or options, 3 unreadable or unsupported input, 4 analysis not possible; 0 where the input must still be
/// analysed, with a warning.
/// </summary>
internal static class BadInputCorpus
{
    private const int Usage = ExitCodes.Usage, BadInput = ExitCodes.BadInput, Impossible = ExitCodes.AnalysisImpossible, Ok = ExitCodes.Success;

    private static string[] Analyze(string clip, params string[] extra) =>
        ["analyze", clip, "--length", "0.5m", "--capture-fps", "400", "--out", "{out}", .. extra];

    private static string[] Track(string clip) => ["track", clip, "--capture-fps", "400", "--out", "{out}"];

    private static string[] WithRig(string rig) => ["analyze", "good", "--capture-fps", "400", "--rig", rig, "--out", "{out}"];

    private static string[] Synth(string scene) => ["synth", scene, "--out", "{out}"];

    private static string Rig(CorpusInputs c, string name, string json) => c.WriteText(name, json);

    private static string Scene(CorpusInputs c, string name, string find, string replace)
    {
        if (!Scenes.Small.Contains(find, StringComparison.Ordinal)) throw new InvalidOperationException($"scene text '{find}' not found");
        return c.WriteText(name, Scenes.Small.Replace(find, replace, StringComparison.Ordinal));
    }

    /// <summary>Five marks along the clip's string, ends first and last (its rest positions, rounded), as rig JSON.</summary>
    private static string MarksJson(CorpusInputs c, (int Index, string X, string Y)? replace = null)
    {
        var points = c.MarkRestPx.Select((p, i) => replace is { } r && r.Index == i
            ? $"[{r.X}, {r.Y}]"
            : FormattableString.Invariant($"[{Math.Round(p.X, 1)}, {Math.Round(p.Y, 1)}]"));
        return $"[{string.Join(", ", points)}]";
    }

    /// <summary>Builds every input of the corpus inside <paramref name="c"/>'s folder and returns the cases, in table order.</summary>
    public static List<CorpusCase> Build(CorpusInputs c)
    {
        var cases = new List<CorpusCase>();
        void Add(CorpusCase k) => cases.Add(k);

        // Encodings of the good 200-frame, 320×120 clip that the damaged files are cut from.
        c.Encode("clip.mkv", "FFV1");
        c.Encode("clip.avi", "MJPG");
        c.Encode("clip.mp4", "mp4v");

        // ---- truncated videos ----
        const string truncated = "truncated video";
        Add(new("mkv-cut-2kB", truncated, "FFV1 .mkv cut after its first 2 kB (headers only)", Analyze(c.Truncate("clip.mkv", "cut-2kB.mkv", 0, 2048)), BadInput, "cut-2kB.mkv"));
        Add(new("mkv-cut-1pc", truncated, "FFV1 .mkv cut at 1 % of its bytes (one frame left)", Analyze(c.Truncate("clip.mkv", "cut-1pc.mkv", 0.01)), BadInput, "cut-1pc.mkv"));
        Add(new("mkv-cut-10pc", truncated, "FFV1 .mkv cut at 10 % (about 20 frames, under 2 periods)", Analyze(c.Truncate("clip.mkv", "cut-10pc.mkv", 0.10)), Ok, "cut-10pc.mkv", Warning: "decoding stopped after"));
        Add(new("mkv-cut-50pc", truncated, "FFV1 .mkv cut at 50 %", Analyze(c.Truncate("clip.mkv", "cut-50pc.mkv", 0.50)), Ok, "cut-50pc.mkv", Warning: "decoding stopped after"));
        Add(new("mkv-cut-50pc-track", truncated, "the same, tracking only", Track("cut-50pc.mkv"), Ok, "cut-50pc.mkv", Warning: "decoding stopped after"));
        Add(new("mkv-cut-95pc", truncated, "FFV1 .mkv cut at 95 %", Analyze(c.Truncate("clip.mkv", "cut-95pc.mkv", 0.95)), Ok, "cut-95pc.mkv", Warning: "decoding stopped after"));
        Add(new("avi-cut-50pc", truncated, "MJPEG .avi cut at 50 %", Analyze(c.Truncate("clip.avi", "cut-50pc.avi", 0.50)), Ok, "cut-50pc.avi", Warning: "decoding stopped after"));
        Add(new("mp4-cut-50pc", truncated, "MPEG-4 .mp4 cut at 50 % (its index, written last, is lost)", Analyze(c.Truncate("clip.mp4", "cut-50pc.mp4", 0.50)), BadInput, "cut-50pc.mp4"));
        Add(new("mp4-cut-50pc-track", truncated, "the same, tracking only", Track("cut-50pc.mp4"), BadInput, "cut-50pc.mp4"));

        // ---- corrupted bytes ----
        const string corrupted = "corrupted bytes";
        Add(new("mkv-noise-middle", corrupted, "FFV1 .mkv with 4 kB of noise at 50 %", Analyze(c.Corrupt("clip.mkv", "noise-middle.mkv", 0.5, 4096, 61)), Ok, "noise-middle.mkv", Warning: "noise-middle.mkv"));
        Add(new("avi-noise-middle", corrupted, "MJPEG .avi with 4 kB of noise at 50 %", Analyze(c.Corrupt("clip.avi", "noise-middle.avi", 0.5, 4096, 62)), Ok, "noise-middle.avi", Warning: "noise-middle.avi"));
        Add(new("mkv-noise-header", corrupted, "FFV1 .mkv whose first 512 bytes are noise", Analyze(c.Corrupt("clip.mkv", "noise-header.mkv", 0, 512, 63)), BadInput, "noise-header.mkv"));

        // ---- not a video ----
        const string notVideo = "not a video";
        Add(new("text-as-mp4", notVideo, "a text file named .mp4", Analyze(c.WriteText("notes.mp4", "shot list: take 1, take 2\n")), BadInput, "notes.mp4"));
        Add(new("png-as-mkv", notVideo, "one PNG frame renamed .mkv", Analyze(c.WriteBytes("still.mkv", File.ReadAllBytes(Directory.GetFiles(c.Full("good")).Order(StringComparer.Ordinal).First()))), BadInput, "still.mkv"));
        Add(new("json-as-mov", notVideo, "a JSON file named .mov", Analyze(c.WriteText("settings.mov", "{ \"fps\": 240 }")), BadInput, "settings.mov"));
        Add(new("noise-as-avi", notVideo, "64 kB of random bytes named .avi", Analyze(c.RandomBytes("noise.avi", 65536, 64)), BadInput, "noise.avi"));
        Add(new("zero-bytes", notVideo, "an empty .mov", Analyze(c.WriteBytes("empty.mov", [])), BadInput, "empty.mov"));
        Add(new("no-such-clip", notVideo, "a clip path that does not exist", Analyze("absent.mp4"), BadInput, "absent.mp4"));

        // ---- zero and one frame ----
        const string frames = "zero or one frame";
        Add(new("mkv-zero-frames", frames, "a valid .mkv with no frames", Analyze(c.Encode("zero-frames.mkv", "FFV1", frameCount: 0)), BadInput, "zero-frames.mkv"));
        Add(new("mkv-one-frame", frames, "a valid .mkv with one frame", Analyze(c.Encode("one-frame.mkv", "FFV1", frameCount: 1)), BadInput, "one-frame.mkv"));
        Add(new("folder-one-frame", frames, "an image folder with one frame", Analyze(c.Frames("one-frame", count: 1)), BadInput, "one-frame"));
        Add(new("folder-one-frame-track", frames, "the same, tracking only", Track("one-frame"), BadInput, "one-frame"));
        Directory.CreateDirectory(c.Full("empty-folder"));
        Add(new("folder-empty", frames, "an empty folder", Analyze("empty-folder"), BadInput, "empty-folder"));

        // ---- absurd dimensions ----
        const string dimensions = "absurd dimensions";
        Add(new("frames-2x2", dimensions, "50 images of 2×2 pixels", Analyze(c.PlainFrames("two-by-two", 50, 2, 2)), Impossible, "two-by-two", Diagnostic: "marks-found.png"));
        Add(new("frames-4000x3", dimensions, "20 images of 4000×3 pixels", Analyze(c.PlainFrames("sliver", 20, 4000, 3)), Impossible, "sliver", Diagnostic: "marks-found.png"));
        Directory.CreateDirectory(c.Full("giant-header"));
        c.PngHeaderOnly("giant-header/frame_000000.png", 200_000, 200_000);
        Add(new("png-claims-200000-square", dimensions, "a PNG header claiming 200000×200000 pixels, no data", Analyze("giant-header"), BadInput, "frame_000000.png"));
        Add(new("mkv-16x16", dimensions, "the clip shrunk to a 16×16 .mkv", Analyze(c.Encode("tiny.mkv", "FFV1", width: 16, height: 16)), Impossible, "tiny.mkv", Diagnostic: "marks-found.png"));

        // ---- folders that are not image sequences ----
        const string notSequence = "not an image sequence";
        Directory.CreateDirectory(c.Full("documents"));
        c.WriteText("documents/readme.txt", "frames go here");
        c.WriteText("documents/notes.csv", "t,x\n0,1\n");
        Add(new("folder-of-text", notSequence, "a folder holding only text files", Analyze("documents"), BadInput, "documents"));
        Directory.CreateDirectory(c.Full("fake-png"));
        for (var k = 0; k < 5; k++) c.WriteText($"fake-png/frame_{k:D6}.png", "not an image");
        Add(new("folder-of-fake-png", notSequence, "a folder of text files named frame_*.png", Analyze("fake-png"), BadInput, "frame_000000.png"));
        Directory.CreateDirectory(c.Full("nested/takes/1"));
        Add(new("folder-of-folders", notSequence, "a folder holding only folders", Analyze("nested"), BadInput, "nested"));
        Add(new("folder-without-fps", notSequence, "a good image folder without --capture-fps", ["analyze", "good", "--length", "0.5m", "--out", "{out}"], BadInput, "good"));

        // ---- mixed sizes ----
        const string mixed = "mixed-size sequence";
        c.Frames("mixed-size");
        using (var odd = new Mat(64, 64, MatType.CV_8UC3, Scalar.All(150))) Cv2.ImWrite(c.Full("mixed-size/frame_000100.png"), odd);
        Add(new("folder-mixed-size", mixed, "an image folder whose frame 100 is 64×64", Analyze("mixed-size"), BadInput, "frame_000100.png"));
        Add(new("folder-mixed-size-track", mixed, "the same, tracking only", Track("mixed-size"), BadInput, "frame_000100.png"));

        // ---- unreadable files ----
        const string unreadable = "unreadable file";
        File.Copy(c.Full("clip.mkv"), c.Full("locked.mkv"));
        Add(new("video-mode-000", unreadable, "an .mkv with permissions 000", Analyze(c.Lock("locked.mkv")), BadInput, "locked.mkv", Unprivileged: true));
        c.Frames("locked-frame");
        c.Lock("locked-frame/frame_000050.png");
        Add(new("frame-mode-000", unreadable, "an image folder whose frame 50 has permissions 000", Analyze("locked-frame"), BadInput, "frame_000050.png", Unprivileged: true));
        c.Frames("locked-folder", count: 20);
        Add(new("folder-mode-000", unreadable, "an image folder with permissions 000", Analyze(c.Lock("locked-folder")), BadInput, "locked-folder", Unprivileged: true));
        Add(new("video-fifo", unreadable, "a named pipe (FIFO) named .mkv, no writer", Analyze(c.Fifo("pipe.mkv")), BadInput, "pipe.mkv"));
        c.Frames("fifo-frame", count: 40);
        File.Delete(c.Full("fifo-frame/frame_000020.png"));
        c.Fifo("fifo-frame/frame_000020.png");
        Add(new("frame-fifo", unreadable, "an image folder whose frame 20 is a named pipe", Analyze("fifo-frame"), BadInput, "frame_000020.png"));
        Add(new("rig-mode-000", unreadable, "a rig file with permissions 000", WithRig(c.Lock(Rig(c, "locked-rig.json", "{ \"length\": \"50 cm\" }"))), BadInput, "locked-rig.json", Unprivileged: true));
        Add(new("rig-fifo", unreadable, "a named pipe given as the rig file", WithRig(c.Fifo("pipe-rig.json")), BadInput, "pipe-rig.json"));
        Directory.CreateDirectory(c.Full("folder-rig.json"));
        Add(new("rig-is-folder", unreadable, "a folder given as the rig file", WithRig("folder-rig.json"), BadInput, "folder-rig.json"));
        Add(new("rig-missing", unreadable, "a rig path that does not exist", WithRig("absent-rig.json"), BadInput, "absent-rig.json"));
        Add(new("scene-mode-000", unreadable, "a scene file with permissions 000", Synth(c.Lock(c.WriteText("locked-scene.json", Scenes.Small))), BadInput, "locked-scene.json", Unprivileged: true));
        Add(new("scene-fifo", unreadable, "a named pipe given as the scene file", Synth(c.Fifo("pipe-scene.json")), BadInput, "pipe-scene.json"));
        Directory.CreateDirectory(c.Full("folder-scene.json"));
        Add(new("scene-is-folder", unreadable, "a folder given as the scene file", Synth("folder-scene.json"), BadInput, "folder-scene.json"));

        // ---- rig files: wrong types, missing fields, bad values, units, marks ----
        const string rigType = "rig file: wrong type";
        Add(new("rig-length-boolean", rigType, "\"length\": true", WithRig(Rig(c, "rig-bool.json", "{ \"length\": true }")), BadInput, "rig-bool.json"));
        Add(new("rig-length-array", rigType, "\"length\": [0.5]", WithRig(Rig(c, "rig-array.json", "{ \"length\": [0.5] }")), BadInput, "rig-array.json"));
        Add(new("rig-marks-text", rigType, "\"marks_px\": \"left to right\"", WithRig(Rig(c, "rig-marks-text.json", "{ \"length\": 0.5, \"marks_px\": \"left to right\" }")), BadInput, "rig-marks-text.json"));
        Add(new("rig-top-level-array", rigType, "a JSON array instead of an object", WithRig(Rig(c, "rig-list.json", "[ { \"length\": 0.5 } ]")), BadInput, "rig-list.json"));
        Add(new("rig-description-number", rigType, "\"description\": 7", WithRig(Rig(c, "rig-description.json", "{ \"description\": 7, \"length\": 0.5 }")), BadInput, "rig-description.json"));
        Add(new("rig-invalid-json", rigType, "a missing closing brace", WithRig(Rig(c, "rig-syntax.json", "{ \"length\": 0.5,\n  \"readout\": \"20 ms\"\n")), BadInput, "rig-syntax.json"));
        Add(new("rig-empty-file", rigType, "an empty rig file", WithRig(Rig(c, "rig-empty.json", "")), BadInput, "rig-empty.json"));
        Add(new("rig-misspelt-field", rigType, "\"lenght\" instead of \"length\"", WithRig(Rig(c, "rig-misspelt.json", "{ \"lenght\": 0.5 }")), BadInput, "rig-misspelt.json"));

        const string rigMissing = "rig file: missing field";
        Add(new("rig-without-length", rigMissing, "a rig file without a length, none on the command line", WithRig(Rig(c, "rig-no-length.json", "{ \"description\": \"bench\" }")), Usage, "--length"));
        Add(new("rig-mass-without-sample-length", rigMissing, "\"sample_mass\" without \"sample_length\"", WithRig(Rig(c, "rig-mass.json", "{ \"length\": 0.5, \"sample_mass\": \"1.2 g\" }")), BadInput, "rig-mass.json"));
        Add(new("rig-density-without-diameter", rigMissing, "\"material_density\" without \"diameter\"", WithRig(Rig(c, "rig-rho.json", "{ \"length\": 0.5, \"material_density\": \"1.14 g/cm3\" }")), BadInput, "rig-rho.json"));

        const string rigValue = "rig file: NaN, infinite, negative or huge value";
        Add(new("rig-length-NaN", rigValue, "\"length\": \"NaN\"", WithRig(Rig(c, "rig-nan.json", "{ \"length\": \"NaN\" }")), BadInput, "rig-nan.json"));
        Add(new("rig-length-Infinity", rigValue, "\"length\": \"Infinity\"", WithRig(Rig(c, "rig-inf.json", "{ \"length\": \"Infinity\" }")), BadInput, "rig-inf.json"));
        Add(new("rig-length-1e400", rigValue, "\"length\": 1e400 (beyond double range)", WithRig(Rig(c, "rig-1e400.json", "{ \"length\": 1e400 }")), BadInput, "rig-1e400.json"));
        Add(new("rig-length-negative", rigValue, "\"length\": -0.5", WithRig(Rig(c, "rig-negative.json", "{ \"length\": -0.5 }")), BadInput, "rig-negative.json"));
        Add(new("rig-length-zero", rigValue, "\"length\": 0", WithRig(Rig(c, "rig-zero.json", "{ \"length\": 0 }")), BadInput, "rig-zero.json"));
        Add(new("rig-length-1e300", rigValue, "\"length\": 1e300", WithRig(Rig(c, "rig-huge.json", "{ \"length\": 1e300 }")), BadInput, "rig-huge.json"));
        Add(new("rig-density-huge", rigValue, "\"linear_density\": \"1e30 g/m\"", WithRig(Rig(c, "rig-huge-mu.json", "{ \"length\": 0.5, \"linear_density\": \"1e30 g/m\" }")), BadInput, "rig-huge-mu.json"));
        Add(new("rig-fps-huge", rigValue, "\"capture_fps\": 1e12", WithRig(Rig(c, "rig-huge-fps.json", "{ \"length\": 0.5, \"capture_fps\": 1e12 }")), BadInput, "rig-huge-fps.json"));
        Add(new("rig-readout-negative", rigValue, "\"readout\": \"-2 ms\"", WithRig(Rig(c, "rig-readout.json", "{ \"length\": 0.5, \"readout\": \"-2 ms\" }")), BadInput, "rig-readout.json"));
        Add(new("rig-uncertainty-negative", rigValue, "\"length_uncertainty\": \"-1 mm\"", WithRig(Rig(c, "rig-negative-u.json", "{ \"length\": 0.5, \"length_uncertainty\": \"-1 mm\" }")), BadInput, "rig-negative-u.json"));

        const string rigUnit = "rig file: unknown unit";
        Add(new("rig-length-furlongs", rigUnit, "\"length\": \"50 furlong\"", WithRig(Rig(c, "rig-furlong.json", "{ \"length\": \"50 furlong\" }")), BadInput, "rig-furlong.json"));
        Add(new("rig-length-in-g-per-m", rigUnit, "\"length\": \"50 g/m\" (a linear density)", WithRig(Rig(c, "rig-dimension.json", "{ \"length\": \"50 g/m\" }")), BadInput, "rig-dimension.json"));
        Add(new("rig-unit-wrong-case", rigUnit, "\"linear_density\": \"0.99 G/M\"", WithRig(Rig(c, "rig-case.json", "{ \"length\": 0.5, \"linear_density\": \"0.99 G/M\" }")), BadInput, "rig-case.json"));

        const string rigMarks = "rig file: marks outside the frame";
        Add(new("rig-mark-beyond-frame", rigMarks, "marks_px with a mark at x = 5000 in a 320×120 frame", WithRig(Rig(c, "rig-mark-far.json", $"{{ \"length\": 0.5, \"marks_px\": {MarksJson(c, (2, "5000", "60"))} }}")), BadInput, "rig-mark-far.json"));
        Add(new("rig-mark-negative", rigMarks, "marks_px with a mark at y = -40", WithRig(Rig(c, "rig-mark-negative.json", $"{{ \"length\": 0.5, \"marks_px\": {MarksJson(c, (3, "160", "-40"))} }}")), BadInput, "rig-mark-negative.json"));
        Add(new("rig-mark-1e308", rigMarks, "marks_px with a mark at x = 1e308", WithRig(Rig(c, "rig-mark-huge.json", $"{{ \"length\": 0.5, \"marks_px\": {MarksJson(c, (1, "1e308", "60"))} }}")), BadInput, "rig-mark-huge.json"));
        Add(new("rig-mark-at-edge", rigMarks, "marks_px with an end mark 3 px from the left edge", WithRig(Rig(c, "rig-mark-edge.json", $"{{ \"length\": 0.5, \"marks_px\": {MarksJson(c, (0, "3", "60"))} }}")), BadInput, "rig-mark-edge.json"));
        Add(new("rig-too-few-marks", rigMarks, "marks_px with three points", WithRig(Rig(c, "rig-three-marks.json", "{ \"length\": 0.5, \"marks_px\": [[20, 60], [160, 59], [300, 59]] }")), BadInput, "rig-three-marks.json"));

        // ---- command-line values (issue #4: μ or L zero, negative or NaN) ----
        const string options = "option value";
        Add(new("option-length-zero", options, "--length 0", ["analyze", "good", "--capture-fps", "400", "--length", "0", "--out", "{out}"], Usage, "--length"));
        Add(new("option-length-negative", options, "--length -50cm", ["analyze", "good", "--capture-fps", "400", "--length=-50cm", "--out", "{out}"], Usage, "--length"));
        Add(new("option-length-NaN", options, "--length NaN", ["analyze", "good", "--capture-fps", "400", "--length", "NaN", "--out", "{out}"], Usage, "--length"));
        Add(new("option-length-huge", options, "--length 1e300", ["analyze", "good", "--capture-fps", "400", "--length", "1e300", "--out", "{out}"], Usage, "--length"));
        Add(new("option-density-zero", options, "--linear-density 0", Analyze("good", "--linear-density", "0"), Usage, "--linear-density"));
        Add(new("option-density-NaN", options, "--linear-density NaN", Analyze("good", "--linear-density", "NaN"), Usage, "--linear-density"));
        Add(new("option-density-unit", options, "--linear-density 1oz/in (unknown unit)", Analyze("good", "--linear-density", "1oz/in"), Usage, "--linear-density"));
        Add(new("option-fps-zero", options, "--capture-fps 0", ["analyze", "good", "--capture-fps", "0", "--length", "0.5m", "--out", "{out}"], Usage, "--capture-fps"));
        Add(new("option-fps-Infinity", options, "--capture-fps Infinity", ["analyze", "good", "--capture-fps", "Infinity", "--length", "0.5m", "--out", "{out}"], Usage, "--capture-fps"));

        // ---- scene files ----
        const string scene = "scene file";
        Add(new("scene-camera-text", scene, "\"camera\": \"fast\"", Synth(Scene(c, "scene-camera.json", "\"camera\": {", "\"camera\": \"fast\", \"camera-unused\": {")), BadInput, "scene-camera.json"));
        Add(new("scene-top-level-array", scene, "a JSON array", Synth(c.WriteText("scene-list.json", $"[{Scenes.Small}]")), BadInput, "scene-list.json"));
        Add(new("scene-empty-file", scene, "an empty scene file", Synth(c.WriteText("scene-empty.json", "")), BadInput, "scene-empty.json"));
        Add(new("scene-length-with-unit", scene, "\"length_m\": \"50 cm\" (scene numbers are SI)", Synth(Scene(c, "scene-unit.json", "\"length_m\": 0.5", "\"length_m\": \"50 cm\"")), BadInput, "scene-unit.json"));
        Add(new("scene-width-absurd", scene, "\"image.width_px\": 1000000", Synth(Scene(c, "scene-wide.json", "\"width_px\": 320", "\"width_px\": 1000000")), BadInput, "scene-wide.json"));
        Add(new("scene-height-one", scene, "\"image.height_px\": 1", Synth(Scene(c, "scene-flat.json", "\"height_px\": 120", "\"height_px\": 1")), BadInput, "scene-flat.json"));
        Add(new("scene-no-marks", scene, "\"marks.count\": 0", Synth(Scene(c, "scene-no-marks.json", "\"count\": 5", "\"count\": 0")), BadInput, "scene-no-marks.json"));
        Add(new("scene-mode-fraction", scene, "a mode with \"n\": 1.5", Synth(Scene(c, "scene-n.json", "{ \"n\": 2,", "{ \"n\": 1.5,")), BadInput, "scene-n.json"));
        Add(new("scene-fps-negative", scene, "\"capture_fps\": -400", Synth(Scene(c, "scene-fps.json", "\"capture_fps\": 400", "\"capture_fps\": -400")), BadInput, "scene-fps.json"));
        Add(new("scene-noise-NaN-text", scene, "\"noise_dn\": \"NaN\"", Synth(Scene(c, "scene-noise.json", "\"noise_dn\": 1", "\"noise_dn\": \"NaN\"")), BadInput, "scene-noise.json"));
        Add(new("scene-amplitude-huge", scene, "\"amplitude_m\": 1e300", Synth(Scene(c, "scene-amplitude.json", "\"amplitude_m\": 0.004", "\"amplitude_m\": 1e300")), BadInput, "scene-amplitude.json"));

        // ---- clips that cannot be analysed (issues #3 and #4) ----
        const string analysis = "nothing to measure";
        c.WriteText("still.json", Scenes.Small.Replace("\"amplitude_m\": 0.004", "\"amplitude_m\": 0", StringComparison.Ordinal)
            .Replace("\"amplitude_m\": 0.0015", "\"amplitude_m\": 0", StringComparison.Ordinal)
            .Replace("\"duration_s\": 0.5", "\"duration_s\": 0.3", StringComparison.Ordinal));
        var still = Cli.Run("synth", c.Full("still.json"), "--out", c.Full("still"), "--seed", "7");
        if (still.ExitCode != 0) throw new InvalidOperationException("synth of the still clip failed: " + still);
        Add(new("no-vibration", analysis, "a clip of a string at rest (sensor noise only)", Analyze("still"), Impossible, "still"));
        using (var first = Cv2.ImRead(Directory.GetFiles(c.Full("good")).Order(StringComparer.Ordinal).First(), ImreadModes.Unchanged))
            c.Frames("frozen", (_, m) => first.CopyTo(m));
        Add(new("frozen-frames", analysis, "200 identical frames (no noise, no motion)", Analyze("frozen"), Impossible, "frozen"));
        // A centroid survives defocus (the blurred disc keeps its centre), so a mildly blurred clip must still be measured.
        c.Frames("defocused", (_, m) => Cv2.GaussianBlur(m, m, new Size(0, 0), 6));
        Add(new("blurred-out-of-focus", analysis, "every frame Gaussian-blurred (σ = 6 px, marks 4.3 px in radius)", Analyze("defocused"), Ok, "defocused"));
        c.Frames("washed-out", (_, m) => Cv2.GaussianBlur(m, m, new Size(0, 0), 20));
        Add(new("blurred-beyond-recognition", analysis, "every frame Gaussian-blurred (σ = 20 px)", Analyze("washed-out"), Impossible, "washed-out", Diagnostic: "marks-found.png"));
        // A streak's centroid is the exposure-averaged position: even an exposure of a whole period of f1 leaves the
        // decay-weighted motion, which is still measured; only marks blurred out of recognition stop the analysis.
        c.MotionBlurred("smeared", 10);
        Add(new("blurred-motion-whole-period", analysis, "every frame the mean of 10 frames (25 ms exposure: one period of f1, two of f2)", Analyze("smeared"), Ok, "smeared"));
        c.MotionBlurred("streaked", 5);
        Add(new("blurred-motion-half-period", analysis, "every frame the mean of 5 frames (12.5 ms exposure: half a period of f1)", Analyze("streaked"), Ok, "streaked"));
        c.Frames("one-mark-leaves", (k, m) => { if (k >= 60) c.HideMark(m, 3); });
        Add(new("mark-leaves-for-good", analysis, "the middle mark gone from frame 60 on", Analyze("one-mark-leaves"), Ok, "mark 3", Warning: "was not seen"));
        c.Frames("end-leaves", (k, m) => { if (k >= 60) c.HideMark(m, 0); });
        Add(new("end-leaves-for-good", analysis, "an end mark gone from frame 60 on", Analyze("end-leaves"), Ok, "mark 0", Warning: "was not seen"));
        c.Frames("all-leave", (k, m) => { if (k >= 60) m.SetTo(Scalar.All(150)); });
        Add(new("all-marks-leave-for-good", analysis, "every mark gone from frame 60 on (6 periods seen)", Analyze("all-leave"), Ok, "mark 1", Warning: "was not seen"));
        c.Frames("six-frames", count: 6);
        Add(new("window-under-one-period", analysis, "6 frames: 0.6 periods of f1", Analyze("six-frames"), Impossible, "six-frames"));
        c.Frames("twelve-frames", count: 12);
        Add(new("window-one-period", analysis, "12 frames: 1.2 periods of f1", Analyze("twelve-frames"), Impossible, "twelve-frames"));
        Add(new("more-modes-than-marks", analysis, "--max-modes 12 with 5 moving marks", Analyze("good", "--max-modes", "12"), Ok, "12 modes", Warning: "12 modes were asked for"));
        return cases;
    }
}
