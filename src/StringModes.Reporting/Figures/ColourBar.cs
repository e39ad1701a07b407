using SkiaSharp;
using StringModes.Reporting.Colour;

namespace StringModes.Reporting.Figures;

/// <summary>A vertical colour bar beside the data area: the map's gradient, value ticks and a label with units.</summary>
internal static class ColourBar
{
    /// <summary>Draws the bar for values <paramref name="min"/> (bottom) .. <paramref name="max"/> (top); returns the gradient area.</summary>
    public static PixelRect Draw(SKCanvas canvas, SKRect plot, ColourMap map, double min, double max, TickSet ticks, string label)
    {
        var bar = new SKRect(plot.Right + 28, plot.Top, plot.Right + 28 + FigureStyle.ColourBarWidth, plot.Bottom);
        const int steps = 512;
        var pixels = new byte[steps * 4];
        for (var i = 0; i < steps; i++)
        {
            // Row 0 is the top of the bar, i.e. the largest value.
            var (r, g, b) = map.Sample(1 - i / (double)(steps - 1)).ToBytes();
            pixels[4 * i] = r;
            pixels[4 * i + 1] = g;
            pixels[4 * i + 2] = b;
            pixels[4 * i + 3] = 255;
        }

        using (var image = SKImage.FromPixelCopy(new SKImageInfo(1, steps, SKColorType.Rgba8888, SKAlphaType.Opaque), pixels))
        {
            canvas.DrawImage(image, bar, new SKSamplingOptions(SKFilterMode.Linear));
        }

        using var frame = FigureStyle.Stroke(FigureStyle.Ink, 1);
        canvas.DrawRect(bar, frame);
        using var textPaint = FigureStyle.Fill(FigureStyle.Ink);
        using var font = FigureStyle.Font(FigureStyle.TickLabelSize);
        var widest = 0f;
        foreach (var v in ticks.Values)
        {
            var y = MathF.Round(bar.Bottom - (float)((v - min) / (max - min) * bar.Height)) + 0.5f;
            canvas.DrawLine(bar.Right, y, bar.Right + 6, y, frame);
            var text = ticks.Label(v);
            widest = Math.Max(widest, font.MeasureText(text));
            canvas.DrawText(text, bar.Right + 10, y + 5, SKTextAlign.Left, font, textPaint);
        }

        using var labelFont = FigureStyle.Font(FigureStyle.AxisLabelSize);
        var lx = bar.Right + 10 + widest + 22;
        canvas.Save();
        canvas.RotateDegrees(90, lx, bar.MidY);
        canvas.DrawText(label, lx, bar.MidY, SKTextAlign.Center, labelFont, textPaint);
        canvas.Restore();
        return new PixelRect(bar.Left, bar.Top, bar.Right, bar.Bottom);
    }
}
