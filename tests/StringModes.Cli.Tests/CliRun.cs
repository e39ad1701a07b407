namespace StringModes.Cli.Tests;

/// <summary>What one in-process run of the command printed and returned.</summary>
internal sealed record CliResult(int ExitCode, string Out, string Error)
{
    /// <summary>Non-empty lines written to stderr.</summary>
    public string[] ErrorLines => Error.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);

    public override string ToString() => $"exit {ExitCode}\nstdout:\n{Out}\nstderr:\n{Error}";
}

/// <summary>Runs <c>stringmodes</c> in-process with captured writers, as a user would see it (no colour, no progress bar).</summary>
internal static class Cli
{
    public static CliResult Run(params string[] args)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        var code = new App(stdout, stderr).Run(args);
        return new CliResult(code, stdout.ToString(), stderr.ToString());
    }

    /// <summary>Runs and fails the test with the whole output when the exit code is not the expected one.</summary>
    public static CliResult RunExpecting(int exitCode, params string[] args)
    {
        var r = Run(args);
        Assert.True(r.ExitCode == exitCode, $"expected exit {exitCode} from 'stringmodes {string.Join(' ', args)}', got {r}");
        return r;
    }

    /// <summary>The repository root (the folder holding StringModes.sln), found upwards from the test binaries.</summary>
    public static string RepoRoot
    {
        get
        {
            for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
                if (File.Exists(Path.Combine(d.FullName, "StringModes.sln"))) return d.FullName;
            throw new InvalidOperationException("StringModes.sln not found above " + AppContext.BaseDirectory);
        }
    }

    /// <summary>Asserts a user-facing error: exactly one stderr line, no stack trace or exception type names.</summary>
    public static void AssertOneLineError(CliResult r, string mustContain)
    {
        Assert.True(r.ErrorLines.Length == 1, $"expected exactly one stderr line, got {r}");
        var line = r.ErrorLines[0];
        Assert.Contains(mustContain, line, StringComparison.Ordinal);
        // A .NET stack frame reads "at Namespace.Type.Method(...)".
        Assert.DoesNotMatch(@"\bat [A-Za-z_][\w.`<>]*\.[\w<>]+\(", r.Error);
        Assert.DoesNotContain("Exception", line, StringComparison.Ordinal);
        Assert.DoesNotContain("internal error", line, StringComparison.Ordinal);
    }
}

/// <summary>A temporary folder deleted after the test.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder() => Path = Directory.CreateTempSubdirectory("stringmodes-cli-test-").FullName;

    public string Path { get; }

    public string File(string name) => System.IO.Path.Combine(Path, name);

    /// <summary>Every entry in the folder, hidden ones included, as names.</summary>
    public string[] Entries() => Directory.GetFileSystemEntries(Path).Select(System.IO.Path.GetFileName).OrderBy(n => n, StringComparer.Ordinal).ToArray()!;

    public void Dispose()
    {
        try { Directory.Delete(Path, true); }
        catch (IOException) { }
    }
}

/// <summary>Small scenes for fast command-line tests (invented rigs, not real measurements).</summary>
internal static class Scenes
{
    /// <summary>
    /// A 320×120 scene: 0.5 m string, ideal fundamental 40 Hz, modes 1 and 2, five dark marks on a plain background;
    /// 0.5 s at 400 fps (200 frames), 1 DN sensor noise.
    /// </summary>
    public const string Small = """
    {
      "description": "test scene (invented): 0.5 m string, two modes",
      "string": {
        "length_m": 0.5, "linear_density_kg_per_m": 0.001, "fundamental_hz": 40, "width_px": 2, "colour_rgb": [150, 150, 150],
        "modes": [ { "n": 1, "amplitude_m": 0.004, "phase_rad": 0.3, "decay_rate_per_s": 1.5 },
                   { "n": 2, "amplitude_m": 0.0015, "phase_rad": -1.0, "decay_rate_per_s": 3.0 } ]
      },
      "image": { "width_px": 320, "height_px": 120, "end0_px": [20.3, 60.2], "end1_px": [300.1, 58.7] },
      "marks": { "count": 5, "radius_px": 4.3, "colour_rgb": [20, 20, 20] },
      "background": { "colour_rgb": [150, 150, 150], "texture_contrast": 0, "lighting_gradient": 0 },
      "camera": { "capture_fps": 400, "duration_s": 0.5, "exposure_s": 0.0015, "subframes": 8, "noise_dn": 1 }
    }
    """;
}
