namespace StringModes.Analysis.Geometry;

/// <summary>
/// Pixel tracks → string coordinates. The string axis runs from end 0 to end 1 (mean positions over the frames);
/// the scale makes the distance between the ends equal the stated vibrating length; s_i is each moving mark's mean
/// position along the axis, u_i(t) its distance from the straight line between the ends (positive to the left of
/// the axis direction in image coordinates, i.e. along (−e_y, e_x)). An optional four-point plane calibration
/// removes perspective first. With a rolling-shutter readout time the sample of a mark at row y belongs to
/// t_frame + (y/H)·t_readout (REFERENCES.md §7); every mark is then resampled onto the common grid
/// t_frame + t_readout/2 (mid-frame) by a natural cubic spline over each unbroken run of samples.
/// </summary>
public static class StringFrame
{
    public static StringFrameResult Compute(Tracks tracks, StringFrameOptions options)
    {
        ArgumentNullException.ThrowIfNull(tracks);
        if (!(options.LengthM > 0) || !double.IsFinite(options.LengthM) || !(options.ReadoutS >= 0) || !double.IsFinite(options.ReadoutS))
        {
            throw new ArgumentOutOfRangeException(nameof(options), "length must be > 0 and readout time ≥ 0");
        }

        if (options.ReadoutS > 0 && options.FrameHeightPx < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(options), "a readout time needs the frame height");
        }

        if (tracks.MarkCount < 3)
        {
            throw new ArgumentException("tracks need two ends and at least one moving mark", nameof(tracks));
        }

        var warnings = new List<string>();
        int frames = tracks.FrameCount, marks = tracks.MarkCount, moving = marks - 2;
        var map = options.Plane is { } plane ? Homography.FromPoints(plane.ImagePx, plane.Plane) : null;

        // Plane positions of every sample.
        var px = new double[frames, marks];
        var py = new double[frames, marks];
        for (int k = 0; k < frames; k++)
        {
            for (int m = 0; m < marks; m++)
            {
                double x = tracks.XPx[k, m], y = tracks.YPx[k, m];
                bool ok = tracks.Quality[k, m] > 0 && double.IsFinite(x) && double.IsFinite(y);
                var p = ok ? map?.Map(x, y) ?? (x, y) : (double.NaN, double.NaN);
                px[k, m] = p.Item1;
                py[k, m] = p.Item2;
            }
        }

        var (e0x, e0y) = MeanOf(px, py, 0);
        var (e1x, e1y) = MeanOf(px, py, marks - 1);
        double lenUnits = Math.Sqrt((e1x - e0x) * (e1x - e0x) + (e1y - e0y) * (e1y - e0y));
        if (!(lenUnits > 0))
        {
            throw new ArgumentException("the two ends coincide or were never measured", nameof(tracks));
        }

        double scale = options.LengthM / lenUnits;
        double ux = (e1x - e0x) / lenUnits, uy = (e1y - e0y) / lenUnits, nx = -uy, ny = ux;

        var along = new double[frames, moving];
        var across = new double[frames, moving];
        var positions = new double[moving];
        for (int i = 0; i < moving; i++)
        {
            double sum = 0;
            int n = 0;
            for (int k = 0; k < frames; k++)
            {
                double dx = px[k, i + 1] - e0x, dy = py[k, i + 1] - e0y;
                along[k, i] = (dx * ux + dy * uy) * scale;
                across[k, i] = (dx * nx + dy * ny) * scale;
                if (double.IsFinite(along[k, i]))
                {
                    sum += along[k, i];
                    n++;
                }
            }

            positions[i] = n > 0 ? sum / n : double.NaN;
            if (n == 0)
            {
                warnings.Add($"mark {i + 1} was never measured");
            }
            else if (!(positions[i] > 0 && positions[i] < options.LengthM))
            {
                warnings.Add($"mark {i + 1} lies outside the span between the ends (s = {positions[i]:0.####} m)");
            }

            for (int k = 0; k < frames; k++)
            {
                along[k, i] -= positions[i];
            }
        }

        for (int i = 1; i < moving; i++)
        {
            if (positions[i] <= positions[i - 1])
            {
                warnings.Add($"marks {i} and {i + 1} are out of order along the string");
            }
        }

        double[] grid;
        var u = new double[frames, moving];
        var w = new double[frames, moving];
        var lon = new double[frames, moving];
        if (options.ReadoutS > 0)
        {
            grid = tracks.TimesS.Select(t => t + options.ReadoutS / 2).ToArray();
            for (int i = 0; i < moving; i++)
            {
                Resample(tracks, i + 1, options.ReadoutS, options.FrameHeightPx, grid, across, along, i, u, lon, w);
            }
        }
        else
        {
            grid = (double[])tracks.TimesS.Clone();
            for (int k = 0; k < frames; k++)
            {
                for (int i = 0; i < moving; i++)
                {
                    bool ok = double.IsFinite(across[k, i]);
                    u[k, i] = ok ? across[k, i] : double.NaN;
                    lon[k, i] = ok ? along[k, i] : double.NaN;
                    w[k, i] = ok ? tracks.Quality[k, i + 1] : 0;
                }
            }
        }

        var coords = new StringCoordinates(options.LengthM, positions.Select(p => double.IsFinite(p) ? p : 0).ToArray(), grid, u, w);
        return new StringFrameResult(coords, lon, scale, warnings);
    }

    private static void Resample(Tracks tracks, int mark, double readoutS, int heightPx, double[] grid,
        double[,] across, double[,] along, int column, double[,] u, double[,] lon, double[,] w)
    {
        int frames = tracks.FrameCount;
        for (int k = 0; k < frames; k++)
        {
            u[k, column] = double.NaN;
            lon[k, column] = double.NaN;
            w[k, column] = 0;
        }

        int start = 0;
        while (start < frames)
        {
            while (start < frames && !double.IsFinite(across[start, column]))
            {
                start++;
            }

            int end = start;
            while (end < frames && double.IsFinite(across[end, column]))
            {
                end++;
            }

            int n = end - start;
            if (n >= 2)
            {
                var t = new double[n];
                var a = new double[n];
                var l = new double[n];
                for (int j = 0; j < n; j++)
                {
                    t[j] = tracks.TimesS[start + j] + tracks.YPx[start + j, mark] / heightPx * readoutS;
                    a[j] = across[start + j, column];
                    l[j] = along[start + j, column];
                }

                if (IsIncreasing(t))
                {
                    var su = new CubicSpline(t, a);
                    var sl = new CubicSpline(t, l);
                    for (int k = start; k < end; k++)
                    {
                        // Only inside the run: no extrapolation past its first and last samples.
                        if (grid[k] < t[0] || grid[k] > t[^1])
                        {
                            continue;
                        }

                        u[k, column] = su.Evaluate(grid[k]);
                        lon[k, column] = sl.Evaluate(grid[k]);
                        int j = Math.Clamp(Array.BinarySearch(t, grid[k]) is var b && b >= 0 ? b : ~b, 1, n - 1);
                        w[k, column] = Math.Min(tracks.Quality[start + j - 1, mark], tracks.Quality[start + j, mark]);
                    }
                }
            }

            start = end;
        }
    }

    private static bool IsIncreasing(double[] t)
    {
        for (int i = 1; i < t.Length; i++)
        {
            if (!(t[i] > t[i - 1]))
            {
                return false;
            }
        }

        return true;
    }

    private static (double X, double Y) MeanOf(double[,] x, double[,] y, int m)
    {
        double sx = 0, sy = 0;
        int n = 0;
        for (int k = 0; k < x.GetLength(0); k++)
        {
            if (double.IsFinite(x[k, m]))
            {
                sx += x[k, m];
                sy += y[k, m];
                n++;
            }
        }

        return n > 0 ? (sx / n, sy / n) : (double.NaN, double.NaN);
    }
}
