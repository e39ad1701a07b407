using SkiaSharp;

namespace StringModes.Reporting.Figures;

/// <summary>How a legend entry's sample is drawn.</summary>
internal enum LegendSymbol
{
    Line,
    DashedLine,
    Band,
    Marker,
}

internal sealed record LegendEntry(string Text, SKColor Colour, LegendSymbol Symbol);

/// <summary>A boxed list of entries in a corner of the data area.</summary>
internal static class Legend
{
    public static void Draw(SKCanvas canvas, SKRect plot, IReadOnlyList<LegendEntry> entries, bool topRight = true)
    {
        if (entries.Count == 0)
        {
            return;
        }

        using var font = FigureStyle.Font(FigureStyle.AnnotationSize);
        const float rowHeight = 21, sample = 28, pad = 9;
        var width = entries.Max(e => font.MeasureText(e.Text)) + sample + 3 * pad;
        var height = entries.Count * rowHeight + pad;
        var left = topRight ? plot.Right - width - 10 : plot.Left + 10;
        var box = new SKRect(left, plot.Top + 10, left + width, plot.Top + 10 + height);
        using (var fill = FigureStyle.Fill(new SKColor(255, 255, 255, 230)))
        {
            canvas.DrawRoundRect(box, 4, 4, fill);
        }

        using (var edge = FigureStyle.Stroke(FigureStyle.Grid, 1))
        {
            canvas.DrawRoundRect(box, 4, 4, edge);
        }

        using var textPaint = FigureStyle.Fill(FigureStyle.Ink);
        for (var i = 0; i < entries.Count; i++)
        {
            var e = entries[i];
            var y = box.Top + pad + i * rowHeight + rowHeight / 2 - 2;
            var x0 = box.Left + pad;
            switch (e.Symbol)
            {
                case LegendSymbol.Band:
                    using (var p = FigureStyle.Fill(e.Colour))
                    {
                        canvas.DrawRect(new SKRect(x0, y - 6, x0 + sample, y + 6), p);
                    }

                    break;
                case LegendSymbol.Marker:
                    using (var p = FigureStyle.Fill(e.Colour))
                    {
                        canvas.DrawCircle(x0 + sample / 2, y, 5, p);
                    }

                    break;
                default:
                    using (var p = FigureStyle.Stroke(e.Colour, 2.5f, e.Symbol == LegendSymbol.DashedLine ? [7, 4] : null))
                    {
                        canvas.DrawLine(x0, y, x0 + sample, y, p);
                    }

                    break;
            }

            canvas.DrawText(e.Text, x0 + sample + pad, y + 5, SKTextAlign.Left, font, textPaint);
        }
    }
}
