namespace StringModes.Video.Tracking;

/// <summary>Result of one windowed-centroid measurement.</summary>
internal struct CentroidMeasurement
{
    public double X;
    public double Y;
    public double Mass;
    public double SpreadAlongPx;
    public double SpreadAcrossPx;
    public double BackgroundDn;
    public bool Valid;
}

/// <summary>
/// Iterative background-subtracted intensity centroid in a smoothly tapered window that follows the estimate.
/// The background level and its spread come from a ring just outside the window (median and MAD, robust to the
/// string crossing it); contrast below a few spreads is cut softly so background texture adds little mass. The
/// window is re-centred on the estimate until it stops moving: at the fixed point the window is symmetric about
/// the mark, so a symmetric mark (disc, or a disc smeared along the transverse direction by motion blur) and the
/// string through it add no bias, and the truncation bias of a fixed window (REFERENCES.md §6) is avoided.
/// The window may be stretched across the string to hold a motion-blur streak; the streak's centroid is the
/// exposure-averaged position (REFERENCES.md §6, blur).
/// </summary>
internal sealed class WindowedCentroid
{
    private readonly float[] ring;
    private readonly float[] scratch;

    public WindowedCentroid(int maxRingPixels)
    {
        ring = new float[maxRingPixels];
        scratch = new float[maxRingPixels];
    }

    /// <param name="img">Frame.</param>
    /// <param name="x">Starting x, px.</param>
    /// <param name="y">Starting y, px.</param>
    /// <param name="sign">+1 for bright marks, −1 for dark.</param>
    /// <param name="ux">String direction x (unit).</param>
    /// <param name="uy">String direction y (unit).</param>
    /// <param name="radiusAlong">Flat part of the window along the string, px.</param>
    /// <param name="radiusAcross">Flat part of the window across the string, px (≥ radiusAlong).</param>
    /// <param name="taper">Cosine edge width, px.</param>
    /// <param name="thresholdSigma">Soft threshold in ring spreads.</param>
    /// <param name="thresholdFloorDn">Smallest soft threshold in grey levels (set above the string's own contrast).</param>
    public CentroidMeasurement Measure(in PlaneView img, double x, double y, int sign, double ux, double uy,
        double radiusAlong, double radiusAcross, double taper, double thresholdSigma, double thresholdFloorDn)
    {
        var m = new CentroidMeasurement();
        double stretch = radiusAlong / radiusAcross;
        double outer = radiusAlong + taper;
        double ringOuter = outer + 2;
        double nx = -uy, ny = ux;

        // Background from the ring outside the window at the starting position.
        int half = (int)Math.Ceiling(ringOuter / stretch) + 1;
        int xc = (int)Math.Round(x), yc = (int)Math.Round(y);
        if (xc - half < 0 || yc - half < 0 || xc + half >= img.Width || yc + half >= img.Height)
        {
            return m;
        }

        int count = 0;
        for (int py = yc - half; py <= yc + half; py++)
        {
            for (int px = xc - half; px <= xc + half; px++)
            {
                double dx = px - x, dy = py - y;
                double a = dx * ux + dy * uy, b = (dx * nx + dy * ny) * stretch;
                double r2 = a * a + b * b;
                if (r2 >= outer * outer && r2 < ringOuter * ringOuter && count < ring.Length)
                {
                    ring[count++] = img[px, py];
                }
            }
        }

        if (count < 8)
        {
            return m;
        }

        float bg = Select.Median(ring.AsSpan(0, count));
        for (int i = 0; i < count; i++)
        {
            scratch[i] = Math.Abs(ring[i] - bg);
        }

        double spread = 1.4826 * Select.Median(scratch.AsSpan(0, count));
        double tau = Math.Max(thresholdSigma * spread, thresholdFloorDn);
        m.BackgroundDn = bg;

        double cx = x, cy = y, mass = 0;
        for (int iter = 0; iter < 12; iter++)
        {
            int hw = (int)Math.Ceiling(outer / stretch) + 1;
            int x0 = (int)Math.Floor(cx) - hw, x1 = (int)Math.Ceiling(cx) + hw;
            int y0 = (int)Math.Floor(cy) - hw, y1 = (int)Math.Ceiling(cy) + hw;
            if (x0 < 0 || y0 < 0 || x1 >= img.Width || y1 >= img.Height)
            {
                return m;
            }

            double s = 0, sx = 0, sy = 0;
            for (int py = y0; py <= y1; py++)
            {
                for (int px = x0; px <= x1; px++)
                {
                    double v = sign * (img[px, py] - bg) - tau;
                    if (v <= 0)
                    {
                        continue;
                    }

                    double dx = px - cx, dy = py - cy;
                    double a = dx * ux + dy * uy, b = (dx * nx + dy * ny) * stretch;
                    double w = Weight(Math.Sqrt(a * a + b * b), radiusAlong, taper);
                    if (w <= 0)
                    {
                        continue;
                    }

                    s += w * v;
                    sx += w * v * px;
                    sy += w * v * py;
                }
            }

            if (s <= 0)
            {
                return m;
            }

            double nxp = sx / s, nyp = sy / s;
            double step = Math.Abs(nxp - cx) + Math.Abs(nyp - cy);
            cx = nxp;
            cy = nyp;
            mass = s;
            if (step < 1e-5)
            {
                break;
            }
        }

        // Second moments about the final centre, for the shape part of the quality figure.
        {
            int hw = (int)Math.Ceiling(outer / stretch) + 1;
            int x0 = (int)Math.Floor(cx) - hw, x1 = (int)Math.Ceiling(cx) + hw;
            int y0 = (int)Math.Floor(cy) - hw, y1 = (int)Math.Ceiling(cy) + hw;
            if (x0 < 0 || y0 < 0 || x1 >= img.Width || y1 >= img.Height)
            {
                return m;
            }

            double s = 0, saa = 0, sbb = 0;
            for (int py = y0; py <= y1; py++)
            {
                for (int px = x0; px <= x1; px++)
                {
                    double v = sign * (img[px, py] - bg) - tau;
                    if (v <= 0)
                    {
                        continue;
                    }

                    double dx = px - cx, dy = py - cy;
                    double a = dx * ux + dy * uy, bn = dx * nx + dy * ny;
                    double w = Weight(Math.Sqrt(a * a + bn * stretch * bn * stretch), radiusAlong, taper);
                    s += w * v;
                    saa += w * v * a * a;
                    sbb += w * v * bn * bn;
                }
            }

            m.SpreadAlongPx = Math.Sqrt(saa / s);
            m.SpreadAcrossPx = Math.Sqrt(sbb / s);
        }

        m.X = cx;
        m.Y = cy;
        m.Mass = mass;
        m.Valid = true;
        return m;
    }

    private static double Weight(double r, double flat, double taper)
    {
        if (r <= flat)
        {
            return 1;
        }

        if (r >= flat + taper)
        {
            return 0;
        }

        double c = Math.Cos(Math.PI * (r - flat) / (2 * taper));
        return c * c;
    }
}
