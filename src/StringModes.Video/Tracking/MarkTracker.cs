using StringModes.Video.Marks;

namespace StringModes.Video.Tracking;

/// <summary>
/// Follows every mark through the frames with <see cref="WindowedCentroid"/>. Prediction is constant velocity,
/// held near the transverse direction (longitudinal offset from rest limited to one mark radius); the window is
/// stretched across the string by the last frame-to-frame motion to hold a blur streak. Quality = mass ratio to the
/// reference × width ratio across the string (a blur streak widens the mark). A lost mark is searched for every
/// frame in a band across the string at its rest position; identities never swap because marks are kept in order
/// along the string and a mark that comes within two radii of a neighbour's position is dropped for that frame.
/// State is preallocated: a frame is tracked without allocating.
/// </summary>
internal sealed class MarkTracker
{
    private readonly Mark[] marks;
    private readonly TrackerOptions options;
    private readonly WindowedCentroid centroid;
    private readonly double ux, uy, nx, ny;
    private readonly double originX, originY;
    private readonly double maxAmplitude;

    public MarkTracker(MarkLayout layout, in PlaneView reference, TrackerOptions options)
    {
        this.options = options;
        var first = layout.Marks[0];
        var last = layout.Marks[^1];
        double dx = last.XPx - first.XPx, dy = last.YPx - first.YPx, len = Math.Sqrt(dx * dx + dy * dy);
        ux = dx / len;
        uy = dy / len;
        nx = -uy;
        ny = ux;
        originX = first.XPx;
        originY = first.YPx;

        double minSpacing = double.MaxValue;
        for (int i = 0; i + 1 < layout.Marks.Count; i++)
        {
            minSpacing = Math.Min(minSpacing, Along(layout.Marks[i + 1].XPx, layout.Marks[i + 1].YPx) - Along(layout.Marks[i].XPx, layout.Marks[i].YPx));
        }

        maxAmplitude = options.MaxAmplitudePx ?? 0.45 * minSpacing;
        double maxRadius = layout.Marks.Max(m => m.RadiusPx);
        double reach = (options.WindowScale * maxRadius + 1 + options.TaperPx + 3) * 4;
        centroid = new WindowedCentroid((int)Math.Ceiling(reach * reach * 4));

        marks = new Mark[layout.Marks.Count];
        for (int i = 0; i < marks.Length; i++)
        {
            var f = layout.Marks[i];
            var mk = new Mark
            {
                RestX = f.XPx,
                RestY = f.YPx,
                Sign = f.ContrastDn >= 0 ? 1 : -1,
                Radius = Math.Max(1.5, f.RadiusPx),
            };
            mk.Window = options.WindowScale * mk.Radius + 1;
            var r = centroid.Measure(reference, f.XPx, f.YPx, mk.Sign, ux, uy, mk.Window, mk.Window, options.TaperPx, options.NoiseThresholdSigma, mk.Floor);
            if (r.Valid)
            {
                mk.RefBackground = r.BackgroundDn;
                mk.Floor = StringFloor(reference, mk, ux, uy, options, r.BackgroundDn, r.Mass / (Math.PI * mk.Radius * mk.Radius));
                r = centroid.Measure(reference, r.X, r.Y, mk.Sign, ux, uy, mk.Window, mk.Window, options.TaperPx, options.NoiseThresholdSigma, mk.Floor);
            }

            if (r.Valid)
            {
                mk.RestX = r.X;
                mk.RestY = r.Y;
                mk.RefMass = r.Mass;
                mk.RefAcross = r.SpreadAcrossPx;
                mk.RefBackground = r.BackgroundDn;
            }
            else
            {
                mk.RefMass = Math.Abs(f.ContrastDn) * Math.PI * mk.Radius * mk.Radius;
                mk.RefAcross = mk.Radius / 2;
            }

            mk.X1 = mk.RestX;
            mk.Y1 = mk.RestY;
            mk.Valid1 = true;
            marks[i] = mk;
        }
    }

    public int MarkCount => marks.Length;

    /// <summary>Rest positions measured on the reference frame (px of the tracked plane).</summary>
    public (double X, double Y) Rest(int i) => (marks[i].RestX, marks[i].RestY);

    /// <summary>Measures every mark on one frame; lost marks get NaN and quality 0.</summary>
    public void Track(in PlaneView img, Span<double> x, Span<double> y, Span<double> quality)
    {
        for (int i = 0; i < marks.Length; i++)
        {
            var mk = marks[i];
            var r = mk.Valid1 ? Follow(img, mk) : default;
            double q = r.Valid ? Quality(mk, r) : 0;
            if (!r.Valid || q < options.MinQuality)
            {
                r = Reacquire(img, mk);
                q = r.Valid ? Quality(mk, r) : 0;
            }

            if (r.Valid && q >= options.MinQuality)
            {
                x[i] = r.X;
                y[i] = r.Y;
                quality[i] = q;
            }
            else
            {
                x[i] = double.NaN;
                y[i] = double.NaN;
                quality[i] = 0;
            }
        }

        EnforceOrder(x, y, quality);
        for (int i = 0; i < marks.Length; i++)
        {
            var mk = marks[i];
            if (quality[i] > 0)
            {
                mk.X2 = mk.X1;
                mk.Y2 = mk.Y1;
                mk.Valid2 = mk.Valid1;
                mk.X1 = x[i];
                mk.Y1 = y[i];
                mk.Valid1 = true;
            }
            else
            {
                mk.Valid1 = false;
                mk.Valid2 = false;
            }
        }
    }

    private CentroidMeasurement Follow(in PlaneView img, Mark mk)
    {
        double px = mk.X1, py = mk.Y1, vAcross = 0;
        if (mk.Valid2)
        {
            double vx = mk.X1 - mk.X2, vy = mk.Y1 - mk.Y2;
            px += vx;
            py += vy;
            vAcross = Math.Abs(vx * nx + vy * ny);
        }

        (px, py) = Constrain(mk, px, py);
        double across = mk.Window + Math.Min(0.6 * vAcross, 3 * mk.Window);
        var r = centroid.Measure(img, px, py, mk.Sign, ux, uy, mk.Window, across, options.TaperPx, options.NoiseThresholdSigma, mk.Floor);
        if (r.Valid && Math.Abs(r.X - px) + Math.Abs(r.Y - py) > 2 * (across + options.TaperPx))
        {
            r.Valid = false;
        }

        return r;
    }

    private CentroidMeasurement Reacquire(in PlaneView img, Mark mk)
    {
        // Scan the band across the string at the rest position for the strongest mark-sized response.
        double best = 0, bestB = double.NaN;
        int rad = (int)Math.Ceiling(mk.Radius);
        for (double b = -maxAmplitude; b <= maxAmplitude; b += 1)
        {
            double cx = mk.RestX + b * nx, cy = mk.RestY + b * ny;
            int xc = (int)Math.Round(cx), yc = (int)Math.Round(cy);
            if (xc - rad < 0 || yc - rad < 0 || xc + rad >= img.Width || yc + rad >= img.Height)
            {
                continue;
            }

            double s = 0;
            for (int yy = yc - rad; yy <= yc + rad; yy++)
            {
                for (int xx = xc - rad; xx <= xc + rad; xx++)
                {
                    s += mk.Sign * (img[xx, yy] - mk.RefBackground);
                }
            }

            if (s > best)
            {
                best = s;
                bestB = b;
            }
        }

        if (double.IsNaN(bestB))
        {
            return default;
        }

        var r = centroid.Measure(img, mk.RestX + bestB * nx, mk.RestY + bestB * ny, mk.Sign, ux, uy, mk.Window, mk.Window, options.TaperPx, options.NoiseThresholdSigma, mk.Floor);
        // A reacquired mark must look like itself: at least half its reference mass and near its rest line.
        if (r.Valid && (r.Mass < 0.5 * mk.RefMass || Math.Abs(Along(r.X, r.Y) - Along(mk.RestX, mk.RestY)) > 2 * mk.Radius))
        {
            r.Valid = false;
        }

        return r;
    }

    private (double X, double Y) Constrain(Mark mk, double x, double y)
    {
        double a = (x - mk.RestX) * ux + (y - mk.RestY) * uy;
        double b = (x - mk.RestX) * nx + (y - mk.RestY) * ny;
        a = Math.Clamp(a, -mk.Radius, mk.Radius);
        b = Math.Clamp(b, -maxAmplitude, maxAmplitude);
        return (mk.RestX + a * ux + b * nx, mk.RestY + a * uy + b * ny);
    }

    private double Quality(Mark mk, in CentroidMeasurement r)
    {
        double massRatio = r.Mass / mk.RefMass;
        double qMass = massRatio >= 1 ? 1 / massRatio : massRatio;
        double qShape = Math.Min(1, (mk.RefAcross + 0.5) / (r.SpreadAcrossPx + 0.5));
        if (Math.Abs(Along(r.X, r.Y) - Along(mk.RestX, mk.RestY)) > 2 * mk.Radius)
        {
            return 0;
        }

        return Math.Clamp(qMass * qShape, 0, 1);
    }

    private void EnforceOrder(Span<double> x, Span<double> y, Span<double> quality)
    {
        int prev = -1;
        for (int i = 0; i < marks.Length; i++)
        {
            if (quality[i] <= 0)
            {
                continue;
            }

            if (prev >= 0)
            {
                double gap = Along(x[i], y[i]) - Along(x[prev], y[prev]);
                double dx = x[i] - x[prev], dy = y[i] - y[prev];
                if (gap <= marks[i].Radius + marks[prev].Radius || dx * dx + dy * dy < 4 * marks[i].Radius * marks[i].Radius)
                {
                    int drop = quality[i] < quality[prev] ? i : prev;
                    x[drop] = double.NaN;
                    y[drop] = double.NaN;
                    quality[drop] = 0;
                    if (drop == prev)
                    {
                        prev = i;
                    }

                    continue;
                }
            }

            prev = i;
        }
    }

    /// <summary>
    /// Soft-threshold floor that keeps the string itself out of the mark's mass: the string passes through the window,
    /// and where it leaves on one side only (the ends) or over uneven background it would pull the centroid along
    /// the string. Set a little above the string's contrast of the same sign, found on cross-sections just outside
    /// the window, but at most <see cref="TrackerOptions.MaxStringFloorFraction"/> of the mark's contrast.
    /// </summary>
    private static double StringFloor(in PlaneView img, Mark mk, double ux, double uy, TrackerOptions o, double bg, double markContrast)
    {
        double nx = -uy, ny = ux, best = 0;
        double d = mk.Window + o.TaperPx + 3;
        foreach (int side in new[] { -1, 1 })
        {
            for (double along = d; along <= d + 4; along += 1)
            {
                for (double b = -3; b <= 3; b += 0.5)
                {
                    int x = (int)Math.Round(mk.RestX + side * along * ux + b * nx), y = (int)Math.Round(mk.RestY + side * along * uy + b * ny);
                    if (x >= 0 && y >= 0 && x < img.Width && y < img.Height)
                    {
                        best = Math.Max(best, mk.Sign * (img[x, y] - bg));
                    }
                }
            }
        }

        return Math.Min(1.25 * best, o.MaxStringFloorFraction * Math.Abs(markContrast));
    }

    private double Along(double x, double y) => (x - originX) * ux + (y - originY) * uy;

    private sealed class Mark
    {
        public double RestX, RestY, Radius, Window, RefMass, RefAcross, RefBackground, Floor;
        public int Sign;
        public double X1, Y1, X2, Y2;
        public bool Valid1, Valid2;
    }
}
