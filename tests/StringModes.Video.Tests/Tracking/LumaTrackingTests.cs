using StringModes.Video.Synthesis;
using StringModes.Video.Tests.Synthesis;
using StringModes.Video.Tracking;

namespace StringModes.Video.Tests.Tracking;

/// <summary>
/// Following the marks on the decoded luma plane alone (no colour conversion) is used exactly when it is safe, and
/// measures as well as colour decoding. Truth: the synthesiser's exposure-averaged mark positions.
/// </summary>
public class LumaTrackingTests
{
    private static double RmsAgainstTruth(TrackingResult result, string truthCsv)
    {
        var truth = TruthRow.Load(truthCsv).ToDictionary(r => (r.Frame, r.Mark));
        double sum = 0;
        var n = 0;
        var t = result.Tracks;
        for (var k = 0; k < t.FrameCount; k++)
            for (var i = 1; i < t.MarkCount - 1; i++)
            {
                Assert.True(t.Quality[k, i] > 0, $"mark {i} lost in frame {k}");
                var r = truth[(k, i)];
                sum += Math.Pow(t.XPx[k, i] - r.XExposure, 2) + Math.Pow(t.YPx[k, i] - r.YExposure, 2);
                n++;
            }
        return Math.Sqrt(sum / n);
    }

    private static (TrackingResult Result, string Truth) Encode(TempFolder temp, string scene, string file, string ffmpegOutput)
    {
        ClipSynthesiser.Run(SceneFixtures.Parse(scene), temp.File("seq"), new SynthesisOptions { Seed = 7 }, "s.json");
        Ffmpeg.Run($"-framerate 400 -i {temp.File("seq")}/frame_%06d.png {ffmpegOutput} {temp.File(file)}");
        return (ClipTracker.Track(temp.File(file), new TrackingOptions { ReferenceTimeS = 0.1 }), temp.File("seq.truth-tracks.csv"));
    }

    // Dark marks in H.264 4:2:0: the luma plane is used. Tolerances: 0.1 px RMS against the truth, as for the other
    // CRF 18 phone-codec fixtures (ClipTrackerTests); and luma may be at most 10 % worse than colour decoding of the
    // same file (it should be no worse: a dark mark's contrast is all in the luma, and the chroma only adds noise).
    [Fact]
    public void DarkMarks_InYuvVideo_AreFollowedOnTheLumaPlane_AsAccuratelyAsInColour()
    {
        using var temp = new TempFolder();
        var scene = SceneFixtures.Small(noiseDn: 2, textureContrast: 0.12, stringColour: "[215, 210, 195]");
        var (luma, truth) = Encode(temp, scene, "h264.mp4", "-c:v libx264 -crf 18 -pix_fmt yuv420p");
        var colour = ClipTracker.Track(temp.File("h264.mp4"), new TrackingOptions { ReferenceTimeS = 0.1, LumaWhenPossible = false });
        Assert.True(luma.LumaOnly);
        Assert.False(colour.LumaOnly);
        var rmsLuma = RmsAgainstTruth(luma, truth);
        var rmsColour = RmsAgainstTruth(colour, truth);
        Assert.True(rmsLuma < 0.1, $"luma RMS {rmsLuma:F4} px");
        Assert.True(rmsLuma <= 1.1 * rmsColour, $"luma RMS {rmsLuma:F4} px against colour {rmsColour:F4} px");
    }

    // A 10-bit stream's first plane is not 8-bit luma: the tracker must notice and decode colour.
    [Fact]
    public void TenBitVideo_IsDecodedInColour_AndTrackedAccurately()
    {
        using var temp = new TempFolder();
        var scene = SceneFixtures.Small(noiseDn: 2, textureContrast: 0.12, stringColour: "[215, 210, 195]");
        var (result, truth) = Encode(temp, scene, "hevc10.mp4", "-c:v libx265 -crf 18 -pix_fmt yuv420p10le -x265-params log-level=error");
        Assert.False(result.LumaOnly);
        var rms = RmsAgainstTruth(result, truth);
        Assert.True(rms < 0.1, $"RMS {rms:F4} px");
    }

    // Marks that differ from the background in colour but hardly in brightness (luma of [255, 100, 132] is 150.0 with
    // the BT.601 weights 0.299, 0.587, 0.114, ITU-R BT.601; the background is grey 150) are invisible on the luma
    // plane, so colour is decoded even though the stream (4:4:4) would allow luma.
    [Fact]
    public void ColouredMarksOfBackgroundBrightness_AreFollowedInColour()
    {
        using var temp = new TempFolder();
        var scene = SceneFixtures.Small(noiseDn: 1).Replace("\"colour_rgb\": [20, 20, 20]", "\"colour_rgb\": [255, 100, 132]", StringComparison.Ordinal);
        Assert.Contains("[255, 100, 132]", scene, StringComparison.Ordinal);
        var (result, truth) = Encode(temp, scene, "h264-444.mp4", "-c:v libx264 -crf 12 -pix_fmt yuv444p");
        Assert.False(result.LumaOnly);
        var rms = RmsAgainstTruth(result, truth);
        Assert.True(rms < 0.1, $"RMS {rms:F4} px");
    }
}
