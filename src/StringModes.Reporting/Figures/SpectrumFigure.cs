using SkiaSharp;
using StringModes.Reporting.Colour;
using StringModes.Reporting.Formatting;
using StringModes.Reporting.Model;

namespace StringModes.Reporting.Figures;

/// <summary>
/// Magnitude spectra of the modal coordinates in dB (re the largest bin of all spectra shown) against
/// frequency, one colour per mode, with each fitted peak marked by a triangle and labelled with its mode
/// and fitted frequency. Pass one spectrum for a single-mode figure.
/// </summary>
public static class SpectrumFigure
{
    /// <summary>File-name stem of this figure.</summary>
    public const string Name = "spectra";

    /// <summary>Renders the spectra; bins below <paramref name="floorDb"/> (−200..−10, default −80) are drawn at the floor.</summary>
    public static RenderedFigure Render(IReadOnlyList<ModeSpectrum> spectra, double floorDb = -80, FigureOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(spectra);
        if (!(floorDb >= -200 && floorDb <= -10))
        {
            throw new ArgumentOutOfRangeException(nameof(floorDb), "The floor must be −200..−10 dB.");
        }

        options ??= FigureOptions.Default;
        var reference = spectra.SelectMany(s => s.Magnitude).Where(m => double.IsFinite(m) && m > 0).DefaultIfEmpty(1).Max();
        double Db(double m) => m > 0 && double.IsFinite(m) ? Math.Max(floorDb, 20 * Math.Log10(m / reference)) : floorDb;
        var fMin = spectra.Where(s => s.FrequenciesHz.Length > 0).Select(s => s.FrequenciesHz[0]).DefaultIfEmpty(0).Min();
        var fMax = spectra.Where(s => s.FrequenciesHz.Length > 0).Select(s => s.FrequenciesHz[^1]).DefaultIfEmpty(1).Max();
        const string caption = "Magnitude spectrum of each modal coordinate in dB relative to the largest component; triangles mark the fitted mode frequencies.";

        return FigureRenderer.Render(Name, caption, options, canvas =>
        {
            var plot = Axes.PlotArea(options, colourBar: false);
            // Headroom above 0 dB for the peak labels.
            var axes = new Axes(plot, fMin, fMax, floorDb, 14);
            Axes.DrawTitle(canvas, plot.Left, "Spectra of the modal coordinates", "Magnitude in dB re the largest component; fitted peaks marked");
            var xTicks = NiceTicks.Generate(axes.XMin, axes.XMax, 9);
            var yTicks = NiceTicks.Generate(floorDb, 0, 9);
            axes.DrawGrid(canvas, xTicks, yTicks);
            var legend = new List<LegendEntry>();
            var labelBoxes = new List<SKRect>();
            using (axes.ClipToPlot(canvas))
            {
                for (var k = 0; k < spectra.Count; k++)
                {
                    var s = spectra[k];
                    var colour = FigureStyle.ToSk(ColourMaps.Category(k));
                    using var line = FigureStyle.Stroke(colour, 1.6f);
                    SeriesDrawing.Polyline(canvas, axes, s.FrequenciesHz, s.Magnitude.Select(Db).ToArray(), line);
                    legend.Add(new LegendEntry(FigureText.Invariant($"n = {s.ModeNumber}"), colour, LegendSymbol.Line));
                }

                using var font = FigureStyle.Font(FigureStyle.AnnotationSize);
                for (var k = 0; k < spectra.Count; k++)
                {
                    var s = spectra[k];
                    var colour = FigureStyle.ToSk(ColourMaps.Category(k));
                    foreach (var peak in s.Peaks)
                    {
                        if (!double.IsFinite(peak.FrequencyHz))
                        {
                            continue;
                        }

                        var level = Db(Sampling.Interpolate(s.FrequenciesHz, s.Magnitude, peak.FrequencyHz));
                        var x = axes.X(peak.FrequencyHz);
                        var tipY = axes.Y(level) - 4;
                        using var marker = FigureStyle.Fill(colour);
                        using var outline = FigureStyle.Stroke(FigureStyle.Ink, 1);
                        using var tri = new SKPathBuilder();
                        tri.MoveTo(x, tipY);
                        tri.LineTo(x - 7, tipY - 12);
                        tri.LineTo(x + 7, tipY - 12);
                        tri.Close();
                        using var triangle = tri.Detach();
                        canvas.DrawPath(triangle, marker);
                        canvas.DrawPath(triangle, outline);

                        var frequency = peak.FrequencyUncertaintyHz > 0
                            ? UncertaintyFormat.FormatValueOnly(peak.FrequencyHz, peak.FrequencyUncertaintyHz)
                            : UncertaintyFormat.FormatValue(peak.FrequencyHz, 5);
                        var text = $"{peak.Label}: {frequency} Hz";
                        var width = font.MeasureText(text);
                        var y = tipY - 18;
                        var box = new SKRect(x - width / 2 - 3, y - 14, x + width / 2 + 3, y + 4);
                        // Lift a label above any earlier one it would overlap.
                        while (labelBoxes.Any(b => b.IntersectsWith(box)) && box.Top > plot.Top + 20)
                        {
                            box.Offset(0, -20);
                            y -= 20;
                        }

                        labelBoxes.Add(box);
                        SeriesDrawing.HaloText(canvas, text, x, y, SKTextAlign.Center, font, FigureStyle.Ink);
                    }
                }
            }

            axes.DrawFrame(canvas);
            axes.DrawXAxis(canvas, xTicks, "Frequency (Hz)");
            axes.DrawYAxis(canvas, yTicks, "Magnitude (dB re max)");
            Legend.Draw(canvas, plot, legend);
            return new DrawnLayout(axes.PlotPx, null, axes.Range);
        });
    }
}
