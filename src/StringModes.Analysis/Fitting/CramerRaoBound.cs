using MathNet.Numerics.LinearAlgebra;

namespace StringModes.Analysis.Fitting;

/// <summary>Cramér–Rao lower bounds (as standard deviations) on the parameters of one damped sinusoid in white Gaussian noise.</summary>
/// <param name="FrequencyHz">Bound on the standard deviation of an unbiased frequency estimate, Hz.</param>
/// <param name="DecayRatePerS">Bound on the standard deviation of the decay rate, 1/s.</param>
/// <param name="AmplitudeM">Bound on the amplitude at t = 0, m.</param>
/// <param name="PhaseRad">Bound on the phase at t = 0, rad.</param>
public sealed record CramerRaoBounds(double FrequencyHz, double DecayRatePerS, double AmplitudeM, double PhaseRad);

/// <summary>
/// Cramér–Rao bounds for tone and damped-tone estimation, used to judge the mode fitter's efficiency.
/// </summary>
public static class CramerRaoBound
{
    /// <summary>
    /// One real tone of unknown amplitude, phase and frequency in white noise, N uniform samples:
    /// var(ω̂) ≥ 12/(η·N·(N²−1)) (rad/sample)², η = A²/(2σ²) (Rife &amp; Boorstyn 1974, IEEE Trans. Inf. Theory 20:591).
    /// Returns the standard deviation bound in rad/sample.
    /// </summary>
    public static double RealToneFrequencyRadPerSample(int sampleCount, double signalToNoiseRatio)
        => Math.Sqrt(12.0 / (signalToNoiseRatio * sampleCount * ((double)sampleCount * sampleCount - 1)));

    /// <summary>
    /// Damped complex exponential A·e^((−α+jω)n), n = 0..N−1, in complex white noise of variance σ²: the frequency and
    /// damping bounds decouple and are equal, CRLB = (σ²/2A²)/S with S = Σn²z²ⁿ − (Σn·z²ⁿ)²/Σz²ⁿ, z = e^(−α)
    /// (context: Yao &amp; Pandit 1995, IEEE Trans. Signal Processing 43:878). Returns the variance bound in (rad/sample)².
    /// </summary>
    public static double DampedComplexExponentialVariance(int sampleCount, double dampingPerSample, double noiseVariance, double amplitude)
    {
        double s0 = 0, s1 = 0, s2 = 0;
        for (var n = 0; n < sampleCount; n++)
        {
            var z2n = Math.Exp(-2.0 * dampingPerSample * n);
            s0 += z2n;
            s1 += n * z2n;
            s2 += (double)n * n * z2n;
        }
        var s = s2 - s1 * s1 / s0;
        return noiseVariance / (2.0 * amplitude * amplitude) / s;
    }

    /// <summary>
    /// Exact bound for the real model A·e^(−σt)·cos(2πft + φ) + c at arbitrary sample times with white Gaussian noise
    /// of standard deviation <paramref name="noiseM"/>: the inverse Fisher information (JᵀJ)⁻¹·σ_noise² (Kay,
    /// Fundamentals of Statistical Signal Processing I, 1993, §3.8). Zeros if the information matrix is singular.
    /// </summary>
    public static CramerRaoBounds DampedSinusoid(IReadOnlyList<double> timesS, double frequencyHz, double decayRatePerS,
        double amplitudeM, double phaseRad, double noiseM)
    {
        var j = Matrix<double>.Build.Dense(timesS.Count, 5);
        for (var i = 0; i < timesS.Count; i++)
        {
            var t = timesS[i];
            var e = Math.Exp(-decayRatePerS * t);
            var arg = 2.0 * Math.PI * frequencyHz * t + phaseRad;
            var c = Math.Cos(arg);
            var s = Math.Sin(arg);
            j[i, 0] = -amplitudeM * e * s * 2.0 * Math.PI * t;
            j[i, 1] = -amplitudeM * t * e * c;
            j[i, 2] = e * c;
            j[i, 3] = -amplitudeM * e * s;
            j[i, 4] = 1;
        }
        var info = j.TransposeThisAndMultiply(j);
        var evd = info.Evd();
        if (evd.EigenValues.Real().Minimum() <= 0) return new CramerRaoBounds(0, 0, 0, 0);
        var cov = info.Inverse() * (noiseM * noiseM);
        return new CramerRaoBounds(Math.Sqrt(cov[0, 0]), Math.Sqrt(cov[1, 1]), Math.Sqrt(cov[2, 2]), Math.Sqrt(cov[3, 3]));
    }
}
