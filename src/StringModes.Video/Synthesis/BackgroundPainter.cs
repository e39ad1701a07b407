namespace StringModes.Video.Synthesis;

/// <summary>
/// The still part of a scene: a seeded value-noise texture (two octaves) under a left-to-right lighting
/// gradient, with any distractor discs painted in. Computed once per clip.
/// </summary>
internal static class BackgroundPainter
{
    /// <summary>Returns an interleaved RGB image (H·W·3 floats, digital numbers 0–255).</summary>
    public static float[] Paint(Scene scene)
    {
        int w = scene.WidthPx, h = scene.HeightPx;
        var coarse = new ValueNoise(scene.TextureSeed, 23.0, w, h);
        var fine = new ValueNoise(scene.TextureSeed + 7919, 4.5, w, h);
        var rgb = new float[w * h * 3];
        var c = scene.BackgroundColour;
        for (var y = 0; y < h; y++)
        {
            for (var x = 0; x < w; x++)
            {
                var texture = 0.7 * coarse.At(x, y) + 0.3 * fine.At(x, y); // in [−1, 1]
                var light = (1 + scene.LightingGradient * (x / (double)(w - 1) - 0.5)) * (1 + scene.TextureContrast * texture);
                var i = (y * w + x) * 3;
                rgb[i] = (float)(c.R * light);
                rgb[i + 1] = (float)(c.G * light);
                rgb[i + 2] = (float)(c.B * light);
            }
        }
        foreach (var d in scene.Distractors)
            PaintDisc(rgb, w, h, d.Centre.X, d.Centre.Y, d.RadiusPx, d.Colour);
        return rgb;
    }

    /// <summary>Blends an exactly antialiased disc into an interleaved RGB image.</summary>
    public static void PaintDisc(float[] rgb, int w, int h, double cx, double cy, double r, Rgb colour)
    {
        var xmin = Math.Max(0, (int)Math.Floor(cx - r - 1));
        var xmax = Math.Min(w - 1, (int)Math.Ceiling(cx + r + 1));
        var ymin = Math.Max(0, (int)Math.Floor(cy - r - 1));
        var ymax = Math.Min(h - 1, (int)Math.Ceiling(cy + r + 1));
        for (var y = ymin; y <= ymax; y++)
            for (var x = xmin; x <= xmax; x++)
            {
                var a = (float)DiscCoverage.PixelArea(cx, cy, r, x, y);
                if (a <= 0) continue;
                var i = (y * w + x) * 3;
                rgb[i] += a * ((float)colour.R - rgb[i]);
                rgb[i + 1] += a * ((float)colour.G - rgb[i + 1]);
                rgb[i + 2] += a * ((float)colour.B - rgb[i + 2]);
            }
    }

    /// <summary>Smoothly interpolated random lattice values in [−1, 1].</summary>
    private sealed class ValueNoise
    {
        private readonly double[] _lattice;
        private readonly int _cols;
        private readonly double _cell;

        public ValueNoise(int seed, double cellPx, int w, int h)
        {
            _cell = cellPx;
            _cols = (int)Math.Ceiling(w / cellPx) + 2;
            var rows = (int)Math.Ceiling(h / cellPx) + 2;
            var random = new Random(seed);
            _lattice = new double[_cols * rows];
            for (var i = 0; i < _lattice.Length; i++) _lattice[i] = 2 * random.NextDouble() - 1;
        }

        public double At(int x, int y)
        {
            var gx = x / _cell;
            var gy = y / _cell;
            var ix = (int)gx;
            var iy = (int)gy;
            var fx = Smooth(gx - ix);
            var fy = Smooth(gy - iy);
            var v00 = _lattice[iy * _cols + ix];
            var v10 = _lattice[iy * _cols + ix + 1];
            var v01 = _lattice[(iy + 1) * _cols + ix];
            var v11 = _lattice[(iy + 1) * _cols + ix + 1];
            return (v00 * (1 - fx) + v10 * fx) * (1 - fy) + (v01 * (1 - fx) + v11 * fx) * fy;
        }

        private static double Smooth(double t) => t * t * (3 - 2 * t);
    }
}
