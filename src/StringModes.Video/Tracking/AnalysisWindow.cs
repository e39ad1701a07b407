using StringModes.Analysis.Geometry;

namespace StringModes.Video.Tracking;

/// <summary>The frames worth analysing: from when every mark is tracked confidently to when motion sinks into noise.</summary>
/// <param name="StartFrame">First frame of the window.</param>
/// <param name="EndFrame">One past the last frame of the window.</param>
/// <param name="StartS">Time of the first frame, s.</param>
/// <param name="EndS">Time of the last frame, s.</param>
/// <param name="NoisePx">Position noise estimated from the still end marks, px.</param>
public sealed record AnalysisWindow(int StartFrame, int EndFrame, double StartS, double EndS, double NoisePx)
{
    /// <summary>Number of frames in the window.</summary>
    public int FrameCount => EndFrame - StartFrame;

    /// <summary>
    /// Start: the first frame from which every mark has quality ≥ <see cref="TrackerOptions.ConfidentQuality"/> for
    /// <see cref="TrackerOptions.ConfidentFrames"/> frames (skips the blurred release). End: after the last stretch
    /// whose windowed RMS transverse motion of some moving mark exceeds <see cref="TrackerOptions.EndNoiseMultiple"/>
    /// × the position noise; the noise comes from frame-to-frame jitter of the end marks (still by definition),
    /// floored at 0.005 px. Returns the whole clip with a reason when no such window exists.
    /// </summary>
    public static AnalysisWindow Choose(Tracks tracks, TrackerOptions options, out string? problem)
    {
        problem = null;
        int frames = tracks.FrameCount, marks = tracks.MarkCount;
        int start = -1, run = 0;
        for (int k = 0; k < frames; k++)
        {
            bool ok = true;
            for (int m = 0; m < marks && ok; m++)
            {
                ok = tracks.Quality[k, m] >= options.ConfidentQuality;
            }

            run = ok ? run + 1 : 0;
            if (run >= options.ConfidentFrames)
            {
                start = k - run + 1;
                break;
            }
        }

        if (start < 0)
        {
            problem = "no stretch of frames where every mark is tracked confidently; the whole clip is used";
            start = 0;
        }

        // Transverse direction from the mean end positions.
        double e0x = Mean(tracks.XPx, 0), e0y = Mean(tracks.YPx, 0), e1x = Mean(tracks.XPx, marks - 1), e1y = Mean(tracks.YPx, marks - 1);
        double len = Math.Sqrt((e1x - e0x) * (e1x - e0x) + (e1y - e0y) * (e1y - e0y));
        double nx = len > 0 ? -(e1y - e0y) / len : 0, ny = len > 0 ? (e1x - e0x) / len : 1;

        var diffs = new List<double>();
        foreach (int m in new[] { 0, marks - 1 })
        {
            for (int k = start + 1; k < frames; k++)
            {
                double a = (tracks.XPx[k, m] - tracks.XPx[k - 1, m]) * nx + (tracks.YPx[k, m] - tracks.YPx[k - 1, m]) * ny;
                if (double.IsFinite(a))
                {
                    diffs.Add(Math.Abs(a));
                }
            }
        }

        double noise = 0.005;
        if (diffs.Count > 4)
        {
            diffs.Sort();
            // Differences of independent noise have √2 × σ; median |d| = 0.6745·√2·σ.
            noise = Math.Max(noise, diffs[diffs.Count / 2] / (0.6745 * Math.Sqrt(2)));
        }

        int w = Math.Max(10, (frames - start) / 40);
        int end = frames;
        bool found = false;
        for (int k = frames - w; k >= start; k -= Math.Max(1, w / 2))
        {
            for (int m = 1; m < marks - 1 && !found; m++)
            {
                double s = 0, s2 = 0;
                int n = 0;
                for (int j = k; j < k + w; j++)
                {
                    double u = tracks.XPx[j, m] * nx + tracks.YPx[j, m] * ny;
                    if (double.IsFinite(u))
                    {
                        s += u;
                        s2 += u * u;
                        n++;
                    }
                }

                if (n > w / 2)
                {
                    double rms = Math.Sqrt(Math.Max(0, s2 / n - (s / n) * (s / n)));
                    if (rms > options.EndNoiseMultiple * noise)
                    {
                        found = true;
                        end = Math.Min(frames, k + w);
                    }
                }
            }

            if (found)
            {
                break;
            }
        }

        if (!found)
        {
            problem ??= "no motion above the noise floor was found";
        }

        if (end - start < 2)
        {
            start = 0;
            end = frames;
        }

        return new AnalysisWindow(start, end, tracks.TimesS[start], tracks.TimesS[end - 1], noise);
    }

    private static double Mean(double[,] a, int m)
    {
        double s = 0;
        int n = 0;
        for (int k = 0; k < a.GetLength(0); k++)
        {
            if (double.IsFinite(a[k, m]))
            {
                s += a[k, m];
                n++;
            }
        }

        return n > 0 ? s / n : 0;
    }
}
