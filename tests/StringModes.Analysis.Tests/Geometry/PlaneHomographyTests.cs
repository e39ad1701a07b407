using StringModes.Analysis.Geometry;

namespace StringModes.Analysis.Tests.Geometry;

/// <summary>
/// A camera not square to the rig: the homography from four plane points (Hartley &amp; Zisserman, Multiple View
/// Geometry, 2nd ed.: a plane projective transform is fixed by four points in general position, §2.3 and §4.1).
/// </summary>
public class PlaneHomographyTests
{
    // An invented camera: plane metres → image pixels, with strong perspective (h31, h32 ≠ 0).
    private static (double X, double Y) Camera(double x, double y)
    {
        var w = 0.15 * x + 0.3 * y + 1;
        return ((800 * x + 120 * y + 100) / w, (10 * x + 700 * y + 80) / w);
    }

    private static readonly (double X, double Y)[] PlaneCorners = [(0, 0), (1, 0), (1, 0.4), (0, 0.4)];

    [Fact]
    public void Four_points_fix_the_transform_everywhere_on_the_plane()
    {
        var image = PlaneCorners.Select(p => Camera(p.X, p.Y)).ToList();
        var h = Homography.FromPoints(image, PlaneCorners);
        // Any other point maps back to where the camera saw it from (1e-9 m: rounding, conditioning of the 8×8 solve).
        foreach (var (x, y) in new[] { (0.5, 0.2), (0.13, 0.37), (0.91, 0.05), (1.4, -0.2) })
        {
            var (px, py) = Camera(x, y);
            var (mx, my) = h.Map(px, py);
            Assert.Equal(x, mx, 1e-9);
            Assert.Equal(y, my, 1e-9);
        }
    }

    [Fact]
    public void Degenerate_points_are_refused()
        => Assert.Throws<ArgumentException>(() => Homography.FromPoints([(0, 0), (1, 1), (2, 2), (0, 5)], PlaneCorners));

    [Fact]
    public void String_coordinates_on_a_tilted_rig_are_recovered_with_the_plane_and_biased_without()
    {
        const double length = 0.8, amplitude = 0.005, f = 10;
        double[] s = [0.2, 0.4, 0.6];
        var frames = 100;
        var times = Enumerable.Range(0, frames).Select(k => k / 1000.0).ToArray();
        var x = new double[frames, 5];
        var y = new double[frames, 5];
        var q = new double[frames, 5];
        for (var k = 0; k < frames; k++)
            for (var i = 0; i < 5; i++)
            {
                var along = i == 0 ? 0 : i == 4 ? length : s[i - 1];
                var u = i is 0 or 4 ? 0 : amplitude * Math.Sin(Math.PI * along / length) * Math.Cos(2 * Math.PI * f * times[k]);
                (x[k, i], y[k, i]) = Camera(0.1 + along, 0.2 + u);
                q[k, i] = 1;
            }
        var tracks = new Tracks(times, x, y, q);
        var plane = Homography.FromPoints(PlaneCorners.Select(p => Camera(p.X, p.Y)).ToList(), PlaneCorners);

        var mapped = StringFrame.Build(tracks, length, 0, 1000, 0, frames - 1, plane);
        var naive = StringFrame.Build(tracks, length, 0, 1000, 0, frames - 1);
        // The sign of "transverse" follows the handedness of the coordinates (image rows run down, the plane's y
        // as the user gives it), so displacements are compared up to one common sign.
        double Worst(StringCoordinates c, int sign)
        {
            double worst = 0;
            for (var k = 0; k < frames; k++)
                for (var i = 0; i < 3; i++)
                {
                    var truth = amplitude * Math.Sin(Math.PI * s[i] / length) * Math.Cos(2 * Math.PI * f * times[k]);
                    worst = Math.Max(worst, Math.Abs(c.DisplacementM[k, i] - sign * truth));
                }
            return worst;
        }
        var worstMapped = Math.Min(Worst(mapped, 1), Worst(mapped, -1));
        var worstNaive = Math.Min(Worst(naive, 1), Worst(naive, -1));
        for (var i = 0; i < 3; i++) Assert.Equal(s[i], mapped.PositionsM[i], 1e-9);
        // On the plane the geometry is exact up to rounding (1e-9 m); in raw pixels the perspective scale varies
        // along the string, so displacements are off by a sizeable fraction of the 5 mm amplitude.
        Assert.True(worstMapped < 1e-9, $"with the plane: worst error {worstMapped:E2} m");
        Assert.True(worstNaive > 2e-4, $"without the plane the error should be visible: {worstNaive:E2} m");
    }
}
