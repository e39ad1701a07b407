namespace StringModes.Cli.Tests;

/// <summary>
/// One small lossless clip (PNG sequence of <see cref="Scenes.Small"/>, rendered by <c>stringmodes synth</c>) and one
/// analysis of it, shared by the tests of the "small clip" collection so that the rendering is paid for once.
/// </summary>
public sealed class SmallClipFixture : IDisposable
{
    private readonly TempFolder _temp = new();

    public SmallClipFixture()
    {
        File.WriteAllText(_temp.File("scene.json"), Scenes.Small);
        Clip = _temp.File("small");
        var synth = Cli.Run("synth", _temp.File("scene.json"), "--out", Clip, "--seed", "5");
        if (synth.ExitCode != 0)
        {
            _temp.Dispose(); // a fixture whose constructor throws is never disposed
            throw new InvalidOperationException("synth failed: " + synth);
        }
        Truth = File.ReadAllText(_temp.File("small.truth.json"));
        ResultsDir = _temp.File("results");
        Analysis = Cli.Run(AnalyzeArgs(ResultsDir));
    }

    /// <summary>The clip folder (200 PNG frames at a capture rate of 400 frames/s).</summary>
    public string Clip { get; }

    /// <summary>The text of the clip's truth file.</summary>
    public string Truth { get; }

    /// <summary>The output folder of the shared analysis.</summary>
    public string ResultsDir { get; }

    /// <summary>The shared analysis run.</summary>
    internal CliResult Analysis { get; }

    /// <summary>A new folder name inside the fixture's temporary folder.</summary>
    public string NewPath(string name) => _temp.File(name);

    /// <summary>Arguments of <c>analyze</c> on the clip with the scene's rig values (invented: L = 0.5 m ± 1 mm, μ = 1 g/m ± 0.01 g/m).</summary>
    public string[] AnalyzeArgs(string outDir, params string[] extra) =>
        ["analyze", Clip, "--capture-fps", "400", "--length", "0.5m", "--length-uncertainty", "1mm",
         "--linear-density", "1g/m", "--linear-density-uncertainty", "0.01g/m", "--out", outDir, .. extra];

    public void Dispose() => _temp.Dispose();
}

[CollectionDefinition("small clip")]
public sealed class SmallClipCollection : ICollectionFixture<SmallClipFixture>;
