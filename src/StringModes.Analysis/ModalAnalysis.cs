using System.Globalization;
using StringModes.Analysis.Fitting;
using StringModes.Analysis.Geometry;
using StringModes.Analysis.Modal;
using StringModes.Analysis.StringModel;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis;

/// <summary>
/// The everyday entry point: string coordinates and rig values in, modal numbers and string properties out.
/// Runs <see cref="ModalProjector"/>, <see cref="ModeFitter"/> and <see cref="StringEstimator"/> in turn (use those
/// directly for full control) and adds a frame-rate aliasing check: a mode expected above half the frame rate is
/// seen at an alias frequency, so it is reported but left out of the string model.
/// </summary>
public static class ModalAnalysis
{
    /// <summary>Analyses <paramref name="coordinates"/>. Never throws for bad data; see <see cref="ModalAnalysisResult.Error"/>.</summary>
    public static ModalAnalysisResult Run(StringCoordinates coordinates, ModalAnalysisOptions? options = null)
    {
        options ??= new ModalAnalysisOptions();
        var warnings = new List<string>();
        var projection = options.MaxModes > 0 ? options.Projection with { MaxModes = options.MaxModes } : options.Projection;
        var modal = ModalProjector.Project(coordinates, projection);
        warnings.AddRange(modal.Warnings);
        var frameRate = MedianRate(modal.TimesS);
        var (start, end) = Window(modal);

        if (modal.ModeCount == 0 || modal.ValidFrameCount == 0)
        {
            var reason = modal.Warnings.Count > 0 ? modal.Warnings[^1] : "no modal coordinates could be formed";
            return new ModalAnalysisResult(false, $"analysis not possible: {reason}; check that the marks are tracked in most frames", modal, new ModeFitResult([], [], []), null, start, end, frameRate, warnings);
        }

        var fits = ModeFitter.Fit(modal, options.Fitting);
        warnings.AddRange(fits.Warnings);
        var usable = fits.Modes.Where(m => m.IsUsable).ToList();
        if (usable.Count == 0)
            return new ModalAnalysisResult(false, NothingFitted(fits.Modes), modal, fits, null, start, end, frameRate, warnings);

        var forModel = ExcludeAliased(usable, frameRate, warnings);

        var length = options.LengthM;
        if (length is null)
        {
            length = Measured.Exact(coordinates.LengthM);
            warnings.Add("no length uncertainty given: the length of the string coordinates was used with u(L) = 0");
        }
        else if (Math.Abs(length.Value.Value - coordinates.LengthM) > 1e-9 * Math.Abs(coordinates.LengthM))
        {
            warnings.Add(FormattableString.Invariant($"the length given ({length.Value.Value:G6} m) differs from the length of the string coordinates ({coordinates.LengthM:G6} m); mode shapes used the latter, the string model the former"));
        }
        var density = options.LinearDensity ?? (options.LinearDensityKgPerM is { } mu ? LinearDensityInput.Direct(mu) : null);
        var estimate = StringEstimator.Estimate(forModel, new StringModelOptions
        {
            LengthM = length,
            LinearDensity = density,
            HarmonicCheckCoverageFactor = options.HarmonicCheckCoverageFactor,
        });
        warnings.AddRange(estimate.Warnings);
        return new ModalAnalysisResult(true, null, modal, fits, estimate, start, end, frameRate, warnings);
    }

    // The error must stand on its own (callers show it as one line without the warnings): it carries the reason of
    // the most telling mode and what to do about it.
    private static string NothingFitted(IReadOnlyList<ModeFit> modes)
    {
        if (modes.All(m => m.Status == FitStatus.NoSignal))
            return "analysis not possible: no vibration was detected in any mode; check that the string vibrates during the clip (pluck it as recording starts) and that the marks move with it";
        string Reason(ModeFit m) => m.Warnings.Count > 0 ? $"mode {m.N}: {m.Warnings[0]}" : $"mode {m.N}: {m.Status}";
        var tooShort = modes.FirstOrDefault(m => m.Status == FitStatus.TooShort);
        if (tooShort is not null)
            return $"analysis not possible: the analysis window is too short to fit any mode ({Reason(tooShort)}); record a longer clip (several periods of the fundamental at least) or check the capture rate";
        var first = modes.FirstOrDefault(m => m.Status != FitStatus.NoSignal) ?? modes[0];
        return $"analysis not possible: no mode could be fitted ({Reason(first)}); check the tracking of the marks and the capture rate";
    }

    private static List<ModeFit> ExcludeAliased(List<ModeFit> usable, double frameRateHz, List<string> warnings)
    {
        if (!(frameRateHz > 0)) return usable;
        var nyquist = frameRateHz / 2;
        // The lowest fitted mode gives the expected spacing; modes fitted near n·f1 above Nyquist cannot be genuine.
        var lowest = usable.OrderBy(m => m.N).First();
        var spacing = lowest.FrequencyHz.Value / lowest.N;
        var kept = new List<ModeFit>();
        foreach (var m in usable)
        {
            var expected = m.N * spacing;
            if (expected > nyquist)
                warnings.Add(string.Create(CultureInfo.InvariantCulture,
                    $"mode {m.N} is expected near {expected:G5} Hz, above half the frame rate ({nyquist:G5} Hz): its measured {m.FrequencyHz.Value:G6} Hz is an alias and it was left out of the string model; a higher frame rate would resolve it"));
            else kept.Add(m);
        }
        return kept.Count > 0 ? kept : usable.Take(1).ToList();
    }

    private static (double Start, double End) Window(ModalCoordinates modal)
    {
        var first = Array.IndexOf(modal.ValidFrame, true);
        var last = Array.LastIndexOf(modal.ValidFrame, true);
        return first < 0 ? (0, 0) : (modal.TimesS[first], modal.TimesS[last]);
    }

    private static double MedianRate(double[] times)
    {
        if (times.Length < 2) return 0;
        var steps = new double[times.Length - 1];
        for (var i = 0; i < steps.Length; i++) steps[i] = times[i + 1] - times[i];
        Array.Sort(steps);
        var dt = steps[steps.Length / 2];
        return dt > 0 && double.IsFinite(dt) ? 1 / dt : 0;
    }
}
