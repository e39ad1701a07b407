using OpenCvSharp;
using StringModes.Video.Frames;
using StringModes.Video.Marks;

namespace StringModes.Video.Tracking;

/// <summary>
/// Decides whether a video's marks can be followed on the luma plane alone (see
/// <see cref="VideoFileSource.TryOpenLuma"/>), which spares the decoder's colour conversion, and gives each mark's
/// contrast on that plane. Luma is used only when every mark's colour contrast is essentially a brightness contrast
/// (a dark, bright or grey mark; not a red mark on a green background of the same brightness), and only after the
/// reference frame's luma plane has been checked against its colour frame: Y must follow the colour frame's grey
/// value linearly (slope 0.8–1.15: 219/255 for studio-range video, 1 for full range; correlation ≥ 0.95), which
/// rules out any stream whose first plane is not the luma after all.
/// </summary>
internal sealed class LumaTracking
{
    /// <summary>Smallest √3·|luma contrast| / |colour contrast| for which a mark counts as a brightness contrast (1 for a grey mark; 0.85 ≈ 30° off grey).</summary>
    public const double MinimumGreyness = 0.85;

    /// <summary>Y / grey slope of the reference frame.</summary>
    private readonly double _slope;

    private LumaTracking(double slope) => _slope = slope;

    /// <summary>The plan for <paramref name="path"/>, or null when colour frames must be decoded.</summary>
    public static LumaTracking? TryPlan(string path, Mat colourReference, int referenceIndex, FoundMarks marks)
    {
        if (marks.Marks.Any(m => Greyness(m.ContrastBgr) < MinimumGreyness)) return null;
        using var source = VideoFileSource.TryOpenLuma(path);
        if (source is null) return null;
        using var luma = ReadFrame(source, referenceIndex);
        if (luma is null || luma.Type() != MatType.CV_8UC1 || luma.Cols != colourReference.Cols || luma.Rows != colourReference.Rows) return null;
        var slope = ConsistentSlope(colourReference, luma);
        return double.IsNaN(slope) ? null : new LumaTracking(slope);
    }

    /// <summary>The mark as seen on the luma plane: its contrast in Y, carried in the first channel (a one-channel frame's projection weights sum to that channel's).</summary>
    public FoundMark OnLuma(FoundMark mark) => mark with { ContrastBgr = (_slope * Grey(mark.ContrastBgr), 0, 0) };

    private static double Grey((double B, double G, double R) c) => 0.114 * c.B + 0.587 * c.G + 0.299 * c.R;

    private static double Greyness((double B, double G, double R) c)
    {
        var norm = Math.Sqrt(c.B * c.B + c.G * c.G + c.R * c.R);
        return norm > 0 ? Math.Sqrt(3) * Math.Abs(Grey(c)) / norm : 0;
    }

    private static Mat? ReadFrame(IFrameSource source, int index)
    {
        var at = 0;
        if (index > 0 && source.TrySkipTo(index)) at = index;
        while (source.Read(out var frame, out _))
            if (at++ >= index) return frame.Clone();
        return null;
    }

    /// <summary>Least-squares slope of Y against the colour frame's grey value on a sparse grid; NaN when they are not consistent.</summary>
    private static double ConsistentSlope(Mat colour, Mat luma)
    {
        var bgr = new PixelAccess(colour);
        var y = new PixelAccess(luma);
        double sx = 0, sy = 0, sxx = 0, syy = 0, sxy = 0;
        var n = 0;
        var step = Math.Max(1, (int)Math.Sqrt((double)bgr.Width * bgr.Height / 40000));
        for (var j = 0; j < bgr.Height; j += step)
            for (var i = 0; i < bgr.Width; i += step)
            {
                var g = Grey(bgr.Colour(i, j));
                var v = y.Colour(i, j).B;
                sx += g; sy += v; sxx += g * g; syy += v * v; sxy += g * v;
                n++;
            }
        var vx = sxx / n - sx / n * (sx / n);
        var vy = syy / n - sy / n * (sy / n);
        var cov = sxy / n - sx / n * (sy / n);
        if (!(vx > 0 && vy > 0)) return double.NaN;
        var slope = cov / vx;
        var r = cov / Math.Sqrt(vx * vy);
        return slope is >= 0.8 and <= 1.15 && r >= 0.95 ? slope : double.NaN;
    }
}
