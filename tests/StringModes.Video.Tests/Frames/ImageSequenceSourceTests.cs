using OpenCvSharp;
using StringModes.Video.Frames;
using StringModes.Video.Tests.Support;

namespace StringModes.Video.Tests.Frames;

public sealed class ImageSequenceSourceTests
{
    [Fact]
    public void SixteenBitTiffFolder_ReadsInNaturalOrderAtStatedRate()
    {
        using var dir = new FixtureFolder();
        var scene = new SyntheticStringScene(96, 64);
        var rng = new Random(5);
        var written = new List<Mat>();
        for (int k = 0; k < 12; k++)
        {
            var m = new Mat();
            scene.Render(k / 100.0, 0, 1.0, rng, m, sixteenBit: true);
            Cv2.ImWrite(dir.File($"frame{k + 1}.tif"), m);
            written.Add(m);
        }

        using var src = FrameSources.Open(dir.Path, new FrameSourceOptions { SequenceFps = 100 });
        Assert.True(src.IsSixteenBit);
        int n = 0;
        while (src.Read())
        {
            using var d = new Mat();
            Cv2.Absdiff(src.Grey, written[n], d);
            Assert.Equal(0, Cv2.CountNonZero(d));
            Assert.Equal(n / 100.0, src.TimeS, 1e-12);
            n++;
        }

        Assert.Equal(12, n);
        written.ForEach(m => m.Dispose());
    }

    [Fact]
    public void EightBitPngFolder_IsEightBit()
    {
        using var dir = new FixtureFolder();
        using var m = new Mat(20, 30, MatType.CV_8UC3, new Scalar(10, 20, 30));
        Cv2.ImWrite(dir.File("a_01.png"), m);
        Cv2.ImWrite(dir.File("a_02.png"), m);
        using var src = FrameSources.Open(dir.Path, new FrameSourceOptions { SequenceFps = 60 });
        Assert.False(src.IsSixteenBit);
        Assert.True(src.Read());
        // BGR→grey weights 0.114, 0.587, 0.299 (OpenCV cvtColor documentation): 10·0.114 + 20·0.587 + 30·0.299 = 21.85 → 22.
        Assert.Equal(22, src.Grey.At<byte>(0, 0));
    }

    [Fact]
    public void MixedSizeFolder_ThrowsInputExceptionNamingTheOddFile()
    {
        using var dir = new FixtureFolder();
        using var a = new Mat(20, 30, MatType.CV_8UC1, Scalar.All(5));
        using var b = new Mat(22, 30, MatType.CV_8UC1, Scalar.All(5));
        Cv2.ImWrite(dir.File("f1.png"), a);
        Cv2.ImWrite(dir.File("f2.png"), b);
        using var src = FrameSources.Open(dir.Path, new FrameSourceOptions { SequenceFps = 60 });
        Assert.True(src.Read());
        var e = Assert.Throws<InputException>(() => { src.Read(); });
        Assert.Contains("f2.png", e.Message);
    }

    [Fact]
    public void FolderWithoutRate_ThrowsInputException()
    {
        using var dir = new FixtureFolder();
        using var a = new Mat(20, 30, MatType.CV_8UC1, Scalar.All(5));
        Cv2.ImWrite(dir.File("f1.png"), a);
        Assert.Throws<InputException>(() => FrameSources.Open(dir.Path));
        Assert.Throws<InputException>(() => FrameSources.Open(dir.File("f1.png")));
    }

    [Theory]
    [InlineData("f2.png", "f10.png", -1)]
    [InlineData("f10.png", "f9.png", 1)]
    [InlineData("x1y10.tif", "x1y9.tif", 1)]
    [InlineData("a.png", "B.png", -1)]
    public void NaturalOrder_ComparesNumbersByValue(string a, string b, int sign)
    {
        Assert.Equal(sign, Math.Sign(NaturalOrder.Instance.Compare(a, b)));
    }
}
