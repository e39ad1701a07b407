namespace StringModes.Analysis.Geometry;

/// <summary>The frames worth analysing and why the window starts and ends where it does.</summary>
/// <param name="FirstFrame">First frame (inclusive).</param>
/// <param name="LastFrame">Last frame (inclusive).</param>
/// <param name="NoiseFloorPx">Position noise estimated from the still ends, px (RMS).</param>
/// <param name="Notes">Plain-language notes on the choice.</param>
public sealed record AnalysisWindowChoice(int FirstFrame, int LastFrame, double NoiseFloorPx, IReadOnlyList<string> Notes);

/// <summary>
/// Picks the analysis window automatically. It starts at the first frame from which every moving mark is tracked
/// confidently (quality ≥ a threshold) for a run of frames — skipping a blurred release, which lowers the quality of
/// a centroid measurement — and ends when the marks' motion falls to a few times the noise floor, estimated from the
/// scatter of the still ends.
/// </summary>
public static class AnalysisWindow
{
    /// <summary>Chooses the window; <paramref name="minimumQuality"/> in (0, 1], default 0.6.</summary>
    public static AnalysisWindowChoice Choose(Tracks tracks, double minimumQuality = 0.6)
    {
        var frames = tracks.FrameCount;
        var marks = tracks.MarkCount;
        var notes = new List<string>();
        var dt = frames > 1 ? (tracks.TimesS[^1] - tracks.TimesS[0]) / (frames - 1) : 1;
        var run = Math.Max(5, (int)Math.Round(0.02 / dt));
        bool Good(int k)
        {
            for (var i = 1; i < marks - 1; i++) if (!(tracks.Quality[k, i] >= minimumQuality)) return false;
            return true;
        }
        var first = -1;
        var streak = 0;
        for (var k = 0; k < frames; k++)
        {
            streak = Good(k) ? streak + 1 : 0;
            if (streak >= run) { first = k - run + 1; break; }
        }
        if (first >= 0) first = SkipBlurredStart(tracks, first, run);
        if (first < 0)
        {
            first = 0;
            notes.Add("no stretch of frames has every mark tracked confidently; the whole clip is used and its weak frames are down-weighted");
        }
        else if (first > 0)
        {
            notes.Add(FormattableString.Invariant($"the first {tracks.TimesS[first] - tracks.TimesS[0]:F3} s were skipped: not every mark was tracked confidently (blurred release, or marks not yet seen)"));
        }

        var noise = EndScatter(tracks, first);
        var block = Math.Max(8, (int)Math.Round(0.1 / dt));
        var last = frames - 1;
        if (noise > 0)
        {
            var lastActive = -1;
            for (var b = first; b + block <= frames; b += block)
            {
                if (BlockMotion(tracks, b, block) > 5 * noise) lastActive = b + block - 1;
            }
            if (lastActive > first && lastActive < frames - 1 - block)
            {
                last = lastActive;
                notes.Add(FormattableString.Invariant($"the window ends at {tracks.TimesS[last] - tracks.TimesS[0]:F3} s, where the motion falls to the noise floor ({noise:F3} px)"));
            }
        }
        return new AnalysisWindowChoice(first, last, noise, notes);
    }

    // Blur lowers a centroid's quality (peak and mass fall as the streak lengthens). Block means of the quality over
    // all moving marks are compared with the clip's settled level (median of the second half's blocks, with a
    // tolerance of three robust standard deviations, 1.4826·MAD, and at least 0.002 so that a perfectly steady clip
    // does not reject ordinary fluctuations): the window starts at the first block that reaches it. A blurred
    // stretch left in the window lowers the measured amplitude there (the exposure average of a sinusoid is
    // sinc(π·f·t_exposure) times its value) and so biases the decay rate.
    private static int SkipBlurredStart(Tracks tracks, int first, int block)
    {
        var means = new List<(int Start, double Mean)>();
        for (var b = first; b + block <= tracks.FrameCount; b += block)
        {
            double sum = 0;
            var n = 0;
            for (var k = b; k < b + block; k++)
                for (var i = 1; i < tracks.MarkCount - 1; i++) { sum += tracks.Quality[k, i]; n++; }
            means.Add((b, n > 0 ? sum / n : 0));
        }
        if (means.Count < 4) return first;
        var late = means.Skip(means.Count / 2).Select(m => m.Mean).Order().ToArray();
        var median = late[late.Length / 2];
        var mad = late.Select(v => Math.Abs(v - median)).Order().ToArray()[late.Length / 2];
        var threshold = median - Math.Max(3 * 1.4826 * mad, 0.002);
        foreach (var (start, mean) in means)
            if (mean >= threshold) return start;
        return first;
    }

    private static double EndScatter(Tracks tracks, int first)
    {
        double sum = 0;
        var n = 0;
        foreach (var mark in new[] { 0, tracks.MarkCount - 1 })
        {
            var xs = new List<double>();
            var ys = new List<double>();
            for (var k = first; k < tracks.FrameCount; k++)
                if (tracks.Quality[k, mark] > 0 && double.IsFinite(tracks.XPx[k, mark])) { xs.Add(tracks.XPx[k, mark]); ys.Add(tracks.YPx[k, mark]); }
            if (xs.Count < 3) continue;
            var mx = xs.Average();
            var my = ys.Average();
            for (var j = 0; j < xs.Count; j++) { sum += (xs[j] - mx) * (xs[j] - mx) + (ys[j] - my) * (ys[j] - my); n++; }
        }
        return n > 0 ? Math.Sqrt(sum / n) : 0;
    }

    // RMS deviation of the moving marks from their block means (x and y together), px.
    private static double BlockMotion(Tracks tracks, int start, int count)
    {
        double sum = 0;
        var n = 0;
        for (var i = 1; i < tracks.MarkCount - 1; i++)
        {
            double mx = 0, my = 0;
            var c = 0;
            for (var k = start; k < start + count; k++)
                if (tracks.Quality[k, i] > 0) { mx += tracks.XPx[k, i]; my += tracks.YPx[k, i]; c++; }
            if (c < 3) continue;
            mx /= c;
            my /= c;
            for (var k = start; k < start + count; k++)
                if (tracks.Quality[k, i] > 0) { sum += Math.Pow(tracks.XPx[k, i] - mx, 2) + Math.Pow(tracks.YPx[k, i] - my, 2); n++; }
        }
        return n > 0 ? Math.Sqrt(sum / n) : 0;
    }
}
