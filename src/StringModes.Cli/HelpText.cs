namespace StringModes.Cli;

/// <summary>The --help texts (kept in one place and checked by a snapshot test).</summary>
internal static class HelpText
{
    public const string ExitCodeTable = """
        Exit codes:
          0  success
          1  internal error (a bug; rerun with --debug and report it)
          2  bad usage or options
          3  unreadable or unsupported input (clip, rig or scene file)
          4  analysis not possible (marks not found, no vibration, ...)
          5  output not writable (or exists; add --force)
          130 interrupted (Ctrl-C or SIGTERM); no partial outputs are kept

        """;

    public static string Main => $"""
        stringmodes {App.Version} - modal analysis of vibrating strings from video

        Usage:
          stringmodes analyze CLIP --length L --linear-density MU --out DIR [options]
          stringmodes track CLIP --length L --out DIR [options]
          stringmodes synth SCENE --out CLIP [options]
          stringmodes --version | --help | COMMAND --help

        Commands:
          analyze  track the marks, fit every mode, infer wave speed and tension; writes
                   results.json, modes.csv, tracks.csv, figures and report.html into DIR
          track    track the marks only; writes tracks.csv and an overlay image
          synth    render a synthetic clip with ground truth from a scene file

        Examples:
          stringmodes synth demo-clips/nylon-bench/scene.json --out /tmp/nylon.mkv
          stringmodes analyze clip.mp4 --length 65cm --linear-density 0.99g/m --out results

        Global options:
          --debug  show stack traces of errors

        {ExitCodeTable}
        """;

    public static string Synth => $"""
        stringmodes synth SCENE --out CLIP [options]

        Renders a clip of a vibrating string from the scene file SCENE (JSON; see docs/scene-file.md) and writes
        CLIP.truth.json (every parameter and per-mode truth) and CLIP.truth-tracks.csv (true mark positions).
        The clip format follows the extension: .mkv lossless FFV1, .mp4 MPEG-4, .avi MJPEG; a name without an
        extension is a folder of numbered images.

        Options:
          --out CLIP            output clip (required)
          --seed N              sensor-noise seed (default 1); the same seed gives identical frames
          --container-fps F     frame rate written into the file (default: the capture rate); a lower value
                                makes a slow-motion file
          --format png|tiff16   image format of a sequence folder (default png)
          --quality Q           lossy encoder quality 1-100 (default 95)
          --threads N           rendering threads (default: all cores)
          --force               replace an existing clip
          --json                print a JSON summary on stdout

        Examples:
          stringmodes synth demo-clips/nylon-bench/scene.json --out /tmp/nylon.mkv --seed 3
          stringmodes synth scene.json --out /tmp/frames --format tiff16

        {ExitCodeTable}
        """;

    public static string? For(string command) => command switch
    {
        "synth" => Synth,
        _ => null,
    };
}
