using CsCheck;
using StringModes.Analysis.Fitting;
using StringModes.Analysis.Tests.TestData;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Tests.Fitting;

/// <summary>
/// The reported standard uncertainties of a mode fit scale linearly with the noise: u = σ̂·√[(JᵀJ)⁻¹]ᵢᵢ with σ̂ the
/// residual RMS (least-squares covariance; Cramér–Rao for white Gaussian noise, Rife &amp; Boorstyn 1974, REFERENCES.md §5),
/// so doubling the noise doubles u(f) and u(σ).
/// </summary>
public class ModeFitterProperties
{
    private const double RateHz = 1000;
    private const int Samples = 1000;

    private sealed record Mode(double FrequencyHz, double DecayPerS, double AmplitudeM, double PhaseRad, int NoiseSeed)
    {
        public override string ToString() => FormattableString.Invariant($"f = {FrequencyHz:R} Hz, σ = {DecayPerS:R} 1/s, A = {AmplitudeM:R} m, φ = {PhaseRad:R}, noise seed {NoiseSeed}");
    }

    private static readonly Gen<Mode> Modes =
        from f in Gen.Double[20, 200]
        from s in Gen.Double[0.3, 3]
        from a in Gen.Double[0.5e-3, 2e-3]
        from p in Gen.Double[-Math.PI, Math.PI]
        from seed in Gen.Int[1, int.MaxValue]
        select new Mode(f, s, a, p, seed);

    private static readonly double[] Times = Enumerable.Range(0, Samples).Select(i => i / RateHz).ToArray();

    private static double[] Clean(Mode m) =>
        Times.Select(t => m.AmplitudeM * Math.Exp(-m.DecayPerS * t) * Math.Cos(2 * Math.PI * m.FrequencyHz * t + m.PhaseRad)).ToArray();

    private static double[] Noise(int seed)
    {
        var random = new Random(seed);
        return Times.Select(_ => MonteCarloPropagation.StandardNormal(random)).ToArray();
    }

    private static ModeFit Fit(double[] clean, double[] noise, double sigma)
    {
        var fit = ModeFitter.FitSeries(1, Times, clean.Select((v, i) => v + sigma * noise[i]).ToArray());
        Assert.True(fit.IsUsable, $"fit status {fit.Status}: {string.Join("; ", fit.Warnings)}");
        return fit;
    }

    // The same noise draw, scaled by 2. At a signal-to-noise ratio A/σ_noise = 1000 the residuals are the noise to
    // first order, so σ̂ doubles; the ratio departs from 2 only through J at the fitted parameters, which differ
    // between the two fits by O(σ_noise/A) = 1e-3 relative. Tolerance 1 %: ten times that.
    [Fact]
    public void ScaledNoise_ScalesTheReportedUncertaintiesByTheSameFactor()
    {
        Property.ForAll(Modes, 40, 31_415_926, m =>
        {
            var clean = Clean(m);
            var noise = Noise(m.NoiseSeed);
            var one = Fit(clean, noise, 1e-3 * m.AmplitudeM);
            var two = Fit(clean, noise, 2e-3 * m.AmplitudeM);
            var rf = two.FrequencyHz.StandardUncertainty / one.FrequencyHz.StandardUncertainty;
            var rs = two.DecayRatePerS.StandardUncertainty / one.DecayRatePerS.StandardUncertainty;
            Assert.True(Math.Abs(rf - 2) <= 0.02, FormattableString.Invariant($"u(f) ratio {rf:F4}, expected 2 ± 0.02"));
            Assert.True(Math.Abs(rs - 2) <= 0.02, FormattableString.Invariant($"u(σ) ratio {rs:F4}, expected 2 ± 0.02"));
        });
    }

    // Independent noise draws at σ_noise and 2σ_noise: each u carries the scatter of its own σ̂ (about 1/√(2N) ≈ 2 %
    // for N = 1000) and of the colour correction, so single ratios scatter; their logarithms averaged over 32 modes
    // must be ln 2 within three standard errors of that mean (estimated from the same 32 ratios), and the
    // geometric-mean ratio within 10 % of 2 besides.
    [Fact]
    public void DoubledIndependentNoise_DoublesTheReportedUncertaintiesOnAverage()
    {
        var logF = new List<double>();
        var logS = new List<double>();
        Property.ForAll(Modes, 32, 27_182_818, m =>
        {
            var clean = Clean(m);
            var one = Fit(clean, Noise(m.NoiseSeed), 1e-3 * m.AmplitudeM);
            var two = Fit(clean, Noise(m.NoiseSeed ^ 0x5bd1e995), 2e-3 * m.AmplitudeM);
            logF.Add(Math.Log(two.FrequencyHz.StandardUncertainty / one.FrequencyHz.StandardUncertainty));
            logS.Add(Math.Log(two.DecayRatePerS.StandardUncertainty / one.DecayRatePerS.StandardUncertainty));
        });
        foreach (var (name, logs) in new[] { ("u(f)", logF), ("u(σ)", logS) })
        {
            var mean = logs.Average();
            var sd = Math.Sqrt(logs.Sum(v => (v - mean) * (v - mean)) / (logs.Count - 1));
            var se = sd / Math.Sqrt(logs.Count);
            Assert.True(Math.Abs(mean - Math.Log(2)) <= 3 * se,
                FormattableString.Invariant($"{name}: mean log ratio {mean:F4} (geometric mean {Math.Exp(mean):F3}), expected ln 2 = {Math.Log(2):F4} ± 3 × {se:F4}"));
            Assert.InRange(Math.Exp(mean), 1.8, 2.2);
        }
    }
}
