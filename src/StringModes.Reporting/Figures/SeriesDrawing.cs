using SkiaSharp;

namespace StringModes.Reporting.Figures;

/// <summary>Polylines and markers in data coordinates.</summary>
internal static class SeriesDrawing
{
    /// <summary>
    /// Draws y(x) as a polyline. With more points than pixel columns, each column keeps its minimum and maximum
    /// so narrow spectral peaks survive the thinning.
    /// </summary>
    public static void Polyline(SKCanvas canvas, Axes axes, double[] x, double[] y, SKPaint paint)
    {
        using var path = new SKPathBuilder();
        var started = false;
        var count = Math.Min(x.Length, y.Length);
        var columns = Math.Max(1, (int)axes.Plot.Width);
        if (count > 4 * columns)
        {
            var lastColumn = int.MinValue;
            double lo = double.MaxValue, hi = double.MinValue;
            double loX = 0, hiX = 0;
            void Flush()
            {
                if (lastColumn == int.MinValue)
                {
                    return;
                }

                var (first, second) = loX <= hiX ? ((loX, lo), (hiX, hi)) : ((hiX, hi), (loX, lo));
                foreach (var (px, py) in new[] { first, second })
                {
                    var point = new SKPoint(axes.X(px), axes.Y(py));
                    if (started)
                    {
                        path.LineTo(point);
                    }
                    else
                    {
                        path.MoveTo(point);
                        started = true;
                    }
                }
            }

            for (var i = 0; i < count; i++)
            {
                if (!double.IsFinite(x[i]) || !double.IsFinite(y[i]))
                {
                    continue;
                }

                var column = (int)Math.Floor(axes.X(x[i]));
                if (column != lastColumn)
                {
                    Flush();
                    lastColumn = column;
                    lo = double.MaxValue;
                    hi = double.MinValue;
                }

                if (y[i] < lo)
                {
                    lo = y[i];
                    loX = x[i];
                }

                if (y[i] > hi)
                {
                    hi = y[i];
                    hiX = x[i];
                }
            }

            Flush();
        }
        else
        {
            for (var i = 0; i < count; i++)
            {
                if (!double.IsFinite(x[i]) || !double.IsFinite(y[i]))
                {
                    started = false;
                    continue;
                }

                var point = new SKPoint(axes.X(x[i]), axes.Y(y[i]));
                if (started)
                {
                    path.LineTo(point);
                }
                else
                {
                    path.MoveTo(point);
                    started = true;
                }
            }
        }

        DrawBuilt(canvas, path, paint);
    }

    /// <summary>A filled band between lower(x) and upper(x).</summary>
    public static void Band(SKCanvas canvas, Axes axes, double[] x, double[] lower, double[] upper, SKPaint paint)
    {
        if (x.Length < 2)
        {
            return;
        }

        using var path = new SKPathBuilder();
        path.MoveTo(axes.X(x[0]), axes.Y(upper[0]));
        for (var i = 1; i < x.Length; i++)
        {
            path.LineTo(axes.X(x[i]), axes.Y(upper[i]));
        }

        for (var i = x.Length - 1; i >= 0; i--)
        {
            path.LineTo(axes.X(x[i]), axes.Y(lower[i]));
        }

        path.Close();
        DrawBuilt(canvas, path, paint);
    }

    private static void DrawBuilt(SKCanvas canvas, SKPathBuilder builder, SKPaint paint)
    {
        using var path = builder.Detach();
        canvas.DrawPath(path, paint);
    }

    /// <summary>Text with a white halo so it stays legible over lines and images.</summary>
    public static void HaloText(SKCanvas canvas, string text, float x, float y, SKTextAlign align, SKFont font, SKColor colour)
    {
        using var halo = new SKPaint { Color = new SKColor(255, 255, 255, 235), IsAntialias = true, Style = SKPaintStyle.Stroke, StrokeWidth = 4, StrokeJoin = SKStrokeJoin.Round };
        using var fill = FigureStyle.Fill(colour);
        canvas.DrawText(text, x, y, align, font, halo);
        canvas.DrawText(text, x, y, align, font, fill);
    }
}
