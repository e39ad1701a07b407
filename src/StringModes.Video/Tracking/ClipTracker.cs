using OpenCvSharp;
using StringModes.Analysis.Geometry;
using StringModes.Video.Frames;
using StringModes.Video.Marks;

namespace StringModes.Video.Tracking;

/// <summary>
/// Everyday entry point: clip in, mark tracks out. Full control: <see cref="FrameSources"/>, <see cref="MarkFinder"/>,
/// <see cref="AnalysisWindow.Choose"/>. Throws <see cref="InputException"/> (unreadable clip, exit code 3) and
/// <see cref="MarksNotFoundException"/> (fewer than three moving marks, exit code 4).
/// </summary>
public static class ClipTracker
{
    public static TrackingResult Track(string clipPath, TrackingOptions options, IProgress<double>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (options.ReferenceFrame < 0 || options.MaxFrames is < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(options), "reference frame must be ≥ 0 and frame limit ≥ 1");
        }

        var source = FrameSources.Open(clipPath, options.Source);
        try
        {
            using var reference = new Mat();
            if (!source.Read())
            {
                throw new InputException(clipPath, $"{clipPath}: contains no frames");
            }

            while (source.FrameIndex < options.ReferenceFrame)
            {
                if (!source.Read())
                {
                    throw new InputException(clipPath, $"{clipPath}: has only {source.FrameIndex + 1} frames, fewer than the reference frame {options.ReferenceFrame}");
                }
            }

            source.Grey.CopyTo(reference);
            var region = source.Region;
            var layout = FindMarks(reference, options, region);
            var tracker = new MarkTracker(layout, new PlaneView(reference), options.Tracker);

            if (options.ReferenceFrame > 0)
            {
                source.Dispose();
                source = FrameSources.Open(clipPath, options.Source);
                source.Read();
            }

            int marks = tracker.MarkCount;
            var times = new List<double>();
            var xs = new List<double>();
            var ys = new List<double>();
            var qs = new List<double>();
            var x = new double[marks];
            var y = new double[marks];
            var q = new double[marks];
            int expected = options.MaxFrames ?? source.DeclaredFrameCount;
            int lastPercent = -1;
            do
            {
                tracker.Track(new PlaneView(source.Grey), x, y, q);
                times.Add(source.TimeS);
                for (int m = 0; m < marks; m++)
                {
                    xs.Add(double.IsNaN(x[m]) ? double.NaN : x[m] + region.X);
                    ys.Add(double.IsNaN(y[m]) ? double.NaN : y[m] + region.Y);
                    qs.Add(q[m]);
                }

                if (progress is not null && expected > 0)
                {
                    int percent = Math.Min(100, 100 * times.Count / expected);
                    if (percent != lastPercent)
                    {
                        lastPercent = percent;
                        progress.Report(percent / 100.0);
                    }
                }
            }
            while ((options.MaxFrames is null || times.Count < options.MaxFrames) && source.Read());

            var tracks = Assemble(times, xs, ys, qs, marks);
            var warnings = new List<string>(source.Warnings);
            var timing = FrameTiming.Analyse(times, source.DeclaredFps, options.Source.CaptureFps);
            warnings.AddRange(timing.Warnings);
            var window = AnalysisWindow.Choose(tracks, options.Tracker, out string? problem);
            if (problem is not null)
            {
                warnings.Add(problem);
            }

            warnings.AddRange(Diagnose(tracks, window, options.EndsPx is not null || options.MarkPositionsPx is not null));
            using var ref8 = new Mat();
            if (reference.Depth() == MatType.CV_16U)
            {
                reference.ConvertTo(ref8, MatType.CV_8U, 1 / 256.0);
            }
            else
            {
                reference.CopyTo(ref8);
            }

            Cv2.ImEncode(".png", ref8, out byte[] png);
            return new TrackingResult(tracks, window, timing, warnings, png, region, source.FrameWidth, source.FrameHeight);
        }
        finally
        {
            source.Dispose();
        }
    }

    private static MarkLayout FindMarks(Mat reference, TrackingOptions options, RegionOfInterest region)
    {
        if (options.MarkPositionsPx is { } given)
        {
            return MarkFinder.FromPositions(reference, given.Select(p => (p.XPx - region.X, p.YPx - region.Y)).ToList(), options.Marks);
        }

        var found = MarkFinder.Find(reference, options.Marks);
        if (options.EndsPx is { } ends)
        {
            return MarkFinder.WithEnds(reference, found, (ends.End0.XPx - region.X, ends.End0.YPx - region.Y),
                (ends.End1.XPx - region.X, ends.End1.YPx - region.Y), options.Marks);
        }

        return found;
    }

    private static Tracks Assemble(List<double> times, List<double> xs, List<double> ys, List<double> qs, int marks)
    {
        int frames = times.Count;
        var x = new double[frames, marks];
        var y = new double[frames, marks];
        var q = new double[frames, marks];
        for (int k = 0; k < frames; k++)
        {
            for (int m = 0; m < marks; m++)
            {
                x[k, m] = xs[k * marks + m];
                y[k, m] = ys[k * marks + m];
                q[k, m] = qs[k * marks + m];
            }
        }

        return new Tracks(times.ToArray(), x, y, q);
    }

    /// <summary>Lost-mark counts in the window, and ends that move (an end is a mark that stays still).</summary>
    private static IEnumerable<string> Diagnose(Tracks t, AnalysisWindow w, bool endsGiven)
    {
        int marks = t.MarkCount;
        var spread = new double[marks];
        for (int m = 0; m < marks; m++)
        {
            int lost = 0;
            double sx = 0, sy = 0, sxx = 0, syy = 0;
            int n = 0;
            for (int k = w.StartFrame; k < w.EndFrame; k++)
            {
                if (t.Quality[k, m] <= 0)
                {
                    lost++;
                    continue;
                }

                sx += t.XPx[k, m];
                sy += t.YPx[k, m];
                sxx += t.XPx[k, m] * t.XPx[k, m];
                syy += t.YPx[k, m] * t.YPx[k, m];
                n++;
            }

            if (lost > 0)
            {
                yield return $"mark {m} was not measured in {lost} of {w.FrameCount} frames of the analysis window";
            }

            spread[m] = n > 1 ? Math.Sqrt(Math.Max(0, sxx / n - sx * sx / n / n + syy / n - sy * sy / n / n)) : 0;
        }

        if (!endsGiven && marks > 2)
        {
            double inner = spread.Skip(1).Take(marks - 2).Max();
            foreach (int m in new[] { 0, marks - 1 })
            {
                if (spread[m] > 0.5 && spread[m] > 0.2 * inner)
                {
                    yield return $"end mark {m} moves ({spread[m]:0.##} px RMS); if it is not a string end, give the end positions";
                }
            }
        }
    }
}
