using System.Text.Json;

namespace StringModes.Cli.Tests;

/// <summary><c>track --json</c>: a machine-readable summary matching the clip and the files written.</summary>
[Collection("small clip")]
public class TrackJsonTests(SmallClipFixture clip)
{
    [Fact]
    public void Json_summary_describes_the_clip_and_the_files()
    {
        var outDir = clip.NewPath("track-json");
        var run = Cli.RunExpecting(ExitCodes.Success, "track", clip.Clip, "--capture-fps", "400", "--out", outDir, "--json");
        using var doc = JsonDocument.Parse(run.Out);
        var root = doc.RootElement;
        // The fixture's clip: 200 frames at 400 frames/s of a scene with 5 marks between the two ends (Scenes.Small).
        Assert.Equal(200, root.GetProperty("frames").GetInt32());
        Assert.Equal(7, root.GetProperty("marks_including_ends").GetInt32());
        Assert.Equal(400, root.GetProperty("capture_fps").GetDouble());
        Assert.Equal(JsonValueKind.Null, root.GetProperty("declared_fps").ValueKind); // an image folder declares no rate
        Assert.Equal(199 / 400.0, root.GetProperty("duration_s").GetDouble(), 1e-12);
        foreach (var f in root.GetProperty("files").EnumerateArray()) Assert.True(File.Exists(f.GetString()), f.GetString());
        Assert.Equal(JsonValueKind.Array, root.GetProperty("warnings").ValueKind);
    }
}
