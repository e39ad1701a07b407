using System.Diagnostics;
using System.Globalization;
using StringModes.Analysis.Fitting;
using StringModes.Analysis.Geometry;
using StringModes.Analysis.Modal;
using StringModes.Analysis.Physics;
using StringModes.Analysis.Uncertainty;

// Accuracy and speed figures of the modal analysis on synthetic data with known truth (invented scenarios).
// Usage: dotnet run -c Release -- [trials]   (default 1000 Monte Carlo trials per scenario)
CultureInfo.CurrentCulture = CultureInfo.InvariantCulture;
if (args.Length > 1 && args[1] == "zscan")
{
    for (var seed = 1; seed <= 15; seed++)
    {
        var motion = new StringMotion(0.65, Enumerable.Range(1, 6).Select(n => new ModeComponent(n, StringLaw.ModeFrequency(n, 82.4, 2e-4), 0.8 * (1 + 0.3 * (n - 1)), Pluck.TriangularAmplitude(n, 0.2, 2e-3), 0.3 * n)));
        var pos = Enumerable.Range(1, 7).Select(i => i * 0.65 / 8).ToArray();
        var tt = Enumerable.Range(0, 3000).Select(k => 0.1 + k / 1000.0).ToArray();
        var uu = new double[3000, 7]; var ww = new double[3000, 7];
        var rnd = new Random(seed);
        for (var fr = 0; fr < 3000; fr++) for (var i = 0; i < 7; i++) { uu[fr, i] = motion.Displacement(pos[i], tt[fr]) + 1e-6 * MonteCarloPropagation_StandardNormal(rnd); ww[fr, i] = 1; }
        var md = ModalProjector.Project(new StringCoordinates(0.65, pos, tt, uu, ww));
        var res = ModeFitter.Fit(md, new ModeFitOptions { CrossCheck = false, CheckDecayShape = false });
        Console.WriteLine(string.Join("  ", res.Modes.Where(m => m.IsUsable).Select(m => $"{m.N}:{(m.FrequencyHz.Value - motion.Modes[m.N - 1].FrequencyHz) / m.FrequencyHz.StandardUncertainty,6:F2}/{(m.DecayRatePerS.Value - motion.Modes[m.N - 1].DecayRatePerS) / m.DecayRatePerS.StandardUncertainty,6:F2} c{m.ResidualColourFactor:F2}")));
    }
    return;
}
var trials = args.Length > 0 ? int.Parse(args[0], CultureInfo.InvariantCulture) : 1000;

Console.WriteLine($"Monte Carlo of single-mode fits, {trials} trials per row (k = 1 coverage should be 0.683 ± {Math.Sqrt(0.683 * 0.317 / trials):F3}):");
Console.WriteLine("scenario                         | f bias/CRLB  SD/CRLB  cover | σ bias/CRLB  SD/CRLB  cover | ms/fit");
SingleModeMonteCarlo("1000 fps 3 s, 82.4 Hz, SNR 70 dB", 1000, 3, 82.4, 0.8, 1.2e-3, 5e-7, 0, trials);
SingleModeMonteCarlo("240 fps 3 s, 31.7 Hz, SNR 34 dB", 240, 3, 31.7, 0.9, 1e-3, 2e-5, 0, trials);
SingleModeMonteCarlo("1000 fps 2 s, 110 Hz, SNR 54 dB", 1000, 2, 110, 1.5, 1e-3, 2e-6, 0, trials);
SingleModeMonteCarlo("500 fps 4 s, 60 Hz, SNR 14 dB", 500, 4, 60, 0.8, 1e-3, 2e-4, 0, trials);
SingleModeMonteCarlo("500 fps 4 s, 60 Hz, AR(1) 0.9", 500, 4, 60, 0.8, 1e-3, 2e-5, 0.9, trials);
SingleModeMonteCarlo("500 fps 4 s, 60 Hz, AR(1) -0.7", 500, 4, 60, 0.8, 1e-3, 2e-5, -0.7, trials);

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
    var watch = Stopwatch.StartNew();
    var modal = ModalProjector.Project(new StringCoordinates(lengthM, positions, times, u, w));
    var projectMs = watch.Elapsed.TotalMilliseconds;
    var result = ModeFitter.Fit(modal);
    var totalMs = watch.Elapsed.TotalMilliseconds;
    Console.WriteLine($"{name}  (projection {projectMs:F0} ms, total {totalMs:F0} ms, condition {modal.ConditionNumber:F2})");
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
    foreach (var warning in modal.Warnings.Concat(result.Warnings)) Console.WriteLine($"  warning: {warning}");
}

static double MonteCarloPropagation_StandardNormal(Random random)
{
    var u1 = 1.0 - random.NextDouble();
    var u2 = random.NextDouble();
    return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
}
