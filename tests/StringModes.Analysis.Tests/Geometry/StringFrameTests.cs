using StringModes.Analysis.Geometry;

namespace StringModes.Analysis.Tests.Geometry;

public sealed class StringFrameTests
{
    /// <summary>Tracks of a string whose geometry is known exactly in metres, drawn at a tilt with a given pixel scale.</summary>
    private static Tracks Build(double lengthM, double pxPerM, double angleRad, double[] sM, Func<int, double, double> uM,
        double[] timesS, Func<int, double, double>? rowTime = null)
    {
        int marks = sM.Length + 2, frames = timesS.Length;
        var x = new double[frames, marks];
        var y = new double[frames, marks];
        var q = new double[frames, marks];
        double ex = Math.Cos(angleRad), ey = Math.Sin(angleRad), nx = -ey, ny = ex;
        (double X, double Y) origin = (100, 200);
        for (int k = 0; k < frames; k++)
        {
            for (int m = 0; m < marks; m++)
            {
                double s = m == 0 ? 0 : m == marks - 1 ? lengthM : sM[m - 1];
                double u = m == 0 || m == marks - 1 ? 0 : uM(m - 1, timesS[k]);
                x[k, m] = origin.X + (s * ex + u * nx) * pxPerM;
                y[k, m] = origin.Y + (s * ey + u * ny) * pxPerM;
                q[k, m] = 1;
            }
        }

        return new Tracks(timesS, x, y, q);
    }

    [Fact]
    public void TiltedString_GivesPositionsAndDisplacementsInMetres()
    {
        double[] s = [0.1625, 0.325, 0.4875];
        var times = Enumerable.Range(0, 50).Select(k => k / 240.0).ToArray();
        Func<int, double, double> u = (i, t) => 0.002 * Math.Sin(Math.PI * s[i] / 0.65) * Math.Cos(2 * Math.PI * 20 * t);
        var tracks = Build(0.65, 1500, Math.PI / 6, s, u, times);
        var r = StringFrame.Compute(tracks, new StringFrameOptions { LengthM = 0.65 });
        // Pure geometry in double precision: agreement to 1e-12 m.
        Assert.Equal(1 / 1500.0, r.MetresPerUnit, 1e-15);
        for (int i = 0; i < 3; i++)
        {
            Assert.Equal(s[i], r.Coordinates.PositionsM[i], 1e-12);
            for (int k = 0; k < times.Length; k++)
            {
                Assert.Equal(u(i, times[k]), r.Coordinates.DisplacementM[k, i], 1e-12);
                Assert.Equal(1, r.Coordinates.Weight[k, i]);
            }
        }

        Assert.Empty(r.Warnings);
    }

    [Fact]
    public void LostSample_IsNaNWithZeroWeight()
    {
        double[] s = [0.2, 0.3, 0.4];
        var times = Enumerable.Range(0, 10).Select(k => k / 100.0).ToArray();
        var tracks = Build(0.6, 1000, 0, s, (i, t) => 0.001 * t, times);
        tracks.XPx[4, 2] = double.NaN;
        tracks.YPx[4, 2] = double.NaN;
        tracks.Quality[4, 2] = 0;
        var r = StringFrame.Compute(tracks, new StringFrameOptions { LengthM = 0.6 });
        Assert.True(double.IsNaN(r.Coordinates.DisplacementM[4, 1]));
        Assert.Equal(0, r.Coordinates.Weight[4, 1]);
        // u = 0.001 m/s · t at t = 0.04 s.
        Assert.Equal(0.00004, r.Coordinates.DisplacementM[4, 0], 1e-12);
    }

    [Fact]
    public void RollingShutter_ResamplingRemovesRowDelayPhase()
    {
        // REFERENCES.md §7 [computed]: 1080 rows, 30 ms readout, rows 500 apart → 13.889 ms delay (50° at 10 Hz).
        // Here a vertical string, marks 500 rows apart, a 2 Hz motion at 30 fps: the raw delay is 10°.
        const double readout = 0.030, f = 2;
        const int rows = 1080;
        double[] s = [0.1, 0.3, 0.5];
        var times = Enumerable.Range(0, 120).Select(k => k / 30.0).ToArray();
        const double pxPerM = 1000;
        // Ends at rows 200 and 200 + 0.6·1000 = 800 (string vertical, angle 90°); mark i at row 200 + s_i·1000.
        double RowTime(int i, double tFrame) => tFrame + (200 + s[i] * pxPerM) / rows * readout;
        var tracks = Build(0.6, pxPerM, Math.PI / 2, s, (i, t) => 0.001 * Math.Cos(2 * Math.PI * f * RowTime(i, t)), times);
        double rawDelay = (s[2] - s[0]) * pxPerM / rows * readout;
        Assert.Equal(0.4 * 30 / 1080.0 * 1000 / 1000, rawDelay, 1e-12);

        var r = StringFrame.Compute(tracks, new StringFrameOptions { LengthM = 0.6, ReadoutS = readout, FrameHeightPx = rows });
        double worst = 0, worstInterior = 0;
        for (int k = 1; k < times.Length - 1; k++)
        {
            for (int i = 0; i < 3; i++)
            {
                double expected = 0.001 * Math.Cos(2 * Math.PI * f * r.Coordinates.TimesS[k]);
                // Transverse axis is (−e_y, e_x) = (−1, 0) for a downward string; u was built along it.
                double e = Math.Abs(r.Coordinates.DisplacementM[k, i] - expected);
                worst = Math.Max(worst, e);
                if (k >= 6 && k < times.Length - 6)
                {
                    worstInterior = Math.Max(worstInterior, e);
                }
            }
        }

        // The uncorrected 10° phase error would be up to 2·sin(5°) ≈ 0.17 of the amplitude. Natural cubic spline,
        // tone at f/fs = 1/15: interior error ~ (2πf/fs)⁴/384 ≈ 1e-4 of the amplitude (Numerical Recipes §3.3 error
        // order); the natural end conditions add up to ~0.5% in the first and last few frames.
        Assert.True(worstInterior < 2e-4 * 0.001, $"interior {worstInterior}");
        Assert.True(worst < 5e-3 * 0.001, $"worst {worst}");
        Assert.Equal(1 / 30.0 + readout / 2, r.Coordinates.TimesS[1], 1e-12);
    }

    [Fact]
    public void PlaneCalibration_RecoversPositionsUnderPerspective()
    {
        // Image = H_true(plane); a known projective map with visible perspective terms.
        double[] H = [800, 40, 300, -20, 780, 250, 0.15, 0.05, 1];
        (double, double) ToImage((double X, double Y) p)
        {
            double w = H[6] * p.X + H[7] * p.Y + H[8];
            return ((H[0] * p.X + H[1] * p.Y + H[2]) / w, (H[3] * p.X + H[4] * p.Y + H[5]) / w);
        }

        var plane = new List<(double X, double Y)> { (0, 0), (1, 0), (1, 0.5), (0, 0.5) };
        var image = plane.Select(ToImage).ToList();
        var h = Homography.FromPoints(image, plane);
        var back = h.Map(ToImage((0.37, 0.21)).Item1, ToImage((0.37, 0.21)).Item2);
        Assert.Equal(0.37, back.X, 1e-9);
        Assert.Equal(0.21, back.Y, 1e-9);

        // String along the plane's x from (0.1, 0.25) to (0.75, 0.25), marks at quarter points, no motion.
        double[] s = [0.1625, 0.325, 0.4875];
        var times = new[] { 0.0, 0.01, 0.02 };
        int marks = 5;
        var x = new double[3, marks];
        var y = new double[3, marks];
        var q = new double[3, marks];
        double[] all = [0, .. s, 0.65];
        for (int k = 0; k < 3; k++)
        {
            for (int m = 0; m < marks; m++)
            {
                (x[k, m], y[k, m]) = ToImage((0.1 + all[m], 0.25 + (m is > 0 and < 4 ? 0.001 * k : 0)));
                q[k, m] = 1;
            }
        }

        var r = StringFrame.Compute(new Tracks(times, x, y, q), new StringFrameOptions { LengthM = 0.65, Plane = new PlaneCalibration(image, plane) });
        for (int i = 0; i < 3; i++)
        {
            // Fit from exact points: 1e-9 m covers the linear solve's rounding.
            Assert.Equal(s[i], r.Coordinates.PositionsM[i], 1e-9);
            Assert.Equal(0.002, r.Coordinates.DisplacementM[2, i], 1e-9);
        }
    }
}
