namespace StringModes.Reporting.Figures;

/// <summary>Index lookups on ascending sample arrays.</summary>
internal static class Sampling
{
    /// <summary>Index of the sample nearest to <paramref name="value"/> in the ascending array <paramref name="sorted"/>.</summary>
    public static int NearestIndex(double[] sorted, double value)
    {
        var i = Array.BinarySearch(sorted, value);
        if (i >= 0)
        {
            return i;
        }

        i = ~i;
        if (i == 0)
        {
            return 0;
        }

        if (i >= sorted.Length)
        {
            return sorted.Length - 1;
        }

        return value - sorted[i - 1] <= sorted[i] - value ? i - 1 : i;
    }

    /// <summary>Linear interpolation of (x, y) at <paramref name="value"/>, clamped to the end values outside the range.</summary>
    public static double Interpolate(double[] x, double[] y, double value)
    {
        if (x.Length == 0)
        {
            return 0;
        }

        if (value <= x[0])
        {
            return y[0];
        }

        if (value >= x[^1])
        {
            return y[^1];
        }

        var i = Array.BinarySearch(x, value);
        if (i >= 0)
        {
            return y[i];
        }

        i = ~i;
        var f = (value - x[i - 1]) / (x[i] - x[i - 1]);
        return y[i - 1] + f * (y[i] - y[i - 1]);
    }
}
