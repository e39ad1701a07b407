namespace StringModes.Analysis.Uncertainty;

/// <summary>One input of a product of powers Y = c·Π X_i^p_i.</summary>
/// <param name="Name">Label for the uncertainty budget (e.g. "length").</param>
/// <param name="Input">Measured input value X_i; its value must be non-zero.</param>
/// <param name="Power">Exponent p_i.</param>
public sealed record PowerTerm(string Name, Measured Input, double Power);

/// <summary>One line of an uncertainty budget.</summary>
/// <param name="Name">Input label.</param>
/// <param name="SensitivityCoefficient">∂Y/∂X_i at the estimate (unit of Y per unit of X_i).</param>
/// <param name="Contribution">|∂Y/∂X_i|·u(X_i): the input's share of u(Y) in the unit of Y (JCGM 100 §5.1.3).</param>
/// <param name="VarianceShare">Fraction of u²(Y) due to this input, in [0, 1]; shares of uncorrelated inputs sum to 1.</param>
public sealed record BudgetEntry(string Name, double SensitivityCoefficient, double Contribution, double VarianceShare);

/// <summary>A value propagated from inputs with its standard uncertainty and budget.</summary>
/// <param name="Result">Output estimate and combined standard uncertainty u_c.</param>
/// <param name="Budget">Per-input contributions, largest first. Correlation terms are not listed separately, so shares may not sum to 1 for correlated inputs.</param>
public sealed record Propagated(Measured Result, IReadOnlyList<BudgetEntry> Budget);

/// <summary>
/// First-order propagation of uncertainty (JCGM 100:2008, GUM, §5.1.2 eq. 10 and §5.2.2 eq. 13 for correlated inputs).
/// </summary>
public static class GumPropagation
{
    /// <summary>
    /// Y = c·Π X_i^p_i with uncorrelated inputs: (u_c/Y)² = Σ(p_i·u(X_i)/X_i)² (GUM §5.1.6).
    /// </summary>
    public static Propagated ProductOfPowers(double coefficient, IReadOnlyList<PowerTerm> terms)
    {
        var y = coefficient;
        foreach (var t in terms) y *= Math.Pow(t.Input.Value, t.Power);
        var sensitivities = terms.Select(t => t.Power * y / t.Input.Value).ToArray();
        var cov = new double[terms.Count, terms.Count];
        for (var i = 0; i < terms.Count; i++) cov[i, i] = terms[i].Input.StandardUncertainty * terms[i].Input.StandardUncertainty;
        return Linear(y, sensitivities, cov, terms.Select(t => t.Name).ToArray());
    }

    /// <summary>
    /// u_c²(y) = cᵀ·V·c for sensitivity coefficients c and input covariance matrix V (GUM §5.2.2 eq. 13 in matrix form).
    /// </summary>
    /// <param name="value">Output estimate y = f(x).</param>
    /// <param name="sensitivities">∂f/∂x_i at the estimate.</param>
    /// <param name="covariance">Covariance matrix of the inputs (symmetric, positive semi-definite).</param>
    /// <param name="names">Label of each input for the budget.</param>
    public static Propagated Linear(double value, IReadOnlyList<double> sensitivities, double[,] covariance, IReadOnlyList<string> names)
    {
        var n = sensitivities.Count;
        double variance = 0;
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++)
                variance += sensitivities[i] * covariance[i, j] * sensitivities[j];
        variance = Math.Max(variance, 0);
        var budget = new List<BudgetEntry>(n);
        for (var i = 0; i < n; i++)
        {
            var contribution = Math.Abs(sensitivities[i]) * Math.Sqrt(Math.Max(covariance[i, i], 0));
            var share = variance > 0 ? contribution * contribution / variance : 0;
            budget.Add(new BudgetEntry(names[i], sensitivities[i], contribution, share));
        }
        return new Propagated(new Measured(value, Math.Sqrt(variance)), budget.OrderByDescending(b => b.Contribution).ToArray());
    }
}
