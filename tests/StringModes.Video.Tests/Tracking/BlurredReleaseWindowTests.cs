using StringModes.Analysis.Geometry;
using StringModes.Video.Synthesis;
using StringModes.Video.Tests.Synthesis;
using StringModes.Video.Tracking;

namespace StringModes.Video.Tests.Tracking;

/// <summary>The analysis window skips a heavily blurred release (tracking issue: start within 0.05 s of its end).</summary>
public class BlurredReleaseWindowTests
{
    [Fact]
    public void Window_starts_within_50_ms_of_the_end_of_a_300_ms_blurred_release()
    {
        // 1 s at 400 fps, fundamental 60 Hz with 12 mm amplitude (560 px/m): peak speed 2π·60·0.012·560 ≈ 2500 px/s.
        // The first 0.3 s are exposed for the whole frame period (2.5 ms, a streak of up to ~6 px on 4.3 px marks:
        // heavy blur), the rest at 0.5 ms (~1.3 px). Lossless, so only the blur differs.
        var text = SceneFixtures.Small(noiseDn: 2, textureContrast: 0.12, stringColour: "[215, 210, 195]")
            .Replace("\"fundamental_hz\": 40", "\"fundamental_hz\": 60")
            .Replace("\"amplitude_m\": 0.004", "\"amplitude_m\": 0.012")
            .Replace("\"duration_s\": 0.25, \"exposure_s\": 0.0015", "\"duration_s\": 1.0, \"exposure_s\": 0.0005")
            .TrimEnd().TrimEnd('}') + ", \"release\": { \"duration_s\": 0.3, \"exposure_s\": 0.0025, \"subframes\": 16 } }";
        var scene = SceneFixtures.Parse(text);
        Assert.Equal(0.3, scene.ReleaseDurationS);
        using var temp = new TempFolder();
        ClipSynthesiser.Run(scene, temp.File("clip.mkv"), new SynthesisOptions { Seed = 8 }, "s.json");
        var tracking = ClipTracker.Track(temp.File("clip.mkv"), new TrackingOptions());
        var window = AnalysisWindow.Choose(tracking.Tracks);
        var start = tracking.Tracks.TimesS[window.FirstFrame];
        Assert.True(Math.Abs(start - 0.3) <= 0.05, $"window starts at {start:F3} s; the release ends at 0.300 s");
    }
}
