using System.Numerics;
using MathNet.Numerics.LinearAlgebra;

namespace StringModes.Analysis.Fitting;

/// <summary>
/// Multi-channel matrix pencil estimate of the discrete poles z_k = e^((−σ_k + j·2πf_k)·Δt) shared by several uniformly
/// sampled channels (Hua &amp; Sarkar 1990, IEEE Trans. ASSP 38:814, in the SVD form of Sarkar &amp; Pereira 1995, IEEE
/// Antennas Propag. Mag. 37(1):48). Each channel contributes a Hankel matrix Y (rows: shifts, L + 1 columns: lags);
/// the stacked matrices share their right singular vectors, which are found here as the leading eigenvectors of the
/// summed Gram matrix Σ YᵀY, built by a rank-one recursion in O(N·L + L²) per channel. With V the K leading vectors,
/// the poles are the eigenvalues of V₁⁺V₂ (V without its last / first row). Real signals give conjugate pairs.
/// </summary>
internal static class MatrixPencil
{
    /// <param name="channels">Equal-length channels sampled at a common uniform interval.</param>
    /// <param name="order">Number of poles K (2 per real damped sinusoid, 1 for an offset); K ≤ L.</param>
    /// <param name="pencil">Pencil parameter L; Hua &amp; Sarkar recommend N/3 … N/2 for the lowest variance.</param>
    public static Complex[] Poles(IReadOnlyList<double[]> channels, int order, int pencil)
    {
        var n = channels[0].Length;
        var rows = n - pencil;
        var size = pencil + 1;
        // Row-major flat arrays: (L + 1)² doubles exceed the large-object threshold at L ≈ 100, and a rectangular
        // array per channel and bootstrap draw would churn that heap.
        var total = new double[size * size];
        var g = new double[size * size];
        foreach (var y in channels)
        {
            // G[j,k] = Σ_{i<rows} y[i+j]·y[i+k]; G[j+1,k+1] = G[j,k] − y[j]·y[k] + y[j+rows]·y[k+rows].
            for (var k = 0; k < size; k++)
            {
                double sum = 0;
                for (var i = 0; i < rows; i++) sum += y[i] * y[i + k];
                g[k] = sum;
                g[k * size] = sum;
            }
            for (var j = 0; j < pencil; j++)
                for (var k = j; k < pencil; k++)
                {
                    var next = g[j * size + k] - y[j] * y[k] + y[j + rows] * y[k + rows];
                    g[(j + 1) * size + k + 1] = next;
                    g[(k + 1) * size + j + 1] = next;
                }
            for (var i = 0; i < total.Length; i++) total[i] += g[i];
        }
        // Symmetric: row-major and column-major storage agree.
        var gram = Matrix<double>.Build.Dense(size, size, total);
        var evd = gram.Evd(Symmetricity.Symmetric);
        var largest = Enumerable.Range(0, size).OrderByDescending(i => evd.EigenValues[i].Real).Take(order).ToArray();
        var v = Matrix<double>.Build.Dense(size, order, (r, c) => evd.EigenVectors[r, largest[c]]);
        var v1 = v.SubMatrix(0, pencil, 0, order);
        var v2 = v.SubMatrix(1, pencil, 0, order);
        var phi = v1.QR().Solve(v2);
        return phi.Evd().EigenValues.ToArray();
    }
}
