using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace StringModes.Analysis.Fitting;

/// <summary>
/// Coherent tracking error at a mode's own frequency, estimated from the other modal coordinates.
/// <para>
/// Tracking errors that repeat with the string's motion (a mark crossing the same background texture every period, a
/// blur-dependent centroid error) are periodic at the strong mode's frequency and its harmonics, so they appear at
/// n·f1 in every modal coordinate. For a nearly ideal string mode n sits at n·f1: the part of that error that falls into
/// mode n's own coordinate has the mode's frequency, is absorbed by the fit and never shows in its residuals. Its
/// envelope follows the strong mode's amplitude, not mode n's decay, so it biases σ (and a little f) of a weak mode
/// by more than the residuals suggest.
/// </para>
/// <para>
/// The other coordinates carry the same kind of error at f_n with no mode there. Each one's residual r_m (after its own
/// mode) is passed through mode n's linearised fit: δθ_m = [(JᵀJ)⁻¹Jᵀ r_m]_θ for θ = f, σ, with J the fit's Jacobian
/// at the solution. Under white noise alone δθ_m / (s_m·√V_θθ) is standard normal (V = (JᵀJ)⁻¹, s_m² the mean square
/// of r_m), so Q = Σ_m δθ_m² / (s_m²·V_θθ) follows χ²(K) over K coordinates. When Q exceeds its 99 % point, mode n is
/// taken to carry, relative to its own noise level s_n, the mean excess the other coordinates show:
/// u_c²(θ) = (Q/K − 1)·s_n²·V_θθ is added to θ's variance (GUM type B). Below the 99 % point nothing is added, so
/// clean data keep their white-noise uncertainties in 99 % of cases.
/// </para>
/// </summary>
internal static class CoherentError
{
    /// <summary>Significance of the excess: the 99 % point of χ²(K).</summary>
    public const double Significance = 0.99;

    private const int ParameterCount = 5;

    /// <summary>Variance added to f and σ (0 when not significant) and the excess ratios Q/K − 1.</summary>
    public sealed record Excess(double FrequencyVariance, double DecayVariance, double FrequencyRatio, double DecayRatio, int Probes);

    /// <param name="times">Sample times of mode n's fit.</param>
    /// <param name="fit">Mode n's fit at those times.</param>
    /// <param name="ownNoiseRms">RMS of mode n's own residual, s_n.</param>
    /// <param name="probes">Residuals of the other coordinates at the same times.</param>
    /// <returns>Null when nothing can be estimated (no probes, singular Jacobian).</returns>
    public static Excess? Estimate(double[] times, SinusoidFit fit, double ownNoiseRms, IReadOnlyList<double[]> probes)
    {
        var n = times.Length;
        if (probes.Count == 0 || n <= ParameterCount) return null;
        // Jacobian columns (f, σ, cos, sin, 1) about the centre time; the span, and so δf and δσ, do not depend on it.
        var centre = 0.5 * (times[0] + times[^1]);
        var jac = new double[n * ParameterCount];
        for (var i = 0; i < n; i++)
        {
            var tau = times[i] - centre;
            var g = fit.AmplitudeM * Math.Exp(-fit.DecayRatePerS * times[i]);
            var (sin, cos) = Math.SinCos(2 * Math.PI * fit.FrequencyHz * times[i] + fit.PhaseRad);
            var row = jac.AsSpan(i * ParameterCount, ParameterCount);
            row[0] = -2 * Math.PI * tau * g * sin;
            row[1] = -tau * g * cos;
            row[2] = g * cos;
            row[3] = g * sin;
            row[4] = 1;
        }
        // Columns scaled to unit norm (in place) before the 5 × 5 inverse.
        var norm = new double[ParameterCount];
        for (var i = 0; i < n; i++)
            for (var k = 0; k < ParameterCount; k++) norm[k] += jac[i * ParameterCount + k] * jac[i * ParameterCount + k];
        for (var k = 0; k < ParameterCount; k++)
        {
            norm[k] = Math.Sqrt(norm[k]);
            if (!(norm[k] > 0)) return null;
        }
        for (var i = 0; i < n; i++)
            for (var k = 0; k < ParameterCount; k++) jac[i * ParameterCount + k] /= norm[k];
        var gram = Matrix<double>.Build.Dense(ParameterCount, ParameterCount);
        for (var i = 0; i < n; i++)
        {
            var row = jac.AsSpan(i * ParameterCount, ParameterCount);
            for (var j = 0; j < ParameterCount; j++)
                for (var k = j; k < ParameterCount; k++) gram[j, k] += row[j] * row[k];
        }
        for (var j = 0; j < ParameterCount; j++)
            for (var k = 0; k < j; k++) gram[j, k] = gram[k, j];
        var eig = gram.Evd(Symmetricity.Symmetric).EigenValues.Real();
        if (!(eig.Minimum() > eig.Maximum() * 1e-13)) return null;
        var inverse = gram.Inverse();
        var vff = inverse[0, 0] / (norm[0] * norm[0]);
        var vss = inverse[1, 1] / (norm[1] * norm[1]);

        double qf = 0, qs = 0;
        var used = 0;
        var projected = new double[ParameterCount];
        foreach (var r in probes)
        {
            double mean = 0, square = 0;
            for (var i = 0; i < n; i++) mean += r[i];
            mean /= n;
            for (var i = 0; i < n; i++) square += (r[i] - mean) * (r[i] - mean);
            var noise2 = square / n;
            if (!(noise2 > 0)) continue;
            Array.Clear(projected);
            for (var i = 0; i < n; i++)
            {
                var row = jac.AsSpan(i * ParameterCount, ParameterCount);
                for (var k = 0; k < ParameterCount; k++) projected[k] += row[k] * r[i];
            }
            double df = 0, ds = 0;
            for (var k = 0; k < ParameterCount; k++)
            {
                df += inverse[0, k] * projected[k];
                ds += inverse[1, k] * projected[k];
            }
            df /= norm[0];
            ds /= norm[1];
            qf += df * df / (noise2 * vff);
            qs += ds * ds / (noise2 * vss);
            used++;
        }
        if (used == 0) return null;
        var threshold = ChiSquared.InvCDF(used, Significance);
        var ratioF = qf > threshold ? qf / used - 1 : 0;
        var ratioS = qs > threshold ? qs / used - 1 : 0;
        var own2 = ownNoiseRms * ownNoiseRms;
        var result = new Excess(ratioF * own2 * vff, ratioS * own2 * vss, ratioF, ratioS, used);
        return double.IsFinite(result.FrequencyVariance) && double.IsFinite(result.DecayVariance) ? result : null;
    }
}
