namespace StringModes.Analysis.Geometry;

/// <summary>
/// Natural cubic spline through (t, y) samples with strictly increasing t (second derivatives by the tridiagonal
/// system of Press et al., Numerical Recipes 3rd ed., §3.3). Used to move each mark's samples from their
/// rolling-shutter row times to the common grid; the shift is below one frame step, where the spline's error for a
/// tone at f is O((2πf·Δt)⁴).
/// </summary>
internal sealed class CubicSpline
{
    private readonly double[] t;
    private readonly double[] y;
    private readonly double[] m;

    public CubicSpline(double[] t, double[] y)
    {
        this.t = t;
        this.y = y;
        int n = t.Length;
        m = new double[n];
        if (n < 3)
        {
            return;
        }

        var c = new double[n];
        var d = new double[n];
        for (int i = 1; i < n - 1; i++)
        {
            double h0 = t[i] - t[i - 1], h1 = t[i + 1] - t[i];
            double a = h0 / 6, b = (h0 + h1) / 3, cc = h1 / 6;
            double r = (y[i + 1] - y[i]) / h1 - (y[i] - y[i - 1]) / h0;
            double denom = b - a * c[i - 1];
            c[i] = cc / denom;
            d[i] = (r - a * d[i - 1]) / denom;
        }

        for (int i = n - 2; i >= 1; i--)
        {
            m[i] = d[i] - c[i] * m[i + 1];
        }
    }

    public double Evaluate(double x)
    {
        int n = t.Length;
        if (n == 1)
        {
            return y[0];
        }

        int k = Array.BinarySearch(t, x);
        int i = k >= 0 ? Math.Min(k, n - 2) : Math.Clamp(~k - 1, 0, n - 2);
        double h = t[i + 1] - t[i];
        double a = (t[i + 1] - x) / h, b = (x - t[i]) / h;
        return a * y[i] + b * y[i + 1] + ((a * a * a - a) * m[i] + (b * b * b - b) * m[i + 1]) * h * h / 6;
    }
}
