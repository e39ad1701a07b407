namespace StringModes.Reporting.Figures;

/// <summary>Size and pixel density of a rendered figure.</summary>
public sealed record FigureOptions
{
    /// <summary>Logical width in pixels; 400..4000; default 1200.</summary>
    public int WidthPx { get; init; } = 1200;

    /// <summary>Logical height in pixels; 300..4000; default 700.</summary>
    public int HeightPx { get; init; } = 700;

    /// <summary>
    /// Pixel density of the PNG (2 gives a 2400×1400 image of the same drawing); 1..4; default 1.
    /// Text sizes are given at scale 1 (smallest 13 px) so figures stay readable at 100 % zoom.
    /// </summary>
    public double Scale { get; init; } = 1;

    /// <summary>Default options.</summary>
    public static FigureOptions Default { get; } = new();

    internal void Validate()
    {
        if (WidthPx is < 400 or > 4000 || HeightPx is < 300 or > 4000)
        {
            throw new ArgumentOutOfRangeException(nameof(WidthPx), "Figure size must be 400..4000 × 300..4000 px.");
        }

        if (!(Scale >= 1 && Scale <= 4))
        {
            throw new ArgumentOutOfRangeException(nameof(Scale), "Figure scale must be 1..4.");
        }
    }
}
