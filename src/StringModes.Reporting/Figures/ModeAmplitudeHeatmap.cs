using SkiaSharp;
using StringModes.Reporting.Colour;
using StringModes.Reporting.Model;

namespace StringModes.Reporting.Figures;

/// <summary>
/// Mode-amplitude heatmap: mode number (rows) × time (columns), colour = envelope amplitude in dB re the
/// largest amplitude of any mode at any time, on the sequential map, clipped at a floor. Shows at a glance
/// which modes the pluck excited, how fast each dies away and whether energy moves between modes.
/// </summary>
public static class ModeAmplitudeHeatmap
{
    /// <summary>File-name stem of this figure.</summary>
    public const string Name = "mode-amplitude";

    /// <summary>
    /// Renders the heatmap. <paramref name="floorDb"/> (−200..−6, default −60) is the level drawn darkest;
    /// <paramref name="analysisWindowS"/> optionally marks the analysed time span with dashed lines.
    /// </summary>
    public static RenderedFigure Render(
        ModeAmplitudeSeries series,
        double floorDb = -60,
        (double StartS, double EndS)? analysisWindowS = null,
        FigureOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(series);
        if (!(floorDb >= -200 && floorDb <= -6))
        {
            throw new ArgumentOutOfRangeException(nameof(floorDb), "The floor must be −200..−6 dB.");
        }

        options ??= FigureOptions.Default;
        var map = ColourMaps.Sequential;
        var modes = series.ModeNumbers.Length;
        var times = series.TimesS;
        var maxAmplitude = series.AmplitudeM.SelectMany(r => r).Where(double.IsFinite).DefaultIfEmpty(0).Max();
        var caption = FigureText.Invariant($"Envelope amplitude of each mode over time, in dB relative to the largest amplitude observed; levels below {FigureText.Number(floorDb, 0)} dB are drawn at the floor colour.");

        return FigureRenderer.Render(Name, caption, options, canvas =>
        {
            var plot = Axes.PlotArea(options, colourBar: true);
            var t0 = times.Length > 0 ? times[0] : 0;
            var t1 = times.Length > 1 ? times[^1] : t0 + 1;
            var axes = new Axes(plot, t0, t1, 0.5, modes + 0.5);
            Axes.DrawTitle(canvas, plot.Left, "Mode amplitude over time",
                FigureText.Invariant($"Envelope of each modal coordinate, dB re the largest ({FigureText.Number(maxAmplitude * 1e3, FigureText.DecimalsFor(maxAmplitude * 1e3, 3))} mm); floor {FigureText.Number(floorDb, 0)} dB"));

            if (modes > 0 && times.Length > 0)
            {
                var w = Math.Max(1, (int)Math.Round(plot.Width));
                var h = Math.Max(1, (int)Math.Round(plot.Height));
                var columnToTime = new int[w];
                for (var c = 0; c < w; c++)
                {
                    columnToTime[c] = Sampling.NearestIndex(times, axes.XMin + (c + 0.5) / w * (axes.XMax - axes.XMin));
                }

                using var image = RasterImage.FromValues(w, h, map, (c, r) =>
                {
                    // Row 0 of the image is the top of the plot: the highest row index (last mode listed).
                    var rowIndex = modes - 1 - (int)Math.Floor(r / (double)h * modes);
                    var a = series.AmplitudeM[Math.Clamp(rowIndex, 0, modes - 1)][columnToTime[c]];
                    return Level(a, maxAmplitude, floorDb);
                });
                canvas.DrawImage(image, plot, new SKSamplingOptions(SKFilterMode.Nearest));

                using var separator = FigureStyle.Stroke(new SKColor(255, 255, 255, 150), 1);
                for (var k = 1; k < modes; k++)
                {
                    var y = MathF.Round(axes.Y(k + 0.5)) + 0.5f;
                    canvas.DrawLine(plot.Left, y, plot.Right, y, separator);
                }
            }

            if (analysisWindowS is { } window)
            {
                using var clip = axes.ClipToPlot(canvas);
                using var dark = FigureStyle.Stroke(new SKColor(0, 0, 0, 170), 3, [9, 6]);
                using var light = FigureStyle.Stroke(new SKColor(255, 255, 255, 230), 1.5f, [9, 6]);
                foreach (var t in new[] { window.StartS, window.EndS })
                {
                    var x = axes.X(t);
                    canvas.DrawLine(x, plot.Top, x, plot.Bottom, dark);
                    canvas.DrawLine(x, plot.Top, x, plot.Bottom, light);
                }
            }

            axes.DrawFrame(canvas);
            axes.DrawXAxis(canvas, NiceTicks.Generate(axes.XMin, axes.XMax, 8), "Time (s)");
            var rowTicks = NiceTicks.Generate(1, modes, Math.Min(modes, 16), minimumStep: 1);
            axes.DrawYAxis(canvas, rowTicks, "Mode number n", v =>
            {
                var index = (int)Math.Round(v) - 1;
                return index >= 0 && index < modes ? series.ModeNumbers[index].ToString(System.Globalization.CultureInfo.InvariantCulture) : "";
            });
            var barTicks = NiceTicks.Generate(floorDb, 0, 7);
            var bar = ColourBar.Draw(canvas, plot, map, floorDb, 0, barTicks, "Amplitude (dB re max)");
            return new DrawnLayout(axes.PlotPx, bar, axes.Range);
        });
    }

    /// <summary>Colour-map fraction of amplitude <paramref name="a"/>: 0 at the floor, 1 at the maximum.</summary>
    internal static double Level(double a, double maxAmplitude, double floorDb)
    {
        if (!(a > 0) || !(maxAmplitude > 0) || !double.IsFinite(a))
        {
            return 0;
        }

        var db = 20 * Math.Log10(a / maxAmplitude);
        return Math.Clamp((db - floorDb) / -floorDb, 0, 1);
    }
}
