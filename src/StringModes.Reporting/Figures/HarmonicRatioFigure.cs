using SkiaSharp;
using StringModes.Reporting.Colour;
using StringModes.Reporting.Model;

namespace StringModes.Reporting.Figures;

/// <summary>
/// Harmonic ratio f_n / (n·f_1) against mode number with ± standard-uncertainty error bars (k = 1), the ideal
/// flexible-string line at 1 and, when an inharmonicity B is given, the stiff-string curve
/// √(1 + B·n²) / √(1 + B) (pinned ends; Fletcher 1964).
/// </summary>
public static class HarmonicRatioFigure
{
    /// <summary>File-name stem of this figure.</summary>
    public const string Name = "harmonic-ratio";

    /// <summary>Renders the chart; <paramref name="inharmonicity"/> (B ≥ 0) adds the stiff-string curve.</summary>
    public static RenderedFigure Render(IReadOnlyList<HarmonicRatioPoint> points, double? inharmonicity = null, FigureOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        options ??= FigureOptions.Default;
        var valid = points.Where(p => double.IsFinite(p.Ratio.Value)).ToArray();
        var nMax = valid.Select(p => p.ModeNumber).DefaultIfEmpty(1).Max();
        double U(HarmonicRatioPoint p) => double.IsFinite(p.Ratio.StandardUncertainty) && p.Ratio.StandardUncertainty > 0 ? p.Ratio.StandardUncertainty : 0;
        var lo = valid.Select(p => p.Ratio.Value - U(p)).Append(1.0).Min();
        var hi = valid.Select(p => p.Ratio.Value + U(p)).Append(1.0).Max();
        double Curve(double n) => Math.Sqrt(1 + inharmonicity!.Value * n * n) / Math.Sqrt(1 + inharmonicity!.Value);
        if (inharmonicity is >= 0)
        {
            hi = Math.Max(hi, Curve(nMax));
        }

        var pad = Math.Max((hi - lo) * 0.12, 2e-4);
        const string caption = "Ratio of each mode frequency to n times the fundamental, with standard-uncertainty error bars; an ideal flexible string gives exactly 1.";

        return FigureRenderer.Render(Name, caption, options, canvas =>
        {
            var plot = Axes.PlotArea(options, colourBar: false);
            var axes = new Axes(plot, 0.5, nMax + 0.5, lo - pad, hi + pad);
            Axes.DrawTitle(canvas, plot.Left, "Harmonic ratio f\u2099 / (n·f\u2081)", "Error bars: ± standard uncertainty (k = 1)");
            var xTicks = NiceTicks.Generate(1, nMax, Math.Min(nMax, 16), minimumStep: 1);
            var yTicks = NiceTicks.Generate(axes.YMin, axes.YMax, 8);
            axes.DrawGrid(canvas, null, yTicks);
            var legend = new List<LegendEntry>
            {
                new("Ideal flexible string (1)", FigureStyle.Reference, LegendSymbol.DashedLine),
            };
            var pointColour = FigureStyle.ToSk(ColourMaps.Category(0));
            using (axes.ClipToPlot(canvas))
            {
                using var ideal = FigureStyle.Stroke(FigureStyle.Reference, 1.8f, [9, 6]);
                canvas.DrawLine(plot.Left, axes.Y(1), plot.Right, axes.Y(1), ideal);
                if (inharmonicity is >= 0 and var b)
                {
                    var curveColour = FigureStyle.ToSk(ColourMaps.Category(1));
                    using var curve = FigureStyle.Stroke(curveColour, 1.8f);
                    var ns = Enumerable.Range(0, 200).Select(i => 0.5 + (nMax) * i / 199.0).ToArray();
                    SeriesDrawing.Polyline(canvas, axes, ns, ns.Select(Curve).ToArray(), curve);
                    legend.Add(new LegendEntry(FigureText.Invariant($"Stiff string, B = {Formatting.UncertaintyFormat.FormatValue(b, 3)}"), curveColour, LegendSymbol.Line));
                }

                using var bar = FigureStyle.Stroke(FigureStyle.Ink, 1.6f);
                using var dot = FigureStyle.Fill(pointColour);
                using var edge = FigureStyle.Stroke(FigureStyle.Ink, 1.2f);
                foreach (var p in valid)
                {
                    var x = axes.X(p.ModeNumber);
                    var u = U(p);
                    if (u > 0)
                    {
                        float top = axes.Y(p.Ratio.Value + u), bottom = axes.Y(p.Ratio.Value - u);
                        canvas.DrawLine(x, top, x, bottom, bar);
                        canvas.DrawLine(x - 6, top, x + 6, top, bar);
                        canvas.DrawLine(x - 6, bottom, x + 6, bottom, bar);
                    }

                    canvas.DrawCircle(x, axes.Y(p.Ratio.Value), 5.5f, dot);
                    canvas.DrawCircle(x, axes.Y(p.Ratio.Value), 5.5f, edge);
                }
            }

            legend.Insert(0, new LegendEntry("Measured f\u2099 / (n·f\u2081)", pointColour, LegendSymbol.Marker));
            axes.DrawFrame(canvas);
            axes.DrawXAxis(canvas, xTicks, "Mode number n");
            axes.DrawYAxis(canvas, yTicks, "f\u2099 / (n·f\u2081)");
            Legend.Draw(canvas, plot, legend, topRight: false);
            return new DrawnLayout(axes.PlotPx, null, axes.Range);
        });
    }
}
