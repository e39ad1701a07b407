using System.Diagnostics;
using System.Globalization;
using StringModes.Analysis;
using StringModes.Analysis.Fitting;
using StringModes.Analysis.Geometry;
using StringModes.Analysis.Modal;
using StringModes.Analysis.Physics;
using StringModes.Analysis.Uncertainty;

// Accuracy and speed figures of the modal analysis on synthetic data with known truth (invented scenarios).
// Usage: dotnet run -c Release -- [trials]   (default 1000 Monte Carlo trials per scenario)
CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
var trials = args.Length > 0 ? int.Parse(args[0], CultureInfo.InvariantCulture) : 1000;
if (args.Length > 1 && args[1] == "pipeline") { PipelineMonteCarlo(trials); return; }

Console.WriteLine($"Monte Carlo of single-mode fits, {trials} trials per row (k = 1 coverage should be 0.683 ± {Math.Sqrt(0.683 * 0.317 / trials):F3}):");
Console.WriteLine("scenario                         | f bias/CRLB  SD/CRLB  cover | σ bias/CRLB  SD/CRLB  cover | ms/fit");
SingleModeMonteCarlo("1000 fps 3 s, 82.4 Hz, SNR 70 dB", 1000, 3, 82.4, 0.8, 1.2e-3, 5e-7, 0, trials);
SingleModeMonteCarlo("240 fps 3 s, 31.7 Hz, SNR 34 dB", 240, 3, 31.7, 0.9, 1e-3, 2e-5, 0, trials);
SingleModeMonteCarlo("1000 fps 2 s, 110 Hz, SNR 54 dB", 1000, 2, 110, 1.5, 1e-3, 2e-6, 0, trials);
SingleModeMonteCarlo("500 fps 4 s, 60 Hz, SNR 14 dB", 500, 4, 60, 0.8, 1e-3, 2e-4, 0, trials);
SingleModeMonteCarlo("500 fps 4 s, 60 Hz, AR(1) 0.9", 500, 4, 60, 0.8, 1e-3, 2e-5, 0.9, trials);
SingleModeMonteCarlo("500 fps 4 s, 60 Hz, AR(1) -0.7", 500, 4, 60, 0.8, 1e-3, 2e-5, -0.7, trials);

Console.WriteLine();
Console.WriteLine($"Matrix-pencil cross-check estimates, {Math.Min(trials, 300)} trials (single channel; SD relative to the exact CRLB):");
PencilMonteCarlo("500 fps 4 s, 60 Hz, SNR 34 dB", 500, 4, 60, 0.8, 1e-3, 2e-5, Math.Min(trials, 300));
PencilMonteCarlo("240 fps 3 s, 31.7 Hz, SNR 14 dB", 240, 3, 31.7, 0.9, 1e-3, 2e-4, Math.Min(trials, 300));

Console.WriteLine();
PipelineMonteCarlo(Math.Min(trials, 200));

Console.WriteLine();
Console.WriteLine("Whole-string scenarios (projection + fits + pencil cross-check), one run each:");
StringScenario("guitar-like: 0.65 m, 82.4 Hz, B 2e-4, 7 marks, 1000 fps, 3 s, noise 1 um", 0.65, 82.4, 2e-4, 6, 2e-3, 0.2, 0.8, 7, 1000, 3, 1e-6);
StringScenario("slack cord: 1.2 m, 18 Hz, B 0, 5 marks, 240 fps, 4 s, noise 1 um", 1.2, 18, 0, 5, 5e-3, 0.3, 0.5, 5, 240, 4, 1e-6);
StringScenario("stiff wire: 0.62 m, 261.63 Hz, B 3.88e-4, 5 marks, 3000 fps, 1 s, noise 1 um", 0.62, 261.63, 3.88453e-4, 4, 1e-3, 0.27, 1.5, 5, 3000, 1, 1e-6);
StringScenario("aliased: stiff wire filmed at 960 fps (modes 2-3 above 480 Hz)", 0.62, 261.63, 3.88453e-4, 3, 1e-3, 0.27, 1.5, 5, 960, 2, 1e-6);

static void SingleModeMonteCarlo(string name, double fps, double duration, double f, double sigma, double amp, double noise, double ar, int trials)
{
    var times = Enumerable.Range(0, (int)(fps * duration)).Select(i => 0.2 + i / fps).ToArray();
    var crlb = CramerRaoBound.DampedSinusoid(times, f, sigma, amp, 0.7, noise);
    var options = new ModeFitOptions { CheckDecayShape = false, CrossCheck = false };
    var random = new Random(12345);
    var ef = new List<double>(); var es = new List<double>();
    int coverF = 0, coverS = 0, usable = 0;
    var watch = Stopwatch.StartNew();
    for (var k = 0; k < trials; k++)
    {
        double previous = 0;
        var y = new double[times.Length];
        // AR(1) noise scaled to the same marginal standard deviation.
        for (var i = 0; i < times.Length; i++)
        {
            var e = MonteCarloPropagation_StandardNormal(random) * noise * Math.Sqrt(1 - ar * ar);
            previous = ar * previous + e;
            y[i] = amp * Math.Exp(-sigma * times[i]) * Math.Cos(2 * Math.PI * f * times[i] + 0.7) + (ar == 0 ? noise * MonteCarloPropagation_StandardNormal(random) : previous);
        }
        var fit = ModeFitter.FitSeries(1, times, y, options);
        if (!fit.IsUsable) continue;
        usable++;
        ef.Add(fit.FrequencyHz.Value - f); es.Add(fit.DecayRatePerS.Value - sigma);
        if (Math.Abs(fit.FrequencyHz.Value - f) <= fit.FrequencyHz.StandardUncertainty) coverF++;
        if (Math.Abs(fit.DecayRatePerS.Value - sigma) <= fit.DecayRatePerS.StandardUncertainty) coverS++;
    }
    var ms = watch.Elapsed.TotalMilliseconds / trials;
    static (double Mean, double Sd) Stats(List<double> v) { var m = v.Average(); return (m, Math.Sqrt(v.Sum(x => (x - m) * (x - m)) / (v.Count - 1))); }
    var (bf, sf) = Stats(ef); var (bs, ss) = Stats(es);
    var note = ar != 0 ? "  (CRLB is the white-noise bound)" : "";
    Console.WriteLine($"{name,-32} | {bf / crlb.FrequencyHz,10:F3} {sf / crlb.FrequencyHz,8:F3} {coverF / (double)usable,6:F3} | {bs / crlb.DecayRatePerS,10:F3} {ss / crlb.DecayRatePerS,8:F3} {coverS / (double)usable,6:F3} | {ms,6:F2}{note}  usable {usable}/{trials}");
}

// Projection + fits on a whole string, repeated with fresh mark noise: per-mode RMS error against the exact CRLB of
// the modal-coordinate noise (mark noise · sqrt(2/(N+1)) for N equally spaced marks, DST-I) and k = 1 coverage.
static void PipelineMonteCarlo(int trials)
{
    const double length = 0.65, f0 = 82.4, b = 2e-4, noise = 1e-6, fps = 1000, duration = 2;
    const int marks = 7;
    var motion = new StringMotion(length, Enumerable.Range(1, 4).Select(n => new ModeComponent(n, StringLaw.ModeFrequency(n, f0, b), 0.8 * (1 + 0.3 * (n - 1)), Pluck.TriangularAmplitude(n, 0.2, 2e-3), 0.3 * n)));
    var positions = Enumerable.Range(1, marks).Select(i => i * length / (marks + 1)).ToArray();
    var frames = (int)(fps * duration);
    var times = Enumerable.Range(0, frames).Select(k => k / fps).ToArray();
    var clean = new double[frames, marks];
    for (var fr = 0; fr < frames; fr++) for (var i = 0; i < marks; i++) clean[fr, i] = motion.Displacement(positions[i], times[fr]);
    var modalNoise = noise * Math.Sqrt(2.0 / (marks + 1));
    var bounds = motion.Modes.Select(m => CramerRaoBound.DampedSinusoid(times, m.FrequencyHz, m.DecayRatePerS, m.AmplitudeM, m.PhaseRad, modalNoise)).ToArray();
    var ef = new double[4]; var es = new double[4]; var cf = new int[4]; var cs = new int[4]; var uf = new double[4]; var us = new double[4];
    var random = new Random(4242);
    var options = new ModalAnalysisOptions { Fitting = new ModeFitOptions { CrossCheck = false, CheckDecayShape = false } };
    for (var k = 0; k < trials; k++)
    {
        var u = new double[frames, marks]; var w = new double[frames, marks];
        for (var fr = 0; fr < frames; fr++) for (var i = 0; i < marks; i++) { u[fr, i] = clean[fr, i] + noise * MonteCarloPropagation_StandardNormal(random); w[fr, i] = 1; }
        var result = ModalAnalysis.Run(new StringCoordinates(length, positions, times, u, w), options);
        for (var j = 0; j < 4; j++)
        {
            var fit = result.Fits.Modes[j]; var truth = motion.Modes[j];
            var df = fit.FrequencyHz.Value - truth.FrequencyHz; var ds = fit.DecayRatePerS.Value - truth.DecayRatePerS;
            ef[j] += df * df; es[j] += ds * ds; uf[j] += fit.FrequencyHz.StandardUncertainty; us[j] += fit.DecayRatePerS.StandardUncertainty;
            if (Math.Abs(df) <= fit.FrequencyHz.StandardUncertainty) cf[j]++;
            if (Math.Abs(ds) <= fit.DecayRatePerS.StandardUncertainty) cs[j]++;
        }
    }
    Console.WriteLine($"Pipeline Monte Carlo ({trials} trials): 0.65 m, 82.4 Hz, B 2e-4, 7 marks, 1000 fps, 2 s, mark noise 1 um");
    for (var j = 0; j < 4; j++)
        Console.WriteLine($"  mode {j + 1}: f RMS/CRLB {Math.Sqrt(ef[j] / trials) / bounds[j].FrequencyHz:F2} mean u/CRLB {uf[j] / trials / bounds[j].FrequencyHz:F2} cover {cf[j] / (double)trials:F3} | σ RMS/CRLB {Math.Sqrt(es[j] / trials) / bounds[j].DecayRatePerS:F2} mean u/CRLB {us[j] / trials / bounds[j].DecayRatePerS:F2} cover {cs[j] / (double)trials:F3}");
}

static void PencilMonteCarlo(string name, double fps, double duration, double f, double sigma, double amp, double noise, int trials)
{
    var times = Enumerable.Range(0, (int)(fps * duration)).Select(i => i / fps).ToArray();
    var crlb = CramerRaoBound.DampedSinusoid(times, f, sigma, amp, 0.7, noise);
    var random = new Random(777);
    var ef = new List<double>(); var es = new List<double>(); var uf = new List<double>(); var agree = 0;
    for (var k = 0; k < trials; k++)
    {
        var a = new double[times.Length, 1];
        for (var i = 0; i < times.Length; i++) a[i, 0] = amp * Math.Exp(-sigma * times[i]) * Math.Cos(2 * Math.PI * f * times[i] + 0.7) + noise * MonteCarloPropagation_StandardNormal(random);
        var modal = new ModalCoordinates(times, a, Enumerable.Repeat(true, times.Length).ToArray(), [1], 1, 0, []);
        var fit = ModeFitter.Fit(modal, new ModeFitOptions { CheckDecayShape = false, Seed = k });
        if (fit.CrossChecks.Count == 0) continue;
        var c = fit.CrossChecks[0];
        ef.Add(c.FrequencyHz.Value - f); es.Add(c.DecayRatePerS.Value - sigma); uf.Add(c.FrequencyHz.StandardUncertainty);
        if (c.Agrees) agree++;
    }
    static double Rms(List<double> v) => Math.Sqrt(v.Sum(x => x * x) / v.Count);
    Console.WriteLine($"{name,-32} | f RMS/CRLB {Rms(ef) / crlb.FrequencyHz,6:F2}  σ RMS/CRLB {Rms(es) / crlb.DecayRatePerS,6:F2}  bootstrap u(f)/RMS {uf.Average() / Rms(ef),5:F2}  agreement flagged OK in {agree}/{ef.Count}");
}

static void StringScenario(string name, double lengthM, double f0, double b, int modes, double peak, double pluck, double sigma1, int marks, double fps, double duration, double noise)
{
    var motion = new StringMotion(lengthM, Enumerable.Range(1, modes).Select(n => new ModeComponent(n, StringLaw.ModeFrequency(n, f0, b), sigma1 * (1 + 0.3 * (n - 1)), Pluck.TriangularAmplitude(n, pluck, peak), 0.3 * n)));
    var frames = (int)(fps * duration);
    var positions = Enumerable.Range(1, marks).Select(i => i * lengthM / (marks + 1)).ToArray();
    var times = Enumerable.Range(0, frames).Select(k => 0.1 + k / fps).ToArray();
    var u = new double[frames, marks]; var w = new double[frames, marks];
    var random = new Random(99);
    for (var fr = 0; fr < frames; fr++)
        for (var i = 0; i < marks; i++) { u[fr, i] = motion.Displacement(positions[i], times[fr]) + noise * MonteCarloPropagation_StandardNormal(random); w[fr, i] = 1; }
    var mu = 1e-3;
    var watch = Stopwatch.StartNew();
    var analysis = ModalAnalysis.Run(new StringCoordinates(lengthM, positions, times, u, w), new ModalAnalysisOptions { LengthM = Measured.Exact(lengthM), LinearDensityKgPerM = Measured.Exact(mu) });
    var totalMs = watch.Elapsed.TotalMilliseconds;
    var modal = analysis.Modal;
    var result = analysis.Fits;
    Console.WriteLine($"{name}  (ModalAnalysis.Run {totalMs:F0} ms, {frames} frames, condition {modal.ConditionNumber:F2})");
    if (analysis.String is { } est)
    {
        var trueT = StringLaw.Tension(mu, lengthM, f0);
        Console.WriteLine($"  f0 rel err {est.FundamentalHz.Value / f0 - 1:E2} (u_rel {est.FundamentalHz.RelativeUncertainty:E2}), B {est.Inharmonicity.Value:E4} (true {b:E4}, u {est.Inharmonicity.StandardUncertainty:E1}{(est.InharmonicityAssumed ? ", assumed" : "")}), tension rel err {est.TensionN?.Value / trueT - 1:E2}, f2/f1 check {(est.SecondHarmonic is null ? "not possible" : est.SecondHarmonic.Passes ? "passes" : "flags")} ({est.SecondHarmonic?.DeviationInUncertainties:F1} u)");
    }
    Console.WriteLine("  n  amp/max   f rel err     (f err)/u   σ rel err   (σ err)/u  pencil f z  pencil σ z  status");
    var largest = motion.Modes.Max(m => Math.Abs(m.AmplitudeM));
    foreach (var truth in motion.Modes)
    {
        var fit = result.Modes.SingleOrDefault(m => m.N == truth.N);
        var check = result.CrossChecks.SingleOrDefault(c => c.N == truth.N);
        if (fit is null || !fit.IsUsable) { Console.WriteLine($"  {truth.N}  {Math.Abs(truth.AmplitudeM) / largest,6:F3}   not fitted: {fit?.Status}"); continue; }
        var ef = fit.FrequencyHz.Value - truth.FrequencyHz; var es = fit.DecayRatePerS.Value - truth.DecayRatePerS;
        Console.WriteLine($"  {truth.N}  {Math.Abs(truth.AmplitudeM) / largest,6:F3}  {ef / truth.FrequencyHz,11:E2}  {ef / fit.FrequencyHz.StandardUncertainty,9:F2}  {es / truth.DecayRatePerS,10:E2}  {es / fit.DecayRatePerS.StandardUncertainty,9:F2}  {check?.FrequencyDifference,10:F2}  {check?.DecayRateDifference,10:F2}  {fit.Status}");
    }
    foreach (var warning in analysis.Warnings) Console.WriteLine($"  warning: {warning}");
}

static double MonteCarloPropagation_StandardNormal(Random random)
{
    var u1 = 1.0 - random.NextDouble();
    var u2 = random.NextDouble();
    return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
}
