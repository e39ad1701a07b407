using SkiaSharp;
using StringModes.Reporting.Colour;
using StringModes.Reporting.Model;

namespace StringModes.Reporting.Figures;

/// <summary>
/// Space–time heatmap of transverse displacement: time (x) × position along the string (y), colour = signed
/// displacement in millimetres on the diverging map, symmetric about zero. Between marks the displacement is
/// interpolated linearly in position; tick marks on the right edge show where the marks are.
/// </summary>
public static class SpaceTimeHeatmap
{
    /// <summary>File-name stem of this figure.</summary>
    public const string Name = "space-time";

    /// <summary>
    /// Renders the heatmap over <paramref name="timeRangeS"/> (default: all samples). Position is shown in
    /// millimetres for strings shorter than 2 m, otherwise in metres. When there are more samples than pixel
    /// columns, each column shows its nearest sample, so choose a range of a few periods to see the wave shape.
    /// </summary>
    public static RenderedFigure Render(DisplacementField field, (double StartS, double EndS)? timeRangeS = null, FigureOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(field);
        options ??= FigureOptions.Default;
        var map = ColourMaps.Diverging;

        // Positions with the fixed ends added when the length is known.
        var positions = new List<double>(field.PositionsM);
        var withEnds = field.LengthM is > 0;
        if (withEnds)
        {
            positions.Insert(0, 0);
            positions.Add(field.LengthM!.Value);
        }

        var pos = positions.ToArray();
        var rows = field.DisplacementM.Select(r => withEnds ? [0, .. r, 0] : r).ToArray();
        var extent = withEnds ? field.LengthM!.Value : (pos.Length > 0 ? pos[^1] : 1);
        var inMm = extent < 2;
        var posScale = inMm ? 1e3 : 1;
        var times = field.TimesS;
        var (tStart, tEnd) = timeRangeS ?? (times.Length > 0 ? times[0] : 0, times.Length > 1 ? times[^1] : 1);
        var peakMm = 0.0;
        for (var i = 0; i < times.Length; i++)
        {
            if (times[i] < tStart || times[i] > tEnd)
            {
                continue;
            }

            foreach (var u in rows[i])
            {
                if (double.IsFinite(u))
                {
                    peakMm = Math.Max(peakMm, Math.Abs(u) * 1e3);
                }
            }
        }

        var limitMm = peakMm > 0 ? NiceCeiling(peakMm) : 1;
        var caption = FigureText.Invariant($"Transverse displacement of the string against time and position along it; colour scale symmetric about zero, ±{FigureText.Number(limitMm, NiceTicks.DecimalsFor(limitMm / 4))} mm.");

        return FigureRenderer.Render(Name, caption, options, canvas =>
        {
            var plot = Axes.PlotArea(options, colourBar: true);
            var yMin = withEnds ? 0 : (pos.Length > 0 ? pos[0] : 0);
            var yMax = withEnds ? field.LengthM!.Value : (pos.Length > 1 ? pos[^1] : yMin + 1);
            var axes = new Axes(plot, tStart, tEnd, yMin * posScale, yMax * posScale);
            Axes.DrawTitle(canvas, plot.Left, "Transverse displacement along the string",
                FigureText.Invariant($"{field.PositionsM.Length} marks{(withEnds ? " plus fixed ends" : "")}; linear interpolation between marks"));

            if (times.Length > 0 && pos.Length > 0)
            {
                var w = Math.Max(1, (int)Math.Round(plot.Width));
                var h = Math.Max(1, (int)Math.Round(plot.Height));
                var columnToTime = new int[w];
                for (var c = 0; c < w; c++)
                {
                    columnToTime[c] = Sampling.NearestIndex(times, axes.XMin + (c + 0.5) / w * (axes.XMax - axes.XMin));
                }

                var rowToPosition = new double[h];
                for (var r = 0; r < h; r++)
                {
                    rowToPosition[r] = (axes.YMax - (r + 0.5) / h * (axes.YMax - axes.YMin)) / posScale;
                }

                using var image = RasterImage.FromValues(w, h, map, (c, r) =>
                {
                    var u = Sampling.Interpolate(pos, rows[columnToTime[c]], rowToPosition[r]);
                    return double.IsFinite(u) ? 0.5 + 0.5 * Math.Clamp(u * 1e3 / limitMm, -1, 1) : 0.5;
                });
                canvas.DrawImage(image, plot, new SKSamplingOptions(SKFilterMode.Nearest));

                using var markTick = FigureStyle.Stroke(FigureStyle.Ink, 2);
                foreach (var p in field.PositionsM)
                {
                    var y = axes.Y(p * posScale);
                    canvas.DrawLine(plot.Right - 8, y, plot.Right, y, markTick);
                }
            }

            axes.DrawFrame(canvas);
            axes.DrawXAxis(canvas, NiceTicks.Generate(axes.XMin, axes.XMax, 8), "Time (s)");
            axes.DrawYAxis(canvas, NiceTicks.Generate(axes.YMin, axes.YMax, 7), inMm ? "Position along string (mm)" : "Position along string (m)");
            var bar = ColourBar.Draw(canvas, plot, map, -limitMm, limitMm, NiceTicks.Generate(-limitMm, limitMm, 7), "Displacement (mm)");
            return new DrawnLayout(axes.PlotPx, bar, axes.Range);
        });
    }

    private static double NiceCeiling(double value)
    {
        var step = NiceTicks.NiceStep(value / 4);
        return Math.Ceiling(value / step - 1e-9) * step;
    }
}
