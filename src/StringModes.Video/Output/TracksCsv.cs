using System.Globalization;
using System.Text;
using StringModes.Shared;
using StringModes.Analysis.Geometry;

namespace StringModes.Video.Output;

/// <summary>tracks.csv: <c>frame,time_s,mark,x_px,y_px,quality</c>, one row per mark per frame; mark 0 and the last are the ends; empty x/y where a mark was not seen.</summary>
public static class TracksCsv
{
    /// <summary>Header line.</summary>
    public const string Header = "frame,time_s,mark,x_px,y_px,quality";

    /// <summary>Writes the tracks atomically to <paramref name="path"/>.</summary>
    public static void Write(string path, Tracks tracks)
        => AtomicFile.Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true);
            writer.NewLine = "\n";
            writer.WriteLine(Header);
            for (var k = 0; k < tracks.FrameCount; k++)
            {
                var t = tracks.TimesS[k].ToString("R", CultureInfo.InvariantCulture);
                for (var i = 0; i < tracks.MarkCount; i++)
                {
                    var seen = tracks.Quality[k, i] > 0 && double.IsFinite(tracks.XPx[k, i]);
                    writer.Write(k.ToString(CultureInfo.InvariantCulture));
                    writer.Write(',');
                    writer.Write(t);
                    writer.Write(',');
                    writer.Write(i.ToString(CultureInfo.InvariantCulture));
                    writer.Write(',');
                    if (seen) writer.Write(tracks.XPx[k, i].ToString("0.#####", CultureInfo.InvariantCulture));
                    writer.Write(',');
                    if (seen) writer.Write(tracks.YPx[k, i].ToString("0.#####", CultureInfo.InvariantCulture));
                    writer.Write(',');
                    writer.WriteLine(tracks.Quality[k, i].ToString("0.###", CultureInfo.InvariantCulture));
                }
            }
        });
}
