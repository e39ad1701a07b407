namespace StringModes.Reporting.Figures;

/// <summary>A rectangle in figure pixels (origin top left, y down).</summary>
public readonly record struct PixelRect(double LeftPx, double TopPx, double RightPx, double BottomPx)
{
    /// <summary>Width in pixels.</summary>
    public double WidthPx => RightPx - LeftPx;

    /// <summary>Height in pixels.</summary>
    public double HeightPx => BottomPx - TopPx;
}

/// <summary>Data range of a figure's main axes, in the units of its axis labels.</summary>
public readonly record struct AxesRange(double XMin, double XMax, double YMin, double YMax);

/// <summary>
/// One figure rendered twice from the same drawing: a PNG image and an SVG document.
/// <see cref="PlotAreaPx"/> and <see cref="ColourBarAreaPx"/> give where the data and the colour bar were
/// drawn (in PNG pixels at <see cref="FigureOptions.Scale"/> 1), so callers and tests can read the figure back.
/// </summary>
public sealed record RenderedFigure
{
    /// <summary>Short file-name stem, e.g. "mode-amplitude".</summary>
    public required string Name { get; init; }

    /// <summary>One-sentence caption for reports.</summary>
    public required string Caption { get; init; }

    /// <summary>PNG-encoded image.</summary>
    public required byte[] Png { get; init; }

    /// <summary>SVG document (UTF-8 text).</summary>
    public required string Svg { get; init; }

    /// <summary>PNG width in pixels.</summary>
    public required int WidthPx { get; init; }

    /// <summary>PNG height in pixels.</summary>
    public required int HeightPx { get; init; }

    /// <summary>Pixel density the PNG was rendered at; display size is WidthPx / Scale × HeightPx / Scale.</summary>
    public double Scale { get; init; } = 1;

    /// <summary>Data area of the main axes in PNG pixels.</summary>
    public required PixelRect PlotAreaPx { get; init; }

    /// <summary>Data range of the main axes (for images: the image pixel extent).</summary>
    public required AxesRange AxesRange { get; init; }

    /// <summary>Colour bar gradient area in PNG pixels; null when colour carries no data.</summary>
    public PixelRect? ColourBarAreaPx { get; init; }
}
