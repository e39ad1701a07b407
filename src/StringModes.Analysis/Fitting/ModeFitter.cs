using System.Numerics;
using MathNet.Numerics.Distributions;
using StringModes.Analysis.Modal;
using StringModes.Analysis.Physics;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Fitting;

/// <summary>
/// Fits every modal coordinate with a decaying sinusoid: a frequency seed from the interpolated peak of a Hann-windowed,
/// zero-padded spectrum, a decay seed from the log-envelope of short segments, then Levenberg–Marquardt on all
/// parameters at the true (possibly non-uniform) sample times. Derived damping measures use <see cref="Damping"/> with
/// first-order propagation of the (f, σ) covariance. Consistency checks — split-window decay rates and frequencies,
/// and an independent multi-channel matrix pencil — add warnings; they never change the reported values. Two steps
/// widen uncertainties without moving values: the split-window Birge ratio on σ, and the coherent tracking error at
/// a mode's own frequency seen in the other coordinates (<see cref="CoherentError"/>).
/// </summary>
public static class ModeFitter
{
    /// <summary>Fits all modes of <paramref name="modal"/>. Never throws for bad data; failures are statuses and warnings.</summary>
    public static ModeFitResult Fit(ModalCoordinates modal, ModeFitOptions? options = null)
    {
        options ??= new ModeFitOptions();
        var warnings = new List<string>();
        // Modes are fitted independently, so in parallel; each result lands in its own slot (order is kept).
        // Mode 1 goes first: its frequency tells the others where their own peak must lie (near n·f1), so a
        // coordinate whose strongest peak is elsewhere (another mode leaking in) is not fitted there in vain.
        var fitted = new (ModeFit Fit, SinusoidFit? Raw, double ElsewhereHz)[modal.ModeCount];
        var first = Array.IndexOf(modal.ModeNumbers, 1);
        double? f1 = null;
        if (first >= 0)
        {
            var (times, values) = modal.ValidSeries(first);
            fitted[first] = FitSeriesCore(1, times, values, options);
            if (fitted[first].Fit.IsUsable) f1 = fitted[first].Fit.FrequencyHz.Value;
        }
        Parallel.For(0, modal.ModeCount, j =>
        {
            if (j == first) return;
            var (times, values) = modal.ValidSeries(j);
            var n = modal.ModeNumbers[j];
            fitted[j] = FitSeriesCore(n, times, values, options, expectedHz: f1 is { } f ? (HarmonicBandLow * n * f, HarmonicBandHigh * n * f) : null);
        });
        var fits = fitted.Select(f => f.Fit).ToList();
        var internals = fitted.Select(f => f.Raw).ToList();
        RefitNearHarmonics(modal, options, fits, internals, fitted.Select(f => f.ElsewhereHz).ToArray());
        // The cross-check runs the matrix pencil on every frame, so it is compared with the fits to every frame, even
        // where the reported values come from the key frames alone: two estimators on the same data.
        var allFrameFits = fits.ToList();
        var allFrameInternals = internals.ToList();
        var keyFrames = options.DetectKeyFrames ? ApplyKeyFrames(modal, options, fits, internals, warnings) : null;
        if (options.IncludeCoherentError) AddCoherentError(modal, fits, keyFrames);
        foreach (var fit in fits) warnings.AddRange(fit.Warnings.Select(w => $"mode {fit.N}: {w}"));

        var checks = new List<CrossCheck>();
        if (options.CrossCheck && fits.Any(f => f.IsUsable))
        {
            var note = RunCrossCheck(modal, allFrameFits, allFrameInternals, options, checks);
            if (note is not null) warnings.Add(note);
            foreach (var c in checks.Where(c => !c.Agrees))
                warnings.Add($"mode {c.N}: the independent matrix-pencil estimate differs from the fit by {c.FrequencyDifference:F1} (frequency) and {c.DecayRateDifference:F1} (decay rate) combined standard uncertainties; the single-sinusoid model may not describe this mode");
        }
        return new ModeFitResult(fits, checks, warnings);
    }

    /// <summary>
    /// Mode identification. Small errors in tracking or mark positions leak a little of a strong mode into every
    /// other modal coordinate; when a weak mode's own peak is smaller than that leakage, the strongest spectral peak
    /// belongs to the wrong mode. A string's mode n sits near n·f1 (within the inharmonicity), so a mode whose fit lies
    /// outside [0.8, 1.6]·n·f1 is refitted with the spectral search confined to that band; the refit is kept when it
    /// finds a detectable peak there, with a note saying so.
    /// </summary>
    /// <summary>Band [low, high]·n·f1 in which mode n's own peak is sought (generous: a stiff string's overtones run sharp).</summary>
    private const double HarmonicBandLow = 0.8, HarmonicBandHigh = 1.6;

    private static void RefitNearHarmonics(ModalCoordinates modal, ModeFitOptions options, List<ModeFit> fits, List<SinusoidFit?> internals, double[] elsewhereHz)
    {
        var first = fits.FirstOrDefault(f => f.N == 1 && f.IsUsable);
        if (first is null) return;
        var f1 = first.FrequencyHz.Value;
        // Each mode's refit reads only f1 and its own slot, so the modes are refitted in parallel.
        Parallel.For(0, fits.Count, j =>
        {
            var n = fits[j].N;
            if (n == 1) return;
            var expected = n * f1;
            var (low, high) = (HarmonicBandLow * expected, HarmonicBandHigh * expected);
            if (fits[j].IsUsable && fits[j].FrequencyHz.Value >= low && fits[j].FrequencyHz.Value <= high) return;
            // The strongest peak lies outside the band: either the first fit landed there, or the spectrum showed it
            // there and the fit was not run.
            double? strongestHz = fits[j].IsUsable ? fits[j].FrequencyHz.Value : double.IsNaN(elsewhereHz[j]) ? null : elsewhereHz[j];
            var (times, values) = modal.ValidSeries(j);
            var (refit, raw, _) = FitSeriesCore(n, times, values, options, (low, high));
            if (!refit.IsUsable || refit.FrequencyHz.Value < low || refit.FrequencyHz.Value > high)
            {
                if (strongestHz is { } elsewhere)
                {
                    // The only peak belongs to another mode: report the mode as not seen rather than mislabel it.
                    var reason = string.Create(System.Globalization.CultureInfo.InvariantCulture,
                        $"no peak near n·f1 = {expected:G6} Hz; the strongest peak of this modal coordinate ({elsewhere:G6} Hz) belongs to another mode leaking in, so the mode is reported as not detected");
                    fits[j] = ModeFit.Unfitted(n, FitStatus.NoSignal, [reason]);
                    internals[j] = null;
                }
                return;
            }
            var note = strongestHz is { } strongest
                ? string.Create(System.Globalization.CultureInfo.InvariantCulture, $"the strongest peak of this modal coordinate ({strongest:G6} Hz) is far from n·f1 = {expected:G6} Hz, most likely another mode leaking in; the mode was fitted at its own peak near n·f1 instead")
                : string.Create(System.Globalization.CultureInfo.InvariantCulture, $"found by searching near n·f1 = {expected:G6} Hz");
            fits[j] = refit with { Warnings = [note, .. refit.Warnings] };
            internals[j] = raw;
        });
    }

    /// <summary>Fits one series a(t) as mode <paramref name="n"/>. Times must be increasing; values finite.</summary>
    public static ModeFit FitSeries(int n, double[] timesS, double[] valuesM, ModeFitOptions? options = null)
        => FitSeriesCore(n, timesS, valuesM, options ?? new ModeFitOptions()).Fit;

    /// <param name="n">Mode number.</param>
    /// <param name="times">Sample times, increasing.</param>
    /// <param name="values">Modal coordinate at those times.</param>
    /// <param name="options">Fit options.</param>
    /// <param name="bandHz">Search the spectral peak only within this band.</param>
    /// <param name="expectedHz">Where the mode's peak is expected: when the strongest peak lies outside, no fit is run; the
    /// result is then <see cref="FitStatus.NoSignal"/> with that peak's frequency as ElsewhereHz (NaN otherwise), for the
    /// caller to search the band.</param>
    private static (ModeFit Fit, SinusoidFit? Raw, double ElsewhereHz) FitSeriesCore(int n, double[] times, double[] values, ModeFitOptions options,
        (double Low, double High)? bandHz = null, (double Low, double High)? expectedHz = null)
    {
        var warnings = new List<string>();
        if (times.Length < 10)
        {
            warnings.Add($"only {times.Length} valid samples; at least 10 are needed to fit frequency and decay");
            return (ModeFit.Unfitted(n, FitStatus.TooShort, warnings), null, double.NaN);
        }
        if (values.Any(v => !double.IsFinite(v)) || times.Any(t => !double.IsFinite(t)))
        {
            warnings.Add("the series contains non-finite values");
            return (ModeFit.Unfitted(n, FitStatus.Singular, warnings), null, double.NaN);
        }
        var duration = times[^1] - times[0];
        var (uniform, rate) = ResampleUniform(times, values);
        var peak = bandHz is { } band
            ? SpectralPeak.Strongest(uniform, rate, Math.Max(1.0 / duration, band.Low), band.High)
            : SpectralPeak.Strongest(uniform, rate, 1.0 / duration);
        if (peak.PeakToMedianPower < options.DetectionThreshold)
        {
            warnings.Add($"no vibration detected: the strongest spectral peak is only {peak.PeakToMedianPower:F1} times the median noise power (threshold {options.DetectionThreshold:G3})");
            return (ModeFit.Unfitted(n, FitStatus.NoSignal, warnings), null, double.NaN);
        }
        var periods = peak.FrequencyHz * duration;
        if (periods < 1.5)
        {
            warnings.Add($"the analysis window ({duration:G3} s) holds only {periods:F1} periods at {peak.FrequencyHz:G4} Hz; frequency and decay cannot be separated");
            return (ModeFit.Unfitted(n, FitStatus.TooShort, warnings), null, double.NaN);
        }
        if (periods < options.MinimumPeriods)
            warnings.Add($"the analysis window holds only {periods:F1} periods; frequency and decay are poorly determined");

        if (expectedHz is { } expected && (peak.FrequencyHz < expected.Low || peak.FrequencyHz > expected.High))
            return (ModeFit.Unfitted(n, FitStatus.NoSignal, [.. warnings, "the strongest spectral peak lies far from n·f1"]), null, peak.FrequencyHz);
        var decaySeed = EnvelopeDecaySeed(times, values, peak.FrequencyHz, periods);
        var fit = DampedSinusoidFit.Fit(times, values, peak.FrequencyHz, decaySeed, options.MaximumIterations, options.CorrectForColouredResiduals);
        if (!fit.Usable)
        {
            warnings.Add(fit.Status == FitStatus.Singular
                ? "the decay fit failed (singular normal matrix or invalid values); no values are reported"
                : "the decay fit failed; no values are reported");
            return (ModeFit.Unfitted(n, fit.Status, warnings), null, double.NaN);
        }
        if (Math.Abs(fit.FrequencyHz - peak.FrequencyHz) * duration > 1.0)
            warnings.Add("the fitted frequency moved more than one spectral bin from the spectral peak; check for a second strong component");
        return (Finish(n, times, values, fit, periods, options, warnings), fit, double.NaN);
    }

    /// <summary>Warnings about a converged fit, the decay-shape checks, and the derived damping measures.</summary>
    private static ModeFit Finish(int n, double[] times, double[] values, SinusoidFit fit, double periods, ModeFitOptions options, List<string> warnings)
    {
        if (fit.Status == FitStatus.IterationLimit)
            warnings.Add($"the decay fit stopped at the iteration limit ({options.MaximumIterations}); values may be less accurate than stated");
        if (fit.ColourFactor > 1.0)
            warnings.Add($"fit residuals are not white: near the mode frequency their noise level is {fit.ColourFactor:G3} times their mean level (errors correlated in time, e.g. from video compression or an envelope the model does not follow); uncertainties were widened by a factor {Math.Sqrt(fit.ColourFactor):F2}");
        else if (fit.ColourFactor < 1.0)
            warnings.Add($"fit residuals are coloured and weak near the mode frequency; uncertainties were reduced to {Math.Sqrt(fit.ColourFactor):F2} times their white-noise values");
        var scale = options.CheckDecayShape ? CheckDecayShape(times, values, fit, periods, options, warnings) : 1.0;
        if (scale > 1)
        {
            // Birge ratio of the part-window decay rates applied to σ's row and column of the covariance.
            var cov = (double[,])fit.Covariance.Clone();
            for (var k = 0; k < 4; k++) { cov[1, k] *= scale; cov[k, 1] *= scale; }
            fit = fit with { Covariance = cov };
        }
        return Derive(n, fit, warnings);
    }

    /// <summary>
    /// Key frames of a predictive video codec (see <see cref="KeyFrameStructure"/>): when the residuals show them,
    /// every mode is refitted on the key frames alone, starting from its all-frame fit, because the frames between
    /// them carry an amplitude-dependent codec error that a fit absorbs into σ and f. The key frames sample the
    /// motion below the modes' frequencies, which is harmless here: the fit uses the true frame times and starts
    /// within a small fraction of the alias spacing of the solution. The all-frame values are kept in a note.
    /// </summary>
    /// <returns>The key-frame mask when the modes were refitted on key frames (those fits have OnKeyFrames set), else null.</returns>
    private static bool[]? ApplyKeyFrames(ModalCoordinates modal, ModeFitOptions options, List<ModeFit> fits, List<SinusoidFit?> internals, List<string> warnings)
    {
        var fitted = Enumerable.Range(0, fits.Count).Where(j => fits[j].IsUsable && internals[j] is not null).Select(j => (j, internals[j]!)).ToList();
        var key = KeyFrameStructure.Detect(modal, fitted);
        if (key is null) return null;
        var found = string.Create(System.Globalization.CultureInfo.InvariantCulture,
            $"every {key.Period}th frame has {key.VarianceRatio:F2} times the residual variance of the others ({-key.Score:F1} standard errors): the key frames of a compressed video, between which the codec loses small motions");
        if (key.Count < options.MinimumKeyFrames)
        {
            warnings.Add($"{found}; there are only {key.Count} key frames in the window (at least {options.MinimumKeyFrames} are needed to fit on them alone), so frequencies and decay rates may carry a codec error beyond their uncertainties; a lossless recording or a shorter keyframe interval avoids this");
            return null;
        }
        warnings.Add($"{found}; the modes were fitted on the {key.Count} key frames only");
        foreach (var (j, all) in fitted)
        {
            var times = new List<double>(key.Count);
            var values = new List<double>(key.Count);
            for (var k = 0; k < modal.FrameCount; k++)
                if (key.IsKey[k]) { times.Add(modal.TimesS[k]); values.Add(modal.AmplitudeM[k, j]); }
            var fit = DampedSinusoidFit.Fit([.. times], [.. values], all.FrequencyHz, all.DecayRatePerS, options.MaximumIterations, options.CorrectForColouredResiduals);
            var n = fits[j].N;
            if (!fit.Usable)
            {
                fits[j] = fits[j] with { Warnings = [.. fits[j].Warnings, "the fit on the key frames alone failed; the values come from all frames and may carry the codec's error beyond their uncertainties"] };
                continue;
            }
            var previous = fits[j];
            var note = string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"fitted on the {key.Count} key frames (every {key.Period}th frame); all frames gave f = {previous.FrequencyHz.Value:G9} Hz and σ = {previous.DecayRatePerS.Value:G5} 1/s");
            var periods = fit.FrequencyHz * (times[^1] - times[0]);
            fits[j] = Finish(n, [.. times], [.. values], fit, periods, options, [note]) with { OnKeyFrames = true };
            internals[j] = fit;
        }
        return key.IsKey;
    }

    /// <summary>
    /// Adds, per usable mode, the coherent tracking error at its own frequency that the other modal coordinates show
    /// (see <see cref="CoherentError"/>) to the uncertainties of f and σ, and re-derives the damping measures.
    /// </summary>
    private static void AddCoherentError(ModalCoordinates modal, List<ModeFit> fits, bool[]? keyFrames)
    {
        if (fits.Count < 2) return;
        // Each mode reads the fits as they were before any widening (a snapshot), and writes only its own slot.
        var before = fits.ToArray();
        Parallel.For(0, fits.Count, j =>
        {
            var fit = before[j];
            if (!fit.IsUsable || fit.Source is not { } source) return;
            var frames = new List<int>(modal.FrameCount);
            for (var k = 0; k < modal.FrameCount; k++)
                if (modal.ValidFrame[k] && (!fit.OnKeyFrames || keyFrames is null || keyFrames[k])) frames.Add(k);
            var times = frames.Select(k => modal.TimesS[k]).ToArray();
            var probes = new List<double[]>(before.Length - 1);
            for (var m = 0; m < before.Length; m++)
            {
                if (m == j) continue;
                var own = before[m].IsUsable ? before[m].Source : null;
                var r = new double[frames.Count];
                for (var i = 0; i < frames.Count; i++)
                    r[i] = modal.AmplitudeM[frames[i], m] - (own?.ValueAt(times[i]) ?? 0);
                probes.Add(r);
            }
            var excess = CoherentError.Estimate(times, source, fit.ResidualRmsM, probes);
            if (excess is null || (excess.FrequencyVariance <= 0 && excess.DecayVariance <= 0)) return;
            var cov = (double[,])source.Covariance.Clone();
            cov[0, 0] += excess.FrequencyVariance;
            cov[1, 1] += excess.DecayVariance;
            var warnings = fit.Warnings.Where(w => !w.StartsWith(NoDecayPrefix, StringComparison.Ordinal) && !w.StartsWith(UnresolvedDecayPrefix, StringComparison.Ordinal)).ToList();
            var inv = System.Globalization.CultureInfo.InvariantCulture;
            var widened = new List<string>(2);
            if (excess.FrequencyVariance > 0) widened.Add(string.Create(inv, $"u(f) from {fit.FrequencyHz.StandardUncertainty:G3} to {Math.Sqrt(cov[0, 0]):G3} Hz"));
            if (excess.DecayVariance > 0) widened.Add(string.Create(inv, $"u(σ) from {fit.DecayRatePerS.StandardUncertainty:G3} to {Math.Sqrt(cov[1, 1]):G3} 1/s"));
            warnings.Add(string.Create(inv,
                $"the other {excess.Probes} modal coordinates carry a coherent component at this mode's frequency ({1 + Math.Max(excess.FrequencyRatio, excess.DecayRatio):G3} times their noise expectation): tracking or codec error that repeats with the string's motion, which this mode's fit absorbs unseen; widened {string.Join(" and ", widened)}"));
            fits[j] = Derive(fit.N, source with { Covariance = cov }, warnings) with
            {
                OnKeyFrames = fit.OnKeyFrames,
                CoherentErrorFrequencyHz = Math.Sqrt(excess.FrequencyVariance),
                CoherentErrorDecayRatePerS = Math.Sqrt(excess.DecayVariance),
            };
        });
    }

    private const string NoDecayPrefix = "the amplitude does not decay ", UnresolvedDecayPrefix = "the decay rate is not resolved ";

    private static ModeFit Derive(int n, SinusoidFit fit, List<string> warnings)
    {
        var cov = new double[2, 2] { { fit.Covariance[0, 0], fit.Covariance[0, 1] }, { fit.Covariance[1, 0], fit.Covariance[1, 1] } };
        var f = fit.FrequencyHz;
        var s = fit.DecayRatePerS;
        var zeta = Propagate((ff, ss) => Damping.DampingRatio(ss, ff), f, s, cov);
        var decrement = Propagate((ff, ss) => Damping.LogarithmicDecrement(Damping.DampingRatio(ss, ff)), f, s, cov);
        Measured? q = null, t60 = null;
        var uSigma = Math.Sqrt(cov[1, 1]);
        if (s > 2 * uSigma && s > 0)
        {
            q = Propagate((ff, ss) => Damping.QualityFactor(Damping.DampingRatio(ss, ff)), f, s, cov);
            t60 = Propagate((_, ss) => Damping.T60(ss), f, s, cov);
        }
        else
        {
            warnings.Add(s <= 0
                ? $"{NoDecayPrefix}(σ = {s:G3} ± {uSigma:G2} 1/s); Q and T60 are not given"
                : $"{UnresolvedDecayPrefix}(σ = {s:G3} ± {uSigma:G2} 1/s); Q and T60 are not given");
        }
        return new ModeFit(n,
            new Measured(f, Math.Sqrt(fit.Covariance[0, 0])),
            new Measured(s, uSigma),
            new Measured(fit.AmplitudeM, Math.Sqrt(fit.Covariance[2, 2])),
            new Measured(fit.PhaseRad, Math.Sqrt(fit.Covariance[3, 3])),
            zeta, q, t60, decrement, fit.Status, fit.ResidualRmsM, fit.ColourFactor, warnings) { Source = fit };
    }

    /// <summary>First-order propagation through g(f, σ) with central-difference partial derivatives.</summary>
    private static Measured Propagate(Func<double, double, double> g, double f, double s, double[,] cov)
    {
        var value = g(f, s);
        var hf = 1e-6 * Math.Max(Math.Abs(f), 1e-3);
        var hs = 1e-6 * Math.Max(Math.Abs(s), 1e-3);
        var df = (g(f + hf, s) - g(f - hf, s)) / (2 * hf);
        var ds = (g(f, s + hs) - g(f, s - hs)) / (2 * hs);
        var variance = df * df * cov[0, 0] + 2 * df * ds * cov[0, 1] + ds * ds * cov[1, 1];
        var u = Math.Sqrt(Math.Max(variance, 0));
        return double.IsFinite(value) && double.IsFinite(u) ? new Measured(value, u) : default;
    }

    /// <summary>Linear interpolation onto the median sample interval, for the spectral seed only.</summary>
    private static (double[] Samples, double RateHz) ResampleUniform(double[] times, double[] values)
    {
        var steps = new double[times.Length - 1];
        for (var i = 0; i < steps.Length; i++) steps[i] = times[i + 1] - times[i];
        Array.Sort(steps);
        var dt = steps[steps.Length / 2];
        if (steps[0] > dt * (1 - 1e-6) && steps[^1] < dt * (1 + 1e-6)) return (values, 1.0 / dt);
        var count = (int)Math.Floor((times[^1] - times[0]) / dt) + 1;
        var samples = new double[count];
        var k = 0;
        for (var i = 0; i < count; i++)
        {
            var t = times[0] + i * dt;
            while (k < times.Length - 2 && times[k + 1] < t) k++;
            var w = (t - times[k]) / (times[k + 1] - times[k]);
            samples[i] = values[k] + Math.Clamp(w, 0, 1) * (values[k + 1] - values[k]);
        }
        return (samples, 1.0 / dt);
    }

    /// <summary>
    /// Decay-rate seed: amplitudes of cos/sin at the seed frequency fitted by linear least squares in 2–8 segments,
    /// then a regression of ln(amplitude) on segment time weighted by amplitude² (larger amplitudes are more reliable).
    /// </summary>
    private static double EnvelopeDecaySeed(double[] times, double[] values, double frequencyHz, double periods)
    {
        var segments = Math.Clamp((int)(periods / 3), 2, 8);
        var centres = new List<double>();
        var logs = new List<double>();
        var weights = new List<double>();
        var segment = new Modal.SmallLeastSquares(times.Length, 3);
        Span<double> x = stackalloc double[3];
        foreach (var (first, count, tc) in Segments(times, segments))
        {
            if (count < 4) continue;
            for (var r = 0; r < count; r++)
            {
                var (sin, cos) = Math.SinCos(2 * Math.PI * frequencyHz * (times[first + r] - tc));
                var row = segment.Row(r);
                row[0] = cos;
                row[1] = sin;
                row[2] = 1.0;
                segment.Rhs[r] = values[first + r];
            }
            if (!(segment.Solve(count, x) < 1e14)) continue;
            var amp = Math.Sqrt(x[0] * x[0] + x[1] * x[1]);
            if (!(amp > 0)) continue;
            centres.Add(tc);
            logs.Add(Math.Log(amp));
            weights.Add(amp * amp);
        }
        if (centres.Count < 2) return 0;
        double sw = 0, st = 0, sl = 0;
        for (var i = 0; i < centres.Count; i++) { sw += weights[i]; st += weights[i] * centres[i]; sl += weights[i] * logs[i]; }
        double stt = 0, stl = 0;
        for (var i = 0; i < centres.Count; i++)
        {
            var dt = centres[i] - st / sw;
            stt += weights[i] * dt * dt;
            stl += weights[i] * dt * (logs[i] - sl / sw);
        }
        var sigma = stt > 0 ? -stl / stt : 0;
        return double.IsFinite(sigma) ? sigma : 0;
    }

    /// <summary>
    /// Splits the window into 2 or 4 parts and refits each. Decay rates that disagree beyond the coverage factor
    /// (χ² test of a common value) mean a non-exponential decay — beating of two close frequencies (the two
    /// polarisations), or amplitude-dependent damping. A significant slope of frequency against time means an
    /// amplitude-dependent frequency (tension modulation, REFERENCES.md §10) or beating. When the decay rates disagree,
    /// the single-exponential model does not describe the data at the stated precision, and the whole-window u(σ) is
    /// scaled by the Birge ratio √(χ²/(parts − 1)) (Birge 1932, Phys. Rev. 40:207; the scale factor of the Particle Data
    /// Group's Review of Particle Physics, Introduction §5.2), the same treatment as the string model's χ²/ν widening.
    /// Returns that factor (1 when the parts agree or the check cannot run).
    /// </summary>
    /// <summary>
    /// The record cut into <paramref name="parts"/> equal spans of time: each span's first sample, sample count and
    /// centre time (the last span keeps the final sample). Times are increasing, so each span is one run.
    /// </summary>
    private static IEnumerable<(int First, int Count, double Centre)> Segments(double[] times, int parts)
    {
        var t0 = times[0];
        var span = times[^1] - t0;
        var next = 0;
        for (var p = 0; p < parts; p++)
        {
            var lo = t0 + span * p / parts;
            var hi = t0 + span * (p + 1) / parts;
            while (next < times.Length && times[next] < lo) next++;
            var first = next;
            while (next < times.Length && (times[next] < hi || p == parts - 1)) next++;
            yield return (first, next - first, 0.5 * (lo + hi));
        }
    }

    private static double CheckDecayShape(double[] times, double[] values, SinusoidFit whole, double periods, ModeFitOptions options, List<string> warnings)
    {
        var parts = periods >= 40 && times.Length >= 80 ? 4 : periods >= 12 && times.Length >= 40 ? 2 : 0;
        if (parts == 0) return 1.0;
        var sub = new List<(double Centre, SinusoidFit Fit)>();
        foreach (var (first, count, centre) in Segments(times, parts))
        {
            // The part's noise level near f is taken from the whole window: its narrow band (1/T bins) estimates the
            // spectral density at f better than a part's band, whose coarser bins fold slow envelope errors into
            // the part's own parameters and so understate its uncertainty.
            var fit = DampedSinusoidFit.Fit(times[first..(first + count)], values[first..(first + count)],
                whole.FrequencyHz, whole.DecayRatePerS, options.MaximumIterations, correctForColouredResiduals: false);
            if (whole.ColourFactor != 1.0 && fit.Usable)
            {
                var cov = (double[,])fit.Covariance.Clone();
                for (var r = 0; r < 4; r++) for (var c = 0; c < 4; c++) cov[r, c] *= whole.ColourFactor;
                fit = fit with { Covariance = cov, ColourFactor = whole.ColourFactor };
            }
            if (!fit.Usable || !(fit.FrequencyUncertainty > 0) || !(fit.DecayRateUncertainty > 0)) return 1.0;
            sub.Add((centre, fit));
        }
        // A chi-square with parts−1 degrees of freedom at the probability that the coverage factor gives a Gaussian.
        var probability = 2 * Normal.CDF(0, 1, options.ConsistencyCoverageFactor) - 1;
        var critical = ChiSquared.InvCDF(parts - 1, probability);

        double sw = 0, sws = 0;
        foreach (var (_, fit) in sub) { var w = 1 / (fit.DecayRateUncertainty * fit.DecayRateUncertainty); sw += w; sws += w * fit.DecayRatePerS; }
        var meanSigma = sws / sw;
        var chi2 = sub.Sum(s => Math.Pow((s.Fit.DecayRatePerS - meanSigma) / s.Fit.DecayRateUncertainty, 2));
        var birge = 1.0;
        if (chi2 > critical)
        {
            birge = Math.Sqrt(chi2 / (parts - 1));
            warnings.Add($"the decay is not a single exponential: decay rates in successive parts of the window run {string.Join(", ", sub.Select(s => s.Fit.DecayRatePerS.ToString("G3", System.Globalization.CultureInfo.InvariantCulture)))} 1/s (disagreeing beyond {options.ConsistencyCoverageFactor:G2} standard uncertainties); two close frequencies may be beating, or damping depends on amplitude; the decay rate's uncertainty was widened by the Birge ratio {birge.ToString("F2", System.Globalization.CultureInfo.InvariantCulture)}");
        }

        // Weighted regression of frequency on time.
        double w0 = 0, wt = 0, wf = 0;
        foreach (var (c, fit) in sub) { var w = 1 / (fit.FrequencyUncertainty * fit.FrequencyUncertainty); w0 += w; wt += w * c; wf += w * fit.FrequencyHz; }
        double stt = 0, stf = 0;
        foreach (var (c, fit) in sub)
        {
            var w = 1 / (fit.FrequencyUncertainty * fit.FrequencyUncertainty);
            stt += w * (c - wt / w0) * (c - wt / w0);
            stf += w * (c - wt / w0) * (fit.FrequencyHz - wf / w0);
        }
        if (stt <= 0) return birge;
        var slope = stf / stt;
        var uSlope = Math.Sqrt(1 / stt);
        if (Math.Abs(slope) > options.ConsistencyCoverageFactor * uSlope)
        {
            var first = sub[0].Fit.FrequencyHz;
            var last = sub[^1].Fit.FrequencyHz;
            warnings.Add(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"the frequency drifts from {first:G7} Hz to {last:G7} Hz across the window ({slope:G3} Hz/s, {Math.Abs(slope) / uSlope:F1} standard uncertainties): amplitude-dependent frequency (tension modulation at large amplitude) or beating; the reported frequency is a window average"));
        }
        return birge;
    }

    private static string? RunCrossCheck(ModalCoordinates modal, List<ModeFit> fits, List<SinusoidFit?> raw, ModeFitOptions options, List<CrossCheck> checks)
    {
        // Longest run of consecutive valid frames: the pencil needs gap-free uniform samples.
        int bestStart = 0, bestLength = 0;
        for (var f = 0; f < modal.FrameCount;)
        {
            if (!modal.ValidFrame[f]) { f++; continue; }
            var start = f;
            while (f < modal.FrameCount && modal.ValidFrame[f]) f++;
            if (f - start > bestLength) { bestStart = start; bestLength = f - start; }
        }
        if (bestLength < 30) return "matrix-pencil cross-check skipped: fewer than 30 consecutive valid frames";
        var times = modal.TimesS[bestStart..(bestStart + bestLength)];
        var dt = (times[^1] - times[0]) / (bestLength - 1);
        for (var i = 1; i < bestLength; i++)
            if (Math.Abs(times[i] - times[i - 1] - dt) > 1e-3 * dt)
                return "matrix-pencil cross-check skipped: the frame times are not uniform";

        var used = Enumerable.Range(0, fits.Count).Where(j => fits[j].IsUsable && raw[j] is not null).ToArray();
        var order = 2 * used.Length + 1;
        var pencil = Math.Clamp(bestLength / 3, order + 1, 120);
        if (pencil >= bestLength - order) return "matrix-pencil cross-check skipped: too few frames for the number of modes";

        // Channels are scaled to equal noise (by their fit's residual RMS), not to equal power: scaled to unit RMS,
        // a weak mode's channel — mostly noise — would add as much noise to the summed Gram matrix as a strong
        // channel adds signal, and bias every decay rate (σ of a clean 88 Hz mode came out 0.44 instead of 0.65 1/s
        // with two such channels among six).
        double[][] Channels(Func<int, int, double> sample)
            => used.Select(j =>
            {
                var c = new double[bestLength];
                for (var i = 0; i < bestLength; i++) c[i] = sample(j, i);
                var scale = raw[j]!.ResidualRmsM;
                if (!(scale > 0)) scale = Math.Sqrt(c.Sum(v => v * v) / c.Length);
                if (scale > 0) for (var i = 0; i < c.Length; i++) c[i] /= scale;
                return c;
            }).ToArray();

        (double F, double S)[]? Estimate(double[][] channels)
        {
            Complex[] poles;
            try { poles = MatrixPencil.Poles(channels, order, pencil); }
            catch (Exception ex) when (ex is ArgumentException or InvalidOperationException or ArithmeticException) { return null; }
            var taken = new bool[poles.Length];
            var result = new (double, double)[used.Length];
            for (var m = 0; m < used.Length; m++)
            {
                var target = 2 * Math.PI * fits[used[m]].FrequencyHz.Value * dt;
                var best = -1;
                for (var p = 0; p < poles.Length; p++)
                {
                    if (taken[p] || poles[p].Phase <= 0 || poles[p].Magnitude <= 0) continue;
                    if (best < 0 || Math.Abs(poles[p].Phase - target) < Math.Abs(poles[best].Phase - target)) best = p;
                }
                if (best < 0) return null;
                taken[best] = true;
                result[m] = (poles[best].Phase / (2 * Math.PI * dt), -Math.Log(poles[best].Magnitude) / dt);
            }
            return result;
        }

        var estimate = Estimate(Channels((j, i) => modal.AmplitudeM[bestStart + i, j]));
        if (estimate is null) return "matrix-pencil cross-check failed: no matching poles were found";

        // Parametric bootstrap: the fitted curves plus white noise at each channel's residual level.
        // Each draw has its own seeded generator, so the draws run in parallel and the result does not depend on
        // how they are scheduled.
        var drawCount = Math.Max(4, options.CrossCheckBootstrapDraws);
        var drawn = new (double F, double S)[]?[drawCount];
        Parallel.For(0, drawCount, b =>
        {
            var random = new Random(unchecked(options.Seed * 7919 + b));
            var noise = new double[used.Length][];
            for (var m = 0; m < used.Length; m++)
            {
                noise[m] = new double[bestLength];
                for (var i = 0; i < bestLength; i++) noise[m][i] = raw[used[m]]!.ResidualRmsM * MonteCarloPropagation.StandardNormal(random);
            }
            var d = Estimate(Channels((j, i) =>
            {
                var m = Array.IndexOf(used, j);
                var r = raw[j]!;
                return r.ValueAt(times[i]) + noise[m][i];
            }));
            drawn[b] = d;
        });
        var draws = drawn.Where(d => d is not null).Select(d => d!).ToList();
        if (draws.Count < 4) return "matrix-pencil cross-check gave no uncertainty: the bootstrap failed";

        for (var m = 0; m < used.Length; m++)
        {
            var fit = fits[used[m]];
            // The draws add white noise; the mode's estimates depend on the noise near its own frequency, which the
            // fit measured (its local noise level, ResidualColour), so the spread is scaled by that level as well.
            var local = Math.Sqrt(raw[used[m]]!.ColourFactor);
            var uf = local * StandardDeviation(draws.Select(d => d[m].F));
            var us = local * StandardDeviation(draws.Select(d => d[m].S));
            var zf = Math.Abs(fit.FrequencyHz.Value - estimate[m].F) / Math.Sqrt(fit.FrequencyHz.StandardUncertainty * fit.FrequencyHz.StandardUncertainty + uf * uf);
            var zs = Math.Abs(fit.DecayRatePerS.Value - estimate[m].S) / Math.Sqrt(fit.DecayRatePerS.StandardUncertainty * fit.DecayRatePerS.StandardUncertainty + us * us);
            zf = double.IsFinite(zf) ? zf : 0;
            zs = double.IsFinite(zs) ? zs : 0;
            checks.Add(new CrossCheck(fit.N, new Measured(estimate[m].F, uf), new Measured(estimate[m].S, us), zf, zs,
                zf <= options.ConsistencyCoverageFactor && zs <= options.ConsistencyCoverageFactor));
        }
        return null;
    }

    private static double StandardDeviation(IEnumerable<double> values)
    {
        var v = values.ToArray();
        var mean = v.Average();
        return Math.Sqrt(v.Sum(x => (x - mean) * (x - mean)) / (v.Length - 1));
    }
}
