using StringModes.Video.Files;
using StringModes.Video.Synthesis;

namespace StringModes.Cli;

/// <summary><c>stringmodes synth SCENE --out CLIP</c>: renders a clip with ground truth from a scene file.</summary>
internal sealed class SynthCommand(App app)
{
    public int Run(string[] args, CancellationToken cancel)
    {
        var a = new ArgumentReader("synth", args, ["out", "seed", "container-fps", "format", "quality", "threads"], ["force", "json"]);
        if (a.Positionals.Count != 1) throw a.Usage("give exactly one scene file, e.g. 'stringmodes synth scene.json --out clip.mkv'");
        var clip = a.Value("out") ?? throw a.Usage("--out CLIP is required (.mkv, .mp4, .avi, or a folder name for an image sequence)");
        var options = new SynthesisOptions
        {
            Seed = a.Integer("seed", long.MinValue, long.MaxValue) ?? 1,
            ContainerFps = a.Number("container-fps", 0.001, 100_000),
            SequenceFormat = a.Value("format"),
            Quality = (int)(a.Integer("quality", 1, 100) ?? 95),
            Threads = (int)(a.Integer("threads", 1, 256) ?? Environment.ProcessorCount),
        };
        ClipFormat format;
        try { format = ClipFormats.FromPath(clip, options.SequenceFormat); }
        catch (ArgumentException e) { throw a.Usage(e.Message); }
        var stem = ClipSynthesiser.TruthStem(clip);
        if (!a.Flag("force") && (File.Exists(clip) || Directory.Exists(clip) || File.Exists(stem + ".truth.json")))
            throw new CliException(ExitCodes.OutputNotWritable, $"{clip}: already exists; choose another --out or add --force to replace it");

        Scene scene;
        try { scene = SceneFile.Load(a.Positionals[0]); }
        catch (InputFileException e) { throw new CliException(ExitCodes.BadInput, e.Message); }

        SynthesisResult result;
        var temporary = ClipSynthesiser.TemporaryPath(clip);
        PartialOutputs.Process.Register(temporary);
        try
        {
            result = ClipSynthesiser.Run(scene, clip, options, a.Positionals[0],
                new ProgressBar(app, "rendering", "frames", scene.FrameCount), cancel);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new CliException(ExitCodes.OutputNotWritable, e.Message.Split('\n')[0]);
        }
        finally
        {
            PartialOutputs.Process.Unregister(temporary);
        }
        var fps = result.Frames / Math.Max(1e-9, result.RenderSeconds);
        if (a.Flag("json"))
        {
            app.Out.WriteLine(System.Text.Json.JsonSerializer.Serialize(new Dictionary<string, object>
            {
                ["clip"] = result.ClipPath,
                ["truth"] = result.TruthPath,
                ["truth_tracks"] = result.TruthTracksPath,
                ["frames"] = result.Frames,
                ["format"] = format.ToString().ToLowerInvariant(),
                ["render_fps"] = Math.Round(fps, 2),
            }));
        }
        else
        {
            app.Out.WriteLine($"wrote {result.ClipPath} ({result.Frames} frames, {format}, {fps:F1} frames/s)");
            app.Out.WriteLine($"truth: {result.TruthPath}, {result.TruthTracksPath}");
        }
        return ExitCodes.Success;
    }
}
