using StringModes.Video.Frames;
using StringModes.Video.Marks;
using StringModes.Video.Synthesis;

namespace StringModes.Video.Tracking;

/// <summary>
/// Follows one mark from frame to frame to sub-pixel precision. An iterated, thresholded, background-subtracted
/// intensity centroid in a small window finds the mark and gives its quality (the centroid of a blur streak is the
/// exposure-averaged position, which is why a centroid beats template matching on blurred marks; REFERENCES.md §6); a
/// threshold-free, tapered centroid of the pixels' mark coverage then refines the position (see TaperedCentroid).
/// Pixels are projected on the mark's own colour contrast, so a coloured mark on a background of equal brightness is
/// still seen. The local background is the median of the window's border, which also absorbs light flicker. The search
/// is confined to the mark's own stretch of the string, so neighbouring marks can never swap identities; a lost mark is
/// searched for again over that whole stretch.
/// </summary>
internal sealed class MarkTracker
{
    private readonly double _wb, _wg, _wr;
    private readonly double _contrast;
    private readonly int _half;
    private readonly double _radius, _taperInner, _taperOuter;
    private readonly double[] _window;
    private readonly double[] _coverage;
    private readonly double[] _core, _ring, _ringSorted, _ringDx, _ringDy;
    private readonly double[] _border;
    private readonly PixelPoint _rest;
    private readonly double _axisX, _axisY;
    private readonly double _alongHalfPx;
    private readonly double _transverseHalfPx;
    private double _referenceMass = double.NaN;
    private int _windowX, _windowY;   // centre pixel of the window last read into _window
    private double _background;       // its background level
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
        _radius = mark.RadiusPx;
        _taperInner = mark.RadiusPx - TaperHalfWidthPx;
        _taperOuter = mark.RadiusPx + TaperHalfWidthPx;
        var side = 2 * _half + 1;
        _window = new double[side * side];
        _coverage = new double[side * side];
        _core = new double[side * side];
        _ring = new double[side * side];
        _ringSorted = new double[side * side];
        _ringDx = new double[side * side];
        _ringDy = new double[side * side];
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
        // The window last read is the one the thresholded centroid was taken in; the tapered centroid reuses it.
        var tapered = TaperedCentroid(result.X, result.Y);
        return tapered is { } t ? (t.X, t.Y, result.Quality) : result;
    }

    // The refinement's constants, chosen by measurement (tracking bench, and sharp discs of radius 3–7 px from the
    // synthesiser; docs/architecture.md): the narrower the taper, the larger the pixel-locking left, which depends on
    // the mark's radius (RMS 0.007 px at r = 4.3 px with ±2.25 px, 0.009 px with ±2 px, 0.002–0.003 px at most
    // other radii); the wider, the more background noise and texture it takes in.
    private const double TaperHalfWidthPx = 2.25;
    private const double AnnulusInnerPx = 1.5, AnnulusOuterPx = 3;

    /// <summary>
    /// Sub-pixel refinement of the thresholded centroid (<paramref name="startX"/>, <paramref name="startY"/>) in the
    /// window last read, removing the two systematic errors measured on it:
    /// <list type="bullet">
    /// <item>Pixel-locking: the threshold clips a sharp edge nonlinearly within its one-pixel ramp, and the clipped
    /// profile, sampled on the pixel grid, pulls the centroid by up to ±0.02–0.03 px with the sub-pixel phase (and,
    /// where a string crosses the edge, by a constant 0.01–0.05 px along it). The refinement is linear in the pixel
    /// values, with no threshold: an iteratively weighted centroid (Baker &amp; Moallem 2007, Opt. Express 15:5147
    /// [memory]; weighted and thresholded centres of gravity compared by Thomas et al. 2006, MNRAS 371:323 [memory])
    /// whose weight W(|p − c|) is a smooth taper (the cubic step 1 − 3t² + 2t³, t = (ρ − r + 2.25 px)/4.5 px) from 1
    /// inside r − 2.25 px to 0 at r + 2.25 px, centred on the current estimate c and iterated to the fixed point
    /// Σ W·α·(p − c) = 0. The geometric taper, not a threshold on the values, keeps the background further out of the
    /// estimate. A point-symmetric image (a mark with the string through it, a blur streak) is a fixed point at its
    /// centre, so the exposure-averaged position is kept.</item>
    /// <item>Background gradient: an edge pixel mixes mark and background, P = α·M + (1 − α)·b (the compositing
    /// equation, Porter &amp; Duff 1984, Computer Graphics 18(3):253 [memory]), so a background that slopes across the
    /// mark weighs one side's edge more than the other's (about 0.01 px per DN/px for a 5 px mark). The coverage
    /// α = (P − b)/(M − b) is used instead of P − b, with b a plane (the window's border median plus the slope fitted
    /// to the ring r + 1.5 … r + 3 px, values more than 3 robust standard deviations (1.4826·MAD) + 1 DN from its
    /// median, such as the string, left out) and M the median of the mark's core. A plane subtracted from P itself,
    /// without the mixing, would tilt the uniform core and bias the centroid far more.</item>
    /// </list>
    /// Each step is a Newton step on the fixed-point condition (the taper moves with c, so its Jacobian is
    /// Σ W·α − Σ α·|W′|/ρ·(p − c)(p − c)ᵀ), which converges in two or three steps where the plain iteration needs a
    /// dozen. Null (the thresholded centroid is kept) when the rings leave the window, the core does not stand out from
    /// the background by a quarter of the mark's contrast, the Newton matrix is not positive definite, or the estimate
    /// moves more than a pixel.
    /// </summary>
    private (double X, double Y)? TaperedCentroid(double startX, double startY)
    {
        if (double.IsNaN(startX) || double.IsNaN(startY)) return null;
        var h = _half;
        var side = 2 * h + 1;
        var left = _windowX - h;
        var top = _windowY - h;
        var outer = _taperOuter;
        // The taper may move a pixel from the start; one more pixel of margin for rounding.
        var reach = Math.Max(outer + 2, _radius + AnnulusOuterPx + 1);
        if (startX - reach < left || startY - reach < top || startX + reach > left + side - 1 || startY + reach > top + side - 1)
            return null;

        // The mark's core (for its level) and the ring beside it (for the background slope).
        var core = Math.Max(1.5, _taperInner);
        var ringIn = _radius + AnnulusInnerPx;
        var ringOut = _radius + AnnulusOuterPx;
        var i0 = (int)Math.Floor(startX - ringOut) - left;
        var i1 = (int)Math.Ceiling(startX + ringOut) - left;
        var j0 = (int)Math.Floor(startY - ringOut) - top;
        var j1 = (int)Math.Ceiling(startY + ringOut) - top;
        int nc = 0, nr = 0;
        for (var j = j0; j <= j1; j++)
            for (var i = i0; i <= i1; i++)
            {
                var dx = left + i - startX;
                var dy = top + j - startY;
                var rho2 = dx * dx + dy * dy;
                var v = _window[j * side + i];
                if (rho2 <= core * core && nc < _core.Length) _core[nc++] = v;
                else if (rho2 >= ringIn * ringIn && rho2 <= ringOut * ringOut && nr < _ring.Length)
                {
                    _ring[nr] = v;
                    _ringDx[nr] = dx;
                    _ringDy[nr] = dy;
                    nr++;
                }
            }
        if (nc == 0) return null;
        var level = Median(_core.AsSpan(0, nc));
        var background = _background;
        if (!(level - background > 0.25 * _contrast)) return null;

        // Background slope: least squares over the ring without its outliers (the string, a neighbouring object).
        double gx = 0, gy = 0;
        if (nr >= 12)
        {
            _ring.AsSpan(0, nr).CopyTo(_ringSorted);
            var median = Median(_ringSorted.AsSpan(0, nr));
            for (var k = 0; k < nr; k++) _ringSorted[k] = Math.Abs(_ring[k] - median);
            var limit = 3 * 1.4826 * Median(_ringSorted.AsSpan(0, nr)) + 1;
            double n = 0, sx = 0, sy = 0, sv = 0, sxx = 0, sxy = 0, syy = 0, sxv = 0, syv = 0;
            for (var k = 0; k < nr; k++)
            {
                var v = _ring[k];
                if (Math.Abs(v - median) > limit) continue;
                double dx = _ringDx[k], dy = _ringDy[k];
                n++; sx += dx; sy += dy; sv += v;
                sxx += dx * dx; sxy += dx * dy; syy += dy * dy; sxv += dx * v; syv += dy * v;
            }
            if (n >= 12)
            {
                // Centred normal equations of v = b0 + gx·dx + gy·dy.
                var cxx = sxx - sx * sx / n;
                var cxy = sxy - sx * sy / n;
                var cyy = syy - sy * sy / n;
                var cxv = sxv - sx * sv / n;
                var cyv = syv - sy * sv / n;
                var det = cxx * cyy - cxy * cxy;
                if (det > 1e-9 * (cxx + cyy) * (cxx + cyy))
                {
                    gx = (cyy * cxv - cxy * cyv) / det;
                    gy = (cxx * cyv - cxy * cxv) / det;
                }
            }
        }

        // Coverage of every pixel the taper can reach within a pixel of the start (the values do not depend on c).
        var k0 = (int)Math.Floor(startX - outer - 1) - left;
        var k1 = (int)Math.Ceiling(startX + outer + 1) - left;
        var l0 = (int)Math.Floor(startY - outer - 1) - top;
        var l1 = (int)Math.Ceiling(startY + outer + 1) - top;
        for (var j = l0; j <= l1; j++)
            for (var i = k0; i <= k1; i++)
            {
                var b = background + gx * (left + i - startX) + gy * (top + j - startY);
                var denominator = level - b;
                _coverage[j * side + i] = denominator > 0 ? (_window[j * side + i] - b) / denominator : 0;
            }

        var inner = Math.Max(0, _taperInner);
        var width = outer - inner;
        double x = startX, y = startY;
        for (var step = 0; step < 10; step++)
        {
            var a0 = (int)Math.Floor(x - outer) - left;
            var a1 = (int)Math.Ceiling(x + outer) - left;
            var b0 = (int)Math.Floor(y - outer) - top;
            var b1 = (int)Math.Ceiling(y + outer) - top;
            if (a0 < k0 || b0 < l0 || a1 > k1 || b1 > l1) return null;
            double m = 0, sx = 0, sy = 0, qxx = 0, qxy = 0, qyy = 0;
            for (var j = b0; j <= b1; j++)
            {
                var dy = top + j - y;
                for (var i = a0; i <= a1; i++)
                {
                    var v = _coverage[j * side + i];
                    var dx = left + i - x;
                    var rho2 = dx * dx + dy * dy;
                    if (rho2 >= outer * outer) continue;
                    if (rho2 <= inner * inner)
                    {
                        m += v;
                        sx += v * dx;
                        sy += v * dy;
                        continue;
                    }
                    var rho = Math.Sqrt(rho2);
                    var t = (rho - inner) / width;
                    var w = v * (1 - t * t * (3 - 2 * t));
                    var slope = v * 6 * t * (1 - t) / (width * rho); // α·|dW/dρ|/ρ
                    m += w;
                    sx += w * dx;
                    sy += w * dy;
                    qxx += slope * dx * dx;
                    qxy += slope * dx * dy;
                    qyy += slope * dy * dy;
                }
            }
            if (!(m > 0)) return null;
            var p = m - qxx;
            var q = m - qyy;
            var det = p * q - qxy * qxy;
            if (!(p > 0 && q > 0 && det > 1e-4 * m * m)) return null;
            var ux = (q * sx + qxy * sy) / det;
            var uy = (p * sy + qxy * sx) / det;
            x += ux;
            y += uy;
            if (Math.Abs(x - startX) + Math.Abs(y - startY) > 1) return null;
            if (Math.Abs(ux) + Math.Abs(uy) < 1e-4) break;
        }
        return (x, y);
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
        _windowX = cx;
        _windowY = cy;
        _background = background;
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
