namespace StringModes.Analysis.Modal;

/// <summary>
/// Least squares for the small, tall systems of the modal projection (a dozen rows, a few columns), solved once per
/// frame: Householder QR for the solution and one-sided Jacobi on R for the 2-norm condition number. Working on
/// plain arrays in place keeps a clip's thousands of frames free of per-frame allocations. Methods: Golub &amp; Van Loan,
/// Matrix Computations (4th ed.), §5.2 (Householder QR least squares) and §8.6.3 (one-sided Jacobi SVD).
/// </summary>
internal sealed class SmallLeastSquares
{
    private readonly double[] _a;
    private readonly double[] _r;
    private readonly double[] _b;
    private readonly int _maxRows;
    private readonly int _cols;

    /// <summary>Workspace for systems of up to <paramref name="maxRows"/> rows and exactly <paramref name="cols"/> columns.</summary>
    public SmallLeastSquares(int maxRows, int cols)
    {
        _maxRows = maxRows;
        _cols = cols;
        _a = new double[maxRows * cols];
        _r = new double[cols * cols];
        _b = new double[maxRows];
    }

    /// <summary>Row <paramref name="row"/> of the design matrix, to be filled before <see cref="Solve"/>.</summary>
    public Span<double> Row(int row) => _a.AsSpan(row * _cols, _cols);

    /// <summary>Right-hand side, to be filled before <see cref="Solve"/>.</summary>
    public Span<double> Rhs => _b;

    /// <summary>
    /// Solves min‖A·x − b‖ for the first <paramref name="rows"/> rows (rows ≥ columns), writing x into
    /// <paramref name="x"/>; returns the condition number σmax/σmin of A (∞ when rank-deficient). A and b are overwritten.
    /// </summary>
    public double Solve(int rows, Span<double> x)
    {
        if (rows < _cols || rows > _maxRows) throw new ArgumentOutOfRangeException(nameof(rows));
        var n = _cols;
        var a = _a;
        var b = _b;
        for (var k = 0; k < n; k++)
        {
            // Householder vector v for column k below the diagonal: H = I − 2vvᵀ/(vᵀv), H·a_k = −sign(a_kk)·‖a_k‖·e_k.
            double norm = 0;
            for (var i = k; i < rows; i++) norm += a[i * n + k] * a[i * n + k];
            norm = Math.Sqrt(norm);
            if (norm == 0) continue;
            var alpha = a[k * n + k] > 0 ? -norm : norm;
            var v0 = a[k * n + k] - alpha;
            // v = (v0, a[k+1..rows, k]); vᵀv = v0² + (norm² − a_kk²).
            var vtv = v0 * v0 + (norm * norm - a[k * n + k] * a[k * n + k]);
            a[k * n + k] = alpha;
            if (vtv == 0) continue;
            for (var j = k + 1; j < n; j++)
            {
                var dot = v0 * a[k * n + j];
                for (var i = k + 1; i < rows; i++) dot += a[i * n + k] * a[i * n + j];
                var f = 2 * dot / vtv;
                a[k * n + j] -= f * v0;
                for (var i = k + 1; i < rows; i++) a[i * n + j] -= f * a[i * n + k];
            }
            {
                var dot = v0 * b[k];
                for (var i = k + 1; i < rows; i++) dot += a[i * n + k] * b[i];
                var f = 2 * dot / vtv;
                b[k] -= f * v0;
                for (var i = k + 1; i < rows; i++) b[i] -= f * a[i * n + k];
            }
        }
        // R is the upper triangle of the first n rows.
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++) _r[i * n + j] = j >= i ? a[i * n + j] : 0;
        var condition = Condition(_r, n);
        if (!double.IsFinite(condition)) return double.PositiveInfinity;
        for (var i = n - 1; i >= 0; i--)
        {
            var s = b[i];
            for (var j = i + 1; j < n; j++) s -= a[i * n + j] * x[j];
            x[i] = s / a[i * n + i];
        }
        return condition;
    }

    /// <summary>σmax/σmin of the n×n matrix <paramref name="m"/> (row-major, overwritten) by one-sided Jacobi rotations of its columns.</summary>
    private static double Condition(double[] m, int n)
    {
        for (var sweep = 0; sweep < 60; sweep++)
        {
            var rotated = false;
            for (var p = 0; p < n - 1; p++)
                for (var q = p + 1; q < n; q++)
                {
                    double alpha = 0, beta = 0, gamma = 0;
                    for (var i = 0; i < n; i++)
                    {
                        alpha += m[i * n + p] * m[i * n + p];
                        beta += m[i * n + q] * m[i * n + q];
                        gamma += m[i * n + p] * m[i * n + q];
                    }
                    if (Math.Abs(gamma) <= 1e-15 * Math.Sqrt(alpha * beta)) continue;
                    rotated = true;
                    var zeta = (beta - alpha) / (2 * gamma);
                    var t = Math.Sign(zeta) / (Math.Abs(zeta) + Math.Sqrt(1 + zeta * zeta));
                    if (zeta == 0) t = 1;
                    var c = 1 / Math.Sqrt(1 + t * t);
                    var s = c * t;
                    for (var i = 0; i < n; i++)
                    {
                        var mp = m[i * n + p];
                        var mq = m[i * n + q];
                        m[i * n + p] = c * mp - s * mq;
                        m[i * n + q] = s * mp + c * mq;
                    }
                }
            if (!rotated) break;
        }
        double max = 0, min = double.PositiveInfinity;
        for (var j = 0; j < n; j++)
        {
            double norm = 0;
            for (var i = 0; i < n; i++) norm += m[i * n + j] * m[i * n + j];
            norm = Math.Sqrt(norm);
            max = Math.Max(max, norm);
            min = Math.Min(min, norm);
        }
        return min > 0 ? max / min : double.PositiveInfinity;
    }
}
