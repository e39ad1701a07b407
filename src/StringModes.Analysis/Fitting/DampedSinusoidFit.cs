using MathNet.Numerics.LinearAlgebra;
using StringModes.Analysis.Modal;

namespace StringModes.Analysis.Fitting;

/// <summary>
/// Result of fitting y(t) = A·e^(−σt)·cos(2πft + φ) + c. Covariance rows/columns: f, σ, A, φ (A and φ at t = 0).
/// </summary>
internal sealed record SinusoidFit(
    FitStatus Status,
    double FrequencyHz,
    double DecayRatePerS,
    double AmplitudeM,
    double PhaseRad,
    double OffsetM,
    double[,] Covariance,
    double ResidualRmsM,
    double ColourFactor,
    int Iterations)
{
    public double FrequencyUncertainty => Math.Sqrt(Covariance[0, 0]);
    public double DecayRateUncertainty => Math.Sqrt(Covariance[1, 1]);
    public bool Usable => Status is FitStatus.Converged or FitStatus.IterationLimit;

    /// <summary>Model value A·e^(−σt)·cos(2πft + φ) + c at time <paramref name="timeS"/>.</summary>
    public double ValueAt(double timeS)
        => AmplitudeM * Math.Exp(-DecayRatePerS * timeS) * Math.Cos(2 * Math.PI * FrequencyHz * timeS + PhaseRad) + OffsetM;

    public static SinusoidFit Failed(FitStatus status) => new(status, 0, 0, 0, 0, 0, new double[4, 4], 0, 1, 0);
}

/// <summary>
/// Levenberg–Marquardt fit of one decaying sinusoid plus offset (Levenberg 1944, Q. Appl. Math. 2:164; Marquardt 1963,
/// SIAM J. Appl. Math. 11:431) (<see cref="DampedSinusoidLm"/>) with an analytic Jacobian, on arbitrary (possibly non-uniform)
/// sample times. Internally the model is linear in its amplitudes, e^(−στ)·(a·cos 2πfτ + b·sin 2πfτ) + c, with τ
/// measured from the middle of the record and scaled to [−1, 1] so that every parameter is of order one; this keeps
/// the problem well conditioned and the A–φ pair free of wrap-around.
/// The covariance is s²·(JᵀJ)⁻¹ with s² = RSS/(n − 5), computed here from the Jacobian at the solution; when the
/// residuals' local spectral level in a narrow band around the mode frequency differs significantly from s², that
/// level replaces s² (Hannan 1973; see <see cref="ResidualColour"/>), so correlated errors near f widen the
/// uncertainties and white noise keeps the textbook covariance.
/// </summary>
internal static class DampedSinusoidFit
{
    private const int ParameterCount = 5;

    /// <param name="timesS">Sample times, increasing.</param>
    /// <param name="values">Samples.</param>
    /// <param name="seedFrequencyHz">Starting frequency (from <see cref="SpectralPeak"/>).</param>
    /// <param name="seedDecayRatePerS">Starting decay rate.</param>
    /// <param name="maximumIterations">Iteration limit of the minimiser.</param>
    /// <param name="correctForColouredResiduals">Whether to apply the residual-colour factor.</param>
    public static SinusoidFit Fit(double[] timesS, double[] values, double seedFrequencyHz, double seedDecayRatePerS,
        int maximumIterations, bool correctForColouredResiduals)
    {
        var n = timesS.Length;
        if (n < 2 * ParameterCount) return SinusoidFit.Failed(FitStatus.TooShort);
        var centre = 0.5 * (timesS[0] + timesS[^1]);
        var halfSpan = 0.5 * (timesS[^1] - timesS[0]);
        if (!(halfSpan > 0)) return SinusoidFit.Failed(FitStatus.TooShort);
        var scale = 0.0;
        foreach (var v in values) scale = Math.Max(scale, Math.Abs(v));
        if (!(scale > 0)) return SinusoidFit.Failed(FitStatus.NoSignal);

        var x = new double[n];
        var y = new double[n];
        for (var i = 0; i < n; i++)
        {
            x[i] = (timesS[i] - centre) / halfSpan;
            y[i] = values[i] / scale;
        }
        var nu0 = seedFrequencyHz * halfSpan; // cycles per half record

        // Parameters p = (Δν, s, a, b, c): frequency ν0 + Δν in cycles per half record, decay s = σ·halfSpan
        // (model and Jacobian: DampedSinusoidLm.Row).
        // Amplitudes of the seed by linear least squares at the seed frequency and decay.
        var s0 = seedDecayRatePerS * halfSpan;
        var seed = new SmallLeastSquares(n, 3);
        for (var i = 0; i < n; i++)
        {
            var e = Math.Exp(-s0 * x[i]);
            var (sin, cos) = Math.SinCos(2 * Math.PI * nu0 * x[i]);
            var r = seed.Row(i);
            r[0] = e * cos;
            r[1] = e * sin;
            r[2] = 1.0;
            seed.Rhs[i] = y[i];
        }
        var lin = new double[3];
        if (!(seed.Solve(n, lin) < 1e14)) return SinusoidFit.Failed(FitStatus.Singular);

        double[] p = [0.0, s0, lin[0], lin[1], lin[2]];
        var (exit, iterations) = DampedSinusoidLm.Minimise(x, y, nu0, p, maximumIterations);
        if (exit == DampedSinusoidLm.Exit.InvalidValues) return SinusoidFit.Failed(FitStatus.Singular);
        var status = exit == DampedSinusoidLm.Exit.IterationLimit ? FitStatus.IterationLimit : FitStatus.Converged;
        if (p.Any(v => !double.IsFinite(v))) return SinusoidFit.Failed(FitStatus.Singular);
        // Jacobian (row-major n × 5) and residuals at the solution; JᵀJ accumulated directly.
        var jac = new double[n * ParameterCount];
        var residual = new double[n];
        var jtj = new double[ParameterCount * ParameterCount];
        double rss = 0;
        for (var i = 0; i < n; i++)
        {
            var row = jac.AsSpan(i * ParameterCount, ParameterCount);
            residual[i] = y[i] - DampedSinusoidLm.Row(x[i], nu0, p, row);
            rss += residual[i] * residual[i];
            for (var j = 0; j < ParameterCount; j++)
                for (var k = j; k < ParameterCount; k++) jtj[j * ParameterCount + k] += row[j] * row[k];
        }
        for (var j = 0; j < ParameterCount; j++)
            for (var k = 0; k < j; k++) jtj[j * ParameterCount + k] = jtj[k * ParameterCount + j];
        var normal = Matrix<double>.Build.Dense(ParameterCount, ParameterCount, jtj);
        var eig = normal.Evd(Symmetricity.Symmetric).EigenValues.Real();
        if (!(eig.Minimum() > eig.Maximum() * 1e-14)) return SinusoidFit.Failed(FitStatus.Singular);
        var f = (nu0 + p[0]) / halfSpan;
        // Residuals at rounding level (noise-free data) carry no statistical information about colour.
        var colour = correctForColouredResiduals && rss > 1e-20 * n ? ResidualColour.Estimate(x, residual, jac, ParameterCount, nu0 + p[0]).VarianceFactor : 1.0;
        var covScaled = normal.Inverse() * (rss / (n - ParameterCount) * colour);

        // Physical parameters (f, σ, A(0), φ(0)) and the Jacobian of that map for the covariance.
        var sigma = p[1] / halfSpan;
        var a = p[2];
        var b = p[3];
        var ampCentre = Math.Sqrt(a * a + b * b);
        if (!(ampCentre > 0)) return SinusoidFit.Failed(FitStatus.Singular);
        var growth = Math.Exp(sigma * centre);
        var amplitude = ampCentre * growth * scale;
        var phaseCentre = Math.Atan2(-b, a);
        var phase = WrapPhase(phaseCentre - 2.0 * Math.PI * f * centre);
        var map = Matrix<double>.Build.Dense(4, ParameterCount);
        map[0, 0] = 1.0 / halfSpan;
        map[1, 1] = 1.0 / halfSpan;
        map[2, 1] = amplitude * centre / halfSpan;
        map[2, 2] = a / ampCentre * growth * scale;
        map[2, 3] = b / ampCentre * growth * scale;
        map[3, 0] = -2.0 * Math.PI * centre / halfSpan;
        map[3, 2] = b / (ampCentre * ampCentre);
        map[3, 3] = -a / (ampCentre * ampCentre);
        var cov = (map * covScaled * map.Transpose()).ToArray();
        if (cov.Cast<double>().Any(v => !double.IsFinite(v))) return SinusoidFit.Failed(FitStatus.Singular);
        return new SinusoidFit(status, f, sigma, amplitude, phase, p[4] * scale, cov, Math.Sqrt(rss / n) * scale, colour, iterations);
    }

    /// <summary>Phase wrapped to (−π, π].</summary>
    public static double WrapPhase(double phaseRad)
    {
        var w = Math.IEEERemainder(phaseRad, 2.0 * Math.PI);
        return w <= -Math.PI ? w + 2.0 * Math.PI : w;
    }
}
