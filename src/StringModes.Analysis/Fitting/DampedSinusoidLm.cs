namespace StringModes.Analysis.Fitting;

/// <summary>
/// Levenberg–Marquardt minimisation of Σ (yᵢ − m(xᵢ; p))² for the scaled damped-sinusoid model of
/// <see cref="DampedSinusoidFit"/>, m = e^(−s·x)·(a·cos wx + b·sin wx) + c with w = 2π(ν0 + Δν) and
/// p = (Δν, s, a, b, c). The normal matrix JᵀJ and gradient Jᵀr are accumulated in one pass over the samples without
/// storing J, so an iteration costs one evaluation of exp, cos and sin per sample and allocates nothing.
/// Damping follows Marquardt (1963, SIAM J. Appl. Math. 11:431): (JᵀJ + λ·diag JᵀJ)·δ = Jᵀr, λ divided by 10 after
/// an accepted step and multiplied by 10 after a rejected one (Press et al., Numerical Recipes, 3rd ed., §15.5.2).
/// </summary>
internal static class DampedSinusoidLm
{
    public const int ParameterCount = 5;

    /// <summary>Exit reason.</summary>
    public enum Exit { Converged, IterationLimit, InvalidValues }

    /// <summary>Minimises from <paramref name="p"/> (updated in place); returns the exit reason and the iterations used.</summary>
    public static (Exit Exit, int Iterations) Minimise(double[] x, double[] y, double nu0, double[] p, int maximumIterations,
        double stepTolerance = 1e-13, double chiSquareTolerance = 1e-8, double gradientTolerance = 1e-14)
    {
        Span<double> a = stackalloc double[ParameterCount * ParameterCount];
        Span<double> g = stackalloc double[ParameterCount];
        Span<double> m = stackalloc double[ParameterCount * ParameterCount];
        Span<double> delta = stackalloc double[ParameterCount];
        Span<double> trial = stackalloc double[ParameterCount];
        var cost = Normal(x, y, nu0, p, a, g);
        if (!double.IsFinite(cost)) return (Exit.InvalidValues, 0);
        var lambda = 1e-3;
        // Below this absolute cost reduction nothing is measurable: it is a model change of 1e-12 of the signal's
        // amplitude, the level at which exp, cos and sin of arguments of order 100 round.
        double sumSquares = 0;
        foreach (var v in y) sumSquares += v * v;
        var scaleFloor = 1e-24 * sumSquares;
        for (var iteration = 1; iteration <= maximumIterations; iteration++)
        {
            var gradient = 0.0;
            for (var i = 0; i < ParameterCount; i++) gradient = Math.Max(gradient, Math.Abs(g[i]));
            if (gradient <= gradientTolerance) return (Exit.Converged, iteration - 1);
            // Convergence is judged on the undamped (Gauss–Newton) step, whatever the damping: the iteration has
            // converged when that step is negligible against the parameters (all of order one by the scaling of
            // DampedSinusoidFit, so the test is relative with an absolute floor of 1), or when the reduction it
            // predicts, gᵀ·(JᵀJ)⁻¹·g, is below chiSquareTolerance times the residual variance s² = cost/(n − 5):
            // then the remaining step moves χ² by less than 1e-8, i.e. the parameters by less than 1e-4 of their
            // standard uncertainties. (A small damped step only means slow progress.)
            a.CopyTo(m);
            if (SolveCholesky(m, g, delta))
            {
                var small = true;
                double predicted = 0;
                for (var i = 0; i < ParameterCount; i++)
                {
                    small &= Math.Abs(delta[i]) <= stepTolerance * (Math.Abs(p[i]) + 1);
                    predicted += g[i] * delta[i];
                }
                if (small || predicted <= chiSquareTolerance * cost / Math.Max(1, x.Length - ParameterCount) + scaleFloor) return (Exit.Converged, iteration - 1);
            }
            while (true)
            {
                a.CopyTo(m);
                for (var i = 0; i < ParameterCount; i++) m[i * ParameterCount + i] += lambda * Math.Max(a[i * ParameterCount + i], 1e-300);
                if (!SolveCholesky(m, g, delta))
                {
                    lambda *= 10;
                    if (lambda > 1e16) return (Exit.Converged, iteration);
                    continue;
                }
                for (var i = 0; i < ParameterCount; i++) trial[i] = p[i] + delta[i];
                var trialCost = Cost(x, y, nu0, trial);
                if (double.IsFinite(trialCost) && trialCost <= cost)
                {
                    trial.CopyTo(p);
                    lambda = Math.Max(lambda / 10, 1e-12);
                    cost = Normal(x, y, nu0, p, a, g);
                    if (!double.IsFinite(cost)) return (Exit.InvalidValues, iteration);
                    break;
                }
                lambda *= 10;
                // No downhill step exists at any damping: the point is a minimum to working precision.
                if (lambda > 1e16) return (Exit.Converged, iteration);
            }
        }
        return (Exit.IterationLimit, maximumIterations);
    }

    /// <summary>Sum of squared residuals at <paramref name="p"/>.</summary>
    public static double Cost(double[] x, double[] y, double nu0, ReadOnlySpan<double> p)
    {
        var w = 2.0 * Math.PI * (nu0 + p[0]);
        double sum = 0;
        for (var i = 0; i < x.Length; i++)
        {
            var e = Math.Exp(-p[1] * x[i]);
            var (s, c) = Math.SinCos(w * x[i]);
            var r = y[i] - (e * (p[2] * c + p[3] * s) + p[4]);
            sum += r * r;
        }
        return sum;
    }

    /// <summary>Jacobian row of the model at sample x (∂m/∂p), and the model value.</summary>
    public static double Row(double xi, double nu0, ReadOnlySpan<double> p, Span<double> row)
    {
        var w = 2.0 * Math.PI * (nu0 + p[0]);
        var e = Math.Exp(-p[1] * xi);
        var (s, c) = Math.SinCos(w * xi);
        var oscillation = p[2] * c + p[3] * s;
        row[0] = e * (-p[2] * s + p[3] * c) * 2.0 * Math.PI * xi;
        row[1] = -xi * e * oscillation;
        row[2] = e * c;
        row[3] = e * s;
        row[4] = 1;
        return e * oscillation + p[4];
    }

    /// <summary>Accumulates JᵀJ into <paramref name="a"/> and Jᵀr into <paramref name="g"/>; returns the cost.</summary>
    private static double Normal(double[] x, double[] y, double nu0, ReadOnlySpan<double> p, Span<double> a, Span<double> g)
    {
        a.Clear();
        g.Clear();
        Span<double> row = stackalloc double[ParameterCount];
        double cost = 0;
        for (var i = 0; i < x.Length; i++)
        {
            var r = y[i] - Row(x[i], nu0, p, row);
            cost += r * r;
            for (var j = 0; j < ParameterCount; j++)
            {
                g[j] += row[j] * r;
                for (var k = j; k < ParameterCount; k++) a[j * ParameterCount + k] += row[j] * row[k];
            }
        }
        for (var j = 0; j < ParameterCount; j++)
            for (var k = 0; k < j; k++) a[j * ParameterCount + k] = a[k * ParameterCount + j];
        return cost;
    }

    /// <summary>Solves the symmetric positive definite system m·x = b by Cholesky; false when m is not positive definite.</summary>
    private static bool SolveCholesky(Span<double> m, ReadOnlySpan<double> b, Span<double> x)
    {
        const int n = ParameterCount;
        for (var j = 0; j < n; j++)
        {
            var d = m[j * n + j];
            for (var k = 0; k < j; k++) d -= m[j * n + k] * m[j * n + k];
            if (!(d > 0)) return false;
            var l = Math.Sqrt(d);
            m[j * n + j] = l;
            for (var i = j + 1; i < n; i++)
            {
                var s = m[i * n + j];
                for (var k = 0; k < j; k++) s -= m[i * n + k] * m[j * n + k];
                m[i * n + j] = s / l;
            }
        }
        for (var i = 0; i < n; i++)
        {
            var s = b[i];
            for (var k = 0; k < i; k++) s -= m[i * n + k] * x[k];
            x[i] = s / m[i * n + i];
        }
        for (var i = n - 1; i >= 0; i--)
        {
            var s = x[i];
            for (var k = i + 1; k < n; k++) s -= m[k * n + i] * x[k];
            x[i] = s / m[i * n + i];
        }
        return true;
    }
}
