using System.Globalization;
using System.Text;
using StringModes.Analysis.Geometry;

namespace StringModes.Video.Tracking;

/// <summary>
/// Writes tracks as CSV: header <c>frame,time_s,mark,x_px,y_px,quality</c>, one row per mark per frame; a lost mark
/// has empty x_px and y_px and quality 0. Written to a temporary file beside the target and renamed, so a reader
/// never sees half a file.
/// </summary>
public static class TracksCsv
{
    public const string Header = "frame,time_s,mark,x_px,y_px,quality";

    public static void Write(Tracks tracks, string path)
    {
        string full = Path.GetFullPath(path);
        string temp = full + ".tmp-" + Environment.ProcessId.ToString(CultureInfo.InvariantCulture);
        try
        {
            using (var w = new StreamWriter(temp, false, new UTF8Encoding(false)))
            {
                Write(tracks, w);
            }

            File.Move(temp, full, overwrite: true);
        }
        catch
        {
            File.Delete(temp);
            throw;
        }
    }

    public static void Write(Tracks tracks, TextWriter w)
    {
        var inv = CultureInfo.InvariantCulture;
        w.Write(Header);
        w.Write('\n');
        for (int k = 0; k < tracks.FrameCount; k++)
        {
            string time = tracks.TimesS[k].ToString("R", inv);
            for (int m = 0; m < tracks.MarkCount; m++)
            {
                w.Write(k.ToString(inv));
                w.Write(',');
                w.Write(time);
                w.Write(',');
                w.Write(m.ToString(inv));
                w.Write(',');
                if (double.IsFinite(tracks.XPx[k, m]) && double.IsFinite(tracks.YPx[k, m]))
                {
                    w.Write(tracks.XPx[k, m].ToString("0.#####", inv));
                    w.Write(',');
                    w.Write(tracks.YPx[k, m].ToString("0.#####", inv));
                }
                else
                {
                    w.Write(',');
                }

                w.Write(',');
                w.Write(tracks.Quality[k, m].ToString("0.####", inv));
                w.Write('\n');
            }
        }
    }
}
