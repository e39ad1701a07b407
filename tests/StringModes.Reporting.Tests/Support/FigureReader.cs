using System.Xml.Linq;
using SkiaSharp;
using StringModes.Reporting.Colour;
using StringModes.Reporting.Figures;

namespace StringModes.Reporting.Tests.Support;

/// <summary>Reads rendered figures back: decodes the PNG with SkiaSharp and samples pixel colours.</summary>
internal sealed class FigureReader : IDisposable
{
    private readonly SKBitmap _bitmap;

    public FigureReader(RenderedFigure figure)
    {
        Figure = figure;
        _bitmap = SKBitmap.Decode(figure.Png) ?? throw new InvalidOperationException("PNG did not decode.");
        if (Environment.GetEnvironmentVariable("STRINGMODES_FIGURE_DUMP") is { Length: > 0 } dir)
        {
            Directory.CreateDirectory(dir);
            File.WriteAllBytes(Path.Combine(dir, figure.Name + ".png"), figure.Png);
            File.WriteAllText(Path.Combine(dir, figure.Name + ".svg"), figure.Svg);
        }
    }

    public RenderedFigure Figure { get; }

    public int Width => _bitmap.Width;

    public int Height => _bitmap.Height;

    public SrgbColour Pixel(double x, double y)
    {
        var c = _bitmap.GetPixel((int)Math.Floor(x), (int)Math.Floor(y));
        return SrgbColour.FromBytes(c.Red, c.Green, c.Blue);
    }

    /// <summary>Fraction of the colour map at a pixel and the Oklab distance to the nearest map colour.</summary>
    public (double Fraction, double Distance) MapValue(ColourMap map, double x, double y) => map.Invert(Pixel(x, y));

    /// <summary>Number of distinct colours in a rectangle (to tell a drawn area from a blank one).</summary>
    public int DistinctColours(PixelRect r)
    {
        var set = new HashSet<SKColor>();
        for (var y = (int)r.TopPx; y < (int)r.BottomPx; y++)
        {
            for (var x = (int)r.LeftPx; x < (int)r.RightPx; x++)
            {
                set.Add(_bitmap.GetPixel(x, y));
            }
        }

        return set.Count;
    }

    /// <summary>Pixel position of a data point on the main axes (linear scales).</summary>
    public (double X, double Y) ToPixel(double x, double y)
    {
        var r = Figure.AxesRange;
        var p = Figure.PlotAreaPx;
        return (p.LeftPx + (x - r.XMin) / (r.XMax - r.XMin) * p.WidthPx,
                p.BottomPx - (y - r.YMin) / (r.YMax - r.YMin) * p.HeightPx);
    }

    /// <summary>Oklab distance between the pixel colour and <paramref name="colour"/>.</summary>
    public double ColourDistance(double x, double y, SrgbColour colour) =>
        Oklab.FromSrgb(Pixel(x, y)).DistanceTo(Oklab.FromSrgb(colour));

    /// <summary>True when some pixel within <paramref name="radius"/> of (x, y) is within 0.04 (Oklab) of <paramref name="colour"/>.</summary>
    public bool HasColourNear(double x, double y, SrgbColour colour, int radius = 3)
    {
        for (var dy = -radius; dy <= radius; dy++)
        {
            for (var dx = -radius; dx <= radius; dx++)
            {
                if (ColourDistance(x + dx, y + dy, colour) < 0.04)
                {
                    return true;
                }
            }
        }

        return false;
    }

    public static XDocument ParseSvg(RenderedFigure figure)
    {
        var doc = XDocument.Parse(figure.Svg);
        Assert.Equal("svg", doc.Root!.Name.LocalName);
        return doc;
    }

    public void Dispose() => _bitmap.Dispose();
}
