using System.Globalization;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using StringModes.Analysis.Fitting;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.StringModel;

/// <summary>
/// From mode frequencies to string properties. The stiff-string law with pinned ends, f_n = n·f0·√(1 + B·n²)
/// (Fletcher 1964, JASA 36:203), is linear in (f0², f0²·B) after squaring: y_n = (f_n/n)² = a + b·n², so a weighted
/// linear regression with weights 1/u²(y_n), u(y_n) = 2·f_n·u(f_n)/n², gives f0 = √a and B = b/a with their
/// covariance. Then c = 2·L·f0, T = μ·c² = 4·μ·L²·a and E·I = B·T·L²/π² = 4·μ·L⁴·b/π². Uncertainties follow the GUM
/// law of propagation (JCGM 100:2008 §5.2, correlated a and b included) with sensitivities by central differences on
/// the base inputs (length, the inputs that give μ, a, b), so a length that enters both μ (elastic correction) and T
/// is counted once, with its correlation.
/// </summary>
public static class StringEstimator
{
    /// <summary>Estimates from the usable fits in <paramref name="fits"/>.</summary>
    public static StringEstimate Estimate(IEnumerable<ModeFit> fits, StringModelOptions options)
        => Estimate(fits.Where(f => f.IsUsable).Select(f => (f.N, f.FrequencyHz)).ToArray(), options);

    /// <summary>
    /// Estimates from mode numbers and frequencies. Never throws for bad input: missing or invalid length or density
    /// leave the dependent quantities null with a warning; no frequency at all gives zeros and a warning.
    /// </summary>
    public static StringEstimate Estimate(IReadOnlyList<(int N, Measured FrequencyHz)> modes, StringModelOptions options)
    {
        var warnings = new List<string>();
        var used = modes.Where(m => m.N >= 1 && m.FrequencyHz.IsFinite && m.FrequencyHz.Value > 0)
            .GroupBy(m => m.N).Select(g => g.First()).OrderBy(m => m.N).ToArray();
        if (used.Length < modes.Count) warnings.Add("modes with a non-positive or non-finite frequency, or repeated mode numbers, were left out");
        if (used.Length == 0)
        {
            warnings.Add("no mode frequency is available; no string properties can be estimated");
            return new StringEstimate([], default, default, true, 0, [], null, null, null, null, null, [], null, warnings);
        }

        var ratios = HarmonicRatios(used);
        var second = SecondHarmonic(used, options.HarmonicCheckCoverageFactor, warnings);

        double a, b, chi2PerDof = 0;
        var abCov = new double[2, 2];
        var assumed = used.Length < 3;
        if (assumed)
        {
            var lowest = used[0];
            var f0 = lowest.FrequencyHz.Value / lowest.N;
            var uf0 = lowest.FrequencyHz.StandardUncertainty / lowest.N;
            a = f0 * f0;
            b = 0;
            abCov[0, 0] = Math.Pow(2 * f0 * uf0, 2);
            warnings.Add($"only {used.Length} mode{(used.Length == 1 ? "" : "s")} available: the fundamental is taken as f{lowest.N}/{lowest.N} and the inharmonicity B = 0 is assumed (at least three modes are needed to estimate it)");
        }
        else
        {
            used = RejectOutliers(used, warnings);
            (a, b, abCov, chi2PerDof) = Regress(used, warnings);
        }
        var fundamental = Propagate(x => Math.Sqrt(x[0]), [a, b], abCov, ["frequencies"]).Result;
        var inharmonicity = assumed ? Measured.Exact(0) : Propagate(x => x[1] / x[0], [a, b], abCov, ["frequencies"]).Result;
        if (!assumed && inharmonicity.Value < -2 * inharmonicity.StandardUncertainty)
            warnings.Add("the inharmonicity is negative beyond its uncertainty: overtones are flatter than harmonic, which a stiff string cannot do; check for aliased or misidentified modes, a non-uniform string or large-amplitude effects");

        var length = Validate(options.LengthM, "length", warnings);
        Measured? waveSpeed = null, tension = null, bending = null, density = null;
        IReadOnlyList<BudgetEntry> budget = [];
        if (length is { } l)
        {
            waveSpeed = Propagate(x => 2 * x[0] * Math.Sqrt(x[1]), [l.Value, a], Block([l], abCov, 1), ["length", "frequencies"]).Result;
            waveSpeed = waveSpeed.Value with { Value = 2 * l.Value * Math.Sqrt(a) };
        }
        if (length is { } len && options.LinearDensity is { } spec)
        {
            var inputs = spec.Inputs();
            var valid = true;
            foreach (var (name, value) in inputs) valid &= Validate(value, name, warnings) is not null;
            if (valid)
            {
                // x = [L, μ inputs…, a, b]
                var names = new List<string> { "length" };
                names.AddRange(inputs.Select(i => i.Name));
                names.Add("f0² (regression intercept)");
                names.Add("f0²·B (regression slope)");
                var x = new List<double> { len.Value };
                x.AddRange(inputs.Select(i => i.Value.Value));
                x.Add(a);
                x.Add(b);
                var cov = Block([len, .. inputs.Select(i => i.Value)], abCov, 2);
                var m = inputs.Count;
                double Mu(double[] v) => spec.Evaluate(v.AsSpan(1, m), v[0]);
                var muValue = Mu([.. x]);
                if (!(muValue > 0) || !double.IsFinite(muValue))
                    warnings.Add("the linear density computed from the inputs is not positive and finite; no tension is given");
                else
                {
                    density = Propagate(Mu, [.. x], cov, names).Result with { Value = muValue };
                    var t = Propagate(v => 4 * Mu(v) * v[0] * v[0] * v[m + 1], [.. x], cov, names);
                    tension = t.Result with { Value = 4 * muValue * len.Value * len.Value * a };
                    budget = t.Budget.Where(e => e.SensitivityCoefficient != 0).ToArray();
                    if (!assumed)
                    {
                        var ei = Propagate(v => 4 * Mu(v) * Math.Pow(v[0], 4) * v[m + 2] / (Math.PI * Math.PI), [.. x], cov, names).Result;
                        bending = ei with { Value = 4 * muValue * Math.Pow(len.Value, 4) * b / (Math.PI * Math.PI) };
                    }
                }
            }
        }
        else if (length is not null && options.LinearDensity is null)
            warnings.Add("no linear density given: tension and bending stiffness are not computed");
        if (options.LengthM is null) warnings.Add("no length given: wave speed, tension and bending stiffness are not computed");

        return new StringEstimate(used.Select(u => u.N).ToArray(), fundamental with { Value = Math.Sqrt(a) },
            assumed ? inharmonicity : inharmonicity with { Value = b / a }, assumed, chi2PerDof, ratios, second,
            length, density, waveSpeed, tension, budget, bending, warnings);
    }

    private static IReadOnlyList<HarmonicRatio> HarmonicRatios((int N, Measured FrequencyHz)[] used)
    {
        var first = used.FirstOrDefault(u => u.N == 1);
        if (first.N != 1) return [];
        return used.Select(u =>
        {
            if (u.N == 1) return new HarmonicRatio(1, Measured.Exact(1));
            var r = u.FrequencyHz.Value / (u.N * first.FrequencyHz.Value);
            var rel = Math.Sqrt(Math.Pow(u.FrequencyHz.RelativeUncertainty, 2) + Math.Pow(first.FrequencyHz.RelativeUncertainty, 2));
            return new HarmonicRatio(u.N, new Measured(r, r * rel));
        }).ToArray();
    }

    private static SecondHarmonicCheck? SecondHarmonic((int N, Measured FrequencyHz)[] used, double k, List<string> warnings)
    {
        var f1 = used.FirstOrDefault(u => u.N == 1);
        var f2 = used.FirstOrDefault(u => u.N == 2);
        if (f1.N != 1 || f2.N != 2) return null;
        var ratio = f2.FrequencyHz.Value / f1.FrequencyHz.Value;
        var u = ratio * Math.Sqrt(Math.Pow(f2.FrequencyHz.RelativeUncertainty, 2) + Math.Pow(f1.FrequencyHz.RelativeUncertainty, 2));
        var deviation = u > 0 ? (ratio - 2) / u : (ratio == 2 ? 0 : Math.Sign(ratio - 2) * double.MaxValue);
        var passes = Math.Abs(ratio - 2) <= k * u;
        if (!passes)
            warnings.Add(ratio > 2
                ? FormattableString.Invariant($"f2/f1 = {ratio:F6} ± {u:G2} is above 2 by {deviation:F1} standard uncertainties: the overtones are sharp, as for a string with bending stiffness")
                : FormattableString.Invariant($"f2/f1 = {ratio:F6} ± {u:G2} is below 2 by {-deviation:F1} standard uncertainties: unusual for a string; check for aliasing (modes above half the frame rate), a misidentified mode or non-uniform density"));
        return new SecondHarmonicCheck(new Measured(ratio, u), double.IsFinite(deviation) ? deviation : 0, k, passes);
    }

    /// <summary>
    /// Leave-one-out outlier test on the (f_n/n)² regression: each mode's y_n is compared with the line fitted to the
    /// other modes, standardised by √(u²(y_n) + u²(ŷ_n)) — the externally studentised (deleted) residual of
    /// weighted least squares (Belsley, Kuh &amp; Welsch, Regression Diagnostics, 1980, §2.1). A mode is left out when
    /// its deleted residual exceeds the normal quantile for a family-wise false-rejection probability of 10⁻³
    /// (Bonferroni over the modes) and the remaining modes (at least three) then fit the law (χ² below its 99 %
    /// point, the test that otherwise widens u(f0) and u(B)); of several such modes the worst is left out. Only one
    /// mode is removed: when no single removal makes the rest consistent, all are kept and the regression widens its
    /// uncertainties instead. With honest frequency uncertainties a genuine mode is rejected in fewer than one
    /// analysis in a thousand; a lone peak that is not the string's mode n (a distortion product of another mode,
    /// leakage or a misidentified peak) is removed.
    /// </summary>
    private static (int N, Measured FrequencyHz)[] RejectOutliers((int N, Measured FrequencyHz)[] used, List<string> warnings)
    {
        if (used.Length < 4) return used;
        var critical = Normal.InvCDF(0, 1, 1 - 1e-3 / (2.0 * used.Length));
        var worst = -1;
        var worstT = 0.0;
        double worstPredicted = 0;
        for (var i = 0; i < used.Length; i++)
        {
            var others = used.Where((_, k) => k != i).ToArray();
            var (a, b, cov, chi2PerDof) = Regress(others, null);
            var dof = others.Length - 2;
            if (dof > 0 && chi2PerDof * dof > ChiSquared.InvCDF(dof, 0.99)) continue;
            var (n, f) = used[i];
            var n2 = (double)n * n;
            var predicted = a + b * n2;
            var uPredicted2 = cov[0, 0] + 2 * n2 * cov[0, 1] + n2 * n2 * cov[1, 1];
            var y = Math.Pow(f.Value / n, 2);
            var uy = 2 * f.Value * Math.Max(f.StandardUncertainty, 1e-12 * f.Value) / n2;
            var t = Math.Abs(y - predicted) / Math.Sqrt(uy * uy + uPredicted2);
            if (double.IsFinite(t) && t > critical && t > worstT) { worstT = t; worst = i; worstPredicted = n * Math.Sqrt(Math.Max(predicted, 0)); }
        }
        if (worst < 0) return used;
        var m = used[worst];
        warnings.Add(string.Create(CultureInfo.InvariantCulture,
            $"mode {m.N} ({m.FrequencyHz.Value:G7} Hz) was left out of the string model: the other modes, which agree with the stiff-string law, put it near {worstPredicted:G7} Hz, {worstT:F1} combined standard uncertainties away (a distortion product of another mode, leakage or a misidentified peak rather than the string's mode {m.N})"));
        return used.Where((_, k) => k != worst).ToArray();
    }

    private static (double A, double B, double[,] Cov, double Chi2PerDof) Regress((int N, Measured FrequencyHz)[] used, List<string>? warnings)
    {
        var m = used.Length;
        var design = Matrix<double>.Build.Dense(m, 2);
        var y = Vector<double>.Build.Dense(m);
        for (var i = 0; i < m; i++)
        {
            var (n, f) = used[i];
            var uf = Math.Max(f.StandardUncertainty, 1e-12 * f.Value);
            var sw = 1.0 / (2.0 * f.Value * uf / ((double)n * n));
            design[i, 0] = sw;
            design[i, 1] = sw * n * n;
            y[i] = sw * Math.Pow(f.Value / n, 2);
        }
        var qr = design.QR();
        var p = qr.Solve(y);
        var r = qr.R.SubMatrix(0, 2, 0, 2);
        var rInv = r.Inverse();
        var cov = (rInv * rInv.Transpose()).ToArray();
        var residual = y - design * p;
        var chi2 = residual.DotProduct(residual);
        var dof = m - 2;
        var chi2PerDof = dof > 0 ? chi2 / dof : 0;
        if (warnings is not null && dof > 0 && chi2 > ChiSquared.InvCDF(dof, 0.99))
        {
            var scale = chi2PerDof;
            for (var i = 0; i < 2; i++) for (var j = 0; j < 2; j++) cov[i, j] *= scale;
            warnings.Add(string.Create(CultureInfo.InvariantCulture,
                $"the stiff-string law f_n = n·f0·√(1 + B·n²) does not fit the mode frequencies within their uncertainties (χ²/ν = {chi2PerDof:G3}); u(f0) and u(B) were widened by √(χ²/ν). Clamped ends, non-uniform density or a misidentified mode can cause this"));
        }
        return (p[0], p[1], cov, chi2PerDof);
    }

    private static Measured? Validate(Measured? value, string name, List<string> warnings)
    {
        if (value is not { } v) return null;
        if (!double.IsFinite(v.Value) || !(v.Value > 0))
        {
            warnings.Add(string.Create(CultureInfo.InvariantCulture, $"the {name} must be a positive finite number (got {v.Value:G6}); quantities that depend on it are not computed"));
            return null;
        }
        if (!double.IsFinite(v.StandardUncertainty) || v.StandardUncertainty < 0)
        {
            warnings.Add($"the uncertainty of the {name} must be a finite number ≥ 0; quantities that depend on it are not computed");
            return null;
        }
        return v;
    }

    /// <summary>Covariance of [independent inputs…, a, b] (or only a when <paramref name="abSize"/> is 1).</summary>
    private static double[,] Block(IReadOnlyList<Measured> independent, double[,] abCov, int abSize)
    {
        var n = independent.Count + abSize;
        var cov = new double[n, n];
        for (var i = 0; i < independent.Count; i++) cov[i, i] = independent[i].StandardUncertainty * independent[i].StandardUncertainty;
        for (var i = 0; i < abSize; i++)
            for (var j = 0; j < abSize; j++) cov[independent.Count + i, independent.Count + j] = abCov[i, j];
        return cov;
    }

    /// <summary>GUM propagation with central-difference sensitivities (relative step 1e-6).</summary>
    internal static Propagated Propagate(Func<double[], double> g, double[] x, double[,] cov, IReadOnlyList<string> names)
    {
        var sensitivities = new double[x.Length];
        var work = (double[])x.Clone();
        for (var i = 0; i < x.Length; i++)
        {
            var h = 1e-6 * Math.Max(Math.Abs(x[i]), 1e-300);
            work[i] = x[i] + h;
            var up = g(work);
            work[i] = x[i] - h;
            var down = g(work);
            work[i] = x[i];
            sensitivities[i] = (up - down) / (2 * h);
            if (!double.IsFinite(sensitivities[i])) sensitivities[i] = 0;
        }
        var labels = names.Count == x.Length ? names : Enumerable.Range(0, x.Length).Select(i => i < names.Count ? names[i] : $"input {i}").ToArray();
        return GumPropagation.Linear(g(x), sensitivities, cov, labels);
    }
}
