using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Fitting;

/// <summary>
/// Fitted parameters of one mode's modal coordinate a_n(t) = A·e^(−σt)·cos(2πft + φ) + c, each with its standard
/// uncertainty (k = 1). Values are meaningful only when <see cref="Status"/> is <see cref="FitStatus.Converged"/> or
/// <see cref="FitStatus.IterationLimit"/>; otherwise they are 0 (never NaN).
/// </summary>
/// <param name="N">Mode number.</param>
/// <param name="FrequencyHz">Damped (observed) frequency f, Hz.</param>
/// <param name="DecayRatePerS">Amplitude decay rate σ, 1/s.</param>
/// <param name="AmplitudeM">Amplitude A at t = 0 of the time axis, metres (extrapolated back from the analysis window).</param>
/// <param name="PhaseRad">Phase φ at t = 0, radians in (−π, π].</param>
/// <param name="DampingRatio">ζ = σ/√(ω_d² + σ²).</param>
/// <param name="QualityFactor">Q = 1/(2ζ); null when the decay is not resolved (σ ≤ 2u(σ)), since Q would be unbounded.</param>
/// <param name="T60S">Time for a 60 dB fall, 3·ln10/σ, s; null when the decay is not resolved.</param>
/// <param name="LogarithmicDecrement">δ = σ/f (per damped period).</param>
/// <param name="Status">Fit outcome.</param>
/// <param name="ResidualRmsM">RMS of the time-domain fit residual, metres.</param>
/// <param name="ResidualColourFactor">Factor by which the covariance was scaled because the residuals' spectral level in a narrow band around f differs significantly from their mean level (local noise level; see the fitter's docs), &gt; 0; 1 for residuals consistent with white noise.</param>
/// <param name="Warnings">Plain-language warnings about this mode (beating, drifting frequency, short window, …).</param>
public sealed record ModeFit(
    int N,
    Measured FrequencyHz,
    Measured DecayRatePerS,
    Measured AmplitudeM,
    Measured PhaseRad,
    Measured DampingRatio,
    Measured? QualityFactor,
    Measured? T60S,
    Measured LogarithmicDecrement,
    FitStatus Status,
    double ResidualRmsM,
    double ResidualColourFactor,
    IReadOnlyList<string> Warnings)
{
    /// <summary>
    /// Standard uncertainty of f from coherent tracking error at the mode's own frequency, Hz, already included in
    /// <see cref="FrequencyHz"/>'s uncertainty (added in quadrature); 0 when the other modal coordinates show none.
    /// </summary>
    public double CoherentErrorFrequencyHz { get; init; }

    /// <summary>As <see cref="CoherentErrorFrequencyHz"/>, for σ, 1/s.</summary>
    public double CoherentErrorDecayRatePerS { get; init; }

    /// <summary>The fit behind these values (final covariance); null when unfitted.</summary>
    internal SinusoidFit? Source { get; init; }

    /// <summary>True when fitted on the key frames of a compressed video only.</summary>
    internal bool OnKeyFrames { get; init; }

    /// <summary>True when the values can be used (converged, or stopped at the iteration limit).</summary>
    public bool IsUsable => Status is FitStatus.Converged or FitStatus.IterationLimit;

    internal static ModeFit Unfitted(int n, FitStatus status, IReadOnlyList<string> warnings)
        => new(n, default, default, default, default, default, null, null, default, status, 0, 1, warnings);
}
