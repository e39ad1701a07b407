namespace StringModes.Video.Frames;

/// <summary>What the frame timestamps say about the clip's rate.</summary>
/// <param name="MedianFps">Rate from the median timestamp step, frames per second.</param>
/// <param name="MinFps">Slowest local rate (largest step), frames per second.</param>
/// <param name="MaxFps">Fastest local rate (smallest step), frames per second.</param>
/// <param name="IsVariableRate">True when steps differ from the median by more than the tolerance.</param>
/// <param name="DroppedFrames">Steps of about two or more median steps (frames the camera or encoder skipped).</param>
/// <param name="Warnings">Findings worth telling the user.</param>
public sealed record FrameTimingReport(
    double MedianFps, double MinFps, double MaxFps, bool IsVariableRate, int DroppedFrames, IReadOnlyList<string> Warnings);

/// <summary>Checks per-frame timestamps against the declared rate: variable frame rate, dropped frames, slow motion.</summary>
public static class FrameTiming
{
    /// <summary>Relative step deviation above which a clip counts as variable-rate (timestamps are quantised to ~1 ms).</summary>
    public const double VariableRateTolerance = 0.05;

    /// <param name="timesS">Frame times in seconds, strictly increasing.</param>
    /// <param name="declaredFps">Container rate; 0 if unknown.</param>
    /// <param name="captureFps">Capture rate the user stated, or null.</param>
    public static FrameTimingReport Analyse(IReadOnlyList<double> timesS, double declaredFps, double? captureFps)
    {
        var warnings = new List<string>();
        if (timesS.Count < 3)
        {
            double fps = captureFps ?? declaredFps;
            return new FrameTimingReport(fps, fps, fps, false, 0, warnings);
        }

        var steps = new double[timesS.Count - 1];
        for (int i = 0; i < steps.Length; i++)
        {
            steps[i] = timesS[i + 1] - timesS[i];
        }

        var sorted = (double[])steps.Clone();
        Array.Sort(sorted);
        double median = sorted[sorted.Length / 2];
        double lo = sorted[0], hi = sorted[^1];
        // 1 ms timestamp rounding alone moves a step by up to 1 ms: do not call that variable.
        double tol = Math.Max(VariableRateTolerance * median, 1.5e-3 * (captureFps is > 0 && declaredFps > 0 ? declaredFps / captureFps.Value : 1));
        int dropped = steps.Count(s => s > 1.8 * median);
        bool variable = steps.Any(s => Math.Abs(s - median) > tol && s <= 1.8 * median);
        if (dropped > steps.Length / 10)
        {
            // Long steps that are common are a change of rate, not the odd dropped frame.
            variable = true;
            dropped = 0;
        }

        // Rate from the mean of the ordinary steps: the median alone is quantised by millisecond timestamps.
        double sum = 0;
        int count = 0;
        foreach (double s in steps)
        {
            if (Math.Abs(s - median) <= tol)
            {
                sum += s;
                count++;
            }
        }

        double medianFps = count > 0 ? count / sum : 1 / median;
        if (variable)
        {
            warnings.Add($"variable frame rate: local rate {1 / hi:0.###} to {1 / lo:0.###} fps (median {medianFps:0.###}); per-frame timestamps are used");
        }

        if (dropped > 0)
        {
            warnings.Add($"{dropped} gap(s) of two or more frame steps in the timestamps (dropped frames); times are kept as stamped");
        }

        // A slow-motion container declares the playback rate; when its timestamps disagree with that rate the
        // clip was most likely re-timed, which is what a slow-motion export looks like from the outside.
        if (declaredFps > 0 && captureFps is null && Math.Abs(medianFps - declaredFps) > 0.01 * declaredFps)
        {
            warnings.Add($"timestamps give {medianFps:0.###} fps but the file declares {declaredFps:0.###} fps; if this is a slow-motion clip, state the capture rate (--capture-fps)");
        }

        return new FrameTimingReport(medianFps, 1 / hi, 1 / lo, variable, dropped, warnings);
    }
}
