using StringModes.Analysis.Fitting;
using StringModes.Analysis.Modal;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Tests.Fitting;

/// <summary>Key frames of a compressed video: detection in the residuals and fitting on the key frames alone.</summary>
public class KeyFrameTests
{
    private const double Fps = 1000, F = 87.84, Sigma = 0.654, Amplitude = 1e-4;

    // One mode of 0.1 mm sampled at 1000 fps for 2 s. Key frames (every 12th, OpenCV's default keyframe interval for its MPEG-4
    // writer, common practice) carry white noise of 1 um; the frames between carry 2 um and a gain deficit growing
    // linearly from 0.4 % to 2.1 % over the record, as measured on the pipeline benchmark's MPEG-4 clip
    // (bench/StringModes.Bench.Pipeline, inter-frame mark displacement against the synthesiser's truth).
    private static ModalCoordinates Codec(int seed, bool withCodecError)
    {
        var random = new Random(seed);
        var frames = (int)(2 * Fps);
        var times = Enumerable.Range(0, frames).Select(k => k / Fps).ToArray();
        var a = new double[frames, 1];
        for (var k = 0; k < frames; k++)
        {
            var x = Amplitude * Math.Exp(-Sigma * times[k]) * Math.Cos(2 * Math.PI * F * times[k] + 0.4);
            var key = k % 12 == 3;
            var gain = !withCodecError || key ? 1.0 : 1 - (0.004 + 0.017 * times[k] / 2);
            var noise = (withCodecError && !key ? 2e-6 : 1e-6) * MonteCarloPropagation.StandardNormal(random);
            a[k, 0] = gain * x + noise;
        }
        return new ModalCoordinates(times, a, Enumerable.Repeat(true, frames).ToArray(), [1], 1, 0, []);
    }

    private static readonly ModeFitOptions Options = new() { CrossCheck = false };

    // Without key-frame handling the inter-frame gain drift is absorbed into the decay rate (bias ≈ 0.017/2 s ÷ σ
    // ≈ 1.3 %) beyond 3 standard uncertainties (z ≈ 4.7 with this seed); on the key frames alone the estimate must lie within 3 standard
    // uncertainties of the truth (the acceptance criterion of the modal-analysis issue).
    [Fact]
    public void InterFrameGainDrift_IsDetectedAndTheKeyFramesGiveAnHonestDecayRate()
    {
        var modal = Codec(31, withCodecError: true);
        var all = ModeFitter.Fit(modal, Options with { DetectKeyFrames = false }).Modes[0];
        var zAll = (all.DecayRatePerS.Value - Sigma) / all.DecayRatePerS.StandardUncertainty;
        Assert.True(Math.Abs(zAll) > 3, $"the test scenario must bias an all-frame fit; z = {zAll:F1}");

        var result = ModeFitter.Fit(modal, Options);
        Assert.Contains(result.Warnings, w => w.Contains("every 12th frame") && w.Contains("167 key frames"));
        var fit = result.Modes[0];
        Assert.InRange((fit.DecayRatePerS.Value - Sigma) / fit.DecayRatePerS.StandardUncertainty, -3, 3);
        Assert.InRange((fit.FrequencyHz.Value - F) / fit.FrequencyHz.StandardUncertainty, -3, 3);
        Assert.True(Math.Abs(fit.DecayRatePerS.Value / Sigma - 1) <= 0.02, $"decay {fit.DecayRatePerS}");
    }

    // The matrix pencil runs on every frame, so on a codec clip it must be compared with the all-frame fit (two
    // estimators, same data): it then agrees, while the key-frame values it is not computed from would differ by the
    // codec's bias. The check's own criterion (ConsistencyCoverageFactor, 3 combined standard uncertainties) decides.
    [Fact]
    public void CrossCheckOnACodecClip_ComparesEstimatorsOnTheSameFrames()
    {
        var modal = Codec(31, withCodecError: true);
        var allFrames = ModeFitter.Fit(modal, new ModeFitOptions { DetectKeyFrames = false }).Modes[0];
        var result = ModeFitter.Fit(modal, new ModeFitOptions());
        Assert.Contains(result.Warnings, w => w.Contains("key frames only"));
        var check = Assert.Single(result.CrossChecks);
        var combined = Math.Sqrt(Math.Pow(allFrames.DecayRatePerS.StandardUncertainty, 2) + Math.Pow(check.DecayRatePerS.StandardUncertainty, 2));
        Assert.Equal(Math.Abs(allFrames.DecayRatePerS.Value - check.DecayRatePerS.Value) / combined, check.DecayRateDifference, 1e-9);
        Assert.True(check.Agrees, $"pencil σ {check.DecayRatePerS}, all-frame fit σ {allFrames.DecayRatePerS}, difference {check.DecayRateDifference:F1} u");
    }

    // Tracking error that grows with the mark's speed (blur), for a 40 Hz mode filmed at 400 frames/s: the error
    // variance repeats every 5 frames (half a period), in step with the frame index for the whole record. That is
    // not a codec's key-frame pattern and must not be taken for one (the detector skips phase-locked periods;
    // without that guard this 2 s record is taken for key frames every 5th frame at 5.9 standard errors).
    [Fact]
    public void MotionDependentErrorLockedToTheFrameRate_IsNotTakenForKeyFrames()
    {
        var random = new Random(32);
        const double fps = 400, f = 40, sigma = 0.5, amp = 1e-3;
        var times = Enumerable.Range(0, 800).Select(k => k / fps).ToArray();
        var a = new double[times.Length, 1];
        for (var k = 0; k < times.Length; k++)
        {
            var phase = 2 * Math.PI * f * times[k] + 0.3;
            var speed = Math.Abs(Math.Sin(phase));
            a[k, 0] = amp * Math.Exp(-sigma * times[k]) * Math.Cos(phase) + (0.2e-6 + 4e-6 * speed) * MonteCarloPropagation.StandardNormal(random);
        }
        var modal = new ModalCoordinates(times, a, Enumerable.Repeat(true, times.Length).ToArray(), [1], 1, 0, []);
        var result = ModeFitter.Fit(modal, Options);
        Assert.Equal(FitStatus.Converged, result.Modes[0].Status);
        Assert.DoesNotContain(result.Warnings, w => w.Contains("key frames"));
    }

    // Residuals of constant variance must not trigger the detection: its family-wise false-alarm probability is
    // 1e-3 per record, so 20 white-noise records all pass except with probability 2 %.
    [Fact]
    public void WhiteNoise_DoesNotLookLikeKeyFrames()
    {
        for (var seed = 0; seed < 20; seed++)
        {
            var result = ModeFitter.Fit(Codec(100 + seed, withCodecError: false), Options);
            Assert.DoesNotContain(result.Warnings, w => w.Contains("key frames"));
        }
    }
}
