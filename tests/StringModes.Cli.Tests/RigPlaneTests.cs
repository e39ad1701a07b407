using StringModes.Video.Files;

namespace StringModes.Cli.Tests;

/// <summary>The rig file's four plane points (camera not square to the rig).</summary>
public class RigPlaneTests
{
    [Fact]
    public void Plane_points_give_a_homography_that_maps_them()
    {
        var rig = Rig.Parse("""{ "plane_image_px": [[100, 80], [760, 95], [740, 330], [115, 300]], "plane_m": [[0, 0], [1, 0], [1, 0.4], [0, 0.4]] }""", "rig.json");
        Assert.NotNull(rig.Plane);
        var (x, y) = rig.Plane!.Map(740, 330);
        // The points themselves map exactly (up to rounding of the 8×8 solve: 1e-9 m).
        Assert.Equal(1, x, 1e-9);
        Assert.Equal(0.4, y, 1e-9);
    }

    [Theory]
    [InlineData("""{ "plane_image_px": [[100, 80], [760, 95], [740, 330], [115, 300]] }""", "plane_image_px is given without plane_m")]
    [InlineData("""{ "plane_image_px": [[100, 80], [760, 95], [740, 330]], "plane_m": [[0, 0], [1, 0], [1, 0.4]] }""", "exactly four points")]
    [InlineData("""{ "plane_image_px": [[0, 0], [10, 10], [20, 20], [0, 50]], "plane_m": [[0, 0], [1, 0], [1, 0.4], [0, 0.4]] }""", "degenerate")]
    public void Bad_plane_points_are_refused_with_one_line(string text, string expected)
    {
        var e = Assert.Throws<InputFileException>(() => Rig.Parse(text, "rig.json"));
        Assert.Contains(expected, e.Message);
        Assert.StartsWith("rig.json: ", e.Message);
        Assert.DoesNotContain('\n', e.Message);
    }
}
