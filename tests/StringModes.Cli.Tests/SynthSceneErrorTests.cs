namespace StringModes.Cli.Tests;

/// <summary>
/// <c>synth</c> with a bad scene file: exit 3 (unreadable or unsupported input), one stderr line that names the field
/// and says how to fix it (the fix follows a ';'), and nothing written — no clip, no truth files, no hidden staging files.
/// </summary>
public class SynthSceneErrorTests
{
    /// <summary>Case name, text to replace in <see cref="Scenes.Small"/>, its replacement, expected exit code, text the message must contain.</summary>
    public static TheoryData<string, string, string, int, string> BadScenes => new()
    {
        { "missing length", "\"length_m\": 0.5, ", "", 3, "string.length_m" },
        { "length of wrong type", "\"length_m\": 0.5", "\"length_m\": \"long\"", 3, "string.length_m" },
        { "zero length", "\"length_m\": 0.5", "\"length_m\": 0", 3, "string.length_m" },
        { "negative length", "\"length_m\": 0.5", "\"length_m\": -0.5", 3, "string.length_m" },
        { "length given as the text NaN", "\"length_m\": 0.5", "\"length_m\": \"NaN\"", 3, "string.length_m" },
        { "huge length", "\"length_m\": 0.5", "\"length_m\": 1e300", 3, "string.length_m" },
        { "length beyond double range", "\"length_m\": 0.5", "\"length_m\": 1e400", 3, "string.length_m" },
        { "huge capture rate", "\"capture_fps\": 400", "\"capture_fps\": 1e12", 3, "camera.capture_fps" },
        { "null capture rate", "\"capture_fps\": 400", "\"capture_fps\": null", 3, "camera.capture_fps" },
        { "mode exactly at half the capture rate", "{ \"n\": 2,", "{ \"n\": 5,", 3, "string.modes" },
        { "fundamental above half the capture rate", "\"fundamental_hz\": 40", "\"fundamental_hz\": 250", 3, "string.modes" },
        { "end mark outside the image", "\"end0_px\": [20.3, 60.2]", "\"end0_px\": [2, 60.2]", 3, "image.end0_px" },
        { "swing carries marks out of the image", "\"amplitude_m\": 0.004", "\"amplitude_m\": 0.2", 3, "image.end0_px" },
        { "misspelt field", "\"length_m\": 0.5,", "\"length_m\": 0.5, \"lenght_m\": 0.5,", 3, "string.lenght_m" },
        { "unknown top-level section", "\"description\":", "\"lights\": {}, \"description\":", 3, "lights" },
        { "too few frames", "\"duration_s\": 0.5", "\"duration_s\": 0.001", 3, "camera.duration_s" },
        { "invalid JSON", "\"length_m\": 0.5,", "\"length_m\": 0.5,,", 3, "not valid JSON (line 4)" },
        { "missing file", "", "", 3, "scene.json" },
    };

    [Theory]
    [MemberData(nameof(BadScenes))]
    public void BadSceneFile_ExitsWithOneLineNamingTheFieldAndWritesNothing(string name, string find, string replace, int exitCode, string fragment)
    {
        using var temp = new TempFolder();
        var scene = temp.File("scene.json");
        if (name != "missing file")
        {
            Assert.Contains(find, Scenes.Small, StringComparison.Ordinal);
            File.WriteAllText(scene, Scenes.Small.Replace(find, replace, StringComparison.Ordinal));
        }
        var before = temp.Entries();
        var clip = temp.File("clip.mkv");

        var r = Cli.RunExpecting(exitCode, "synth", scene, "--out", clip);

        Cli.AssertOneLineError(r, fragment);
        Assert.Contains(";", r.ErrorLines[0], StringComparison.Ordinal);
        Assert.False(File.Exists(clip), name);
        Assert.False(File.Exists(temp.File("clip.truth.json")), name);
        Assert.False(File.Exists(temp.File("clip.truth-tracks.csv")), name);
        Assert.Equal(before, temp.Entries());
        Assert.Equal("", r.Out);
    }

    /// <summary>Case name, arguments after the scene file, text the message must contain.</summary>
    public static TheoryData<string, string[], string> UsageErrors => new()
    {
        { "no --out", [], "--out" },
        { "unknown clip extension", ["--out", "CLIP.xyz"], "'.xyz'" },
        { "unknown option", ["--out", "CLIP.mkv", "--colour", "red"], "--colour" },
        { "quality out of range", ["--out", "CLIP.mkv", "--quality", "0"], "--quality" },
        { "seed not a number", ["--out", "CLIP.mkv", "--seed", "x"], "--seed" },
        { "unknown sequence format", ["--out", "CLIP", "--format", "gif"], "gif" },
    };

    [Theory]
    [MemberData(nameof(UsageErrors))]
    public void SynthUsageError_ExitsTwoWithOneLineAndWritesNothing(string name, string[] tail, string fragment)
    {
        using var temp = new TempFolder();
        var scene = temp.File("scene.json");
        File.WriteAllText(scene, Scenes.Small);
        var args = new[] { "synth", scene }.Concat(tail.Select(a => a.Replace("CLIP", temp.File("clip"), StringComparison.Ordinal))).ToArray();

        var r = Cli.RunExpecting(ExitCodes.Usage, args);

        Cli.AssertOneLineError(r, fragment);
        Assert.True(temp.Entries().SequenceEqual(["scene.json"]), $"{name}: folder holds {string.Join(", ", temp.Entries())}");
    }
}
