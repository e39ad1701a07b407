namespace StringModes.Analysis.Geometry;

/// <summary>
/// Turns pixel tracks into string coordinates. The string axis runs from end 0 to end 1 (their median positions);
/// the pixel scale is the axis length over the stated vibrating length; a mark's position along the string is its
/// median projection on the axis; its transverse displacement is its signed distance from the axis, positive to
/// the axis turned 90° counter-clockwise on screen. With a rolling shutter, a mark seen on row y of frame k was
/// sampled at t_k + (y/H)·t_readout; every mark is then resampled onto the common grid t_k by 4-point Lagrange
/// (cubic) interpolation, so all marks share one time base before modal projection.
/// </summary>
public static class StringFrame
{
    /// <summary>Builds string coordinates for frames <paramref name="firstFrame"/>..<paramref name="lastFrame"/> (inclusive).</summary>
    /// <param name="tracks">Pixel tracks, ends first and last.</param>
    /// <param name="lengthM">Vibrating length between the ends in metres, &gt; 0.</param>
    /// <param name="readoutS">Rolling-shutter readout time in seconds, ≥ 0 (0 = global shutter).</param>
    /// <param name="imageHeightPx">Frame height in rows (for row times).</param>
    /// <param name="firstFrame">First frame of the analysis window.</param>
    /// <param name="lastFrame">Last frame of the analysis window.</param>
    /// <param name="plane">Optional image → rig-plane homography (camera not square to the rig); default none.</param>
    public static StringCoordinates Build(Tracks tracks, double lengthM, double readoutS, int imageHeightPx, int firstFrame, int lastFrame, Homography? plane = null)
    {
        if (!(lengthM > 0) || !double.IsFinite(lengthM)) throw new ArgumentOutOfRangeException(nameof(lengthM), "the vibrating length must be a positive number of metres");
        if (tracks.MarkCount < 3) throw new ArgumentException("tracks need two ends and at least one moving mark", nameof(tracks));
        var last = tracks.MarkCount - 1;
        // Geometry is taken on the rig plane when a homography is given (rows, for the rolling shutter, stay in pixels).
        var (gx, gy) = plane is null ? (tracks.XPx, tracks.YPx) : MapToPlane(tracks, plane);
        var e0x = Median(gx, 0, firstFrame, lastFrame);
        var e0y = Median(gy, 0, firstFrame, lastFrame);
        var e1x = Median(gx, last, firstFrame, lastFrame);
        var e1y = Median(gy, last, firstFrame, lastFrame);
        var span = Math.Sqrt((e1x - e0x) * (e1x - e0x) + (e1y - e0y) * (e1y - e0y));
        var ax = (e1x - e0x) / span;
        var ay = (e1y - e0y) / span;
        var nx = ay;
        var ny = -ax;
        var pixelsPerMetre = span / lengthM;

        var frames = lastFrame - firstFrame + 1;
        var moving = tracks.MarkCount - 2;
        var positions = new double[moving];
        var displacement = new double[frames, moving];
        var weight = new double[frames, moving];
        var times = new double[frames];
        for (var k = 0; k < frames; k++) times[k] = tracks.TimesS[firstFrame + k];

        var sampleTimes = new double[frames];
        var values = new double[frames];
        var valid = new bool[frames];
        var quality = new double[frames];
        for (var i = 0; i < moving; i++)
        {
            var mark = i + 1;
            var along = new List<double>();
            for (var k = 0; k < frames; k++)
            {
                var x = gx[firstFrame + k, mark];
                var y = gy[firstFrame + k, mark];
                var row = tracks.YPx[firstFrame + k, mark];
                var q = tracks.Quality[firstFrame + k, mark];
                valid[k] = q > 0 && double.IsFinite(x) && double.IsFinite(y);
                quality[k] = valid[k] ? q : 0;
                values[k] = valid[k] ? ((x - e0x) * nx + (y - e0y) * ny) / pixelsPerMetre : double.NaN;
                sampleTimes[k] = times[k] + (valid[k] && readoutS > 0 ? row / imageHeightPx * readoutS : 0);
                if (valid[k]) along.Add(((x - e0x) * ax + (y - e0y) * ay) / pixelsPerMetre);
            }
            positions[i] = along.Count > 0 ? Math.Clamp(MedianOf(along), 1e-6 * lengthM, lengthM * (1 - 1e-6)) : lengthM * mark / (moving + 1.0);
            for (var k = 0; k < frames; k++)
            {
                if (readoutS > 0)
                {
                    var u = Resample(sampleTimes, values, valid, times[k], k);
                    displacement[k, i] = u;
                    weight[k, i] = double.IsNaN(u) ? 0 : quality[k];
                }
                else
                {
                    displacement[k, i] = values[k];
                    weight[k, i] = quality[k];
                }
            }
        }
        return new StringCoordinates(lengthM, positions, times, displacement, weight);
    }

    private static (double[,] X, double[,] Y) MapToPlane(Tracks tracks, Homography plane)
    {
        var x = new double[tracks.FrameCount, tracks.MarkCount];
        var y = new double[tracks.FrameCount, tracks.MarkCount];
        for (var k = 0; k < tracks.FrameCount; k++)
            for (var i = 0; i < tracks.MarkCount; i++)
            {
                var px = tracks.XPx[k, i];
                var py = tracks.YPx[k, i];
                (x[k, i], y[k, i]) = double.IsFinite(px) && double.IsFinite(py) ? plane.Map(px, py) : (double.NaN, double.NaN);
            }
        return (x, y);
    }

    // Cubic Lagrange interpolation at t from the four valid samples around index k (sample times are the row
    // times, each within one frame period of the frame time, so the neighbourhood k−2..k+2 brackets t).
    private static double Resample(double[] t, double[] v, bool[] valid, double at, int k)
    {
        var n = t.Length;
        var lo = k;
        while (lo > 0 && t[lo] > at) lo--;
        var start = Math.Clamp(lo - 1, 0, Math.Max(0, n - 4));
        if (n < 4) return valid[k] ? v[k] : double.NaN;
        for (var j = start; j < start + 4; j++) if (!valid[j]) return double.NaN;
        double sum = 0;
        for (var j = start; j < start + 4; j++)
        {
            var basis = 1.0;
            for (var m = start; m < start + 4; m++)
                if (m != j) basis *= (at - t[m]) / (t[j] - t[m]);
            sum += basis * v[j];
        }
        return sum;
    }

    private static double Median(double[,] values, int mark, int first, int last)
    {
        var list = new List<double>();
        for (var k = first; k <= last; k++) if (double.IsFinite(values[k, mark])) list.Add(values[k, mark]);
        if (list.Count == 0) throw new ArgumentException($"end mark {mark} was never seen in the analysis window");
        return MedianOf(list);
    }

    private static double MedianOf(List<double> list)
    {
        list.Sort();
        var n = list.Count;
        return n % 2 == 1 ? list[n / 2] : 0.5 * (list[n / 2 - 1] + list[n / 2]);
    }
}
