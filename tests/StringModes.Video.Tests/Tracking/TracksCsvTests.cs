using StringModes.Analysis.Geometry;
using StringModes.Video.Tests.Support;
using StringModes.Video.Tracking;

namespace StringModes.Video.Tests.Tracking;

public sealed class TracksCsvTests
{
    [Fact]
    public void Tracks_WrittenOneRowPerMarkPerFrameWithLostMarksEmpty()
    {
        var x = new double[,] { { 1.5, 2.25 }, { double.NaN, 3 } };
        var y = new double[,] { { 10, 20 }, { double.NaN, 21.125 } };
        var q = new double[,] { { 1, 0.5 }, { 0, 0.75 } };
        var t = new Tracks([0, 0.004166666666666667], x, y, q);
        using var dir = new FixtureFolder();
        string path = dir.File("tracks.csv");
        TracksCsv.Write(t, path);
        // Snapshot of the file a user reads (header is the output contract in DESIGN.md).
        Assert.Equal(
            "frame,time_s,mark,x_px,y_px,quality\n" +
            "0,0,0,1.5,10,1\n" +
            "0,0,1,2.25,20,0.5\n" +
            "1,0.004166666666666667,0,,,0\n" +
            "1,0.004166666666666667,1,3,21.125,0.75\n",
            File.ReadAllText(path));
        Assert.Single(Directory.GetFiles(dir.Path));
    }
}
