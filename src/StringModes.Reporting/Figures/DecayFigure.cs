using SkiaSharp;
using StringModes.Reporting.Colour;
using StringModes.Reporting.Formatting;
using StringModes.Reporting.Model;

namespace StringModes.Reporting.Figures;

/// <summary>
/// Log envelope of each mode (dB re the largest fitted initial amplitude) against time, with the fitted
/// straight line 20·log10(A0·e^(−σt)) and its standard-uncertainty band (k = 1). The band half-width follows
/// GUM first-order propagation (JCGM 100:2008 eq. 13) for L(t) = c·(ln A0 − σt), c = 20/ln 10:
/// u²(L) = c²·[(u(A0)/A0)² + t²·u²(σ) − 2·t·ρ·(u(A0)/A0)·u(σ)].
/// A bend in the measured envelope away from the line (beating of two polarisations) is visible at a glance.
/// </summary>
public static class DecayFigure
{
    /// <summary>File-name stem of this figure.</summary>
    public const string Name = "decay";

    private static readonly double DbPerNeper = 20 / Math.Log(10);

    /// <summary>Renders the decays; envelope levels below <paramref name="floorDb"/> (−200..−10, default −70) are clipped.</summary>
    public static RenderedFigure Render(IReadOnlyList<ModeDecay> decays, double floorDb = -70, FigureOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(decays);
        if (!(floorDb >= -200 && floorDb <= -10))
        {
            throw new ArgumentOutOfRangeException(nameof(floorDb), "The floor must be −200..−10 dB.");
        }

        options ??= FigureOptions.Default;
        var reference = decays.Select(d => d.InitialAmplitudeM.Value).Where(a => a > 0 && double.IsFinite(a)).DefaultIfEmpty(1).Max();
        double Db(double a) => a > 0 && double.IsFinite(a) ? 20 * Math.Log10(a / reference) : double.NaN;
        var tMin = decays.SelectMany(d => d.TimesS).Where(double.IsFinite).DefaultIfEmpty(0).Min();
        var tMax = decays.SelectMany(d => d.TimesS).Where(double.IsFinite).DefaultIfEmpty(1).Max();
        var lowest = decays.SelectMany(d => d.EnvelopeM.Select(Db)).Where(double.IsFinite).DefaultIfEmpty(-40).Min();
        var yMin = Math.Max(floorDb, NiceTicks.Expand(lowest, 0).Min);
        const string caption = "Envelope of each mode on a logarithmic scale with the fitted exponential decay (dashed) and its standard-uncertainty band (k = 1).";

        return FigureRenderer.Render(Name, caption, options, canvas =>
        {
            var plot = Axes.PlotArea(options, colourBar: false);
            var axes = new Axes(plot, tMin, tMax, yMin, 6);
            Axes.DrawTitle(canvas, plot.Left, "Decay of each mode", "Envelope in dB re the largest fitted initial amplitude; dashed: fit, band: ± standard uncertainty");
            var xTicks = NiceTicks.Generate(axes.XMin, axes.XMax, 8);
            var yTicks = NiceTicks.Generate(yMin, 0, 8);
            axes.DrawGrid(canvas, xTicks, yTicks);
            var legend = new List<LegendEntry>();
            using (axes.ClipToPlot(canvas))
            {
                for (var k = 0; k < decays.Count; k++)
                {
                    var d = decays[k];
                    var colour = ColourMaps.Category(k);
                    var sk = FigureStyle.ToSk(colour);
                    var (fitT, fit, lower, upper) = FitLine(d, tMin, tMax, reference);
                    using (var band = FigureStyle.Fill(FigureStyle.ToSk(colour, 60)))
                    {
                        SeriesDrawing.Band(canvas, axes, fitT, lower, upper, band);
                    }

                    using (var measured = FigureStyle.Stroke(sk, 1.4f))
                    {
                        SeriesDrawing.Polyline(canvas, axes, d.TimesS, d.EnvelopeM.Select(a => Math.Max(Db(a), yMin - 10)).ToArray(), measured);
                    }

                    using (var fitted = FigureStyle.Stroke(Darker(colour), 2.4f, [10, 6]))
                    {
                        SeriesDrawing.Polyline(canvas, axes, fitT, fit, fitted);
                    }

                    var sigma = UncertaintyFormat.Format(d.DecayRatePerS.Value, d.DecayRatePerS.StandardUncertainty, "s⁻¹");
                    legend.Add(new LegendEntry(FigureText.Invariant($"n = {d.ModeNumber}: σ = {sigma}"), sk, LegendSymbol.Line));
                }
            }

            axes.DrawFrame(canvas);
            axes.DrawXAxis(canvas, xTicks, "Time (s)");
            axes.DrawYAxis(canvas, yTicks, "Envelope (dB re max)");
            Legend.Draw(canvas, plot, legend);
            return new DrawnLayout(axes.PlotPx, null, axes.Range);
        });
    }

    /// <summary>Fitted level and its ±u band in dB re <paramref name="referenceM"/> at 64 times spanning the plot.</summary>
    internal static (double[] TimesS, double[] FitDb, double[] LowerDb, double[] UpperDb) FitLine(ModeDecay d, double tMin, double tMax, double referenceM)
    {
        const int n = 64;
        var t = new double[n];
        var fit = new double[n];
        var lo = new double[n];
        var hi = new double[n];
        var a0 = d.InitialAmplitudeM.Value;
        var relA = a0 > 0 ? d.InitialAmplitudeM.StandardUncertainty / a0 : 0;
        var uSigma = d.DecayRatePerS.StandardUncertainty;
        var rho = Math.Clamp(d.Correlation, -1, 1);
        for (var i = 0; i < n; i++)
        {
            t[i] = tMin + (tMax - tMin) * i / (n - 1);
            fit[i] = a0 > 0 ? DbPerNeper * (Math.Log(a0 / referenceM) - d.DecayRatePerS.Value * t[i]) : double.NaN;
            var variance = relA * relA + t[i] * t[i] * uSigma * uSigma - 2 * t[i] * rho * relA * uSigma;
            var u = DbPerNeper * Math.Sqrt(Math.Max(0, variance));
            lo[i] = fit[i] - u;
            hi[i] = fit[i] + u;
        }

        return (t, fit, lo, hi);
    }

    private static SKColor Darker(SrgbColour c)
    {
        var lab = Oklab.FromSrgb(c);
        return FigureStyle.ToSk(Oklab.ToSrgb(lab with { L = lab.L * 0.72 }).Clamped());
    }
}
