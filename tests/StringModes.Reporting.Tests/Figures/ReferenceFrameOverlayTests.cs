using SkiaSharp;
using StringModes.Reporting.Colour;
using StringModes.Reporting.Figures;
using StringModes.Reporting.Model;
using StringModes.Reporting.Tests.Support;

namespace StringModes.Reporting.Tests.Figures;

public class ReferenceFrameOverlayTests
{
    private const int W = 640, H = 360;

    /// <summary>A dark-red background frame as raw BGR (blue, green, red per pixel).</summary>
    private static byte[] Bgr()
    {
        var bgr = new byte[W * H * 3];
        for (var i = 0; i < W * H; i++)
        {
            bgr[3 * i] = 20;      // blue
            bgr[3 * i + 1] = 30;  // green
            bgr[3 * i + 2] = 160; // red
        }

        return bgr;
    }

    private static byte[] Png()
    {
        using var bitmap = new SKBitmap(W, H);
        bitmap.Erase(new SKColor(160, 30, 20));
        using var data = bitmap.Encode(SKEncodedImageFormat.Png, 100);
        return data.ToArray();
    }

    private static ReferenceFrame Frame(byte[]? png, byte[]? bgr) => new()
    {
        EncodedImage = png,
        BgrPixels = bgr,
        BgrWidthPx = W,
        BgrHeightPx = H,
        FirstEndPx = new ImagePoint(40, 180),
        SecondEndPx = new ImagePoint(600, 180),
        Marks = Enumerable.Range(1, 4).Select(i => new TrackedMark(i, new ImagePoint(40 + 112 * i, 180), new ImagePoint(36 + 112 * i, 150), new ImagePoint(44 + 112 * i, 210))).ToArray(),
    };

    [Fact]
    public void BgrAndEncodedInputs_GiveTheSameFigureWithRedBackground()
    {
        var fromBgr = ReferenceFrameOverlay.Render(Frame(null, Bgr()));
        var fromPng = ReferenceFrameOverlay.Render(Frame(Png(), null));
        using var a = new FigureReader(fromBgr);
        using var b = new FigureReader(fromPng);
        var (x, y) = a.ToPixel(100, 60);
        // Channel order: BGR (20, 30, 160) must show as red, i.e. sRGB (160, 30, 20), within 8-bit resampling.
        var c = a.Pixel(x, y);
        Assert.Equal(160 / 255.0, c.R, 0.02);
        Assert.Equal(20 / 255.0, c.B, 0.02);
        Assert.Equal(c, b.Pixel(x, y));
    }

    [Fact]
    public void Symbols_AreDrawnAtMarksEndsAndExtents()
    {
        var frame = Frame(Png(), null);
        var figure = ReferenceFrameOverlay.Render(frame);
        using var reader = new FigureReader(figure);
        var scale = figure.PlotAreaPx.WidthPx / W;
        var magenta = SrgbColour.FromBytes(0xff, 0x4f, 0xd8);
        var amber = SrgbColour.FromBytes(0xff, 0xb0, 0x00);
        var lime = SrgbColour.FromBytes(0x9c, 0xff, 0x57);
        foreach (var m in frame.Marks)
        {
            var (x, y) = reader.ToPixel(m.RestPx.XPx, m.RestPx.YPx);
            Assert.True(reader.HasColourNear(x, y - 9, magenta, 2), $"ring of mark {m.Index} missing");
            var (_, yTop) = reader.ToPixel(m.RestPx.XPx, m.MinPx.YPx);
            Assert.True(reader.HasColourNear(x, yTop, lime, 2), $"extent of mark {m.Index} missing");
        }

        var (ex, ey) = reader.ToPixel(frame.FirstEndPx.XPx, frame.FirstEndPx.YPx);
        Assert.True(reader.HasColourNear(ex, ey, amber, 2), "end square missing");
        Assert.True(scale > 1.5, "the 640 px frame should be scaled up to fill the figure");
        FigureReader.ParseSvg(figure);
    }

    [Fact]
    public void UndecodableImage_IsRejectedWithArgumentException()
    {
        Assert.Throws<ArgumentException>(() => ReferenceFrameOverlay.Render(Frame([1, 2, 3, 4], null)));
    }
}
