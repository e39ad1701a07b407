using System.Diagnostics;
using System.Globalization;
using OpenCvSharp;
using StringModes.Analysis.Geometry;
using StringModes.Video.Files;
using StringModes.Video.Frames;
using StringModes.Video.Marks;
using StringModes.Video.Synthesis;

namespace StringModes.Video.Tracking;

/// <summary>Options of <see cref="ClipTracker.Track"/>.</summary>
public sealed record TrackingOptions
{
    /// <summary>True capture rate in frames/s (slow-motion files declare the playback rate); required for image sequences; default: from the file.</summary>
    public double? CaptureFps { get; init; }

    /// <summary>Pixel positions of the marks, ends first and last, ordered along the string; default: found automatically.</summary>
    public IReadOnlyList<PixelPoint>? MarkPositions { get; init; }

    /// <summary>Time into the clip of the frame the marks are found on, s; default 0.5 (past a blurred release, before the motion dies).</summary>
    public double ReferenceTimeS { get; init; } = 0.5;

    /// <summary>Follow the marks on the decoded luma plane alone where the clip and the marks allow it (faster; see <see cref="LumaTracking"/>); false always decodes colour.</summary>
    public bool LumaWhenPossible { get; init; } = true;

    /// <summary>Automatic mark-finding options.</summary>
    public MarkFinderOptions Finder { get; init; } = new();
}

/// <summary>What tracking produced.</summary>
/// <param name="Tracks">Per-frame mark positions and quality (ends are marks 0 and last).</param>
/// <param name="Marks">The marks as found on the reference frame.</param>
/// <param name="ReferenceFramePng">The reference frame as PNG (for overlays).</param>
/// <param name="CaptureFps">Capture rate used for the time base.</param>
/// <param name="DeclaredFps">Rate declared by the file (NaN when none).</param>
/// <param name="WidthPx">Frame width.</param>
/// <param name="HeightPx">Frame height.</param>
/// <param name="Warnings">Plain-language warnings.</param>
/// <param name="LumaOnly">True when the marks were followed on the luma plane alone.</param>
public sealed record TrackingResult(Tracks Tracks, FoundMarks Marks, byte[] ReferenceFramePng, double CaptureFps, double DeclaredFps,
    int WidthPx, int HeightPx, IReadOnlyList<string> Warnings, bool LumaOnly = false);

/// <summary>
/// Tracking of a whole clip: opens the frames, finds the marks on a reference frame (or takes them from the rig),
/// then follows every mark through every frame in one streaming pass (memory holds the tracks, not the frames).
/// </summary>
public static class ClipTracker
{
    /// <summary>Tracks the marks of the clip at <paramref name="path"/>. Throws <see cref="InputFileException"/> for unusable input and <see cref="MarksNotFoundException"/> when fewer than 3 moving marks are found.</summary>
    public static TrackingResult Track(string path, TrackingOptions options, IProgress<double>? progress = null, CancellationToken cancel = default)
    {
        var warnings = new List<string>();
        FoundMarks marks;
        LumaTracking? luma = null;
        byte[] referencePng;
        double declaredFps;
        int width, height, declaredCount;
        using (var source = FrameSources.Open(path, options.CaptureFps))
        {
            declaredFps = source.DeclaredFps;
            width = source.WidthPx;
            height = source.HeightPx;
            declaredCount = source.DeclaredFrameCount;
            var rate = options.CaptureFps ?? (double.IsNaN(declaredFps) ? 30 : declaredFps);
            var referenceIndex = (int)Math.Round(options.ReferenceTimeS * rate);
            if (declaredCount > 0) referenceIndex = Math.Min(referenceIndex, declaredCount / 4);
            Mat? reference = null;
            var index = 0;
            // Skipping straight to the reference frame avoids decoding the start of the clip twice; where the
            // format cannot skip, or the frame is not there after all, the frames are read in order up to it.
            if (referenceIndex > 0 && source.TrySkipTo(referenceIndex) && source.Read(out var skipped, out _))
            {
                reference = skipped.Clone();
                index = referenceIndex + 1;
            }
            if (reference is null)
            {
                using var ordered = referenceIndex > 0 ? FrameSources.Open(path, options.CaptureFps) : null;
                var inOrder = ordered ?? source;
                while (inOrder.Read(out var frame, out _))
                {
                    cancel.ThrowIfCancellationRequested();
                    reference?.Dispose();
                    reference = frame.Clone();
                    if (index++ >= referenceIndex) break;
                }
            }
            if (reference is null)
                throw new InputFileException($"{path}: holds no decodable frames; check that the recording finished and the file was copied completely");
            referenceIndex = index - 1;
            using (reference)
            {
                marks = options.MarkPositions is { } given ? MarksAt(reference, given, referenceIndex) : MarkFinder.Find(reference, referenceIndex, options.Finder);
                if (marks.Marks.Count < 5)
                {
                    var png = MarkFinder.DiagnosticPng(reference, marks.Marks.Select(m => m.Position).ToArray(), marks.Rejected);
                    throw new MarksNotFoundException(
                        $"{path}: found {Math.Max(0, marks.Marks.Count - 2)} moving marks on the string (at least 3 are needed, plus the two ends) on frame {referenceIndex}; " +
                        "use small marks that contrast with string and background, or list their pixel positions in the rig file", png);
                }
                referencePng = MarkFinder.To8BitBgr(reference).ImEncode(".png");
                if (options.LumaWhenPossible && source is VideoFileSource) luma = LumaTracking.TryPlan(path, reference, referenceIndex, marks);
            }
        }

        var ends = (marks.Marks[0].Position, marks.Marks[^1].Position);
        var span = Math.Sqrt(Math.Pow(ends.Item2.X - ends.Item1.X, 2) + Math.Pow(ends.Item2.Y - ends.Item1.Y, 2));
        var axisX = (ends.Item2.X - ends.Item1.X) / span;
        var axisY = (ends.Item2.Y - ends.Item1.Y) / span;
        var trackers = new MarkTracker[marks.Marks.Count];
        for (var i = 0; i < trackers.Length; i++)
        {
            var previous = i > 0 ? Distance(marks.Marks[i - 1].Position, marks.Marks[i].Position) : double.PositiveInfinity;
            var next = i + 1 < trackers.Length ? Distance(marks.Marks[i + 1].Position, marks.Marks[i].Position) : double.PositiveInfinity;
            var alongHalf = 0.45 * Math.Min(previous, next);
            // A string's swing rarely exceeds a tenth of its span; marks beyond that are not followed.
            var transverseHalf = Math.Max(8 * marks.Marks[i].RadiusPx, 0.12 * span);
            trackers[i] = new MarkTracker(luma is null ? marks.Marks[i] : luma.OnLuma(marks.Marks[i]), axisX, axisY, alongHalf, transverseHalf);
        }

        var times = new List<double>();
        var xs = new List<double[]>();
        var ys = new List<double[]>();
        var qs = new List<double[]>();
        using (var source = luma is null
                   ? FrameSources.Open(path, options.CaptureFps)
                   : VideoFileSource.TryOpenLuma(path) ?? throw new InvalidOperationException("the clip's luma plane could be opened for the reference frame but not for tracking"))
        {
            var scale = options.CaptureFps is { } capture && !double.IsNaN(source.DeclaredFps) ? source.DeclaredFps / capture : 1.0;
            var total = source.DeclaredFrameCount > 0 ? source.DeclaredFrameCount : 0;
            using var pipeline = new FramePipeline(source, cancel: cancel);
            foreach (var (frame, timestamp) in pipeline.Frames())
            {
                cancel.ThrowIfCancellationRequested();
                var access = new PixelAccess(frame);
                var x = new double[trackers.Length];
                var y = new double[trackers.Length];
                var q = new double[trackers.Length];
                for (var i = 0; i < trackers.Length; i++) (x[i], y[i], q[i]) = trackers[i].Measure(access);
                times.Add(timestamp * scale);
                xs.Add(x);
                ys.Add(y);
                qs.Add(q);
                if (total > 0 && times.Count % 64 == 0) progress?.Report(Math.Min(1, times.Count / (double)total));
            }
            warnings.AddRange(source.Warnings);
        }
        progress?.Report(1);
        if (times.Count < 2)
            throw new InputFileException($"{path}: only {times.Count} frame could be decoded; a clip needs many frames (at least several periods of the fundamental)");

        var frameCount = times.Count;
        var tracks = new Tracks(times.ToArray(), To2D(xs), To2D(ys), To2D(qs));
        var captureFps = options.CaptureFps ?? (double.IsNaN(declaredFps) ? double.NaN : declaredFps);
        warnings.AddRange(TimeBaseWarnings(path, tracks.TimesS, declaredFps, options.CaptureFps));
        for (var i = 0; i < trackers.Length; i++)
        {
            var lost = 0;
            for (var k = 0; k < frameCount; k++) if (tracks.Quality[k, i] <= 0) lost++;
            if (lost > 0.2 * frameCount)
                warnings.Add(string.Create(CultureInfo.InvariantCulture, $"mark {i} was not seen in {lost} of {frameCount} frames (hidden, blurred or out of frame); its gaps are left out of the fit"));
        }
        return new TrackingResult(tracks, marks, referencePng, captureFps, declaredFps, width, height, warnings, luma is not null);
    }

    private static IEnumerable<string> TimeBaseWarnings(string path, double[] times, double declaredFps, double? captureFps)
    {
        if (times.Length < 3) yield break;
        var steps = new double[times.Length - 1];
        for (var i = 0; i < steps.Length; i++) steps[i] = times[i + 1] - times[i];
        var sorted = steps.Order().ToArray();
        var median = sorted[sorted.Length / 2];
        var spread = (sorted[(int)(0.99 * (sorted.Length - 1))] - sorted[(int)(0.01 * (sorted.Length - 1))]) / median;
        if (spread > 0.05)
            yield return string.Create(CultureInfo.InvariantCulture,
                $"{path}: variable frame rate (frame intervals vary by {spread * 100:F0}% around {1 / median:F2} frames/s); each frame's own timestamp is used");
        if (captureFps is null && declaredFps <= 60)
            yield return string.Create(CultureInfo.InvariantCulture,
                $"{path}: the file declares {declaredFps:G4} frames/s; phone slow-motion files declare the playback rate, not the capture rate — if this was filmed in slow motion, give the true rate with --capture-fps (e.g. 240), or every frequency will be too low by that factor");
        if (captureFps is { } c && !double.IsNaN(declaredFps) && Math.Abs(c - declaredFps) / declaredFps > 0.01)
            yield return string.Create(CultureInfo.InvariantCulture,
                $"{path}: treated as slow motion: declared {declaredFps:G4} frames/s, captured at {c:G4} frames/s as stated");
    }

    private static FoundMarks MarksAt(Mat frame, IReadOnlyList<PixelPoint> positions, int referenceIndex)
    {
        var access = new PixelAccess(frame);
        var list = new List<FoundMark>();
        foreach (var p in positions)
        {
            int cx = (int)Math.Round(p.X), cy = (int)Math.Round(p.Y);
            if (cx < 12 || cy < 12 || cx >= access.Width - 12 || cy >= access.Height - 12)
                throw new InputFileException(FormattableString.Invariant($"mark at ({p.X:F1}, {p.Y:F1}) px is outside the {access.Width}×{access.Height} frame (or within 12 px of its edge); correct marks_px in the rig file"));
            double b = 0, g = 0, r = 0;
            var n = 0;
            var ring = new List<(double B, double G, double R)>();
            for (var dy = -10; dy <= 10; dy++)
                for (var dx = -10; dx <= 10; dx++)
                {
                    var d2 = dx * dx + dy * dy;
                    var c = access.Colour(cx + dx, cy + dy);
                    if (d2 <= 2) { b += c.B; g += c.G; r += c.R; n++; }
                    else if (d2 >= 64 && d2 <= 100) ring.Add(c);
                }
            double Med(Func<(double B, double G, double R), double> f) => ring.Select(f).Order().ElementAt(ring.Count / 2);
            list.Add(new FoundMark(p, (b / n - Med(c => c.B), g / n - Med(c => c.G), r / n - Med(c => c.R)), 4));
        }
        return new FoundMarks(list, [], referenceIndex);
    }

    private static double Distance(PixelPoint a, PixelPoint b) => Math.Sqrt((a.X - b.X) * (a.X - b.X) + (a.Y - b.Y) * (a.Y - b.Y));

    private static double[,] To2D(List<double[]> rows)
    {
        var result = new double[rows.Count, rows[0].Length];
        for (var k = 0; k < rows.Count; k++)
            for (var i = 0; i < rows[k].Length; i++) result[k, i] = rows[k][i];
        return result;
    }
}
