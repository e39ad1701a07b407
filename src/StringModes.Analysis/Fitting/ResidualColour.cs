using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace StringModes.Analysis.Fitting;

/// <summary>Outcome of the local noise-level estimate near a mode frequency.</summary>
/// <param name="VarianceFactor">Ŝ(f)/s² applied to the covariance (1 when the residuals are consistent with white noise).</param>
/// <param name="Ratio">The estimated ratio Ŝ(f)/s², whether or not it was applied.</param>
/// <param name="DegreesOfFreedom">Effective degrees of freedom ν of Ŝ(f).</param>
internal readonly record struct LocalNoiseLevel(double VarianceFactor, double Ratio, double DegreesOfFreedom);

/// <summary>
/// Local (narrow-band) noise level of least-squares residuals at a sinusoid's frequency, for honest parameter
/// uncertainties when the errors are correlated in time.
/// <para>
/// Theory: for a sinusoid in stationary, not necessarily white, noise the least-squares frequency, amplitude and
/// phase estimates have asymptotically the white-noise covariance with the noise variance σ² replaced by the noise
/// spectral density at the signal frequency, 2π·f_e(ω₀) in Hannan's normalisation (Hannan 1973, "The estimation
/// of frequency", J. Appl. Probab. 10:510–519; Quinn &amp; Hannan, The Estimation and Tracking of Frequency, 2001,
/// §3.3; the same result underlies Whittle's frequency-domain likelihood). A damped sinusoid's parameters are
/// linear functionals of the noise modulated at f over the record, so only the noise within a few Fourier bins of
/// f (spacing 1/T) matters.
/// </para>
/// <para>
/// Estimate: the residual r is projected onto the cosines and sines at the Fourier frequencies f + k/T,
/// |k| ≤ K (a Daniell band of 2K + 1 bins around f; orthonormalised by QR, so non-uniform sampling is exact). With Q
/// that projector and P the projector onto the fit's Jacobian columns, E‖Q r‖² = σ²·(rank Q − tr QP) for white
/// noise, because the fit has absorbed tr QP of the band's dimensions (mostly the bins next to f). So
/// Ŝ = ‖Q r‖² / (rank Q − tr QP) is the band-limited analogue of the textbook s² = RSS/(n − p), unbiased for white
/// noise, with ν = rank Q − tr QP effective degrees of freedom (≈ 22 for K = 6). Because white noise gives
/// Ŝ/s² ≈ χ²_ν/ν, the covariance keeps its textbook white-noise form unless the ratio lies outside the central 95 %
/// of that distribution; then it is scaled by Ŝ/s² (up or down). The test keeps white-noise coverage at its nominal
/// value, and the narrow band sees errors concentrated next to f — an unmodelled envelope or phase wobble from
/// video compression, a tracker non-linearity or a blurred stretch — which a broad lag-window estimate of the
/// spectrum averages away.
/// </para>
/// </summary>
internal static class ResidualColour
{
    /// <summary>Half-width of the band in Fourier bins: 2K + 1 = 13 bins, ν ≈ 22 after the fit's share.</summary>
    public const int BandHalfWidthBins = 6;

    /// <summary>Two-sided probability of the whiteness test; outside its central interval the local level is used.</summary>
    public const double TestProbability = 0.95;

    /// <param name="x">Sample abscissae (any affine scaling of time).</param>
    /// <param name="residual">Residuals at <paramref name="x"/>.</param>
    /// <param name="jacobian">Jacobian of the fitted model at the solution (n × p), same abscissae.</param>
    /// <param name="cyclesPerUnit">Mode frequency in cycles per unit of <paramref name="x"/>.</param>
    public static LocalNoiseLevel Estimate(Vector<double> x, Vector<double> residual, Matrix<double> jacobian, double cyclesPerUnit)
    {
        var n = x.Count;
        var p = jacobian.ColumnCount;
        var white = new LocalNoiseLevel(1, 1, n - p);
        var bins = 2 * BandHalfWidthBins + 1;
        if (n < 4 * bins || !(cyclesPerUnit > 0)) return white;
        var span = x[n - 1] - x[0];
        if (!(span > 0)) return white;
        var spacing = (n - 1) / (span * n); // Fourier spacing 1/T, with T = n·mean interval
        var rate = (n - 1) / span;
        var nyquist = 0.5 * rate;
        // A series sampled below the mode frequency (key frames only) sees it at its alias, where the band belongs.
        if (cyclesPerUnit > nyquist)
        {
            cyclesPerUnit = Math.IEEERemainder(cyclesPerUnit, rate);
            cyclesPerUnit = Math.Abs(cyclesPerUnit);
        }

        // Bins f + k/T, kept inside (0, Nyquist); a band cut by either limit is extended on the other side.
        var frequencies = new List<double>(bins);
        for (var k = -BandHalfWidthBins; k <= BandHalfWidthBins; k++) frequencies.Add(cyclesPerUnit + k * spacing);
        var lowCut = frequencies.Count(v => v < 0.5 * spacing);
        var highCut = frequencies.Count(v => v > nyquist - 0.5 * spacing);
        frequencies.RemoveAll(v => v < 0.5 * spacing || v > nyquist - 0.5 * spacing);
        for (var k = 1; k <= lowCut; k++) frequencies.Add(cyclesPerUnit + (BandHalfWidthBins + k) * spacing);
        for (var k = 1; k <= highCut; k++) frequencies.Add(cyclesPerUnit - (BandHalfWidthBins + k) * spacing);
        frequencies.RemoveAll(v => v < 0.5 * spacing || v > nyquist - 0.5 * spacing);
        if (frequencies.Count < bins - 1) return white;

        var basis = Matrix<double>.Build.Dense(n, 2 * frequencies.Count, (i, c) =>
        {
            var arg = 2.0 * Math.PI * frequencies[c / 2] * (x[i] - x[0]);
            return c % 2 == 0 ? Math.Cos(arg) : Math.Sin(arg);
        });
        var bandQr = basis.QR(MathNet.Numerics.LinearAlgebra.Factorization.QRMethod.Thin);
        if (!bandQr.IsFullRank) return white;
        var jacQr = jacobian.QR(MathNet.Numerics.LinearAlgebra.Factorization.QRMethod.Thin);
        if (!jacQr.IsFullRank) return white;
        var u = bandQr.Q;
        var projected = u.TransposeThisAndMultiply(residual);
        var bandEnergy = projected.DotProduct(projected);
        var shared = u.TransposeThisAndMultiply(jacQr.Q).FrobeniusNorm();
        var dof = basis.ColumnCount - shared * shared;
        var rss = residual.DotProduct(residual);
        if (!(dof > 2) || !(rss > 0) || n <= p) return white;
        var ratio = bandEnergy / dof / (rss / (n - p));
        if (!double.IsFinite(ratio)) return white;

        // White noise: ratio ≈ χ²_ν/ν (the full-band s² has n − p ≫ ν degrees of freedom).
        var tail = 0.5 * (1 - TestProbability);
        var lower = ChiSquared.InvCDF(dof, tail) / dof;
        var upper = ChiSquared.InvCDF(dof, 1 - tail) / dof;
        var applied = ratio < lower || ratio > upper ? ratio : 1.0;
        return new LocalNoiseLevel(applied, ratio, dof);
    }
}
