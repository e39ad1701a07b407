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

    /// <param name="x">Sample abscissae (any affine scaling of time), increasing.</param>
    /// <param name="residual">Residuals at <paramref name="x"/>.</param>
    /// <param name="jacobian">Jacobian of the fitted model at the solution, row-major n × <paramref name="parameters"/>, same abscissae.</param>
    /// <param name="parameters">Number of fitted parameters p (columns of the Jacobian).</param>
    /// <param name="cyclesPerUnit">Mode frequency in cycles per unit of <paramref name="x"/>.</param>
    public static LocalNoiseLevel Estimate(ReadOnlySpan<double> x, ReadOnlySpan<double> residual, ReadOnlySpan<double> jacobian, int parameters, double cyclesPerUnit)
    {
        var n = x.Length;
        var p = parameters;
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
        var offsets = new List<int>(bins);
        for (var k = -BandHalfWidthBins; k <= BandHalfWidthBins; k++) offsets.Add(k);
        bool Outside(int k) => cyclesPerUnit + k * spacing < 0.5 * spacing || cyclesPerUnit + k * spacing > nyquist - 0.5 * spacing;
        var lowCut = offsets.Count(k => cyclesPerUnit + k * spacing < 0.5 * spacing);
        var highCut = offsets.Count(k => cyclesPerUnit + k * spacing > nyquist - 0.5 * spacing);
        offsets.RemoveAll(Outside);
        for (var k = 1; k <= lowCut; k++) offsets.Add(BandHalfWidthBins + k);
        for (var k = 1; k <= highCut; k++) offsets.Add(-(BandHalfWidthBins + k));
        offsets.RemoveAll(Outside);
        if (offsets.Count < bins - 1) return white;

        // With B the band's cosines and sines (n × m) and J the Jacobian, the projections need only the small
        // products BᵀB, Bᵀr, BᵀJ and JᵀJ, accumulated row by row (B is never stored):
        //   ‖Q r‖² = (Bᵀr)ᵀ(BᵀB)⁻¹(Bᵀr),   tr QP = ‖L_B⁻¹ (BᵀJ) L_J⁻ᵀ‖²_F   (BᵀB = L_B L_Bᵀ, JᵀJ = L_J L_Jᵀ, Cholesky).
        // The band's columns are nearly orthogonal (Fourier-spaced), so BᵀB is well conditioned; the fit's Jacobian
        // is in scaled time, where JᵀJ is too.
        var m = 2 * offsets.Count;
        var kMin = offsets.Min();
        var kMax = offsets.Max();
        var btb = new double[m * m];
        var btr = new double[m];
        var btj = new double[m * p];
        var jtj = new double[p * p];
        var b = new double[m];
        var powers = new System.Numerics.Complex[kMax - kMin + 1];
        double rss = 0;
        for (var i = 0; i < n; i++)
        {
            // e^{j2π(f + k/T)(x − x0)} for all k by a rotation recurrence from k = kMin (error grows by ~1 ulp per step).
            var dx = x[i] - x[0];
            var step = System.Numerics.Complex.FromPolarCoordinates(1, 2.0 * Math.PI * spacing * dx);
            var value = System.Numerics.Complex.FromPolarCoordinates(1, 2.0 * Math.PI * (cyclesPerUnit + kMin * spacing) * dx);
            for (var k = 0; k < powers.Length; k++)
            {
                powers[k] = value;
                value *= step;
            }
            for (var c = 0; c < offsets.Count; c++)
            {
                var z = powers[offsets[c] - kMin];
                b[2 * c] = z.Real;
                b[2 * c + 1] = z.Imaginary;
            }
            var r = residual[i];
            rss += r * r;
            var row = jacobian.Slice(i * p, p);
            for (var c = 0; c < m; c++)
            {
                var bc = b[c];
                btr[c] += bc * r;
                for (var d = c; d < m; d++) btb[c * m + d] += bc * b[d];
                for (var k = 0; k < p; k++) btj[c * p + k] += bc * row[k];
            }
            for (var j = 0; j < p; j++)
                for (var k = j; k < p; k++) jtj[j * p + k] += row[j] * row[k];
        }
        if (!CholeskyInPlace(btb, m) || !CholeskyInPlace(jtj, p)) return white;
        // ‖L_B⁻¹ Bᵀr‖²
        ForwardSubstitute(btb, m, btr, 1);
        double bandEnergy = 0;
        foreach (var v in btr) bandEnergy += v * v;
        // W = L_B⁻¹ (BᵀJ) (m × p), then W L_J⁻ᵀ: solve row by row with L_J.
        ForwardSubstitute(btb, m, btj, p);
        double shared = 0;
        var w = new double[p];
        for (var c = 0; c < m; c++)
        {
            for (var k = 0; k < p; k++)
            {
                var s = btj[c * p + k];
                for (var j = 0; j < k; j++) s -= jtj[k * p + j] * w[j];
                w[k] = s / jtj[k * p + k];
                shared += w[k] * w[k];
            }
        }
        var dof = m - shared;
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

    /// <summary>Cholesky factor L (lower triangle, row-major, in place) of a symmetric matrix given by its upper triangle; false unless positive definite.</summary>
    private static bool CholeskyInPlace(double[] a, int n)
    {
        for (var j = 0; j < n; j++)
            for (var i = j + 1; i < n; i++) a[i * n + j] = a[j * n + i];
        for (var j = 0; j < n; j++)
        {
            var d = a[j * n + j];
            for (var k = 0; k < j; k++) d -= a[j * n + k] * a[j * n + k];
            if (!(d > 0)) return false;
            d = Math.Sqrt(d);
            a[j * n + j] = d;
            for (var i = j + 1; i < n; i++)
            {
                var s = a[i * n + j];
                for (var k = 0; k < j; k++) s -= a[i * n + k] * a[j * n + k];
                a[i * n + j] = s / d;
            }
        }
        return true;
    }

    /// <summary>Solves L·X = B in place for the n × columns matrix B (row-major), L from <see cref="CholeskyInPlace"/>.</summary>
    private static void ForwardSubstitute(double[] l, int n, double[] b, int columns)
    {
        for (var i = 0; i < n; i++)
            for (var c = 0; c < columns; c++)
            {
                var s = b[i * columns + c];
                for (var k = 0; k < i; k++) s -= l[i * n + k] * b[k * columns + c];
                b[i * columns + c] = s / l[i * n + i];
            }
    }
}
