namespace StringModes.Cli.Tests;

/// <summary>The committed demo clips come from the committed scene files: re-rendering reproduces their truth files byte for byte.</summary>
public class DemoClipTests
{
    [Fact]
    public void NylonBenchScene_RerenderedWithSameName_GivesByteIdenticalTruthFiles()
    {
        var demo = Path.Combine(Cli.RepoRoot, "demo-clips", "nylon-bench");
        using var temp = new TempFolder();
        // The same file name as the committed clip, so the truth file's "clip" key matches too.
        var clip = temp.File("nylon-bench.mp4");

        var r = Cli.RunExpecting(ExitCodes.Success, "synth", Path.Combine(demo, "scene.json"), "--out", clip);

        Assert.Equal("", r.Error);
        Assert.True(File.Exists(clip));
        Assert.Equal(File.ReadAllBytes(Path.Combine(demo, "nylon-bench.truth.json")), File.ReadAllBytes(temp.File("nylon-bench.truth.json")));
        Assert.Equal(File.ReadAllBytes(Path.Combine(demo, "nylon-bench.truth-tracks.csv")), File.ReadAllBytes(temp.File("nylon-bench.truth-tracks.csv")));
    }
}
