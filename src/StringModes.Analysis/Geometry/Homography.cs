using MathNet.Numerics.LinearAlgebra;

namespace StringModes.Analysis.Geometry;

/// <summary>
/// Plane projective transform (image pixels → rig-plane coordinates) from four point pairs, for a camera that is not
/// square to the rig: marks and ends are mapped onto the plane before the string axis and scale are taken. Fitted by the direct linear transform with h₃₃ = 1
/// (Hartley &amp; Zisserman, Multiple View Geometry, 2nd ed., §4.1), coordinates normalised first (§4.4).
/// </summary>
public sealed class Homography
{
    private readonly double[] h;

    private Homography(double[] h) => this.h = h;

    /// <summary>Fits the transform taking each <paramref name="from"/> point to the matching <paramref name="to"/> point.</summary>
    public static Homography FromPoints(IReadOnlyList<(double X, double Y)> from, IReadOnlyList<(double X, double Y)> to)
    {
        if (from.Count != 4 || to.Count != 4)
        {
            throw new ArgumentException("a homography needs exactly four point pairs");
        }

        if (HasThreeOnALine(from) || HasThreeOnALine(to))
        {
            throw new ArgumentException("the four calibration points are degenerate (three are collinear)");
        }

        var (fs, fx, fy) = Normaliser(from);
        var (ts, tx, ty) = Normaliser(to);
        var a = Matrix<double>.Build.Dense(8, 8);
        var b = Vector<double>.Build.Dense(8);
        for (int i = 0; i < 4; i++)
        {
            double x = (from[i].X - fx) * fs, y = (from[i].Y - fy) * fs;
            double u = (to[i].X - tx) * ts, v = (to[i].Y - ty) * ts;
            a.SetRow(2 * i, new[] { x, y, 1, 0, 0, 0, -u * x, -u * y });
            a.SetRow(2 * i + 1, new[] { 0, 0, 0, x, y, 1, -v * x, -v * y });
            b[2 * i] = u;
            b[2 * i + 1] = v;
        }

        var lu = a.LU();
        if (Math.Abs(lu.Determinant) < 1e-12)
        {
            throw new ArgumentException("the four calibration points are degenerate (three are collinear)");
        }

        var p = lu.Solve(b);
        // Undo the normalisations: H = T_to⁻¹ · Ĥ · T_from.
        var hn = Matrix<double>.Build.DenseOfArray(new[,] { { p[0], p[1], p[2] }, { p[3], p[4], p[5] }, { p[6], p[7], 1 } });
        var tf = Matrix<double>.Build.DenseOfArray(new[,] { { fs, 0, -fs * fx }, { 0, fs, -fs * fy }, { 0, 0, 1 } });
        var tt = Matrix<double>.Build.DenseOfArray(new[,] { { 1 / ts, 0, tx }, { 0, 1 / ts, ty }, { 0, 0, 1 } });
        var full = tt * hn * tf;
        full /= full[2, 2];
        return new Homography([full[0, 0], full[0, 1], full[0, 2], full[1, 0], full[1, 1], full[1, 2], full[2, 0], full[2, 1], full[2, 2]]);
    }

    /// <summary>Maps a point.</summary>
    public (double X, double Y) Map(double x, double y)
    {
        double w = h[6] * x + h[7] * y + h[8];
        return ((h[0] * x + h[1] * y + h[2]) / w, (h[3] * x + h[4] * y + h[5]) / w);
    }

    // Three points on one line (within 1e-6 of the points' spread, relative): no projective transform is defined.
    private static bool HasThreeOnALine(IReadOnlyList<(double X, double Y)> p)
    {
        var (scale, _, _) = Normaliser(p);
        for (var a = 0; a < 4; a++)
            for (var b = a + 1; b < 4; b++)
                for (var c = b + 1; c < 4; c++)
                {
                    var cross = (p[b].X - p[a].X) * (p[c].Y - p[a].Y) - (p[b].Y - p[a].Y) * (p[c].X - p[a].X);
                    if (Math.Abs(cross) * scale * scale < 1e-6) return true;
                }
        return false;
    }

    private static (double Scale, double Cx, double Cy) Normaliser(IReadOnlyList<(double X, double Y)> p)
    {
        double cx = p.Average(q => q.X), cy = p.Average(q => q.Y);
        double d = p.Average(q => Math.Sqrt((q.X - cx) * (q.X - cx) + (q.Y - cy) * (q.Y - cy)));
        return (d > 0 ? Math.Sqrt(2) / d : 1, cx, cy);
    }
}
