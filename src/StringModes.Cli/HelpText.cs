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
          130 interrupted (Ctrl-C, SIGTERM, SIGHUP); no partial outputs are kept

        """;

    public static string Main => $"""
        stringmodes {App.Version} - modal analysis of vibrating strings from video

        Usage:
          stringmodes analyze CLIP --length L --linear-density MU --out DIR [options]
          stringmodes track CLIP --out DIR [options]
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
          --debug  show stack traces of errors and the time each stage took

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

    public static string Analyze => $"""
        stringmodes analyze CLIP --length L --out DIR [options]

        Tracks the marks on the string in CLIP (a video file, or a folder of numbered images with --capture-fps),
        fits every mode (frequency, decay rate, damping ratio, Q) and infers the ideal fundamental, inharmonicity,
        wave speed and, given the linear density, the tension, each with its standard uncertainty. Writes
        results.json, modes.csv, tracks.csv and reference-frame.png into DIR as a whole: nothing is kept if it fails.
        Lengths and densities take a number in SI units or a number with a unit (65cm, 0.99g/m).

        Options:
          --out DIR                      output folder (required); must be new or empty unless --force
          --length L                     vibrating length between the ends (required here or in the rig file)
          --length-uncertainty U         standard uncertainty of the length (default 0, with a warning)
          --linear-density MU            mass per unit length; without it the tension is not computed
          --linear-density-uncertainty U standard uncertainty of the linear density (default 0, with a warning)
          --rig FILE                     rig file (JSON; see docs/rig-file.md); options given here win over it
          --capture-fps F                true capture rate in frames/s; needed for an image folder and for a
                                         slow-motion file whose declared rate is not the capture rate
          --readout-ms R                 rolling-shutter readout time in ms, 0-1000 (default 0: global shutter)
          --max-modes N                  fit at most N modes, 1-64 (default: as many as the marks resolve)
          --harmonic-k K                 coverage factor of the f2/(2 f1) = 1 check, 0.1-10 (default 2)
          --force                        replace the contents of an existing DIR
          --json                         print results.json on stdout instead of the summary table

        Examples:
          stringmodes analyze clip.mp4 --length 65cm --linear-density 0.99g/m --out results
          stringmodes analyze demo-clips/nylon-bench/nylon-bench.mp4 --rig demo-clips/nylon-bench/rig.json --out /tmp/nylon
          stringmodes analyze frames/ --capture-fps 1000 --length 0.8 --length-uncertainty 0.5mm --out results --json

        {ExitCodeTable}
        """;

    public static string Track => $"""
        stringmodes track CLIP --out DIR [options]

        Finds the marks on the string in CLIP (a video file, or a folder of numbered images with --capture-fps) and
        follows each through every frame; writes tracks.csv and marks-found.png (the reference frame with the marks
        it found) into DIR as a whole. Use it to check the tracking before a full analysis.

        Options:
          --out DIR                output folder (required); must be new or empty unless --force
          --length L               vibrating length between the ends (optional here), e.g. 65cm
          --length-uncertainty U   standard uncertainty of the length
          --rig FILE               rig file (JSON; see docs/rig-file.md); its marks_px fixes the mark positions
          --capture-fps F          true capture rate in frames/s; needed for an image folder and for a
                                   slow-motion file whose declared rate is not the capture rate
          --readout-ms R           rolling-shutter readout time in ms, 0-1000 (default 0: global shutter)
          --force                  replace the contents of an existing DIR
          --json                   print a JSON summary (frames, marks, rates, files, warnings) instead of one line

        Examples:
          stringmodes track clip.mp4 --out tracking
          stringmodes track frames/ --capture-fps 1000 --rig rig.json --out tracking --force

        {ExitCodeTable}
        """;

    public static string? For(string command) => command switch
    {
        "analyze" => Analyze,
        "track" => Track,
        "synth" => Synth,
        _ => null,
    };
}
