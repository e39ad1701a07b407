using System.Numerics;

namespace StringModes.Analysis.Fitting;

/// <summary>A spectral peak located by interpolation.</summary>
/// <param name="FrequencyHz">Interpolated peak frequency.</param>
/// <param name="PeakToMedianPower">Power at the peak bin over the median power of the searched band: a detection statistic (≈ 1 for noise).</param>
internal readonly record struct PeakEstimate(double FrequencyHz, double PeakToMedianPower);

/// <summary>
/// Frequency of the strongest spectral peak, as the seed of the nonlinear mode fit, and the classic three-point
/// DFT interpolators. Uses FftSharp's unscaled FFT.
/// </summary>
internal static class SpectralPeak
{
    /// <summary>
    /// Jacobsen's three-bin estimator of the fractional bin offset of a tone from the rectangular-window DFT values
    /// X[k−1], X[k], X[k+1] (Jacobsen &amp; Kootsookos 2007, IEEE Signal Processing Magazine 24(3):123):
    /// δ = Re[(X[k−1] − X[k+1]) / (2X[k] − X[k−1] − X[k+1])].
    /// </summary>
    public static double Jacobsen(Complex previous, Complex peak, Complex next)
        => ((previous - next) / (2.0 * peak - previous - next)).Real;

    /// <summary>Candan's bias correction of Jacobsen's estimator for an N-point DFT (Candan 2011, IEEE SP Letters 18:351): δ·tan(π/N)/(π/N).</summary>
    public static double CandanCorrected(double jacobsenOffset, int n) => jacobsenOffset * Math.Tan(Math.PI / n) / (Math.PI / n);

    /// <summary>
    /// Strongest peak above <paramref name="minimumHz"/>: Hann window, zero padding to at least 8× the record
    /// (rounded up to a power of two), and a parabola through the logarithm of the three highest bins (for the
    /// Hann main lobe, nearly a parabola in dB: Gaussian interpolation, Gasior &amp; Gonzalez 2004, CERN-AB-2004-023).
    /// The seed is within a small fraction of a bin; the mode fit refines it. Samples must be uniform at <paramref name="sampleRateHz"/>.
    /// </summary>
    public static PeakEstimate Strongest(ReadOnlySpan<double> samples, double sampleRateHz, double minimumHz)
        => Strongest(samples, sampleRateHz, minimumHz, double.PositiveInfinity);

    /// <summary>Strongest peak between <paramref name="minimumHz"/> and <paramref name="maximumHz"/>; the noise median is over the whole spectrum.</summary>
    public static PeakEstimate Strongest(ReadOnlySpan<double> samples, double sampleRateHz, double minimumHz, double maximumHz)
    {
        var n = samples.Length;
        var size = 1;
        while (size < 8 * n) size <<= 1;
        double mean = 0;
        foreach (var v in samples) mean += v;
        mean /= n;
        // A series constant to rounding (identical frames, a mark that never moves) holds no tone: without this test
        // the rounding error of its mean, shaped by the window, would show as a spurious peak at the lowest bin.
        double spread = 0, scale = 0;
        foreach (var v in samples)
        {
            spread = Math.Max(spread, Math.Abs(v - mean));
            scale = Math.Max(scale, Math.Abs(v));
        }
        if (!(spread > 1e-9 * scale)) return new PeakEstimate(0, 0);
        var windowed = new double[n];
        for (var i = 0; i < n; i++) windowed[i] = (samples[i] - mean) * (0.5 - 0.5 * Math.Cos(2.0 * Math.PI * (i + 0.5) / n));
        var half = size / 2;
        var power = RealPower(windowed, size);

        var binHz = sampleRateHz / size;
        var first = Math.Max(1, (int)Math.Ceiling(minimumHz / binHz));
        if (first >= half - 1) return new PeakEstimate(0, 0);
        var lastBin = double.IsPositiveInfinity(maximumHz) ? half - 1 : Math.Min(half - 1, (int)Math.Floor(maximumHz / binHz));
        var lowBin = Math.Max(first, (int)Math.Ceiling(minimumHz / binHz));
        if (lastBin <= lowBin) return new PeakEstimate(0, 0);
        var best = lowBin;
        for (var k = lowBin; k <= lastBin; k++) if (power[k] > power[best]) best = k;
        var band = power[first..half];
        Array.Sort(band);
        var median = band[band.Length / 2];
        var ratio = median > 0 ? power[best] / median : (power[best] > 0 ? double.MaxValue : 0);
        if (power[best] <= 0) return new PeakEstimate(0, 0);

        var offset = 0.0;
        if (best > 0 && best < half && power[best - 1] > 0 && power[best + 1] > 0)
        {
            var lm = Math.Log(power[best - 1]);
            var l0 = Math.Log(power[best]);
            var lp = Math.Log(power[best + 1]);
            var denominator = lm - 2 * l0 + lp;
            if (denominator < 0) offset = Math.Clamp(0.5 * (lm - lp) / denominator, -0.5, 0.5);
        }
        return new PeakEstimate((best + offset) * binHz, ratio);
    }

    /// <summary>
    /// |X[k]|², k = 0 … size/2, of the <paramref name="size"/>-point DFT of the real samples zero-padded to that size,
    /// by one complex FFT of half the size: with z[m] = x[2m] + j·x[2m+1] and Z its size/2-point DFT,
    /// X[k] = ½(Z[k] + Z*[M−k]) − ½j·e^(−j2πk/size)·(Z[k] − Z*[M−k]), M = size/2 (the standard real-input FFT;
    /// Press et al., Numerical Recipes, 3rd ed., §12.3; section number from memory).
    /// </summary>
    internal static double[] RealPower(ReadOnlySpan<double> samples, int size)
    {
        var m = size / 2;
        var z = new Complex[m];
        for (var i = 0; i < samples.Length; i++)
            z[i >> 1] = (i & 1) == 0 ? new Complex(samples[i], z[i >> 1].Imaginary) : new Complex(z[i >> 1].Real, samples[i]);
        FftSharp.FFT.Forward(z);
        var power = new double[m + 1];
        for (var k = 0; k <= m; k++)
        {
            var a = z[k % m];
            var b = Complex.Conjugate(z[(m - k) % m]);
            var (sin, cos) = Math.SinCos(-2.0 * Math.PI * k / size);
            var x = 0.5 * (a + b) - 0.5 * Complex.ImaginaryOne * new Complex(cos, sin) * (a - b);
            power[k] = x.Real * x.Real + x.Imaginary * x.Imaginary;
        }
        return power;
    }
}
