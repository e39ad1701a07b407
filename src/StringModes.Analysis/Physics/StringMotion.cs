namespace StringModes.Analysis.Physics;

/// <summary>One standing-wave mode of a string: u_n(s,t) = A·e^(−σt)·sin(nπs/L)·cos(2π·f·t + φ).</summary>
/// <param name="N">Mode number, ≥ 1.</param>
/// <param name="FrequencyHz">Damped (observed) frequency in Hz.</param>
/// <param name="DecayRatePerS">Amplitude decay rate σ in 1/s, ≥ 0.</param>
/// <param name="AmplitudeM">Amplitude A at t = 0 in metres (may be negative).</param>
/// <param name="PhaseRad">Phase φ in radians.</param>
public sealed record ModeComponent(int N, double FrequencyHz, double DecayRatePerS, double AmplitudeM, double PhaseRad);

/// <summary>
/// Transverse displacement field of a string with pinned ends as a sum of decaying sine modes:
/// u(s,t) = Σ A_n·e^(−σ_n·t)·sin(nπs/L)·cos(2π·f_n·t + φ_n).
/// This is the synthesiser's ground truth and the model the modal analysis inverts.
/// </summary>
public sealed class StringMotion
{
    private readonly ModeComponent[] _modes;

    public StringMotion(double lengthM, IEnumerable<ModeComponent> modes)
    {
        if (!(lengthM > 0) || double.IsInfinity(lengthM)) throw new ArgumentOutOfRangeException(nameof(lengthM), "length must be positive and finite");
        LengthM = lengthM;
        _modes = modes.OrderBy(m => m.N).ToArray();
    }

    /// <summary>Vibrating length in metres.</summary>
    public double LengthM { get; }

    /// <summary>Modes in ascending order of mode number.</summary>
    public IReadOnlyList<ModeComponent> Modes => _modes;

    /// <summary>Modal coordinate a_n(t) = A·e^(−σt)·cos(2πft + φ) of one mode, in metres.</summary>
    public static double ModalCoordinate(ModeComponent m, double timeS)
        => m.AmplitudeM * Math.Exp(-m.DecayRatePerS * timeS) * Math.Cos(2.0 * Math.PI * m.FrequencyHz * timeS + m.PhaseRad);

    /// <summary>Transverse displacement in metres at position s (m from end 0) and time t (s).</summary>
    public double Displacement(double positionM, double timeS)
    {
        double u = 0;
        foreach (var m in _modes)
            u += ModalCoordinate(m, timeS) * Math.Sin(m.N * Math.PI * positionM / LengthM);
        return u;
    }

    /// <summary>Slope ∂u/∂s (dimensionless) at position s and time t.</summary>
    public double Slope(double positionM, double timeS)
    {
        double d = 0;
        foreach (var m in _modes)
        {
            var k = m.N * Math.PI / LengthM;
            d += ModalCoordinate(m, timeS) * k * Math.Cos(k * positionM);
        }
        return d;
    }

    /// <summary>Fills <paramref name="coordinates"/> with a_n(t) for every mode, in the order of <see cref="Modes"/>.</summary>
    public void ModalCoordinates(double timeS, Span<double> coordinates)
    {
        for (var i = 0; i < _modes.Length; i++) coordinates[i] = ModalCoordinate(_modes[i], timeS);
    }
}

/// <summary>Initial shapes that set mode amplitudes.</summary>
public static class Pluck
{
    /// <summary>
    /// Sine-series amplitude of mode n for a triangular pluck of peak h (m) at fractional position p (0 &lt; p &lt; 1),
    /// released from rest: A_n = 2h·sin(nπp)/(n²π²·p·(1−p)) (Fourier sine series of the triangle; any text on the plucked string).
    /// </summary>
    public static double TriangularAmplitude(int n, double positionFraction, double peakM)
    {
        var p = positionFraction;
        return 2.0 * peakM * Math.Sin(n * Math.PI * p) / (n * n * Math.PI * Math.PI * p * (1.0 - p));
    }
}
