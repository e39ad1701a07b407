using OpenCvSharp;
using StringModes.Video.Marks;
using StringModes.Video.Tests.Support;

namespace StringModes.Video.Tests.Marks;

public sealed class MarkFinderTests
{
    [Fact]
    public void DarkMarksOnTexturedBackground_FoundInOrderWithEndsOutermost()
    {
        var scene = new SyntheticStringScene(320, 240);
        using var grey = new Mat();
        var truth = scene.Render(0.05, 0, 2, new Random(1), grey);
        var layout = MarkFinder.Find(grey);
        Assert.Equal(scene.MarkCount, layout.Marks.Count);
        for (int i = 0; i < truth.Length; i++)
        {
            // Detection only seeds the tracker: within 0.5 px of the rendered centre is plenty.
            Assert.Equal(truth[i].X, layout.Marks[i].XPx, 0.5);
            Assert.Equal(truth[i].Y, layout.Marks[i].YPx, 0.5);
            Assert.True(layout.Marks[i].ContrastDn < 0);
            Assert.InRange(layout.Marks[i].RadiusPx, 2.5, 4.5);
        }
    }

    [Fact]
    public void BrightMarksWithStrayBlob_StrayRejectedByLineConsensus()
    {
        var scene = new SyntheticStringScene(320, 240) { MarkDn = 240, EndMarkDn = 240 };
        using var grey = new Mat();
        scene.Render(0, 0, 1, new Random(2), grey);
        // A stray bright disc well off the string line.
        Cv2.Circle(grey, new Point(160, 40), 4, Scalar.All(250), -1, LineTypes.AntiAlias);
        var layout = MarkFinder.Find(grey);
        Assert.Equal(scene.MarkCount, layout.Marks.Count);
        Assert.Contains(layout.Rejected, r => Math.Abs(r.XPx - 160) < 1 && Math.Abs(r.YPx - 40) < 1);
        Assert.All(layout.Marks, m => Assert.True(m.ContrastDn > 0));
    }

    [Fact]
    public void SixteenBitFrame_FindsTheSameMarks()
    {
        var scene = new SyntheticStringScene(200, 120);
        using var grey = new Mat();
        scene.Render(0, 0, 0, new Random(3), grey, sixteenBit: true);
        Assert.Equal(scene.MarkCount, MarkFinder.Find(grey).Marks.Count);
    }

    [Fact]
    public void TwoMovingMarks_ThrowWithDiagnosticPng()
    {
        var scene = new SyntheticStringScene(200, 120) { MarkFractions = [0.3, 0.7] };
        using var grey = new Mat();
        scene.Render(0, 0, 0, new Random(4), grey);
        var e = Assert.Throws<MarksNotFoundException>(() => MarkFinder.Find(grey));
        Assert.Equal(2, e.MovingFound);
        // PNG signature (ISO/IEC 15948 §5.2): 89 50 4E 47 0D 0A 1A 0A.
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, e.DiagnosticPng[..8]);
        using var decoded = Cv2.ImDecode(e.DiagnosticPng, ImreadModes.Color);
        Assert.Equal(new Size(200, 120), decoded.Size());
    }

    [Fact]
    public void GivenEnds_ReplaceDetectedEnds()
    {
        var scene = new SyntheticStringScene(320, 240);
        using var grey = new Mat();
        var truth = scene.Render(0, 0, 0, new Random(5), grey);
        var found = MarkFinder.Find(grey);
        var e0 = (truth[0].X + 0.3, truth[0].Y);
        var e1 = (truth[^1].X - 0.2, truth[^1].Y);
        var layout = MarkFinder.WithEnds(grey, found, e0, e1);
        Assert.Equal(scene.MarkCount, layout.Marks.Count);
        Assert.Equal(e0.Item1, layout.Marks[0].XPx, 1e-12);
        Assert.Equal(e1.Item1, layout.Marks[^1].XPx, 1e-12);
    }
}
