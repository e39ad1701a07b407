using System.Text.Json;

namespace StringModes.Cli.Tests;

/// <summary><c>analyze</c> on a small synthesised lossless clip: exit 0, the documented files, and the fundamental found.</summary>
[Collection("small clip")]
public class AnalyzeEndToEndTests(SmallClipFixture clip)
{
    private string ResultsText => File.ReadAllText(Path.Combine(clip.ResultsDir, "results.json"));

    [Fact]
    public void SmallLosslessClip_ExitsZeroAndWritesResultsWithTheDocumentedKeys()
    {
        Assert.True(clip.Analysis.ExitCode == 0, clip.Analysis.ToString());
        using var doc = JsonDocument.Parse(ResultsText);
        var root = doc.RootElement;
        Assert.Equal(JsonValueKind.Object, root.GetProperty("input").ValueKind);
        Assert.Equal(200, root.GetProperty("input").GetProperty("frames").GetInt32());
        Assert.Equal(JsonValueKind.Object, root.GetProperty("analysis_window_s").ValueKind);
        Assert.Equal(JsonValueKind.Array, root.GetProperty("warnings").ValueKind);
        var modes = root.GetProperty("modes");
        Assert.True(modes.GetArrayLength() >= 2, "modes 1 and 2 are in the scene");
        var converged = modes.EnumerateArray().Where(m => m.GetProperty("fit_status").GetString() == "converged").ToArray();
        Assert.Contains(converged, m => m.GetProperty("n").GetInt32() == 1);
        Assert.Contains(converged, m => m.GetProperty("n").GetInt32() == 2);
        foreach (var m in converged)
        {
            Assert.True(m.GetProperty("frequency_hz").GetProperty("value").GetDouble() > 0);
            Assert.True(m.GetProperty("frequency_hz").GetProperty("uncertainty").GetDouble() > 0);
        }
        var tension = root.GetProperty("string").GetProperty("tension_n");
        Assert.True(tension.GetProperty("value").GetDouble() > 0);
        Assert.True(tension.GetProperty("uncertainty").GetDouble() > 0);
    }

    // Check value: the scene's mode-1 frequency, written by the synthesiser as truth.modes[0].frequency_hz
    // (40 Hz by construction). Two tolerances: (a) 3 standard uncertainties — the reported u must cover the error
    // (coverage factor 3, common practice); (b) 1e-4 relative = 0.004 Hz, about 8× the Cramér–Rao bound for this clip
    // (Rife & Boorstyn 1974, REFERENCES.md §5: mid-string mark swing ≈ 2.2 px, tracking noise ≈ 0.01 px, N = 200 →
    // std ≥ 5e-4 Hz [computed]), so it cannot be met by a large u alone and catches a wrong time base.
    [Fact]
    public void SmallLosslessClip_FundamentalAgreesWithTruthWithinThreeUncertaintiesAndOneInTenThousand()
    {
        Assert.True(clip.Analysis.ExitCode == 0, clip.Analysis.ToString());
        using var truth = JsonDocument.Parse(clip.Truth);
        var trueF1 = truth.RootElement.GetProperty("modes")[0].GetProperty("frequency_hz").GetDouble();
        Assert.Equal(1, truth.RootElement.GetProperty("modes")[0].GetProperty("n").GetInt32());
        using var doc = JsonDocument.Parse(ResultsText);
        var mode1 = doc.RootElement.GetProperty("modes").EnumerateArray().Single(m => m.GetProperty("n").GetInt32() == 1);
        var f = mode1.GetProperty("frequency_hz").GetProperty("value").GetDouble();
        var u = mode1.GetProperty("frequency_hz").GetProperty("uncertainty").GetDouble();
        Assert.True(Math.Abs(f - trueF1) <= 3 * u, $"f1 = {f:R} ± {u:R} Hz, truth {trueF1:R} Hz: {Math.Abs(f - trueF1) / u:F2} u apart");
        Assert.True(Math.Abs(f - trueF1) <= 1e-4 * trueF1, $"f1 = {f:R} Hz, truth {trueF1:R} Hz: relative error {Math.Abs(f - trueF1) / trueF1:E2}");
    }

    [Fact]
    public void ResultsJson_HoldsNoNaNOrInfinityText()
    {
        var text = ResultsText;
        Assert.DoesNotContain("NaN", text, StringComparison.Ordinal);
        Assert.DoesNotContain("Infinity", text, StringComparison.Ordinal);
    }

    [Fact]
    public void CsvFiles_HaveTheDocumentedHeaders()
    {
        var tracks = File.ReadLines(Path.Combine(clip.ResultsDir, "tracks.csv")).First();
        Assert.Equal("frame,time_s,mark,x_px,y_px,quality", tracks);
        var modes = File.ReadLines(Path.Combine(clip.ResultsDir, "modes.csv")).First();
        Assert.StartsWith("time_s,a1_m", modes, StringComparison.Ordinal);
    }

    [Fact]
    public void JsonOption_PrintsParseableResultsOnStdout()
    {
        var outDir = clip.NewPath("json-run");
        var r = Cli.RunExpecting(ExitCodes.Success, clip.AnalyzeArgs(outDir, "--json"));
        using var doc = JsonDocument.Parse(r.Out);
        Assert.Equal(JsonValueKind.Array, doc.RootElement.GetProperty("modes").ValueKind);
        Assert.Equal(File.ReadAllText(Path.Combine(outDir, "results.json")), r.Out);
    }

    [Fact]
    public void TwoRunsOnTheSameClip_GiveByteIdenticalOutputs()
    {
        var again = clip.NewPath("second-run");
        Cli.RunExpecting(ExitCodes.Success, clip.AnalyzeArgs(again));
        foreach (var name in new[] { "results.json", "modes.csv", "tracks.csv" })
            Assert.True(File.ReadAllBytes(Path.Combine(clip.ResultsDir, name)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(again, name))), $"{name} differs between runs");
    }

    // A 400 frames/s FFV1 clip written by synth carries its own rate: analyze should read 400 frames/s from it
    // (the scene's capture rate) without --capture-fps, to 1e-6 relative (the rate is exact by construction).
    [Fact]
    public void SynthesisedMkvAt400Fps_IsReadAtItsCaptureRateWithoutVariableRateWarning()
    {
        using var temp = new TempFolder();
        File.WriteAllText(temp.File("scene.json"), Scenes.Small.Replace("\"duration_s\": 0.5", "\"duration_s\": 0.3", StringComparison.Ordinal));
        Cli.RunExpecting(ExitCodes.Success, "synth", temp.File("scene.json"), "--out", temp.File("clip.mkv"));
        var r = Cli.RunExpecting(ExitCodes.Success, "analyze", temp.File("clip.mkv"), "--length", "0.5m", "--out", temp.File("results"), "--json");
        using var doc = JsonDocument.Parse(r.Out);
        var fps = doc.RootElement.GetProperty("input").GetProperty("capture_fps").GetDouble();
        Assert.True(Math.Abs(fps - 400) <= 400e-6, $"capture_fps {fps:R}; stderr: {r.Error}");
        Assert.DoesNotContain("variable frame rate", r.Error, StringComparison.Ordinal);
    }
}
