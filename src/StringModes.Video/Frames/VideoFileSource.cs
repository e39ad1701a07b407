using OpenCvSharp;
using StringModes.Video.Files;

namespace StringModes.Video.Frames;

/// <summary>
/// Frames of a video file (mp4, mov, mkv, avi; H.264, HEVC, MPEG-4, MJPEG, FFV1) decoded by OpenCV's FFmpeg backend,
/// with each frame's presentation timestamp (CAP_PROP_POS_MSEC).
/// </summary>
public sealed class VideoFileSource : IFrameSource
{
    private readonly VideoCapture _capture;
    private readonly Mat _frame = new();
    private readonly List<string> _warnings = [];
    private int _read;
    private double _lastTimestamp = double.NegativeInfinity;

    public VideoFileSource(string path) : this(path, lumaOnly: false) { }

    private VideoFileSource(string path, bool lumaOnly)
    {
        Path = path;
        LumaOnly = lumaOnly;
        InputFiles.RequireReadable(path, "a video file", "record or copy the clip again");
        _capture = lumaOnly
            ? new VideoCapture(path, VideoCaptureAPIs.FFMPEG, [(int)VideoCaptureProperties.ConvertRgb, 0])
            : new VideoCapture(path, VideoCaptureAPIs.FFMPEG);
        if (!_capture.IsOpened())
        {
            _capture.Dispose();
            throw new InputFileException($"{path}: not a readable video (unknown container or codec, or damaged or cut short: a recording stopped early has no index); copy it again from the camera, or convert it to H.264 MP4 or an image sequence");
        }
        WidthPx = _capture.FrameWidth;
        HeightPx = _capture.FrameHeight;
        var fps = _capture.Fps;
        DeclaredFps = fps > 0 && double.IsFinite(fps) ? fps : double.NaN;
        var count = _capture.FrameCount;
        DeclaredFrameCount = count > 0 ? count : -1;
        if (WidthPx <= 0 || HeightPx <= 0 || WidthPx > 16384 || HeightPx > 16384)
        {
            _capture.Dispose();
            throw new InputFileException($"{path}: frame size {WidthPx}×{HeightPx} is not usable; the file is damaged or not a video");
        }
    }

    /// <summary>
    /// Opens the clip so that each frame is its luma (Y) plane alone, one 8-bit channel, without the conversion to
    /// BGR that otherwise costs about a quarter of the decoding time at 1080p. Only 8-bit planar YUV and grey streams
    /// qualify (their first plane is the luma); any other pixel format (packed RGB, 10-bit, …) gives null, and the
    /// caller keeps decoding colour frames.
    /// </summary>
    public static VideoFileSource? TryOpenLuma(string path)
    {
        // The backend logs a warning per frame when it hands out the decoder's own format; that is the intent here.
        if (Cv2.GetLogLevel() > LogLevel.ERROR) Cv2.SetLogLevel(LogLevel.ERROR);
        var source = new VideoFileSource(path, lumaOnly: true);
        var tag = source._capture.Get(VideoCaptureProperties.CodecPixelFormat);
        if (tag > 0 && LumaFirstFormats.Contains((uint)tag)) return source;
        source.Dispose();
        return null;
    }

    // FourCC tags (as FFmpeg maps its pixel formats) of 8-bit formats whose first plane is the full-size luma:
    // planar YUV 4:2:0, 4:2:2, 4:4:4 (limited and full range share the tag), semi-planar NV12/NV21, and grey.
    private static readonly HashSet<uint> LumaFirstFormats =
        [FourCc("I420"), FourCc("IYUV"), FourCc("YV12"), FourCc("Y42B"), FourCc("444P"), FourCc("NV12"), FourCc("NV21"), FourCc("Y800"), FourCc("GREY")];

    private static uint FourCc(string s) => s[0] | (uint)s[1] << 8 | (uint)s[2] << 16 | (uint)s[3] << 24;

    /// <summary>True when frames are the luma plane alone (see <see cref="TryOpenLuma"/>).</summary>
    public bool LumaOnly { get; }

    public string Path { get; }
    public int WidthPx { get; }
    public int HeightPx { get; }
    public double DeclaredFps { get; }
    public int DeclaredFrameCount { get; }
    public IReadOnlyList<string> Warnings => _warnings;

    /// <inheritdoc/>
    public bool TrySkipTo(int index)
    {
        if (_read != 0 || index <= 0 || (DeclaredFrameCount > 0 && index >= DeclaredFrameCount)) return false;
        // The backend seeks to the key frame before the target and decodes forward to it; a failed seek leaves the
        // capture at the start, which is checked by reading the position back.
        bool ok;
        try { ok = _capture.Set(VideoCaptureProperties.PosFrames, index) && (int)Math.Round(_capture.Get(VideoCaptureProperties.PosFrames)) == index; }
        catch (OpenCVException) { ok = false; }
        if (!ok)
        {
            try { _capture.Set(VideoCaptureProperties.PosFrames, 0); } catch (OpenCVException) { }
            return false;
        }
        _read = index;
        return true;
    }

    /// <inheritdoc/>
    public bool Read(out Mat frame, out double timestampS)
    {
        frame = _frame;
        return ReadInto(_frame, out timestampS);
    }

    /// <inheritdoc/>
    public bool ReadInto(Mat target, out double timestampS)
    {
        timestampS = double.NaN;
        bool ok;
        try { ok = _capture.Read(target) && !target.Empty(); }
        catch (OpenCVException) { ok = false; }
        if (!ok)
        {
            if (DeclaredFrameCount > 0 && _read < DeclaredFrameCount - 1)
                _warnings.Add($"{Path}: decoding stopped after {_read} of {DeclaredFrameCount} declared frames; the file may be truncated or damaged, so only the frames before the damage were used");
            return false;
        }
        if (target.Cols != WidthPx || target.Rows != HeightPx)
        {
            _warnings.Add($"{Path}: frame {_read} changed size to {target.Cols}×{target.Rows}; stopped there");
            return false;
        }
        var ms = _capture.Get(VideoCaptureProperties.PosMsec);
        var nominal = double.IsNaN(DeclaredFps) ? double.NaN : _read / DeclaredFps;
        // Some containers report no timestamp (0 for every frame): fall back to the declared rate.
        timestampS = ms > 0 || _read == 0 ? ms / 1000.0 : nominal;
        // Containers such as Matroska store whole milliseconds: a constant-rate clip's timestamps then sit within
        // 1 ms of k/rate. Those are snapped to the declared rate; real variable-rate clips drift further and keep theirs.
        if (!double.IsNaN(nominal) && Math.Abs(timestampS - nominal) <= 1.0e-3 + 1e-9) timestampS = nominal;
        if (!(timestampS > _lastTimestamp)) timestampS = double.IsNaN(nominal) ? _lastTimestamp + 1e-3 : Math.Max(nominal, _lastTimestamp + 1e-9);
        _lastTimestamp = timestampS;
        _read++;
        return true;
    }

    public void Dispose()
    {
        _capture.Dispose();
        _frame.Dispose();
    }
}
