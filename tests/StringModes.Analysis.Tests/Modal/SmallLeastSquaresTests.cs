using MathNet.Numerics.LinearAlgebra;
using StringModes.Analysis.Modal;

namespace StringModes.Analysis.Tests.Modal;

/// <summary>The projection's small least-squares solver against MathNet.Numerics (a general-purpose reference library).</summary>
public class SmallLeastSquaresTests
{
    [Theory]
    [InlineData(3, 1, 1)]
    [InlineData(7, 4, 2)]
    [InlineData(9, 9, 3)]
    [InlineData(11, 6, 4)]
    [InlineData(12, 12, 5)]
    public void Solution_and_condition_match_MathNet(int rows, int cols, int seed)
    {
        var random = new Random(seed);
        for (var trial = 0; trial < 50; trial++)
        {
            var a = Matrix<double>.Build.Dense(rows, cols, (_, _) => random.NextDouble() * 2 - 1);
            // Scale some columns so that conditions range over several decades.
            for (var j = 0; j < cols; j++) a.SetColumn(j, a.Column(j) * Math.Pow(10, -3 * random.NextDouble()));
            var b = Vector<double>.Build.Dense(rows, _ => random.NextDouble() * 2 - 1);
            var solver = new SmallLeastSquares(rows + 2, cols);
            for (var i = 0; i < rows; i++)
            {
                for (var j = 0; j < cols; j++) solver.Row(i)[j] = a[i, j];
                solver.Rhs[i] = b[i];
            }
            var x = new double[cols];
            var condition = solver.Solve(rows, x);

            var svd = a.Svd(computeVectors: false).S;
            var reference = svd.Maximum() / svd.Minimum();
            var expected = a.QR().Solve(b);
            // Both are backward-stable solvers: solutions agree to about cond · machine epsilon (relative to ‖x‖);
            // 1e-12·cond leaves a margin of ~5000 over 2.2e-16.
            Assert.Equal(reference, condition, reference * 1e-10);
            var scale = expected.L2Norm();
            for (var j = 0; j < cols; j++) Assert.Equal(expected[j], x[j], 1e-12 * reference * Math.Max(1, scale));
        }
    }

    [Fact]
    public void Rank_deficient_system_reports_infinite_condition()
    {
        var solver = new SmallLeastSquares(4, 2);
        double[][] rows = [[1, 2], [2, 4], [3, 6], [4, 8]];
        for (var i = 0; i < 4; i++) { rows[i].CopyTo(solver.Row(i)); solver.Rhs[i] = i; }
        var condition = solver.Solve(4, new double[2]);
        // Exactly dependent columns: the second Householder step finds an exactly (or numerically) zero column,
        // so the condition is infinite or at least beyond 1e12 (any projector limit).
        Assert.True(condition > 1e12, $"condition {condition}");
    }
}
