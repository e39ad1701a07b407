using StringModes.Analysis.Physics;

namespace StringModes.Video.Synthesis;

/// <summary>
/// Renders frames of a <see cref="Scene"/>. Time convention: frame k's time is t_k = k / capture rate, the
/// middle of row 0's exposure. Row y is exposed around t_k + (y/H)·readout (rolling shutter). Motion blur is the
/// mean of sub-frames at offsets ((j + ½)/J − ½)·exposure, j = 0..J−1. Only a band around the string changes
/// from frame to frame, so only that band is re-rendered. One instance per thread: it owns its buffers.
/// </summary>
internal sealed class SceneRenderer
{
    private readonly Scene _scene;
    private readonly StringGeometry _geometry;
    private readonly ModeComponent[] _modes;
    private readonly float[] _background;
    private readonly int _w, _h;
    private readonly int[] _bandPixels;      // flat pixel index y·W + x
    private readonly int[] _bandIndexOf;     // pixel index → band index, −1 outside
    private readonly float[] _bandV;         // transverse coordinate of the pixel, px
    private readonly float[] _basis;         // sin(nπs/L) per band pixel and mode (0 beyond the ends)
    private readonly float[] _slopeBasis;    // (nπ/L)·cos(nπs/L)
    private readonly int _bandRowMin, _bandRowMax;
    private readonly double[] _rowCoordinates; // modal coordinates per band row and mode, for one sub-frame
    private readonly double[] _markBasis;      // sin(nπ f_i) per moving mark and mode
    private readonly float[] _layer;
    private readonly float[] _accumulator;

    public SceneRenderer(Scene scene, float[] background)
    {
        _scene = scene;
        _geometry = new StringGeometry(scene);
        _modes = scene.Motion.Modes.ToArray();
        _background = background;
        _w = scene.WidthPx;
        _h = scene.HeightPx;
        var m = _modes.Length;
        var g = _geometry;
        var swingPx = _modes.Sum(x => Math.Abs(x.AmplitudeM)) * g.PixelsPerMetre;
        var halfBand = swingPx + Math.Max(Math.Max(scene.MarkRadiusPx, scene.EndRadiusPx), scene.StringWidthPx) + 2.5;
        var alongMin = -scene.StringExtensionPx - scene.EndRadiusPx - 2;
        var alongMax = g.SpanPx + scene.StringExtensionPx + scene.EndRadiusPx + 2;

        var pixels = new List<int>();
        _bandIndexOf = new int[_w * _h];
        Array.Fill(_bandIndexOf, -1);
        _bandRowMin = _h;
        _bandRowMax = -1;
        for (var y = 0; y < _h; y++)
            for (var x = 0; x < _w; x++)
            {
                var dx = x - g.Origin.X;
                var dy = y - g.Origin.Y;
                var along = dx * g.AxisX + dy * g.AxisY;
                var v = dx * g.NormalX + dy * g.NormalY;
                if (along < alongMin || along > alongMax || Math.Abs(v) > halfBand) continue;
                _bandIndexOf[y * _w + x] = pixels.Count;
                pixels.Add(y * _w + x);
                _bandRowMin = Math.Min(_bandRowMin, y);
                _bandRowMax = Math.Max(_bandRowMax, y);
            }
        _bandPixels = pixels.ToArray();
        _bandV = new float[_bandPixels.Length];
        _basis = new float[_bandPixels.Length * m];
        _slopeBasis = new float[_bandPixels.Length * m];
        for (var p = 0; p < _bandPixels.Length; p++)
        {
            var x = _bandPixels[p] % _w;
            var y = _bandPixels[p] / _w;
            var dx = x - g.Origin.X;
            var dy = y - g.Origin.Y;
            var along = dx * g.AxisX + dy * g.AxisY;
            _bandV[p] = (float)(dx * g.NormalX + dy * g.NormalY);
            var s = along / g.PixelsPerMetre;
            if (s <= 0 || s >= g.LengthM) continue;
            for (var j = 0; j < m; j++)
            {
                var k = _modes[j].N * Math.PI / g.LengthM;
                _basis[p * m + j] = (float)Math.Sin(k * s);
                _slopeBasis[p * m + j] = (float)(k * Math.Cos(k * s));
            }
        }
        _rowCoordinates = new double[Math.Max(0, _bandRowMax - _bandRowMin + 1) * m];
        _markBasis = new double[scene.MarkFractions.Length * m];
        for (var i = 0; i < scene.MarkFractions.Length; i++)
            for (var j = 0; j < m; j++)
                _markBasis[i * m + j] = Math.Sin(_modes[j].N * Math.PI * scene.MarkFractions[i]);
        _layer = new float[_bandPixels.Length * 3];
        _accumulator = new float[_bandPixels.Length * 3];
    }

    /// <summary>Number of pixels re-rendered per sub-frame.</summary>
    public int BandPixelCount => _bandPixels.Length;

    /// <summary>Exposure and sub-frame count of frame <paramref name="frame"/> (longer during a blurred release).</summary>
    public (double ExposureS, int Subframes) ExposureOf(int frame)
    {
        var t = frame / _scene.CaptureFps;
        return t < _scene.ReleaseDurationS
            ? (_scene.ReleaseExposureS, _scene.ReleaseSubframes)
            : (_scene.ExposureS, _scene.Subframes);
    }

    /// <summary>Sub-frame time offsets from the frame's mid-exposure time.</summary>
    public static double SubframeOffset(int j, int count, double exposureS) => ((j + 0.5) / count - 0.5) * exposureS;

    /// <summary>Renders frame <paramref name="frame"/> into <paramref name="rgb"/> (H·W·3 floats, DN, before quantisation), noise included.</summary>
    public void Render(int frame, long seed, float[] rgb)
    {
        var t0 = frame / _scene.CaptureFps;
        var (exposure, subframes) = ExposureOf(frame);
        Array.Clear(_accumulator);
        for (var j = 0; j < subframes; j++)
        {
            RenderSubframe(t0 + SubframeOffset(j, subframes, exposure));
            var acc = _accumulator;
            var layer = _layer;
            for (var i = 0; i < acc.Length; i++) acc[i] += layer[i];
        }
        Array.Copy(_background, rgb, _background.Length);
        var scale = 1f / subframes;
        for (var p = 0; p < _bandPixels.Length; p++)
        {
            var o = _bandPixels[p] * 3;
            rgb[o] = _accumulator[p * 3] * scale;
            rgb[o + 1] = _accumulator[p * 3 + 1] * scale;
            rgb[o + 2] = _accumulator[p * 3 + 2] * scale;
        }
        foreach (var occ in _scene.Occluders)
            if (t0 >= occ.FromS && t0 < occ.ToS) PaintRectangle(rgb, occ);
        ApplyFlickerAndNoise(rgb, t0, seed, frame);
    }

    private void RenderSubframe(double t)
    {
        var m = _modes.Length;
        var rows = _bandRowMax - _bandRowMin + 1;
        var readout = _scene.ReadoutS;
        for (var r = 0; r < rows; r++)
        {
            var tr = t + (_bandRowMin + r) / (double)_h * readout;
            if (r > 0 && readout == 0)
            {
                Array.Copy(_rowCoordinates, 0, _rowCoordinates, r * m, m);
                continue;
            }
            for (var j = 0; j < m; j++) _rowCoordinates[r * m + j] = StringMotion.ModalCoordinate(_modes[j], tr);
        }

        var ppm = _geometry.PixelsPerMetre;
        var half = _scene.StringWidthPx / 2 + 0.5;
        var sc = _scene.StringColour;
        for (var p = 0; p < _bandPixels.Length; p++)
        {
            var pix = _bandPixels[p];
            var row = pix / _w - _bandRowMin;
            double u = 0, slope = 0;
            var b = p * m;
            var c = row * m;
            for (var j = 0; j < m; j++)
            {
                var a = _rowCoordinates[c + j];
                u += a * _basis[b + j];
                slope += a * _slopeBasis[b + j];
            }
            var distance = Math.Abs(_bandV[p] - u * ppm) / Math.Sqrt(1 + slope * slope);
            var cover = (float)Math.Clamp(half - distance, 0, 1);
            var o = pix * 3;
            var l = p * 3;
            _layer[l] = _background[o] + cover * ((float)sc.R - _background[o]);
            _layer[l + 1] = _background[o + 1] + cover * ((float)sc.G - _background[o + 1]);
            _layer[l + 2] = _background[o + 2] + cover * ((float)sc.B - _background[o + 2]);
        }

        DrawStillMark(_scene.End0, _scene.EndRadiusPx, _scene.EndColour);
        DrawStillMark(_scene.End1, _scene.EndRadiusPx, _scene.EndColour);
        for (var i = 0; i < _scene.MarkFractions.Length; i++) DrawMovingMark(i);
    }

    private void DrawStillMark(PixelPoint centre, double radius, Rgb colour)
    {
        var ymin = Math.Max(0, (int)Math.Floor(centre.Y - radius - 1));
        var ymax = Math.Min(_h - 1, (int)Math.Ceiling(centre.Y + radius + 1));
        for (var y = ymin; y <= ymax; y++) DrawDiscRow(centre.X, centre.Y, radius, colour, y);
    }

    private void DrawMovingMark(int mark)
    {
        var m = _modes.Length;
        var radius = _scene.MarkRadiusPx;
        var fraction = _scene.MarkFractions[mark];
        var rest = _geometry.RestPosition(fraction);
        var swing = _modes.Sum(x => Math.Abs(x.AmplitudeM)) * _geometry.PixelsPerMetre * Math.Abs(_geometry.NormalY);
        var ymin = Math.Max(_bandRowMin, (int)Math.Floor(rest.Y - swing - radius - 1));
        var ymax = Math.Min(_bandRowMax, (int)Math.Ceiling(rest.Y + swing + radius + 1));
        for (var y = ymin; y <= ymax; y++)
        {
            // With a rolling shutter each row sees the mark at that row's time.
            double u = 0;
            var c = (y - _bandRowMin) * m;
            for (var j = 0; j < m; j++) u += _rowCoordinates[c + j] * _markBasis[mark * m + j];
            var centre = _geometry.Position(fraction, u);
            if (Math.Abs(y - centre.Y) > radius + 1) continue;
            DrawDiscRow(centre.X, centre.Y, radius, _scene.MarkColour, y);
        }
    }

    private void DrawDiscRow(double cx, double cy, double radius, Rgb colour, int y)
    {
        var xmin = Math.Max(0, (int)Math.Floor(cx - radius - 1));
        var xmax = Math.Min(_w - 1, (int)Math.Ceiling(cx + radius + 1));
        for (var x = xmin; x <= xmax; x++)
        {
            var p = _bandIndexOf[y * _w + x];
            if (p < 0) continue;
            var a = (float)DiscCoverage.PixelArea(cx, cy, radius, x, y);
            if (a <= 0) continue;
            var l = p * 3;
            _layer[l] += a * ((float)colour.R - _layer[l]);
            _layer[l + 1] += a * ((float)colour.G - _layer[l + 1]);
            _layer[l + 2] += a * ((float)colour.B - _layer[l + 2]);
        }
    }

    private void PaintRectangle(float[] rgb, Occluder occ)
    {
        var x0 = Math.Max(0, (int)Math.Round(occ.XPx));
        var y0 = Math.Max(0, (int)Math.Round(occ.YPx));
        var x1 = Math.Min(_w, (int)Math.Round(occ.XPx + occ.WidthPx));
        var y1 = Math.Min(_h, (int)Math.Round(occ.YPx + occ.HeightPx));
        for (var y = y0; y < y1; y++)
            for (var x = x0; x < x1; x++)
            {
                var o = (y * _w + x) * 3;
                rgb[o] = (float)occ.Colour.R;
                rgb[o + 1] = (float)occ.Colour.G;
                rgb[o + 2] = (float)occ.Colour.B;
            }
    }

    private void ApplyFlickerAndNoise(float[] rgb, double t0, long seed, int frame)
    {
        var noise = new NoiseSource(seed, frame);
        var sigma = _scene.NoiseDn;
        var flicker = _scene.FlickerFraction;
        for (var y = 0; y < _h; y++)
        {
            var gain = flicker == 0 ? 1f
                : (float)(1 + flicker * Math.Sin(2 * Math.PI * _scene.FlickerHz * (t0 + y / (double)_h * _scene.ReadoutS)));
            var start = y * _w * 3;
            var end = start + _w * 3;
            if (sigma == 0)
            {
                if (gain != 1f) for (var q = start; q < end; q++) rgb[q] *= gain;
                continue;
            }
            var table = GaussianTable.Values;
            const int mask = (1 << GaussianTable.Bits) - 1;
            var sigmaF = (float)sigma;
            var i = start;
            // One 64-bit draw gives three 20-bit table indices.
            for (; i + 3 <= end; i += 3)
            {
                var bits = noise.NextBits();
                rgb[i] = rgb[i] * gain + sigmaF * table[(int)(bits & mask)];
                rgb[i + 1] = rgb[i + 1] * gain + sigmaF * table[(int)((bits >> 20) & mask)];
                rgb[i + 2] = rgb[i + 2] * gain + sigmaF * table[(int)((bits >> 40) & mask)];
            }
            for (; i < end; i++) rgb[i] = rgb[i] * gain + sigmaF * table[(int)(noise.NextBits() & mask)];
        }
    }

    /// <summary>
    /// True image position of moving mark <paramref name="mark"/> in frame <paramref name="frame"/>: at mid-exposure of
    /// the row it sits on, and averaged over the same sub-frames the renderer uses (what a centroid sees of a blurred mark).
    /// </summary>
    public MarkTruth Truth(int frame, int mark)
    {
        var t0 = frame / _scene.CaptureFps;
        var fraction = _scene.MarkFractions[mark];
        var basis = new double[_modes.Length];
        for (var j = 0; j < _modes.Length; j++) basis[j] = _markBasis[mark * _modes.Length + j];
        double DisplacementAt(double t)
        {
            double u = 0;
            for (var j = 0; j < _modes.Length; j++) u += StringMotion.ModalCoordinate(_modes[j], t) * basis[j];
            return u;
        }
        // The row depends on the position and the position on the row's time: two fixed-point steps converge
        // (readout · swing speed ≪ 1 px per row).
        var rowTime = t0;
        var mid = _geometry.Position(fraction, DisplacementAt(rowTime));
        for (var it = 0; it < 3 && _scene.ReadoutS > 0; it++)
        {
            rowTime = t0 + mid.Y / _h * _scene.ReadoutS;
            mid = _geometry.Position(fraction, DisplacementAt(rowTime));
        }
        var (exposure, subframes) = ExposureOf(frame);
        double sx = 0, sy = 0, su = 0;
        for (var j = 0; j < subframes; j++)
        {
            var u = DisplacementAt(rowTime + SubframeOffset(j, subframes, exposure));
            var p = _geometry.Position(fraction, u);
            sx += p.X;
            sy += p.Y;
            su += u;
        }
        var visible = !_scene.Occluders.Any(o => t0 >= o.FromS && t0 < o.ToS
            && mid.X + _scene.MarkRadiusPx > o.XPx && mid.X - _scene.MarkRadiusPx < o.XPx + o.WidthPx
            && mid.Y + _scene.MarkRadiusPx > o.YPx && mid.Y - _scene.MarkRadiusPx < o.YPx + o.HeightPx);
        return new MarkTruth(rowTime, mid, new PixelPoint(sx / subframes, sy / subframes), DisplacementAt(rowTime), su / subframes, visible);
    }
}

/// <summary>Ground truth of one moving mark in one frame.</summary>
/// <param name="RowTimeS">Mid-exposure time of the row the mark sits on (the frame time without a rolling shutter).</param>
/// <param name="MidExposure">Position at <paramref name="RowTimeS"/>.</param>
/// <param name="ExposureAveraged">Position averaged over the exposure.</param>
/// <param name="DisplacementM">Transverse displacement at <paramref name="RowTimeS"/>, metres.</param>
/// <param name="ExposureAveragedDisplacementM">Transverse displacement averaged over the exposure, metres.</param>
/// <param name="Visible">False while an occluder covers the mark.</param>
internal sealed record MarkTruth(double RowTimeS, PixelPoint MidExposure, PixelPoint ExposureAveraged, double DisplacementM, double ExposureAveragedDisplacementM, bool Visible);
