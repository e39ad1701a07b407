using StringModes.Reporting.Figures;
using StringModes.Reporting.Model;

namespace StringModes.Reporting.Html;

/// <summary>Renders every figure whose data the report model carries, in report order.</summary>
public static class ReportFigures
{
    /// <summary>
    /// Renders the figures present in <paramref name="model"/>: mode amplitude, space–time, spectra, decay,
    /// harmonic ratio, reference frame (each only when its data are set and non-empty), in that order.
    /// </summary>
    public static IReadOnlyList<RenderedFigure> RenderAll(ReportModel model, FigureOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(model);
        var f = model.Figures;
        var list = new List<Func<RenderedFigure>>();
        var window = (model.Measurement.AnalysisWindowStartS, model.Measurement.AnalysisWindowEndS);
        if (f.ModeAmplitudes is { ModeNumbers.Length: > 0 } amplitudes)
        {
            list.Add(() => ModeAmplitudeHeatmap.Render(amplitudes, analysisWindowS: window.AnalysisWindowEndS > window.AnalysisWindowStartS ? window : null, options: options));
        }

        if (f.Displacement is { PositionsM.Length: > 0, TimesS.Length: > 0 } field)
        {
            list.Add(() => SpaceTimeHeatmap.Render(field, f.DisplacementTimeRangeS, options));
        }

        if (f.Spectra is { Count: > 0 } spectra)
        {
            list.Add(() => SpectrumFigure.Render(spectra, options: options));
        }

        if (f.Decays is { Count: > 0 } decays)
        {
            list.Add(() => DecayFigure.Render(decays, options: options));
        }

        if (f.HarmonicRatios is { Count: > 0 } ratios)
        {
            list.Add(() => HarmonicRatioFigure.Render(ratios, f.Inharmonicity, options));
        }

        if (f.ReferenceFrame is { } frame)
        {
            list.Add(() => ReferenceFrameOverlay.Render(frame, options));
        }

        // Figures are independent: they are drawn in parallel and returned in report order.
        var rendered = new RenderedFigure[list.Count];
        Parallel.For(0, list.Count, i => rendered[i] = list[i]());
        return rendered;
    }
}
