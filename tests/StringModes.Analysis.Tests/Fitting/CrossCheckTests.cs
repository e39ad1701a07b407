using StringModes.Analysis.Fitting;
using StringModes.Analysis.Modal;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Tests.Fitting;

/// <summary>The matrix-pencil cross-check agrees with the fits on clean data that include weak modes.</summary>
public class CrossCheckTests
{
    // Six modal coordinates at 1000 fps for 3 s, as on the pipeline benchmark (f_n = n·87.84 Hz,
    // σ_n = 0.5 + 2e-5·f_n² 1/s, white noise 10 µm): modes of 4 mm, 1.5 mm, 0.2 mm and 0.1 mm, and two coordinates
    // that hold no mode: a faint steady tone at n·f1 (3 µm, σ = 0.4 1/s) and a leak of mode 1's frequency with a
    // different envelope (3 µm, σ = 0.05 1/s), as a tracker's harmonic distortion and leakage look, with 1 µm noise. The pencil must find the strong modes' decay rates within 3 of its
    // standard uncertainties of the truth, and agree with the fits (the check's own criterion, 3 combined
    // standard uncertainties). Scaled to equal power instead of equal noise, the two mode-less coordinates pulled the
    // pencil's mode-1 decay rate to 0.34 1/s (z = −69).
    [Fact]
    public void WeakModesAmongStrongOnes_DoNotBiasThePencil()
    {
        var random = new Random(5);
        const double fps = 1000, f1 = 87.84;
        var frames = 3000;
        double[] amplitudes = [4e-3, 1.5e-3, 2e-4, 1e-4, 3e-6, 3e-6];
        double Sigma(int n) => n <= 4 ? 0.5 + 2e-5 * Math.Pow(n * f1, 2) : 0.4;
        var times = Enumerable.Range(0, frames).Select(k => k / fps).ToArray();
        var a = new double[frames, amplitudes.Length];
        for (var k = 0; k < frames; k++)
            for (var j = 0; j < amplitudes.Length; j++)
            {
                var n = j + 1;
                a[k, j] = amplitudes[j] * Math.Exp(-Sigma(n) * times[k]) * Math.Cos(2 * Math.PI * n * f1 * times[k] + 0.7 * n)
                    + (n <= 4 ? 1e-5 : 1e-6) * MonteCarloPropagation.StandardNormal(random)
                    + (n > 4 ? 3e-6 * Math.Exp(-0.05 * times[k]) * Math.Cos(2 * Math.PI * f1 * times[k]) : 0);
            }
        var modal = new ModalCoordinates(times, a, Enumerable.Repeat(true, frames).ToArray(), [1, 2, 3, 4, 5, 6], 1, 0, []);
        var result = ModeFitter.Fit(modal, new ModeFitOptions { DetectKeyFrames = false });
        Assert.True(result.CrossChecks.Count >= 5, $"only {result.CrossChecks.Count} modes were cross-checked: " + string.Join("; ", result.Modes.Select(m => $"{m.N} {m.Status}")));
        foreach (var n in new[] { 1, 2 })
        {
            var check = result.CrossChecks.Single(c => c.N == n);
            var z = (check.DecayRatePerS.Value - Sigma(n)) / check.DecayRatePerS.StandardUncertainty;
            Assert.True(Math.Abs(z) <= 3, $"mode {n}: pencil σ {check.DecayRatePerS} against {Sigma(n):F4} 1/s (z = {z:F1})");
            Assert.True(check.Agrees, $"mode {n}: differences {check.FrequencyDifference:F1} u and {check.DecayRateDifference:F1} u");
        }
    }
}
