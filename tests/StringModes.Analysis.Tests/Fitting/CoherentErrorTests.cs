using StringModes.Analysis.Fitting;
using StringModes.Analysis.Modal;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Tests.Fitting;

/// <summary>
/// Coherent tracking error at a weak mode's own frequency (see <see cref="CoherentError"/>): harmonics of a strong
/// mode's motion that every modal coordinate carries, which the weak mode's fit absorbs unseen.
/// </summary>
public class CoherentErrorTests
{
    // Six modal coordinates at 1000 fps for 2.5 s, shaped like the pipeline benchmark's blurred-release clip: modes 1
    // and 2 strong (4 mm, 1.5 mm), mode 3 weak (0.1 mm, σ = 1.9 1/s), coordinates 4–6 without a mode; white noise
    // 2 µm everywhere. With contamination, every coordinate also carries a steady 2 µm tone at exactly 3·f1 (slow decay,
    // 0.3 1/s; random phase per coordinate and trial), as a mark crossing background texture produces.
    private const double Fps = 1000, F1 = 87.84, Sigma3 = 1.9, Noise = 2e-6, Tone = 2e-6;
    private static readonly double[] Amplitudes = [4e-3, 1.5e-3, 1e-4, 0, 0, 0];
    private static double Sigma(int n) => 0.5 + 2e-5 * Math.Pow(n * F1, 2) is var s && n == 3 ? Sigma3 : s;

    private static ModalCoordinates Coordinates(int seed, bool contaminated)
    {
        var random = new Random(seed);
        var frames = 2500;
        var times = Enumerable.Range(0, frames).Select(k => k / Fps).ToArray();
        var phases = Amplitudes.Select(_ => 2 * Math.PI * random.NextDouble()).ToArray();
        var a = new double[frames, Amplitudes.Length];
        for (var k = 0; k < frames; k++)
            for (var j = 0; j < Amplitudes.Length; j++)
            {
                var n = j + 1;
                a[k, j] = Amplitudes[j] * Math.Exp(-Sigma(n) * times[k]) * Math.Cos(2 * Math.PI * n * F1 * times[k] + 0.7 * n)
                    + Noise * MonteCarloPropagation.StandardNormal(random)
                    + (contaminated ? Tone * Math.Exp(-0.3 * times[k]) * Math.Cos(2 * Math.PI * 3 * F1 * times[k] + phases[j]) : 0);
            }
        return new ModalCoordinates(times, a, Enumerable.Repeat(true, frames).ToArray(), [1, 2, 3, 4, 5, 6], 1, 0, []);
    }

    private static (double[] ZSigma, double[] ZFrequency, int Widened) Trials(bool contaminated, bool include, int count = 40)
    {
        var options = new ModeFitOptions { DetectKeyFrames = false, CrossCheck = false, CheckDecayShape = false, IncludeCoherentError = include };
        var zs = new List<double>();
        var zf = new List<double>();
        var widened = 0;
        for (var seed = 1; seed <= count; seed++)
        {
            var mode3 = ModeFitter.Fit(Coordinates(seed, contaminated), options).Modes.Single(m => m.N == 3);
            Assert.True(mode3.IsUsable, $"seed {seed}: mode 3 {mode3.Status}");
            zs.Add((mode3.DecayRatePerS.Value - Sigma3) / mode3.DecayRatePerS.StandardUncertainty);
            zf.Add((mode3.FrequencyHz.Value - 3 * F1) / mode3.FrequencyHz.StandardUncertainty);
            if (mode3.CoherentErrorDecayRatePerS > 0) widened++;
        }
        return ([.. zs], [.. zf], widened);
    }

    private static double Coverage(double[] z, double k) => z.Count(v => Math.Abs(v) <= k) / (double)z.Length;
    private static double Rms(double[] z) => Math.Sqrt(z.Average(v => v * v));

    // A standard uncertainty is the standard deviation of the error it describes (GUM, JCGM 100:2008, 2.3.1), so the
    // RMS of error/u over trials should be 1. The absorbed tone has a random phase: its error is arcsine-distributed
    // (JCGM 101:2008, 6.4.6, section number from memory), for which k = 1 covers only 50 % but k = 3 covers all, so
    // coverage at k = 1 is not the criterion here. Tolerance on the RMS: [0.7, 1.45]; with 40 trials the RMS of an
    // arcsine-plus-normal mix scatters by about ±0.1, and the excess is estimated from only five other coordinates
    // (200 trials gave 1.17 for σ and 1.18 for f).
    [Fact]
    public void ContaminatedWeakMode_UncertaintyDescribesTheError()
    {
        var (without, _, _) = Trials(contaminated: true, include: false);
        // The scenario must show the problem: the white-noise uncertainty alone misses the absorbed tone.
        Assert.True(Rms(without) > 2.5, $"without the coherent-error term the RMS z of σ3 is only {Rms(without):F2}; the test scenario does not exercise it");
        var (zs, zf, widened) = Trials(contaminated: true, include: true);
        Assert.True(widened >= 36, $"the coherent error was found in only {widened}/40 contaminated trials");
        Assert.InRange(Rms(zs), 0.7, 1.45);
        Assert.InRange(Rms(zf), 0.7, 1.45);
        Assert.True(Coverage(zs, 3) >= 0.95, $"only {Coverage(zs, 3):P0} of σ3 errors lie within 3u");
    }

    // Clean data: the 99 % significance gate leaves the white-noise uncertainty alone in about 99 % of trials
    // (at most 4 of 40 allowed: the binomial probability of more at p = 0.01 is below 1e-3), and k = 1 covers 68.3 %
    // of a normal error (GUM, JCGM 100:2008, G.1.3, Table G.1); with 40 trials the binomial standard deviation is
    // 0.074, so [0.50, 0.87] is about ±2.5 of them.
    [Fact]
    public void CleanCoordinates_AreNotWidened()
    {
        var (zs, _, widened) = Trials(contaminated: false, include: true);
        Assert.True(widened <= 4, $"{widened}/40 clean trials were widened");
        Assert.InRange(Coverage(zs, 1), 0.50, 0.87);
    }
}
