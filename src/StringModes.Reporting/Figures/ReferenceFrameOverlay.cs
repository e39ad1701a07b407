using SkiaSharp;
using StringModes.Reporting.Model;

namespace StringModes.Reporting.Figures;

/// <summary>
/// The reference frame with what was found on it: the string axis (dashed line through the two ends), the
/// ends (squares), each mark's rest position (ring with a centre dot and its number) and the extent of its
/// track over the analysis (rectangle from its minimum to maximum x and y). Each symbol is drawn bright over
/// a dark under-stroke so it stays visible on light and dark backgrounds. The image is scaled to fit the
/// figure; symbol and text sizes do not depend on the image resolution.
/// </summary>
public static class ReferenceFrameOverlay
{
    /// <summary>File-name stem of this figure.</summary>
    public const string Name = "reference-frame";

    internal static readonly SKColor AxisColour = new(0x3f, 0xd0, 0xe0);
    internal static readonly SKColor EndColour = new(0xff, 0xb0, 0x00);
    internal static readonly SKColor MarkColour = new(0xff, 0x4f, 0xd8);
    internal static readonly SKColor ExtentColour = new(0x9c, 0xff, 0x57);
    private static readonly SKColor UnderStroke = new(0, 0, 0, 200);

    // Layout: title band, legend strip and side margins, in figure pixels.
    private const float Top = 62, LegendStrip = 46, Side = 16;

    /// <summary>Renders the overlay. Throws <see cref="ArgumentException"/> when the image cannot be decoded.</summary>
    public static RenderedFigure Render(ReferenceFrame frame, FigureOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(frame);
        options ??= FigureOptions.Default;
        using var image = Decode(frame);
        // The frame is drawn at figure size: it is resampled once to that size (times the raster scale), so the
        // PNG and the SVG embed a picture no larger than they show; the full-size frame is its own output file.
        using var shown = Downscaled(image, options);
        const string caption = "Reference frame with the string ends, the string axis, each mark's rest position and the extent of its track during the analysis.";

        return FigureRenderer.Render(Name, caption, options, canvas =>
        {
            var k = DrawScale(image, options);
            var w = image.Width * k;
            var h = image.Height * k;
            var left = (options.WidthPx - w) / 2;
            var rect = new SKRect(left, Top, left + w, Top + h);
            Axes.DrawTitle(canvas, Side, "Reference frame",
                FigureText.Invariant($"{image.Width} × {image.Height} px, {frame.Marks.Count} marks; track extents over the analysis window"));
            canvas.DrawImage(shown ?? image, rect, new SKSamplingOptions(SKFilterMode.Linear));
            SKPoint P(ImagePoint p) => new(rect.Left + (float)(p.XPx * k), rect.Top + (float)(p.YPx * k));

            var count = canvas.Save();
            canvas.ClipRect(rect);
            var a = P(frame.FirstEndPx);
            var b = P(frame.SecondEndPx);
            DrawDoubleLine(canvas, a, b, AxisColour, [12, 7]);

            foreach (var m in frame.Marks)
            {
                var lo = P(m.MinPx);
                var hi = P(m.MaxPx);
                var box = new SKRect(Math.Min(lo.X, hi.X), Math.Min(lo.Y, hi.Y), Math.Max(lo.X, hi.X), Math.Max(lo.Y, hi.Y));
                box.Inflate(Math.Max(0, 3 - box.Width / 2), Math.Max(0, 3 - box.Height / 2));
                using var under = FigureStyle.Stroke(UnderStroke, 3.5f);
                using var over = FigureStyle.Stroke(ExtentColour, 1.6f);
                canvas.DrawRect(box, under);
                canvas.DrawRect(box, over);
            }

            using var font = FigureStyle.Font(FigureStyle.AnnotationSize, bold: true);
            foreach (var m in frame.Marks)
            {
                var c = P(m.RestPx);
                using var under = FigureStyle.Stroke(UnderStroke, 5);
                using var ring = FigureStyle.Stroke(MarkColour, 2.4f);
                using var dot = FigureStyle.Fill(MarkColour);
                canvas.DrawCircle(c, 9, under);
                canvas.DrawCircle(c, 9, ring);
                canvas.DrawCircle(c, 2, dot);
                OutlinedText(canvas, m.Index.ToString(System.Globalization.CultureInfo.InvariantCulture), c.X + 11, c.Y - 11, SKTextAlign.Left, font, MarkColour);
            }

            var endNumber = 1;
            foreach (var e in new[] { a, b })
            {
                var square = new SKRect(e.X - 7, e.Y - 7, e.X + 7, e.Y + 7);
                using var fill = FigureStyle.Fill(EndColour);
                using var edge = FigureStyle.Stroke(UnderStroke, 2);
                canvas.DrawRect(square, fill);
                canvas.DrawRect(square, edge);
                OutlinedText(canvas, FigureText.Invariant($"end {endNumber++}"), e.X, e.Y + 26, SKTextAlign.Center, font, EndColour);
            }

            canvas.RestoreToCount(count);
            using var frameEdge = FigureStyle.Stroke(FigureStyle.Ink, 1);
            canvas.DrawRect(rect, frameEdge);
            DrawLegend(canvas, options.HeightPx - LegendStrip + 10);
            return new DrawnLayout(new PixelRect(rect.Left, rect.Top, rect.Right, rect.Bottom), null, new AxesRange(0, image.Width, image.Height, 0));
        });
    }

    // Figure pixels per frame pixel: the frame fills the space between the title band, the legend strip and the margins.
    private static float DrawScale(SKImage image, FigureOptions options)
        => Math.Min((options.WidthPx - 2 * Side) / image.Width, (options.HeightPx - Top - LegendStrip) / image.Height);

    private static SKImage? Downscaled(SKImage image, FigureOptions options)
    {
        var k = DrawScale(image, options) * options.Scale;
        if (k >= 0.9) return null;
        var info = new SKImageInfo(Math.Max(1, (int)Math.Ceiling(image.Width * k)), Math.Max(1, (int)Math.Ceiling(image.Height * k)), SKColorType.Rgba8888, SKAlphaType.Opaque);
        using var bitmap = new SKBitmap(info);
        using var pixmap = bitmap.PeekPixels();
        if (!image.ScalePixels(pixmap, new SKSamplingOptions(SKCubicResampler.Mitchell))) return null;
        return SKImage.FromPixelCopy(pixmap);
    }

    internal static SKImage Decode(ReferenceFrame frame)
    {
        if (frame.EncodedImage is { Length: > 0 } encoded)
        {
            return SKImage.FromEncodedData(encoded) ?? throw new ArgumentException("The reference frame image could not be decoded.", nameof(frame));
        }

        if (frame.BgrPixels is { } bgr && frame.BgrWidthPx > 0 && frame.BgrHeightPx > 0)
        {
            var stride = frame.BgrStrideBytes > 0 ? frame.BgrStrideBytes : 3 * frame.BgrWidthPx;
            if (stride < 3 * frame.BgrWidthPx || bgr.Length < stride * (frame.BgrHeightPx - 1) + 3 * frame.BgrWidthPx)
            {
                throw new ArgumentException("BGR pixel buffer is smaller than width × height × 3.", nameof(frame));
            }

            var rgba = new byte[frame.BgrWidthPx * frame.BgrHeightPx * 4];
            for (var y = 0; y < frame.BgrHeightPx; y++)
            {
                for (var x = 0; x < frame.BgrWidthPx; x++)
                {
                    var s = y * stride + 3 * x;
                    var d = 4 * (y * frame.BgrWidthPx + x);
                    rgba[d] = bgr[s + 2];
                    rgba[d + 1] = bgr[s + 1];
                    rgba[d + 2] = bgr[s];
                    rgba[d + 3] = 255;
                }
            }

            return SKImage.FromPixelCopy(new SKImageInfo(frame.BgrWidthPx, frame.BgrHeightPx, SKColorType.Rgba8888, SKAlphaType.Opaque), rgba)
                ?? throw new ArgumentException("The BGR pixels could not be turned into an image.", nameof(frame));
        }

        throw new ArgumentException("The reference frame has neither an encoded image nor BGR pixels.", nameof(frame));
    }

    private static void DrawDoubleLine(SKCanvas canvas, SKPoint a, SKPoint b, SKColor colour, float[] dash)
    {
        using var under = FigureStyle.Stroke(UnderStroke, 4.5f);
        using var over = FigureStyle.Stroke(colour, 2, dash);
        canvas.DrawLine(a, b, under);
        canvas.DrawLine(a, b, over);
    }

    private static void OutlinedText(SKCanvas canvas, string text, float x, float y, SKTextAlign align, SKFont font, SKColor colour)
    {
        using var outline = new SKPaint { Color = UnderStroke, IsAntialias = true, Style = SKPaintStyle.Stroke, StrokeWidth = 4, StrokeJoin = SKStrokeJoin.Round };
        using var fill = FigureStyle.Fill(colour);
        canvas.DrawText(text, x, y, align, font, outline);
        canvas.DrawText(text, x, y, align, font, fill);
    }

    private static void DrawLegend(SKCanvas canvas, float y)
    {
        using var font = FigureStyle.Font(FigureStyle.AnnotationSize);
        using var ink = FigureStyle.Fill(FigureStyle.Ink);
        var x = 24f;
        void Item(string text, Action<float, float> symbol)
        {
            symbol(x, y + 10);
            canvas.DrawText(text, x + 36, y + 15, SKTextAlign.Left, font, ink);
            x += 36 + font.MeasureText(text) + 34;
        }

        Item("string axis", (sx, sy) => DrawDoubleLine(canvas, new SKPoint(sx, sy), new SKPoint(sx + 28, sy), AxisColour, [8, 5]));
        Item("string end", (sx, sy) =>
        {
            using var fill = FigureStyle.Fill(EndColour);
            using var edge = FigureStyle.Stroke(UnderStroke, 2);
            canvas.DrawRect(new SKRect(sx + 7, sy - 7, sx + 21, sy + 7), fill);
            canvas.DrawRect(new SKRect(sx + 7, sy - 7, sx + 21, sy + 7), edge);
        });
        Item("mark at rest (number)", (sx, sy) =>
        {
            using var under = FigureStyle.Stroke(UnderStroke, 5);
            using var ring = FigureStyle.Stroke(MarkColour, 2.4f);
            canvas.DrawCircle(sx + 14, sy, 8, under);
            canvas.DrawCircle(sx + 14, sy, 8, ring);
        });
        Item("track extent (min–max x, y)", (sx, sy) =>
        {
            using var under = FigureStyle.Stroke(UnderStroke, 3.5f);
            using var over = FigureStyle.Stroke(ExtentColour, 1.6f);
            canvas.DrawRect(new SKRect(sx + 2, sy - 7, sx + 26, sy + 7), under);
            canvas.DrawRect(new SKRect(sx + 2, sy - 7, sx + 26, sy + 7), over);
        });
    }
}
