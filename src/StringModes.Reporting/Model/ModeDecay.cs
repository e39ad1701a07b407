namespace StringModes.Reporting.Model;

/// <summary>
/// Measured envelope of one mode and the fitted exponential decay A0·e^(−σt) with its uncertainties.
/// </summary>
/// <param name="ModeNumber">Mode number n.</param>
/// <param name="TimesS">Envelope sample times, seconds (t = 0 is the fit's reference time).</param>
/// <param name="EnvelopeM">Measured envelope amplitude, metres (≥ 0).</param>
/// <param name="InitialAmplitudeM">Fitted A0 at t = 0, metres, with standard uncertainty.</param>
/// <param name="DecayRatePerS">Fitted decay rate σ, 1/s, with standard uncertainty.</param>
/// <param name="Correlation">Correlation coefficient between the fitted A0 and σ (−1..1; 0 when unknown).</param>
public sealed record ModeDecay(
    int ModeNumber,
    double[] TimesS,
    double[] EnvelopeM,
    MeasuredValue InitialAmplitudeM,
    MeasuredValue DecayRatePerS,
    double Correlation = 0);
