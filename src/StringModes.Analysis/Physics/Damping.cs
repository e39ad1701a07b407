namespace StringModes.Analysis.Physics;

/// <summary>
/// Conversions between damping measures of a viscously damped mode A·e^(−σt)·cos(ω_d·t + φ)
/// (Rao, Mechanical Vibrations; Inman, Engineering Vibration): σ = ζ·ω_n, ω_d = ω_n·√(1−ζ²),
/// δ = σ·T_d = 2πζ/√(1−ζ²), Q = 1/(2ζ), T60 = 3·ln10/σ.
/// Frequencies here are the damped (observed) frequency f_d = ω_d/2π unless a name says otherwise.
/// </summary>
public static class Damping
{
    /// <summary>Damping ratio ζ from decay rate σ (1/s) and damped frequency f_d (Hz): ζ = σ/√(ω_d² + σ²).</summary>
    public static double DampingRatio(double decayRatePerS, double dampedFrequencyHz)
    {
        var wd = 2.0 * Math.PI * dampedFrequencyHz;
        return decayRatePerS / Math.Sqrt(wd * wd + decayRatePerS * decayRatePerS);
    }

    /// <summary>Decay rate σ (1/s) from damping ratio ζ and undamped natural frequency f_n (Hz).</summary>
    public static double DecayRateFromNatural(double dampingRatio, double naturalFrequencyHz)
        => dampingRatio * 2.0 * Math.PI * naturalFrequencyHz;

    /// <summary>Quality factor Q = 1/(2ζ).</summary>
    public static double QualityFactor(double dampingRatio) => 1.0 / (2.0 * dampingRatio);

    /// <summary>Logarithmic decrement δ = 2πζ/√(1−ζ²) (per damped period).</summary>
    public static double LogarithmicDecrement(double dampingRatio)
        => 2.0 * Math.PI * dampingRatio / Math.Sqrt(1.0 - dampingRatio * dampingRatio);

    /// <summary>Damping ratio from logarithmic decrement, ζ = δ/√(4π² + δ²).</summary>
    public static double DampingRatioFromLogDecrement(double logDecrement)
        => logDecrement / Math.Sqrt(4.0 * Math.PI * Math.PI + logDecrement * logDecrement);

    /// <summary>Time in s for the amplitude to fall by 60 dB, T60 = 3·ln10/σ.</summary>
    public static double T60(double decayRatePerS) => 3.0 * Math.Log(10.0) / decayRatePerS;

    /// <summary>Loss factor η = 2ζ.</summary>
    public static double LossFactor(double dampingRatio) => 2.0 * dampingRatio;

    /// <summary>Undamped natural frequency f_n (Hz) from damped frequency and decay rate: ω_n² = ω_d² + σ².</summary>
    public static double NaturalFrequency(double dampedFrequencyHz, double decayRatePerS)
    {
        var wd = 2.0 * Math.PI * dampedFrequencyHz;
        return Math.Sqrt(wd * wd + decayRatePerS * decayRatePerS) / (2.0 * Math.PI);
    }
}
