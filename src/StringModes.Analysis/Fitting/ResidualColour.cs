namespace StringModes.Analysis.Fitting;

/// <summary>
/// Variance inflation for least-squares fits whose residuals are not white. The parameters of a sinusoid fit are
/// linear functionals of the noise modulated at the mode frequency f, so their variance scales with the noise power
/// spectral density at f rather than with its mean: the factor is S(f)/σ², estimated by the Blackman–Tukey lag-window
/// estimate 1 + 2·Σ_k w_k·ρ_k·cos(2πfkΔt) with a Bartlett window of M lags (Priestley, Spectral Analysis and Time
/// Series, 1981, §6.2.3). For white residuals the factor is 1; it is applied only when it differs from 1 by more than
/// twice its own sampling standard deviation √((2/N)·Σ w_k²), so that white noise keeps the textbook covariance
/// (and its coverage) while coloured noise or model error changes it: widened where the residual spectrum is high at
/// f, narrowed (never below 1/4) where it is low, e.g. low-pass noise and a mode well above its corner.
/// </summary>
internal static class ResidualColour
{
    /// <param name="residuals">Residuals in time order (roughly uniform sampling assumed).</param>
    /// <param name="frequencyCyclesPerSample">Mode frequency times the mean sample interval.</param>
    public static double VarianceFactor(IReadOnlyList<double> residuals, double frequencyCyclesPerSample)
    {
        var n = residuals.Count;
        if (n < 32) return 1.0;
        var lags = Math.Max(4, (int)Math.Ceiling(2.0 * Math.Cbrt(n)));
        double mean = 0;
        for (var i = 0; i < n; i++) mean += residuals[i];
        mean /= n;
        double c0 = 0;
        for (var i = 0; i < n; i++) c0 += (residuals[i] - mean) * (residuals[i] - mean);
        if (!(c0 > 0)) return 1.0;
        double spectrum = 1, weightSquares = 1;
        for (var k = 1; k <= lags; k++)
        {
            double ck = 0;
            for (var i = k; i < n; i++) ck += (residuals[i] - mean) * (residuals[i - k] - mean);
            var w = 1.0 - k / (lags + 1.0);
            spectrum += 2.0 * w * (ck / c0) * Math.Cos(2.0 * Math.PI * frequencyCyclesPerSample * k);
            weightSquares += 2.0 * w * w;
        }
        var threshold = 1.0 + 2.0 * Math.Sqrt(2.0 * weightSquares / n);
        var margin = threshold - 1.0;
        return Math.Abs(spectrum - 1.0) > margin ? Math.Max(spectrum, 0.25) : 1.0;
    }
}
