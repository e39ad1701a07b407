using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Factorization;
using StringModes.Analysis.Fitting;

namespace StringModes.Analysis.Tests.Fitting;

/// <summary>
/// The local noise level near a mode frequency is computed from small accumulated products (BᵀB, Bᵀr, BᵀJ, JᵀJ)
/// instead of explicit orthonormal bases. Reference: the same quantities from Math.NET's thin QR factorisations of
/// the band basis B and the Jacobian J, ‖Q_Bᵀr‖² and ‖Q_BᵀQ_J‖²_F (a general-purpose library, independent code).
/// </summary>
public class ResidualColourTests
{
    // Tolerance 1e-9 relative: both sides are exact formulas in double precision; the band basis is nearly
    // orthogonal and the Jacobian here has condition number below 1e3, so normal equations lose at most ~1e-10.
    [Theory]
    [InlineData(14.3, new[] { -6, -5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5, 6 })]
    [InlineData(2.2, new[] { -1, 0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11 })] // band cut at 0 Hz and extended upwards
    public void LocalLevel_MatchesOrthonormalProjections(double binsFromZero, int[] expectedOffsets)
    {
        var random = new Random(11);
        const int n = 600;
        const int p = 5;
        var x = new double[n];
        for (var i = 0; i < n; i++) x[i] = -1 + 2.0 * (i + 0.3 * (random.NextDouble() - 0.5)) / (n - 1);
        Array.Sort(x);
        var span = x[^1] - x[0];
        var spacing = (n - 1) / (span * n);
        var f = binsFromZero * spacing;
        var residual = new double[n];
        var previous = 0.0;
        for (var i = 0; i < n; i++) residual[i] = previous = 0.6 * previous + (random.NextDouble() - 0.5); // coloured (AR(1))
        var jac = new double[n * p];
        for (var i = 0; i < n; i++)
        {
            var e = Math.Exp(-0.3 * x[i]);
            var (s, c) = Math.SinCos(2 * Math.PI * f * x[i]);
            double[] row = [2 * Math.PI * x[i] * e * s, -x[i] * e * c, e * c, e * s, 1];
            row.CopyTo(jac, i * p);
        }

        var level = ResidualColour.Estimate(x, residual, jac, p, f);

        var b = Matrix<double>.Build.Dense(n, 2 * expectedOffsets.Length, (i, col) =>
        {
            var arg = 2 * Math.PI * (f + expectedOffsets[col / 2] * spacing) * (x[i] - x[0]);
            return col % 2 == 0 ? Math.Cos(arg) : Math.Sin(arg);
        });
        var qb = b.QR(QRMethod.Thin).Q;
        var qj = Matrix<double>.Build.Dense(n, p, (i, k) => jac[i * p + k]).QR(QRMethod.Thin).Q;
        var r = Vector<double>.Build.DenseOfArray(residual);
        var projected = qb.TransposeThisAndMultiply(r);
        var shared = qb.TransposeThisAndMultiply(qj).FrobeniusNorm();
        var dof = b.ColumnCount - shared * shared;
        var ratio = projected.DotProduct(projected) / dof / (r.DotProduct(r) / (n - p));

        Assert.Equal(dof, level.DegreesOfFreedom, dof * 1e-9);
        Assert.Equal(ratio, level.Ratio, ratio * 1e-9);
    }
}
