using SkiaSharp;
using StringModes.Reporting.Colour;

namespace StringModes.Reporting.Figures;

/// <summary>Builds an opaque RGBA image whose pixel (column, row) colour is map(value(column, row)).</summary>
internal static class RasterImage
{
    public static SKImage FromValues(int widthPx, int heightPx, ColourMap map, Func<int, int, double> fraction)
    {
        var pixels = new byte[widthPx * heightPx * 4];
        for (var row = 0; row < heightPx; row++)
        {
            for (var col = 0; col < widthPx; col++)
            {
                var (r, g, b) = map.Sample(fraction(col, row)).ToBytes();
                var i = 4 * (row * widthPx + col);
                pixels[i] = r;
                pixels[i + 1] = g;
                pixels[i + 2] = b;
                pixels[i + 3] = 255;
            }
        }

        return SKImage.FromPixelCopy(new SKImageInfo(widthPx, heightPx, SKColorType.Rgba8888, SKAlphaType.Opaque), pixels)
            ?? throw new InvalidOperationException("Could not build a raster image.");
    }
}
