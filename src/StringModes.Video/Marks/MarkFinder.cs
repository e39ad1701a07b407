using OpenCvSharp;

namespace StringModes.Video.Marks;

/// <summary>
/// Finds small marks on a reference frame. The background is estimated by a large median filter (robust to the
/// marks and the thin string), the absolute difference is opened with a disc a little smaller than the smallest
/// mark so the string line disappears, thresholded at a robust noise multiple and split into connected components;
/// components are kept by size and fill. Stray blobs are rejected by consensus on a line: every pair of candidates
/// proposes a line and the one with most candidates within tolerance wins (exhaustive RANSAC, Fischler &amp; Bolles
/// 1981, CACM 24:381), refitted by total least squares. Marks are ordered along that line; the outermost are the ends.
/// Works on any grey plane, dark or bright marks alike.
/// </summary>
public static class MarkFinder
{
    /// <summary>Finds and orders the marks; throws <see cref="MarksNotFoundException"/> when fewer than three moving marks remain.</summary>
    public static MarkLayout Find(Mat grey, MarkFinderOptions? options = null)
    {
        options ??= new MarkFinderOptions();
        Validate(options);
        using var grey8 = ToEightBit(grey);
        using var diff = new Mat();
        var candidates = Candidates(grey8, diff, options);
        var (inliers, rejected) = Collinear(candidates, options);
        var ordered = OrderAlongLine(inliers);
        var layout = new MarkLayout(ordered, rejected);
        if (layout.MovingCount < 3)
        {
            throw new MarksNotFoundException(
                $"found {layout.MovingCount} moving mark(s) on the string (need at least 3) and {rejected.Count} stray blob(s); check contrast and focus, or give the mark positions",
                layout.MovingCount, DiagnosticPng(grey8, layout));
        }

        return layout;
    }

    /// <summary>
    /// Marks at given positions (for example from a rig file), ordered as given: the first and last are the ends.
    /// Radius and contrast are measured on the frame.
    /// </summary>
    public static MarkLayout FromPositions(Mat grey, IReadOnlyList<(double XPx, double YPx)> positionsPx, MarkFinderOptions? options = null)
    {
        options ??= new MarkFinderOptions();
        Validate(options);
        using var grey8 = ToEightBit(grey);
        using var diff = new Mat();
        var found = Candidates(grey8, diff, options);
        var marks = new List<FoundMark>();
        foreach (var p in positionsPx)
        {
            var near = found.OrderBy(f => Dist2(f, p.XPx, p.YPx)).FirstOrDefault(f => Dist2(f, p.XPx, p.YPx) < Sq(options.MaxDiameterPx / 2));
            marks.Add(near is null
                ? new FoundMark(p.XPx, p.YPx, options.MinDiameterPx, ContrastAt(grey8, diff, p.XPx, p.YPx))
                : near with { XPx = p.XPx, YPx = p.YPx });
        }

        var layout = new MarkLayout(marks, []);
        if (layout.MovingCount < 3)
        {
            throw new MarksNotFoundException($"{layout.MovingCount} moving mark(s) given (need at least 3)", layout.MovingCount, DiagnosticPng(grey8, layout));
        }

        return layout;
    }

    /// <summary>
    /// Replaces the ends of a found layout with given end positions: found marks within one mark diameter of a
    /// given end, or outside the span between the ends, are dropped.
    /// </summary>
    public static MarkLayout WithEnds(Mat grey, MarkLayout found, (double XPx, double YPx) end0, (double XPx, double YPx) end1, MarkFinderOptions? options = null)
    {
        options ??= new MarkFinderOptions();
        double ex = end1.XPx - end0.XPx, ey = end1.YPx - end0.YPx, len = Math.Sqrt(ex * ex + ey * ey);
        var inner = found.Marks
            .Select(m => (m, t: ((m.XPx - end0.XPx) * ex + (m.YPx - end0.YPx) * ey) / len))
            .Where(v => v.t > v.m.RadiusPx * 2 && v.t < len - v.m.RadiusPx * 2)
            .OrderBy(v => v.t)
            .Select(v => v.m)
            .ToList();
        var positions = new List<(double, double)> { end0 };
        positions.AddRange(inner.Select(m => (m.XPx, m.YPx)));
        positions.Add(end1);
        return FromPositions(grey, positions, options) with { Rejected = found.Rejected };
    }

    private static void Validate(MarkFinderOptions o)
    {
        if (!(o.MinDiameterPx >= 3) || !(o.MaxDiameterPx > o.MinDiameterPx) || !(o.ThresholdSigma > 0) || !(o.MinContrastDn >= 0)
            || !(o.LineToleranceFraction > 0 && o.LineToleranceFraction <= 0.5) || !(o.MinFill > 0 && o.MinFill <= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(o), "mark finder options out of range");
        }
    }

    private static Mat ToEightBit(Mat grey)
    {
        var g = new Mat();
        if (grey.Depth() == MatType.CV_16U)
        {
            grey.ConvertTo(g, MatType.CV_8U, 1 / 256.0);
        }
        else
        {
            grey.CopyTo(g);
        }

        return g;
    }

    private static List<FoundMark> Candidates(Mat grey8, Mat diff, MarkFinderOptions o)
    {
        int k = Odd(Math.Max(9, 2 * o.MaxDiameterPx + 1));
        using var bg = new Mat();
        Cv2.MedianBlur(grey8, bg, Math.Min(k, 255));
        using var gf = new Mat();
        using var bf = new Mat();
        grey8.ConvertTo(gf, MatType.CV_32F);
        bg.ConvertTo(bf, MatType.CV_32F);
        Cv2.Subtract(gf, bf, diff);
        using var abs = new Mat();
        Cv2.Absdiff(gf, bf, abs);

        int ko = Odd(Math.Max(3, Math.Floor(o.MinDiameterPx * 0.8)));
        using var kernel = Cv2.GetStructuringElement(MorphShapes.Ellipse, new Size(ko, ko));
        using var opened = new Mat();
        Cv2.MorphologyEx(abs, opened, MorphTypes.Open, kernel);

        double sigma = 1.4826 * Median(abs);
        // A third of the strongest response as well, so a contrasty string that survives the opening stays below threshold.
        Cv2.MinMaxLoc(opened, out double _, out double peak);
        double threshold = Math.Max(Math.Max(o.ThresholdSigma * sigma, o.MinContrastDn), peak / 3);
        using var binary = new Mat();
        Cv2.Threshold(opened, binary, threshold, 255, ThresholdTypes.Binary);
        using var bin8 = new Mat();
        binary.ConvertTo(bin8, MatType.CV_8U);
        using var labels = new Mat();
        using var stats = new Mat();
        using var centroids = new Mat();
        int n = Cv2.ConnectedComponentsWithStats(bin8, labels, stats, centroids);

        double minArea = 0.4 * Math.PI * Sq(o.MinDiameterPx / 2);
        double maxArea = 1.5 * Math.PI * Sq(o.MaxDiameterPx / 2);
        var result = new List<FoundMark>();
        int rows = grey8.Rows, cols = grey8.Cols;
        var lab = Floats.Ints(labels);
        var dif = Floats.Of(diff);
        for (int i = 1; i < n; i++)
        {
            int area = stats.At<int>(i, (int)ConnectedComponentsTypes.Area);
            int w = stats.At<int>(i, (int)ConnectedComponentsTypes.Width);
            int h = stats.At<int>(i, (int)ConnectedComponentsTypes.Height);
            int x0 = stats.At<int>(i, (int)ConnectedComponentsTypes.Left);
            int y0 = stats.At<int>(i, (int)ConnectedComponentsTypes.Top);
            double aspect = w / (double)h;
            if (area < minArea || area > maxArea || aspect < 0.4 || aspect > 2.5 || area < o.MinFill * w * h)
            {
                continue;
            }

            // Moments of |difference| over the component grown by one pixel (keeps the antialiased rim).
            double m = 0, mx = 0, my = 0, sd = 0;
            for (int y = Math.Max(0, y0 - 1); y <= Math.Min(rows - 1, y0 + h); y++)
            {
                for (int x = Math.Max(0, x0 - 1); x <= Math.Min(cols - 1, x0 + w); x++)
                {
                    if (!NearLabel(lab, rows, cols, x, y, i))
                    {
                        continue;
                    }

                    float d = dif[y * cols + x];
                    double a = Math.Abs(d);
                    m += a;
                    mx += a * x;
                    my += a * y;
                    sd += d;
                }
            }

            if (m <= 0)
            {
                continue;
            }

            double cx = mx / m, cy = my / m, mxx = 0, myy = 0;
            for (int y = Math.Max(0, y0 - 1); y <= Math.Min(rows - 1, y0 + h); y++)
            {
                for (int x = Math.Max(0, x0 - 1); x <= Math.Min(cols - 1, x0 + w); x++)
                {
                    if (NearLabel(lab, rows, cols, x, y, i))
                    {
                        double a = Math.Abs(dif[y * cols + x]);
                        mxx += a * Sq(x - cx);
                        myy += a * Sq(y - cy);
                    }
                }
            }

            double radius = 2 * Math.Sqrt(Math.Max(mxx, myy) / m);
            result.Add(new FoundMark(cx, cy, Math.Max(radius, 1), sd / area));
        }

        return result;
    }

    private static bool NearLabel(int[] labels, int rows, int cols, int x, int y, int label)
    {
        for (int dy = -1; dy <= 1; dy++)
        {
            for (int dx = -1; dx <= 1; dx++)
            {
                int yy = y + dy, xx = x + dx;
                if (yy >= 0 && xx >= 0 && yy < rows && xx < cols && labels[yy * cols + xx] == label)
                {
                    return true;
                }
            }
        }

        return false;
    }

    private static (List<FoundMark> Inliers, List<FoundMark> Rejected) Collinear(List<FoundMark> c, MarkFinderOptions o)
    {
        if (c.Count < 3)
        {
            return (c, []);
        }

        // Strongest 60 blobs bound the pair search to ~1800 lines.
        var pool = c.OrderByDescending(f => Math.Abs(f.ContrastDn) * f.RadiusPx * f.RadiusPx).Take(60).ToList();
        int bestCount = 0;
        double bestSpan = 0;
        List<FoundMark> best = [];
        for (int a = 0; a < pool.Count; a++)
        {
            for (int b = a + 1; b < pool.Count; b++)
            {
                double dx = pool[b].XPx - pool[a].XPx, dy = pool[b].YPx - pool[a].YPx, len = Math.Sqrt(dx * dx + dy * dy);
                if (len < 1)
                {
                    continue;
                }

                var inl = Inliers(pool, pool[a].XPx, pool[a].YPx, dx / len, dy / len, o.LineToleranceFraction);
                double span = Span(inl);
                if (inl.Count > bestCount || (inl.Count == bestCount && span > bestSpan))
                {
                    bestCount = inl.Count;
                    bestSpan = span;
                    best = inl;
                }
            }
        }

        // Refit by total least squares and collect once more with the refined line.
        var (px, py, ux, uy) = TotalLeastSquares(best);
        var final = Inliers(pool, px, py, ux, uy, o.LineToleranceFraction);
        var rejected = c.Where(f => !final.Contains(f)).ToList();
        return (final, rejected);
    }

    private static List<FoundMark> Inliers(List<FoundMark> pool, double px, double py, double ux, double uy, double fraction)
    {
        double tmin = pool.Min(f => (f.XPx - px) * ux + (f.YPx - py) * uy);
        double tmax = pool.Max(f => (f.XPx - px) * ux + (f.YPx - py) * uy);
        // Tolerance relative to the span of the candidates this line would join (iterated twice to settle).
        var result = pool;
        for (int pass = 0; pass < 2; pass++)
        {
            double tol = Math.Max(3, fraction * (tmax - tmin));
            result = pool.Where(f => Math.Abs(-(f.XPx - px) * uy + (f.YPx - py) * ux) <= tol).ToList();
            if (result.Count == 0)
            {
                break;
            }

            tmin = result.Min(f => (f.XPx - px) * ux + (f.YPx - py) * uy);
            tmax = result.Max(f => (f.XPx - px) * ux + (f.YPx - py) * uy);
        }

        return result;
    }

    private static double Span(List<FoundMark> m)
    {
        double best = 0;
        for (int i = 0; i < m.Count; i++)
        {
            for (int j = i + 1; j < m.Count; j++)
            {
                best = Math.Max(best, Dist2(m[i], m[j].XPx, m[j].YPx));
            }
        }

        return best;
    }

    private static (double Px, double Py, double Ux, double Uy) TotalLeastSquares(List<FoundMark> m)
    {
        double mx = m.Average(f => f.XPx), my = m.Average(f => f.YPx);
        double sxx = m.Sum(f => Sq(f.XPx - mx)), syy = m.Sum(f => Sq(f.YPx - my)), sxy = m.Sum(f => (f.XPx - mx) * (f.YPx - my));
        double angle = 0.5 * Math.Atan2(2 * sxy, sxx - syy);
        return (mx, my, Math.Cos(angle), Math.Sin(angle));
    }

    private static List<FoundMark> OrderAlongLine(List<FoundMark> m)
    {
        if (m.Count < 2)
        {
            return m;
        }

        var (px, py, ux, uy) = TotalLeastSquares(m);
        // Orient left to right (top to bottom for a vertical string) so the order does not depend on the fit's sign.
        if (ux < -1e-9 || (Math.Abs(ux) <= 1e-9 && uy < 0))
        {
            ux = -ux;
            uy = -uy;
        }

        return m.OrderBy(f => (f.XPx - px) * ux + (f.YPx - py) * uy).ToList();
    }

    private static double ContrastAt(Mat grey8, Mat diff, double x, double y)
    {
        int xi = Math.Clamp((int)Math.Round(x), 0, grey8.Cols - 1), yi = Math.Clamp((int)Math.Round(y), 0, grey8.Rows - 1);
        return diff.At<float>(yi, xi);
    }

    /// <summary>Reference frame in colour with accepted marks (green), rejected blobs (red) and the order line (blue).</summary>
    internal static byte[] DiagnosticPng(Mat grey8, MarkLayout layout)
    {
        using var colour = new Mat();
        Cv2.CvtColor(grey8, colour, ColorConversionCodes.GRAY2BGR);
        for (int i = 0; i + 1 < layout.Marks.Count; i++)
        {
            Cv2.Line(colour, P(layout.Marks[i]), P(layout.Marks[i + 1]), new Scalar(255, 0, 0), 1, LineTypes.AntiAlias);
        }

        foreach (var r in layout.Rejected)
        {
            Cv2.Circle(colour, P(r), (int)Math.Ceiling(r.RadiusPx + 3), new Scalar(0, 0, 255), 1, LineTypes.AntiAlias);
        }

        foreach (var m in layout.Marks)
        {
            Cv2.Circle(colour, P(m), (int)Math.Ceiling(m.RadiusPx + 3), new Scalar(0, 200, 0), 1, LineTypes.AntiAlias);
        }

        Cv2.ImEncode(".png", colour, out byte[] png);
        return png;
    }

    private static Point P(FoundMark m) => new((int)Math.Round(m.XPx), (int)Math.Round(m.YPx));

    private static double Median(Mat m32)
    {
        // Histogram median of |difference| in 0.25-level bins: exact enough for a noise scale, no sort of the frame.
        const int bins = 1024;
        var hist = new int[bins];
        var data = Floats.Of(m32);
        int total = data.Length;
        foreach (float v in data)
        {
            hist[Math.Min(bins - 1, (int)(v * 4))]++;
        }

        int acc = 0;
        for (int i = 0; i < bins; i++)
        {
            acc += hist[i];
            if (acc * 2 >= total)
            {
                return (i + 0.5) / 4;
            }
        }

        return bins / 4.0;
    }

    private static int Odd(double v)
    {
        int i = (int)Math.Ceiling(v);
        return i % 2 == 1 ? i : i + 1;
    }

    private static double Sq(double v) => v * v;

    private static double Dist2(FoundMark f, double x, double y) => Sq(f.XPx - x) + Sq(f.YPx - y);
}
