using System.Globalization;
using System.Numerics;
using StringModes.Analysis;
using StringModes.Analysis.Geometry;
using StringModes.Analysis.Uncertainty;
using StringModes.Reporting.Model;
using StringModes.Video.Tracking;

namespace StringModes.Cli;

/// <summary>Maps an analysis onto the report model: tables, checks, warnings with actions, and figure data.</summary>
internal static class ReportMapping
{
    public static ReportModel Build(string clip, string? description, TrackingResult tracking, AnalysisWindowChoice window,
        StringCoordinates coordinates, ModalAnalysisResult result, IReadOnlyList<string> warnings, IReadOnlyList<KeyValuePair<string, string>> settings)
    {
        var t = tracking.Tracks;
        var ratios = result.String?.HarmonicRatios.ToDictionary(h => h.N, h => h.Ratio) ?? [];
        var usable = result.Fits.Modes.Where(m => m.IsUsable).OrderBy(m => m.N).ToList();
        var modes = usable.Select(m => new ModeRow(m.N, V(m.FrequencyHz), V(m.DecayRatePerS), V(m.DampingRatio), V(m.QualityFactor),
            V(m.AmplitudeM), ratios.TryGetValue(m.N, out var r) ? V(r) : new MeasuredValue(double.NaN, 0))).ToArray();

        StringProperties? properties = null;
        UncertaintyBudget? budget = null;
        var checks = new List<CheckRow>();
        if (result.String is { } s)
        {
            if (s.TensionN is { } tension && s.WaveSpeedMPerS is { } c && s.LengthM is { } length && s.LinearDensityKgPerM is { } mu)
            {
                properties = new StringProperties
                {
                    LengthM = V(length),
                    LinearDensityKgPerM = V(mu),
                    FundamentalHz = V(s.FundamentalHz),
                    Inharmonicity = V(s.Inharmonicity),
                    WaveSpeedMPerS = V(c),
                    TensionN = V(tension),
                    BendingStiffnessNM2 = s.BendingStiffnessNM2 is { } ei ? V(ei) : null,
                };
                budget = new UncertaintyBudget("Tension T", "N", V(tension), s.TensionBudget.Select(b => new BudgetRow(
                    b.Name, UnitOf(b.Name), new MeasuredValue(EstimateOf(b.Name, s), b.SensitivityCoefficient == 0 ? 0 : b.Contribution / Math.Abs(b.SensitivityCoefficient)),
                    b.SensitivityCoefficient)).ToArray());
            }
            if (s.SecondHarmonic is { } h)
                checks.Add(new CheckRow("2nd harmonic at 2× the fundamental", h.Passes, string.Create(CultureInfo.InvariantCulture,
                    $"f2/f1 = {Summary.F(h.Ratio)}; {h.DeviationInUncertainties:F1} standard uncertainties from 2 (tolerance k = {h.CoverageFactor:G3})")));
            if (!s.InharmonicityAssumed)
                checks.Add(new CheckRow("Stiff-string law fits the mode frequencies", s.RegressionReducedChiSquare < 4, string.Create(CultureInfo.InvariantCulture,
                    $"χ²/ν = {s.RegressionReducedChiSquare:G3} over modes {string.Join(", ", s.ModesUsed)}")));
        }
        foreach (var x in result.Fits.CrossChecks)
            checks.Add(new CheckRow($"Mode {x.N}: independent matrix-pencil estimate agrees", x.Agrees, string.Create(CultureInfo.InvariantCulture,
                $"{Summary.F(x.FrequencyHz)} Hz, σ = {Summary.F(x.DecayRatePerS)} 1/s; differences {x.FrequencyDifference:F1} and {x.DecayRateDifference:F1} combined uncertainties")));

        var modal = result.Modal;
        var validIndex = Enumerable.Range(0, modal.FrameCount).Where(k => modal.ValidFrame[k]).ToArray();
        var times = validIndex.Select(k => modal.TimesS[k]).ToArray();
        var series = Enumerable.Range(0, modal.ModeCount).Select(j => validIndex.Select(k => modal.AmplitudeM[k, j]).ToArray()).ToArray();
        var f1 = usable.FirstOrDefault()?.FrequencyHz.Value ?? 1;
        var figures = new ReportFigureData
        {
            ModeAmplitudes = times.Length > 4 ? ModeAmplitudeSeries.FromModalCoordinates(modal.ModeNumbers, times, series, Math.Max(2.0 / f1, 4 * MedianStep(times))) : null,
            Displacement = new DisplacementField(coordinates.PositionsM, coordinates.TimesS,
                Enumerable.Range(0, coordinates.FrameCount).Select(k => Enumerable.Range(0, coordinates.MarkCount).Select(i => coordinates.DisplacementM[k, i]).ToArray()).ToArray(),
                coordinates.LengthM),
            DisplacementTimeRangeS = (coordinates.TimesS[0], Math.Min(coordinates.TimesS[^1], coordinates.TimesS[0] + 4.0 / f1)),
            Spectra = usable.Select(m => Spectrum(m.N, times, series[Array.IndexOf(modal.ModeNumbers, m.N)], m)).ToArray(),
            Decays = usable.Select(m => Decay(m.N, times, series[Array.IndexOf(modal.ModeNumbers, m.N)], m)).ToArray(),
            HarmonicRatios = result.String?.HarmonicRatios.Select(h => new HarmonicRatioPoint(h.N, V(h.Ratio))).ToArray(),
            Inharmonicity = result.String is { InharmonicityAssumed: false } st ? st.Inharmonicity.Value : null,
            ReferenceFrame = new ReferenceFrame
            {
                EncodedImage = tracking.ReferenceFramePng,
                FirstEndPx = P(tracking.Marks.Marks[0].Position),
                SecondEndPx = P(tracking.Marks.Marks[^1].Position),
                Marks = Enumerable.Range(1, t.MarkCount - 2).Select(i => new TrackedMark(i, P(tracking.Marks.Marks[i].Position),
                    new ImagePoint(Min(t.XPx, i, window), Min(t.YPx, i, window)), new ImagePoint(Max(t.XPx, i, window), Max(t.YPx, i, window)))).ToArray(),
            },
        };
        return new ReportModel
        {
            Measurement = new MeasurementSummary
            {
                ClipName = clip,
                SpecimenDescription = string.IsNullOrWhiteSpace(description) ? null : description,
                Frames = t.FrameCount,
                CaptureFps = 1 / MedianStep(t.TimesS),
                DurationS = t.TimesS[^1] - t.TimesS[0],
                AnalysisWindowStartS = result.AnalysisWindowStartS - t.TimesS[0],
                AnalysisWindowEndS = result.AnalysisWindowEndS - t.TimesS[0],
                MarkCount = t.MarkCount - 2,
            },
            Modes = modes,
            StringProperties = properties,
            Budget = budget,
            Checks = checks,
            Warnings = warnings.Select(w => new ReportWarning(w, ActionFor(w))).ToArray(),
            Settings = settings.Select(kv => new SettingRow(kv.Key, kv.Value)).ToArray(),
            Figures = figures,
            Generator = "stringmodes " + App.Version,
        };
    }

    /// <summary>What a user can do about each kind of warning.</summary>
    internal static string ActionFor(string warning)
    {
        var w = warning.ToLowerInvariant();
        if (w.Contains("slow motion") || w.Contains("capture-fps")) return "Check the camera's capture rate and give it with --capture-fps (or capture_fps in the rig file).";
        if (w.Contains("alias")) return "Film at a higher frame rate, or ignore this mode: it is left out of the string model.";
        if (w.Contains("no uncertainty")) return "Measure the input's uncertainty and give it (e.g. --length-uncertainty) so the tension budget is complete.";
        if (w.Contains("variable frame rate")) return "Nothing needed: per-frame timestamps are used. A fixed-rate recording mode avoids it.";
        if (w.Contains("truncated") || w.Contains("damaged")) return "Copy the clip again from the camera; only the frames before the damage were analysed.";
        if (w.Contains("beating") || w.Contains("single exponential")) return "Look at this mode's decay figure; pluck in one plane (two polarisations beat) and check the supports for loose contact.";
        if (w.Contains("drift")) return "Pluck more gently (large amplitude raises the tension), or analyse a later part of the clip.";
        if (w.Contains("key frame")) return "For damping measurements record losslessly, or at a high bitrate with a short keyframe interval: between key frames the codec loses small motions.";
        if (w.Contains("left out of the string model")) return "Check this mode's spectrum: a distortion product or leakage peak was taken for it; the string model used the other modes.";
        if (w.Contains("not white") || w.Contains("coloured")) return "No action needed: the uncertainties were adjusted for the correlated residuals.";
        if (w.Contains("skipped") || w.Contains("window ends")) return "No action needed: the analysis window was chosen automatically.";
        if (w.Contains("not seen") || w.Contains("hidden")) return "Keep hands and objects out of view and the marks inside the frame.";
        if (w.Contains("matrix-pencil")) return "Treat this mode's numbers with caution and look at its decay figure.";
        if (w.Contains("not resolved") || w.Contains("does not decay")) return "Record longer, or with less noise, to resolve this mode's damping.";
        if (w.Contains("inharmonicity") || w.Contains("stiff-string") || w.Contains("sharp")) return "Compare with the harmonic-ratio chart; check for clamped ends, a non-uniform string or a misidentified mode.";
        return "Review the figures for the quantity named.";
    }

    private static ModeSpectrum Spectrum(int n, double[] times, double[] values, Analysis.Fitting.ModeFit fit)
    {
        var count = values.Length;
        var size = 1;
        while (size < 4 * count) size <<= 1;
        var buffer = new Complex[size];
        var mean = values.Average();
        for (var i = 0; i < count; i++) buffer[i] = (values[i] - mean) * (0.5 - 0.5 * Math.Cos(2 * Math.PI * (i + 0.5) / count));
        FftSharp.FFT.Forward(buffer);
        var rate = 1 / MedianStep(times);
        var half = size / 2;
        var freqs = new double[half];
        var mags = new double[half];
        // Amplitude scaling for a Hann window: a sinusoid of amplitude A peaks at A·N/4.
        for (var k = 0; k < half; k++)
        {
            freqs[k] = k * rate / size;
            mags[k] = buffer[k].Magnitude * 4 / count;
        }
        return new ModeSpectrum(n, freqs, mags, [new SpectrumPeak(fit.FrequencyHz.Value, fit.FrequencyHz.StandardUncertainty, $"n = {n}")]);
    }

    // Envelope: amplitude of a cos/sin fit at the mode's frequency over windows of about four periods.
    private static ModeDecay Decay(int n, double[] times, double[] values, Analysis.Fitting.ModeFit fit)
    {
        var f = fit.FrequencyHz.Value;
        var dt = MedianStep(times);
        var window = Math.Max(8, (int)Math.Round(4 / (f * dt)));
        var envelopeTimes = new List<double>();
        var envelope = new List<double>();
        for (var start = 0; start + window <= values.Length; start += window / 2)
        {
            double scc = 0, sss = 0, scs = 0, syc = 0, sys = 0, sy = 0;
            for (var i = start; i < start + window; i++) sy += values[i];
            var mean = sy / window;
            for (var i = start; i < start + window; i++)
            {
                var (sn, cs) = Math.SinCos(2 * Math.PI * f * times[i]);
                scc += cs * cs; sss += sn * sn; scs += cs * sn;
                syc += (values[i] - mean) * cs; sys += (values[i] - mean) * sn;
            }
            var det = scc * sss - scs * scs;
            if (Math.Abs(det) < 1e-12) continue;
            var a = (syc * sss - sys * scs) / det;
            var b = (sys * scc - syc * scs) / det;
            envelopeTimes.Add(0.5 * (times[start] + times[start + window - 1]));
            envelope.Add(Math.Sqrt(a * a + b * b));
        }
        return new ModeDecay(n, envelopeTimes.ToArray(), envelope.ToArray(), V(new Measured(Math.Abs(fit.AmplitudeM.Value), fit.AmplitudeM.StandardUncertainty)), V(fit.DecayRatePerS));
    }

    private static double EstimateOf(string name, Analysis.StringModel.StringEstimate s) => name switch
    {
        "length" => s.LengthM?.Value ?? double.NaN,
        "f0² (regression intercept)" => s.FundamentalHz.Value * s.FundamentalHz.Value,
        "f0²·B (regression slope)" => s.FundamentalHz.Value * s.FundamentalHz.Value * s.Inharmonicity.Value,
        "linear density" => s.LinearDensityKgPerM?.Value ?? double.NaN,
        _ => double.NaN,
    };

    private static string UnitOf(string name) => name switch
    {
        "length" or "sample length" or "diameter" or "unstretched length" => "m",
        "f0² (regression intercept)" or "f0²·B (regression slope)" => "Hz²",
        "linear density" => "kg/m",
        "sample mass" => "kg",
        "density" or "material density" => "kg/m³",
        _ => "",
    };

    private static MeasuredValue V(Measured m) => new(m.Value, m.StandardUncertainty);

    private static MeasuredValue V(Measured? m) => m is { } v ? V(v) : new MeasuredValue(double.NaN, 0);

    private static ImagePoint P(Video.Synthesis.PixelPoint p) => new(p.X, p.Y);

    private static double MedianStep(double[] times) => AnalyzeCommand.MedianStep(times);

    private static double Min(double[,] a, int mark, AnalysisWindowChoice w)
        => Enumerable.Range(w.FirstFrame, w.LastFrame - w.FirstFrame + 1).Select(k => a[k, mark]).Where(double.IsFinite).DefaultIfEmpty(double.NaN).Min();

    private static double Max(double[,] a, int mark, AnalysisWindowChoice w)
        => Enumerable.Range(w.FirstFrame, w.LastFrame - w.FirstFrame + 1).Select(k => a[k, mark]).Where(double.IsFinite).DefaultIfEmpty(double.NaN).Max();
}
