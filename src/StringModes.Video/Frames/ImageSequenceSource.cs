using System.Text.RegularExpressions;
using OpenCvSharp;
using StringModes.Video.Files;

namespace StringModes.Video.Frames;

/// <summary>
/// Frames of a folder of numbered images (PNG, TIFF, JPEG; 8- or 16-bit) in natural order, at a stated rate.
/// All images must have the same size.
/// </summary>
public sealed partial class ImageSequenceSource : IFrameSource
{
    private static readonly string[] Extensions = [".png", ".tif", ".tiff", ".jpg", ".jpeg", ".bmp"];
    private readonly string[] _files;
    private readonly double _fps;
    private Mat _frame = new();
    private int _next;

    public ImageSequenceSource(string folder, double fps)
    {
        Path = folder;
        if (!(fps > 0))
            throw new InputFileException($"{folder}: an image sequence has no frame rate of its own; give --capture-fps");
        _fps = fps;
        string[] all;
        try { all = Directory.GetFiles(folder); }
        catch (UnauthorizedAccessException) { throw new InputFileException($"{folder}: permission denied; make the folder readable"); }
        _files = all.Where(f => Extensions.Contains(System.IO.Path.GetExtension(f).ToLowerInvariant()))
            .OrderBy(f => NaturalKey(System.IO.Path.GetFileName(f)), StringComparer.Ordinal).ToArray();
        if (_files.Length == 0)
            throw new InputFileException($"{folder}: holds no images (.png, .tif, .jpg); point at a folder of numbered frames or at a video file");
        using var first = Load(_files[0]);
        WidthPx = first.Cols;
        HeightPx = first.Rows;
    }

    public string Path { get; }
    public int WidthPx { get; }
    public int HeightPx { get; }
    public double DeclaredFps => double.NaN;
    public int DeclaredFrameCount => _files.Length;
    public IReadOnlyList<string> Warnings => [];

    private static Mat Load(string file)
    {
        // Checked before decoding: a named pipe among the frames would block the decoder for ever.
        InputFiles.RequireReadable(file, "an image", "replace or remove it");
        Mat m;
        try { m = Cv2.ImRead(file, ImreadModes.Unchanged); }
        catch (OpenCVException) { m = new Mat(); }
        if (m.Empty())
        {
            m.Dispose();
            throw new InputFileException($"{file}: not a readable image (damaged, or a format or size the decoder refuses); replace or remove it");
        }
        return m;
    }

    /// <inheritdoc/>
    public bool TrySkipTo(int index)
    {
        if (index < 0 || index >= _files.Length) return false;
        _next = index;
        return true;
    }

    /// <inheritdoc/>
    public bool Read(out Mat frame, out double timestampS)
    {
        timestampS = _next / _fps;
        if (_next >= _files.Length)
        {
            frame = _frame;
            return false;
        }
        var m = Load(_files[_next]);
        if (m.Cols != WidthPx || m.Rows != HeightPx)
        {
            var size = $"{m.Cols}×{m.Rows}";
            m.Dispose();
            throw new InputFileException($"{_files[_next]}: is {size} but the sequence started at {WidthPx}×{HeightPx}; all frames must have one size — remove the odd ones");
        }
        _frame.Dispose();
        _frame = m;
        frame = m;
        _next++;
        return true;
    }

    /// <inheritdoc/>
    public bool ReadInto(Mat target, out double timestampS)
    {
        if (!Read(out var frame, out timestampS)) return false;
        frame.CopyTo(target);
        return true;
    }

    private static string NaturalKey(string name) => Digits().Replace(name, d => d.Value.PadLeft(12, '0'));

    [GeneratedRegex("[0-9]+")]
    private static partial Regex Digits();

    public void Dispose() => _frame.Dispose();
}
