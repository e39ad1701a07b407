namespace StringModes.Reporting.Model;

/// <summary>
/// Transverse displacement sampled at marks along the string: <c>DisplacementM[timeIndex][positionIndex]</c>.
/// </summary>
/// <param name="PositionsM">Mark positions along the string from one end, metres, ascending.</param>
/// <param name="TimesS">Sample times, seconds, ascending.</param>
/// <param name="DisplacementM">Transverse displacement in metres, one row per time, one column per position.</param>
/// <param name="LengthM">Vibrating length in metres; when given, the fixed ends (zero displacement) are drawn too.</param>
public sealed record DisplacementField(double[] PositionsM, double[] TimesS, double[][] DisplacementM, double? LengthM = null);
