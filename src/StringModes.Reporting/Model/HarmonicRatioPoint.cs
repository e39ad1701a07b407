namespace StringModes.Reporting.Model;

/// <summary>Harmonic ratio f_n / (n·f_1) of one mode with its standard uncertainty.</summary>
public sealed record HarmonicRatioPoint(int ModeNumber, MeasuredValue Ratio);
