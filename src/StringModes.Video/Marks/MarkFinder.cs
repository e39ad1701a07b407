using OpenCvSharp;
using StringModes.Video.Synthesis;

namespace StringModes.Video.Marks;

/// <summary>Options of automatic mark finding.</summary>
public sealed record MarkFinderOptions
{
    /// <summary>Side of the median filter that estimates the background, px; odd, larger than twice a mark's diameter; default 31.</summary>
    public int BackgroundKernelPx { get; init; } = 31;

    /// <summary>Smallest colour difference from the background that can be a mark, 8-bit DN; default 20.</summary>
    public double MinimumContrastDn { get; init; } = 20;

    /// <summary>Marks must lie within this fraction of the span from the line through the ends; default 0.06.</summary>
    public double LineToleranceFraction { get; init; } = 0.06;
}

/// <summary>
/// Finds marks automatically on a reference frame: colour difference from a median-filtered background,
/// thresholding, a morphological opening that removes the thin string itself, connected components filtered by
/// size and roundness, then a consensus line (RANSAC, Fischler and Bolles 1981, run exhaustively over candidate
/// pairs so it is deterministic) that rejects stray objects of the marks' colour off the string.
/// </summary>
public static class MarkFinder
{
    public static FoundMarks Find(Mat frame, int referenceFrame, MarkFinderOptions? options = null)
    {
        options ??= new MarkFinderOptions();
        using var bgr8 = To8BitBgr(frame);
        using var background = new Mat();
        var k = options.BackgroundKernelPx | 1;
        Cv2.MedianBlur(bgr8, background, k);
        using var diff = new Mat();
        Cv2.Absdiff(bgr8, background, diff);
        var channels = Cv2.Split(diff);
        using var distance = channels[0].Clone();
        for (var c = 1; c < channels.Length; c++) Cv2.Max(distance, channels[c], distance);
        foreach (var ch in channels) ch.Dispose();

        var threshold = Math.Max(options.MinimumContrastDn, 0.4 * Percentile(distance, 0.9995));
        using var mask = new Mat();
        Cv2.Threshold(distance, mask, threshold, 255, ThresholdTypes.Binary);
        using var kernel = Cv2.GetStructuringElement(MorphShapes.Ellipse, new Size(5, 5));
        Cv2.MorphologyEx(mask, mask, MorphTypes.Open, kernel);

        using var labels = new Mat();
        using var stats = new Mat();
        using var centroids = new Mat();
        var count = Cv2.ConnectedComponentsWithStats(mask, labels, stats, centroids, PixelConnectivity.Connectivity8);
        var candidates = new List<FoundMark>();
        for (var i = 1; i < count; i++)
        {
            var area = stats.At<int>(i, (int)ConnectedComponentsTypes.Area);
            var w = stats.At<int>(i, (int)ConnectedComponentsTypes.Width);
            var h = stats.At<int>(i, (int)ConnectedComponentsTypes.Height);
            if (area < 6 || area > 20000) continue;
            if (Math.Max(w, h) > 2.5 * Math.Min(w, h)) continue;
            if (area < 0.45 * w * h) continue;
            var x0 = stats.At<int>(i, (int)ConnectedComponentsTypes.Left);
            var y0 = stats.At<int>(i, (int)ConnectedComponentsTypes.Top);
            double sx = 0, sy = 0, sm = 0, db = 0, dg = 0, dr = 0;
            var n = 0;
            for (var y = y0; y < y0 + h; y++)
                for (var x = x0; x < x0 + w; x++)
                {
                    if (labels.At<int>(y, x) != i) continue;
                    var weight = (double)distance.At<byte>(y, x);
                    sx += weight * x; sy += weight * y; sm += weight;
                    var p = bgr8.At<Vec3b>(y, x);
                    var q = background.At<Vec3b>(y, x);
                    db += p.Item0 - q.Item0; dg += p.Item1 - q.Item1; dr += p.Item2 - q.Item2;
                    n++;
                }
            candidates.Add(new FoundMark(new PixelPoint(sx / sm, sy / sm), (db / n, dg / n, dr / n), Math.Sqrt(area / Math.PI)));
        }

        var (inliers, rejected) = ConsensusLine(candidates, options.LineToleranceFraction);
        return new FoundMarks(inliers, rejected.Select(r => r.Position).ToArray(), referenceFrame);
    }

    private static (List<FoundMark> Inliers, List<FoundMark> Rejected) ConsensusLine(List<FoundMark> candidates, double tolerance)
    {
        if (candidates.Count < 2) return ([.. candidates], []);
        // Keep the problem bounded: at most the 300 strongest candidates enter the exhaustive pair search.
        var pool = candidates.OrderByDescending(c => c.Contrast * c.RadiusPx).Take(300).ToList();
        List<FoundMark> best = [];
        double bestSpan = 0;
        for (var i = 0; i < pool.Count; i++)
            for (var j = i + 1; j < pool.Count; j++)
            {
                var a = pool[i].Position;
                var b = pool[j].Position;
                var span = Math.Sqrt((b.X - a.X) * (b.X - a.X) + (b.Y - a.Y) * (b.Y - a.Y));
                if (span < 20) continue;
                var nx = -(b.Y - a.Y) / span;
                var ny = (b.X - a.X) / span;
                var tol = Math.Max(4, tolerance * span);
                var inliers = pool.Where(c =>
                {
                    var along = ((c.Position.X - a.X) * (b.X - a.X) + (c.Position.Y - a.Y) * (b.Y - a.Y)) / span;
                    return Math.Abs((c.Position.X - a.X) * nx + (c.Position.Y - a.Y) * ny) <= tol && along >= -0.02 * span && along <= 1.02 * span;
                }).ToList();
                if (inliers.Count > best.Count || (inliers.Count == best.Count && span > bestSpan))
                {
                    best = inliers;
                    bestSpan = span;
                }
            }
        // Order along the string: end 0 is the left end (the top end for a vertical string).
        var first = best.MinBy(c => c.Position.X + 1e-3 * c.Position.Y)!;
        var last = best.MaxBy(c => c.Position.X + 1e-3 * c.Position.Y)!;
        var dx = last.Position.X - first.Position.X;
        var dy = last.Position.Y - first.Position.Y;
        var ordered = best.OrderBy(c => (c.Position.X - first.Position.X) * dx + (c.Position.Y - first.Position.Y) * dy).ToList();
        return (ordered, candidates.Except(best).ToList());
    }

    private static double Percentile(Mat grey8, double p)
    {
        var histogram = new long[256];
        int rows = grey8.Rows, cols = grey8.Cols;
        for (var y = 0; y < rows; y++)
            for (var x = 0; x < cols; x++) histogram[grey8.At<byte>(y, x)]++;
        var target = p * rows * cols;
        long cumulative = 0;
        for (var v = 0; v < 256; v++)
        {
            cumulative += histogram[v];
            if (cumulative >= target) return v;
        }
        return 255;
    }

    internal static Mat To8BitBgr(Mat frame)
    {
        var out8 = new Mat();
        if (frame.Depth() == MatType.CV_16U) frame.ConvertTo(out8, MatType.CV_8U, 1.0 / 257.0);
        else frame.CopyTo(out8);
        if (out8.Channels() == 1) Cv2.CvtColor(out8, out8, ColorConversionCodes.GRAY2BGR);
        else if (out8.Channels() == 4) Cv2.CvtColor(out8, out8, ColorConversionCodes.BGRA2BGR);
        return out8;
    }

    /// <summary>PNG of the frame with accepted marks (circled, numbered) and rejected candidates (crossed).</summary>
    public static byte[] DiagnosticPng(Mat frame, IReadOnlyList<PixelPoint> accepted, IReadOnlyList<PixelPoint> rejected)
    {
        using var image = To8BitBgr(frame);
        for (var i = 0; i < accepted.Count; i++)
        {
            var p = new Point((int)Math.Round(accepted[i].X), (int)Math.Round(accepted[i].Y));
            Cv2.Circle(image, p, 9, new Scalar(60, 220, 60), 2, LineTypes.AntiAlias);
            Cv2.PutText(image, i.ToString(System.Globalization.CultureInfo.InvariantCulture), new Point(p.X + 8, p.Y - 10), HersheyFonts.HersheySimplex, 0.45, new Scalar(60, 220, 60), 1, LineTypes.AntiAlias);
        }
        foreach (var r in rejected)
        {
            var p = new Point((int)Math.Round(r.X), (int)Math.Round(r.Y));
            Cv2.Line(image, new Point(p.X - 6, p.Y - 6), new Point(p.X + 6, p.Y + 6), new Scalar(40, 40, 230), 2);
            Cv2.Line(image, new Point(p.X - 6, p.Y + 6), new Point(p.X + 6, p.Y - 6), new Scalar(40, 40, 230), 2);
        }
        return image.ImEncode(".png");
    }
}
