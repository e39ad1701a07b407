using SkiaSharp;

namespace StringModes.Reporting.Figures;

/// <summary>A rectangular data area with linear x and y scales, its ticks, labels and frame.</summary>
internal sealed class Axes
{
    public Axes(SKRect plot, double xMin, double xMax, double yMin, double yMax)
    {
        Plot = plot;
        (XMin, XMax) = NiceTicks.SafeRange(xMin, xMax);
        (YMin, YMax) = NiceTicks.SafeRange(yMin, yMax);
    }

    public SKRect Plot { get; }

    public double XMin { get; }

    public double XMax { get; }

    public double YMin { get; }

    public double YMax { get; }

    /// <summary>Standard data-area placement for a figure, leaving room on the right for a colour bar when asked.</summary>
    public static SKRect PlotArea(FigureOptions options, bool colourBar, float extraRight = 0) =>
        new(104, 74, options.WidthPx - (colourBar ? 150 : 36) - extraRight, options.HeightPx - 84);

    public float X(double value) => Plot.Left + (float)((value - XMin) / (XMax - XMin) * Plot.Width);

    public float Y(double value) => Plot.Bottom - (float)((value - YMin) / (YMax - YMin) * Plot.Height);

    public PixelRect PlotPx => new(Plot.Left, Plot.Top, Plot.Right, Plot.Bottom);

    public AxesRange Range => new(XMin, XMax, YMin, YMax);

    public void FillBackground(SKCanvas canvas, SKColor colour)
    {
        using var paint = FigureStyle.Fill(colour);
        canvas.DrawRect(Plot, paint);
    }

    public void DrawGrid(SKCanvas canvas, TickSet? xTicks, TickSet? yTicks)
    {
        using var paint = FigureStyle.Stroke(FigureStyle.Grid, 1);
        foreach (var v in xTicks?.Values ?? [])
        {
            var x = Snap(X(v));
            canvas.DrawLine(x, Plot.Top, x, Plot.Bottom, paint);
        }

        foreach (var v in yTicks?.Values ?? [])
        {
            var y = Snap(Y(v));
            canvas.DrawLine(Plot.Left, y, Plot.Right, y, paint);
        }
    }

    public void DrawFrame(SKCanvas canvas)
    {
        using var paint = FigureStyle.Stroke(FigureStyle.Ink, 1.2f);
        canvas.DrawRect(Plot, paint);
    }

    public void DrawXAxis(SKCanvas canvas, TickSet ticks, string label, Func<double, string>? labeller = null)
    {
        using var tickPaint = FigureStyle.Stroke(FigureStyle.Ink, 1.2f);
        using var textPaint = FigureStyle.Fill(FigureStyle.Ink);
        using var tickFont = FigureStyle.Font(FigureStyle.TickLabelSize);
        foreach (var v in ticks.Values)
        {
            var x = Snap(X(v));
            canvas.DrawLine(x, Plot.Bottom, x, Plot.Bottom + FigureStyle.TickLength, tickPaint);
            canvas.DrawText(labeller?.Invoke(v) ?? ticks.Label(v), x, Plot.Bottom + FigureStyle.TickLength + 17, SKTextAlign.Center, tickFont, textPaint);
        }

        using var labelFont = FigureStyle.Font(FigureStyle.AxisLabelSize);
        canvas.DrawText(label, Plot.MidX, Plot.Bottom + 58, SKTextAlign.Center, labelFont, textPaint);
    }

    public void DrawYAxis(SKCanvas canvas, TickSet ticks, string label, Func<double, string>? labeller = null)
    {
        using var tickPaint = FigureStyle.Stroke(FigureStyle.Ink, 1.2f);
        using var textPaint = FigureStyle.Fill(FigureStyle.Ink);
        using var tickFont = FigureStyle.Font(FigureStyle.TickLabelSize);
        var widest = 0f;
        foreach (var v in ticks.Values)
        {
            var y = Snap(Y(v));
            var text = labeller?.Invoke(v) ?? ticks.Label(v);
            widest = Math.Max(widest, tickFont.MeasureText(text));
            canvas.DrawLine(Plot.Left - FigureStyle.TickLength, y, Plot.Left, y, tickPaint);
            canvas.DrawText(text, Plot.Left - FigureStyle.TickLength - 5, y + 5, SKTextAlign.Right, tickFont, textPaint);
        }

        using var labelFont = FigureStyle.Font(FigureStyle.AxisLabelSize);
        var lx = Math.Max(20, Plot.Left - FigureStyle.TickLength - 14 - widest);
        canvas.Save();
        canvas.RotateDegrees(-90, lx, Plot.MidY);
        canvas.DrawText(label, lx, Plot.MidY, SKTextAlign.Center, labelFont, textPaint);
        canvas.Restore();
    }

    /// <summary>Title (bold) and an optional one-line subtitle above the data area.</summary>
    public static void DrawTitle(SKCanvas canvas, float left, string title, string? subtitle)
    {
        using var paint = FigureStyle.Fill(FigureStyle.Ink);
        using var titleFont = FigureStyle.Font(FigureStyle.TitleSize, bold: true);
        canvas.DrawText(title, left, 32, SKTextAlign.Left, titleFont, paint);
        if (!string.IsNullOrEmpty(subtitle))
        {
            using var muted = FigureStyle.Fill(FigureStyle.MutedInk);
            using var subFont = FigureStyle.Font(FigureStyle.AnnotationSize);
            canvas.DrawText(subtitle, left, 56, SKTextAlign.Left, subFont, muted);
        }
    }

    /// <summary>Clips drawing to the data area until the returned scope is disposed.</summary>
    public CanvasScope ClipToPlot(SKCanvas canvas)
    {
        var count = canvas.Save();
        canvas.ClipRect(Plot);
        return new CanvasScope(canvas, count);
    }

    private static float Snap(float v) => MathF.Round(v) + 0.5f;
}

/// <summary>Restores a canvas to a saved state on dispose.</summary>
internal readonly struct CanvasScope(SKCanvas canvas, int count) : IDisposable
{
    public void Dispose() => canvas.RestoreToCount(count);
}
