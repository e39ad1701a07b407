using SkiaSharp;

namespace StringModes.Reporting.Figures;

/// <summary>Shared sizes (pixels at scale 1) and colours of figure furniture.</summary>
internal static class FigureStyle
{
    public const float TitleSize = 22;
    public const float AxisLabelSize = 17;
    public const float TickLabelSize = 15;
    public const float AnnotationSize = 14;
    public const float TickLength = 7;
    public const float ColourBarWidth = 24;

    public static readonly SKColor Background = SKColors.White;
    public static readonly SKColor Ink = new(0x22, 0x26, 0x2e);
    public static readonly SKColor MutedInk = new(0x5a, 0x60, 0x6b);
    public static readonly SKColor Grid = new(0xe3, 0xe6, 0xea);
    public static readonly SKColor Reference = new(0x7a, 0x7f, 0x88);

    public static SKFont Font(float size, bool bold = false) =>
        new(bold ? FigureFonts.Bold : FigureFonts.Regular, size) { Subpixel = true, Edging = SKFontEdging.Antialias };

    public static SKPaint Fill(SKColor colour) => new() { Color = colour, IsAntialias = true, Style = SKPaintStyle.Fill };

    public static SKPaint Stroke(SKColor colour, float width, float[]? dash = null) => new()
    {
        Color = colour,
        IsAntialias = true,
        Style = SKPaintStyle.Stroke,
        StrokeWidth = width,
        PathEffect = dash is null ? null : SKPathEffect.CreateDash(dash, 0),
    };

    public static SKColor ToSk(Colour.SrgbColour c, byte alpha = 255)
    {
        var (r, g, b) = c.ToBytes();
        return new SKColor(r, g, b, alpha);
    }
}
