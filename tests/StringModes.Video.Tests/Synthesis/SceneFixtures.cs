using StringModes.Video.Synthesis;

namespace StringModes.Video.Tests.Synthesis;

/// <summary>Small scenes for fast tests (invented rigs).</summary>
internal static class SceneFixtures
{
    /// <summary>A 320×120 scene, uniform background, 5 dark marks, two modes; 0.25 s at 400 fps.</summary>
    public static string Small(double noiseDn = 0, double textureContrast = 0, string extraCamera = "", string stringColour = "[150, 150, 150]") => $$"""
    {
      "description": "test scene (invented): 0.5 m string, two modes",
      "string": {
        "length_m": 0.5, "fundamental_hz": 40, "width_px": 2, "colour_rgb": {{stringColour}},
        "modes": [ { "n": 1, "amplitude_m": 0.004, "phase_rad": 0.3, "decay_rate_per_s": 1.5 },
                   { "n": 2, "amplitude_m": 0.0015, "phase_rad": -1.0, "decay_rate_per_s": 3.0 } ]
      },
      "image": { "width_px": 320, "height_px": 120, "end0_px": [20.3, 60.2], "end1_px": [300.1, 58.7] },
      "marks": { "count": 5, "radius_px": 4.3, "colour_rgb": [20, 20, 20] },
      "background": { "colour_rgb": [150, 150, 150], "texture_contrast": {{textureContrast}}, "lighting_gradient": 0 },
      "camera": { "capture_fps": 400, "duration_s": 0.25, "exposure_s": 0.0015, "subframes": 8, "noise_dn": {{noiseDn}} {{extraCamera}} }
    }
    """;

    public static Scene Parse(string text) => SceneFile.Parse(text, "test-scene.json");
}

/// <summary>A temporary folder deleted after the test.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder() => Path = Directory.CreateTempSubdirectory("stringmodes-test-").FullName;

    public string Path { get; }

    public string File(string name) => System.IO.Path.Combine(Path, name);

    public void Dispose()
    {
        try { Directory.Delete(Path, true); }
        catch (IOException) { }
    }
}

/// <summary>Debian's ffmpeg, for encoding phone-codec fixtures (installed by <c>bash build.sh test</c>).</summary>
internal static class Ffmpeg
{
    public static void Run(string arguments)
    {
        using var p = System.Diagnostics.Process.Start(new System.Diagnostics.ProcessStartInfo("ffmpeg", "-v error -y " + arguments) { RedirectStandardError = true })
            ?? throw new InvalidOperationException("ffmpeg could not be started; the test set-up (bash build.sh test) installs it");
        var error = p.StandardError.ReadToEnd();
        p.WaitForExit();
        Assert.True(p.ExitCode == 0, $"ffmpeg failed: {error}");
    }
}
