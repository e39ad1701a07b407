using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;
using StringModes.Analysis.Fitting;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Tests.Fitting;

/// <summary>The fit's own Levenberg–Marquardt loop against Math.NET's minimiser (a general-purpose reference library).</summary>
public class DampedSinusoidLmTests
{
    [Theory]
    [InlineData(1, 0.02)]
    [InlineData(2, 0.2)]
    [InlineData(3, 0.0)]
    public void Reaches_the_same_minimum_as_MathNet(int seed, double noise)
    {
        var random = new Random(seed);
        const int n = 900;
        const double nu0 = 40.3;
        var x = Enumerable.Range(0, n).Select(i => -1 + 2.0 * i / (n - 1)).ToArray();
        var y = x.Select(t => Math.Exp(-0.4 * t) * (0.7 * Math.Cos(2 * Math.PI * (nu0 + 0.02) * t) - 0.3 * Math.Sin(2 * Math.PI * (nu0 + 0.02) * t)) + 0.05
            + noise * MonteCarloPropagation.StandardNormal(random)).ToArray();
        double[] start = [0, 0.3, 0.6, -0.2, 0];

        var ours = (double[])start.Clone();
        var (exit, _) = DampedSinusoidLm.Minimise(x, y, nu0, ours, 200);
        Assert.Equal(DampedSinusoidLm.Exit.Converged, exit);

        var xv = Vector<double>.Build.DenseOfArray(x);
        var objective = ObjectiveFunction.NonlinearModel(
            (p, xs) => Vector<double>.Build.Dense(xs.Count, i => DampedSinusoidLm.Row(xs[i], nu0, p.ToArray(), new double[5])),
            (p, xs) => Matrix<double>.Build.DenseOfRowArrays(Enumerable.Range(0, xs.Count).Select(i =>
            {
                var row = new double[5];
                DampedSinusoidLm.Row(xs[i], nu0, p.ToArray(), row);
                return row;
            })),
            xv, Vector<double>.Build.DenseOfArray(y));
        var reference = new LevenbergMarquardtMinimizer(gradientTolerance: 1e-15, stepTolerance: 1e-15, functionTolerance: 1e-15, maximumIterations: 500)
            .FindMinimum(objective, Vector<double>.Build.DenseOfArray(start)).MinimizingPoint;

        // Both stop within 1e-4 standard uncertainties of the minimum (our χ² rule); parameters are of order one and
        // their standard uncertainties here are below 0.02, so 1e-6 absolute is a safe bound; noise-free data agree
        // to rounding (1e-9 allows for the conditioning of the frequency–decay pair).
        for (var i = 0; i < 5; i++) Assert.Equal(reference[i], ours[i], noise > 0 ? 1e-6 : 1e-9);
        Assert.True(DampedSinusoidLm.Cost(x, y, nu0, ours) <= DampedSinusoidLm.Cost(x, y, nu0, reference.ToArray()) * (1 + 1e-9) + 1e-25);
    }
}
