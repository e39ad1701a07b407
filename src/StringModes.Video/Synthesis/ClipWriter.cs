using OpenCvSharp;

namespace StringModes.Video.Synthesis;

/// <summary>
/// Writes rendered frames through OpenCV: FFV1/MPEG-4/MJPEG through its FFmpeg writer, or numbered PNG / 16-bit TIFF
/// images into a folder. Everything goes to a temporary path beside the target; <see cref="Commit"/> renames it into
/// place, so a failed or interrupted run leaves no partial clip.
/// </summary>
internal sealed class ClipWriter : IDisposable
{
    private readonly ClipFormat _format;
    private readonly string _target;
    private readonly string _temporary;
    private readonly int _w, _h;
    private readonly VideoWriter? _video;
    private readonly Mat _frame;
    private int _count;
    private bool _committed;

    public ClipWriter(string target, ClipFormat format, int widthPx, int heightPx, double containerFps, int quality)
    {
        _format = format;
        _target = Path.GetFullPath(target.TrimEnd('/', '\\'));
        _w = widthPx;
        _h = heightPx;
        Directory.CreateDirectory(Path.GetDirectoryName(_target)!);
        _temporary = TemporaryPathFor(target);
        // A constructor that throws is never disposed: whatever it created is removed here.
        try
        {
            if (format.IsSequence())
            {
                if (Directory.Exists(_temporary)) Directory.Delete(_temporary, true);
                Directory.CreateDirectory(_temporary);
                _frame = new Mat(heightPx, widthPx, format == ClipFormat.Tiff16Sequence ? MatType.CV_16UC3 : MatType.CV_8UC3);
                return;
            }
            var fourcc = format switch
            {
                ClipFormat.Ffv1 => VideoWriter.FourCC('F', 'F', 'V', '1'),
                ClipFormat.Mpeg4 => VideoWriter.FourCC('m', 'p', '4', 'v'),
                _ => VideoWriter.FourCC('M', 'J', 'P', 'G'),
            };
            _video = new VideoWriter(_temporary, VideoCaptureAPIs.FFMPEG, fourcc, containerFps, new Size(widthPx, heightPx), true);
            if (!_video.IsOpened())
                throw new IOException($"{target}: OpenCV could not open a {format} writer; check the folder is writable and the extension matches the format");
            _video.Set(VideoWriterProperties.Quality, quality);
            _frame = new Mat(heightPx, widthPx, MatType.CV_8UC3);
        }
        catch
        {
            _video?.Dispose();
            RemoveTemporary();
            throw;
        }
    }

    /// <summary>The hidden path the clip for <paramref name="target"/> is written to before <see cref="Commit"/>.</summary>
    public static string TemporaryPathFor(string target)
    {
        var full = Path.GetFullPath(target.TrimEnd('/', '\\'));
        return Path.Combine(Path.GetDirectoryName(full)!, $".{Path.GetFileName(full)}.partial-{Environment.ProcessId}{Path.GetExtension(full)}");
    }

    /// <summary>Quantises an RGB float frame (DN 0–255) and appends it.</summary>
    public unsafe void Write(float[] rgb)
    {
        if (_format == ClipFormat.Tiff16Sequence)
        {
            var p = (ushort*)_frame.DataPointer;
            for (var i = 0; i < _w * _h; i++)
            {
                // OpenCV stores BGR; 16-bit DN = 8-bit DN × 257 (full-scale 255 → 65535).
                p[i * 3] = (ushort)Math.Clamp(Math.Round(rgb[i * 3 + 2] * 257.0), 0, 65535);
                p[i * 3 + 1] = (ushort)Math.Clamp(Math.Round(rgb[i * 3 + 1] * 257.0), 0, 65535);
                p[i * 3 + 2] = (ushort)Math.Clamp(Math.Round(rgb[i * 3] * 257.0), 0, 65535);
            }
        }
        else
        {
            var p = (byte*)_frame.DataPointer;
            for (var i = 0; i < _w * _h; i++)
            {
                p[i * 3] = Quantise(rgb[i * 3 + 2]);
                p[i * 3 + 1] = Quantise(rgb[i * 3 + 1]);
                p[i * 3 + 2] = Quantise(rgb[i * 3]);
            }
        }
        if (_video is not null) _video.Write(_frame);
        else
        {
            var file = Path.Combine(_temporary, $"frame_{_count:D6}{(_format == ClipFormat.PngSequence ? ".png" : ".tif")}");
            if (!Cv2.ImWrite(file, _frame))
                throw new IOException($"{_target}: could not write image {Path.GetFileName(file)}; check free disk space");
        }
        _count++;
    }

    private static byte Quantise(float v) => v <= 0 ? (byte)0 : v >= 255 ? (byte)255 : (byte)(v + 0.5f);

    /// <summary>Closes the clip and moves it into place, replacing any clip already there.</summary>
    public void Commit()
    {
        _video?.Release();
        if (_format.IsSequence())
        {
            if (Directory.Exists(_target)) Directory.Delete(_target, true);
            Directory.Move(_temporary, _target);
        }
        else
        {
            if (!File.Exists(_temporary) || new FileInfo(_temporary).Length == 0)
                throw new IOException($"{_target}: the encoder wrote nothing; check free disk space");
            File.Move(_temporary, _target, true);
        }
        _committed = true;
    }

    public void Dispose()
    {
        _video?.Dispose();
        _frame.Dispose();
        if (_committed) return;
        RemoveTemporary();
    }

    private void RemoveTemporary()
    {
        try
        {
            if (Directory.Exists(_temporary)) Directory.Delete(_temporary, true);
            else if (File.Exists(_temporary)) File.Delete(_temporary);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Best effort: a leftover temporary file is hidden and named as partial.
        }
    }
}
