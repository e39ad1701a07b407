namespace StringModes.Reporting.Model;

/// <summary>Magnitude spectrum of one modal coordinate, with the fitted peak(s) to mark on it.</summary>
/// <param name="ModeNumber">Mode number n.</param>
/// <param name="FrequenciesHz">Frequency of each spectrum bin, hertz, ascending.</param>
/// <param name="Magnitude">Linear magnitude of each bin (any consistent unit; plotted in dB re the largest over all spectra).</param>
/// <param name="Peaks">Fitted peaks to mark and label.</param>
public sealed record ModeSpectrum(int ModeNumber, double[] FrequenciesHz, double[] Magnitude, SpectrumPeak[] Peaks);

/// <summary>A fitted spectral peak.</summary>
/// <param name="FrequencyHz">Fitted frequency, hertz.</param>
/// <param name="FrequencyUncertaintyHz">Standard uncertainty of the frequency, hertz (0 when unknown).</param>
/// <param name="Label">Short label, e.g. "n = 2"; the frequency is appended.</param>
public sealed record SpectrumPeak(double FrequencyHz, double FrequencyUncertaintyHz, string Label);
