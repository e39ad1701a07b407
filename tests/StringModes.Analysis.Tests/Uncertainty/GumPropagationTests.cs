using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Tests.Uncertainty;

public class GumPropagationTests
{
    // REFERENCES.md section 8 [computed] from JCGM 100:2008 §5.1.6 (product of powers): T = 4·mu·L²·f²,
    // mu = 1.000 g/m ± 1 %, L = 0.650 ± 0.001 m, f = 100.0 ± 0.1 Hz -> T = 16.900 N, u_rel = 0.0106521,
    // u(T) = 0.18002 N. Tolerances: half a unit in the last quoted digit.
    [Fact]
    public void TensionProductOfPowers_MatchesWorkedValues()
    {
        var r = GumPropagation.ProductOfPowers(4.0,
        [
            new PowerTerm("linear density", Measured.WithRelativeUncertainty(1.000e-3, 0.01), 1),
            new PowerTerm("length", new Measured(0.650, 0.001), 2),
            new PowerTerm("frequency", new Measured(100.0, 0.1), 2),
        ]);
        Assert.Equal(16.900, r.Result.Value, 0.0005);
        Assert.Equal(0.0106521, r.Result.RelativeUncertainty, 0.5e-7);
        Assert.Equal(0.18002, r.Result.StandardUncertainty, 0.5e-5);
        // Budget: relative contributions 1 %, 2·0.001/0.65 = 0.3077 %, 2·0.1 % = 0.2 %; shares of the variance sum to 1.
        Assert.Equal("linear density", r.Budget[0].Name);
        Assert.Equal(0.01 * 16.9, r.Budget[0].Contribution, 1e-12);
        Assert.Equal(1.0, r.Budget.Sum(b => b.VarianceShare), 1e-12);
        Assert.Equal(2 * 16.9 / 0.65, r.Budget.Single(b => b.Name == "length").SensitivityCoefficient, 1e-9);
    }

    // Same model by Monte Carlo (JCGM 101:2008); REFERENCES.md section 8 [computed]: 2e5 draws give SD 0.18018 N.
    // The sampling SD of a standard deviation from 2e5 draws is u/sqrt(2·2e5) = 2.8e-4 N, so the tolerance is
    // 1e-3 N (about 3.5 sampling SDs); the mean must sit within 3 standard errors (3·0.18/sqrt(2e5) = 1.2e-3 N) of
    // 16.900 N plus the second-order bias (about +0.01 N from the squared terms, 0.5·T''·u² summed).
    [Fact]
    public void TensionMonteCarlo_AgreesWithFirstOrderPropagation()
    {
        Measured[] inputs = [Measured.WithRelativeUncertainty(1.000e-3, 0.01), new(0.650, 0.001), new(100.0, 0.1)];
        var mc = MonteCarloPropagation.Propagate(x => 4 * x[0] * x[1] * x[1] * x[2] * x[2], inputs, 200_000, seed: 20261201);
        Assert.Equal(200_000, mc.Draws);
        Assert.Equal(0.18018, mc.StandardDeviation, 1e-3);
        var secondOrderBias = 16.9 * (Math.Pow(0.001 / 0.65, 2) + Math.Pow(0.1 / 100, 2));
        Assert.Equal(16.900 + secondOrderBias, mc.Mean, 1.2e-3);
        // For a near-Gaussian output the 95 % interval half-width is about 1.96·u.
        Assert.Equal(2 * 1.96 * 0.18002, mc.High95 - mc.Low95, 0.01);
    }

    [Fact]
    public void CorrelatedInputs_PropagateThroughTheCovariance()
    {
        // y = x1 - x2 with fully correlated equal uncertainties: u(y) = 0 (GUM §5.2.2 with r = 1).
        var r = GumPropagation.Linear(0, [1.0, -1.0], new double[,] { { 4, 4 }, { 4, 4 } }, ["a", "b"]);
        Assert.Equal(0.0, r.Result.StandardUncertainty, 1e-15);
        // Uncorrelated: u(y) = sqrt(4 + 4).
        var s = GumPropagation.Linear(0, [1.0, -1.0], new double[,] { { 4, 0 }, { 0, 4 } }, ["a", "b"]);
        Assert.Equal(Math.Sqrt(8), s.Result.StandardUncertainty, 1e-15);
    }
}
