using StringModes.Video.Frames;
using StringModes.Video.Marks;
using StringModes.Video.Synthesis;

namespace StringModes.Video.Tracking;

/// <summary>
/// Follows one mark from frame to frame to sub-pixel precision with an iterated, thresholded, background-subtracted
/// intensity centroid in a small window (the centroid of a blur streak is the exposure-averaged position, which is
/// why a centroid beats template matching on blurred marks; REFERENCES.md §6). Pixels are projected on the mark's
/// own colour contrast, so a coloured mark on a background of equal brightness is still seen. The local background
/// is the median of the window's border, which also absorbs light flicker. The search is confined to the mark's own
/// stretch of the string, so neighbouring marks can never swap identities; a lost mark is searched for again over
/// that whole stretch.
/// </summary>
internal sealed class MarkTracker
{
    private readonly double _wb, _wg, _wr;
    private readonly double _contrast;
    private readonly int _half;
    private readonly double[] _window;
    private readonly double[] _border;
    private readonly PixelPoint _rest;
    private readonly double _axisX, _axisY;
    private readonly double _alongHalfPx;
    private readonly double _transverseHalfPx;
    private double _referenceMass = double.NaN;
    private PixelPoint _last;
    private PixelPoint _velocity;
    private bool _tracking;

    public MarkTracker(FoundMark mark, double axisX, double axisY, double alongHalfPx, double transverseHalfPx)
    {
        var c = mark.ContrastBgr;
        var norm = mark.Contrast;
        _wb = c.B / norm;
        _wg = c.G / norm;
        _wr = c.R / norm;
        _contrast = norm;
        _half = (int)Math.Ceiling(1.6 * mark.RadiusPx + 3);
        var side = 2 * _half + 1;
        _window = new double[side * side];
        _border = new double[4 * side];
        _rest = mark.Position;
        _axisX = axisX;
        _axisY = axisY;
        _alongHalfPx = alongHalfPx;
        _transverseHalfPx = transverseHalfPx;
        _last = mark.Position;
    }

    /// <summary>Measures the mark in one frame; NaN position and quality 0 when it is not seen.</summary>
    public (double X, double Y, double Quality) Measure(PixelAccess frame)
    {
        if (_tracking)
        {
            var predicted = new PixelPoint(_last.X + _velocity.X, _last.Y + _velocity.Y);
            var r = Refine(frame, predicted);
            if (r.Quality > 0 && WithinStretch(r.X, r.Y)) return Accept(r);
        }
        var seed = Search(frame);
        if (seed is { } s)
        {
            var r = Refine(frame, s);
            if (r.Quality > 0 && WithinStretch(r.X, r.Y))
            {
                _velocity = default;
                return Accept(r);
            }
        }
        _tracking = false;
        return (double.NaN, double.NaN, 0);
    }

    private (double X, double Y, double Quality) Accept((double X, double Y, double Quality) r)
    {
        if (_tracking) _velocity = new PixelPoint(r.X - _last.X, r.Y - _last.Y);
        _last = new PixelPoint(r.X, r.Y);
        _tracking = true;
        return r;
    }

    private bool WithinStretch(double x, double y)
    {
        var dx = x - _rest.X;
        var dy = y - _rest.Y;
        var along = dx * _axisX + dy * _axisY;
        var across = -dx * _axisY + dy * _axisX;
        // Marks on a string move across it; along it they move only to second order (a few tenths of a pixel).
        return Math.Abs(along) <= Math.Min(_alongHalfPx, Math.Max(2.5, 0.6 * _half)) && Math.Abs(across) <= _transverseHalfPx;
    }

    private (double X, double Y, double Quality) Refine(PixelAccess frame, PixelPoint start)
    {
        var centre = start;
        (double X, double Y, double Quality) result = (double.NaN, double.NaN, 0);
        for (var iteration = 0; iteration < 4; iteration++)
        {
            var m = Centroid(frame, centre);
            if (m.Quality <= 0) return (double.NaN, double.NaN, 0);
            var shift = Math.Abs(m.X - centre.X) + Math.Abs(m.Y - centre.Y);
            result = m;
            centre = new PixelPoint(m.X, m.Y);
            if (shift < 0.002) break;
        }
        return result;
    }

    private (double X, double Y, double Quality) Centroid(PixelAccess frame, PixelPoint centre)
    {
        var cx = (int)Math.Round(centre.X);
        var cy = (int)Math.Round(centre.Y);
        var h = _half;
        if (cx - h < 0 || cy - h < 0 || cx + h >= frame.Width || cy + h >= frame.Height) return (double.NaN, double.NaN, 0);
        var side = 2 * h + 1;
        var nb = 0;
        for (var j = 0; j < side; j++)
            for (var i = 0; i < side; i++)
            {
                var v = frame.Project(cx - h + i, cy - h + j, _wb, _wg, _wr);
                _window[j * side + i] = v;
                if (i == 0 || j == 0 || i == side - 1 || j == side - 1) _border[nb++] = v;
            }
        var background = Median(_border.AsSpan(0, nb));
        var threshold = 0.3 * _contrast;
        double sx = 0, sy = 0, sm = 0, peak = 0, sxx = 0, syy = 0, sxy = 0;
        for (var j = 0; j < side; j++)
            for (var i = 0; i < side; i++)
            {
                var s = _window[j * side + i] - background;
                if (s > peak) peak = s;
                var w = s - threshold;
                if (w <= 0) continue;
                sx += w * i;
                sy += w * j;
                sm += w;
            }
        // Second moments for the sharpness, from the faint streak as well as the core (a lower threshold: blur
        // spreads a mark's contrast thinly along its path, below the centroid's threshold).
        double mx0 = 0, my0 = 0, m0 = 0;
        for (var j = 0; j < side; j++)
            for (var i = 0; i < side; i++)
            {
                var w = _window[j * side + i] - background - 0.1 * _contrast;
                if (w <= 0) continue;
                mx0 += w * i;
                my0 += w * j;
                m0 += w;
                sxx += w * i * i;
                syy += w * j * j;
                sxy += w * i * j;
            }
        if (peak < 0.5 * _contrast || sm <= 0) return (double.NaN, double.NaN, 0);
        if (double.IsNaN(_referenceMass)) _referenceMass = sm;
        var massRatio = sm / _referenceMass;
        var quality = Math.Clamp(peak / _contrast, 0, 1) * Math.Clamp(Math.Min(massRatio, 1 / massRatio), 0, 1) * (m0 > 0 ? Sharpness(mx0, my0, m0, sxx, syy, sxy) : 1);
        if (massRatio < 0.2) return (double.NaN, double.NaN, 0);
        return (cx - h + sx / sm, cy - h + sy / sm, quality);
    }

    /// <summary>
    /// Motion blur stretches a mark across the string (the direction it moves in) and not along it: a streak of
    /// length ℓ adds ℓ²/12 to the blob's variance across. The factor √(var along / var across), at most 1, is 1 for
    /// a sharp round mark and falls as blur lengthens the blob, so blurred frames (a blurred release) carry a lower quality.
    /// </summary>
    private double Sharpness(double sx, double sy, double sm, double sxx, double syy, double sxy)
    {
        var mx = sx / sm;
        var my = sy / sm;
        var vxx = sxx / sm - mx * mx;
        var vyy = syy / sm - my * my;
        var vxy = sxy / sm - mx * my;
        var nx = -_axisY;
        var ny = _axisX;
        var along = _axisX * _axisX * vxx + 2 * _axisX * _axisY * vxy + _axisY * _axisY * vyy;
        var across = nx * nx * vxx + 2 * nx * ny * vxy + ny * ny * vyy;
        if (!(along > 0) || !(across > 0)) return 1;
        return Math.Min(1, Math.Sqrt(along / across));
    }

    // Brightest pixel of the mark's colour over its whole stretch of string; seeds the centroid after a loss.
    private PixelPoint? Search(PixelAccess frame)
    {
        var nx = -_axisY;
        var ny = _axisX;
        var reachX = Math.Abs(_alongHalfPx * _axisX) + Math.Abs(_transverseHalfPx * nx);
        var reachY = Math.Abs(_alongHalfPx * _axisY) + Math.Abs(_transverseHalfPx * ny);
        var x0 = Math.Max(_half, (int)Math.Floor(_rest.X - reachX));
        var x1 = Math.Min(frame.Width - 1 - _half, (int)Math.Ceiling(_rest.X + reachX));
        var y0 = Math.Max(_half, (int)Math.Floor(_rest.Y - reachY));
        var y1 = Math.Min(frame.Height - 1 - _half, (int)Math.Ceiling(_rest.Y + reachY));
        if (x1 < x0 || y1 < y0) return null;
        // The background level: median of a sparse sample of the region.
        var count = 0;
        var step = Math.Max(1, (int)Math.Sqrt((x1 - x0 + 1) * (y1 - y0 + 1) / (double)_border.Length));
        for (var y = y0; y <= y1 && count < _border.Length; y += step)
            for (var x = x0; x <= x1 && count < _border.Length; x += step)
                _border[count++] = frame.Project(x, y, _wb, _wg, _wr);
        var background = Median(_border.AsSpan(0, count));
        double best = 0.6 * _contrast;
        PixelPoint? found = null;
        for (var y = y0; y <= y1; y++)
            for (var x = x0; x <= x1; x++)
            {
                var dx = x - _rest.X;
                var dy = y - _rest.Y;
                if (Math.Abs(dx * _axisX + dy * _axisY) > _alongHalfPx || Math.Abs(dx * nx + dy * ny) > _transverseHalfPx) continue;
                var s = frame.Project(x, y, _wb, _wg, _wr) - background;
                if (s > best)
                {
                    best = s;
                    found = new PixelPoint(x, y);
                }
            }
        return found;
    }

    private static double Median(Span<double> values)
    {
        values.Sort();
        var n = values.Length;
        return n == 0 ? 0 : n % 2 == 1 ? values[n / 2] : 0.5 * (values[n / 2 - 1] + values[n / 2]);
    }
}
