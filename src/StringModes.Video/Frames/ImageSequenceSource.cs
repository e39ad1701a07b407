using OpenCvSharp;

namespace StringModes.Video.Frames;

/// <summary>
/// A folder of PNG or TIFF frames (8- or 16-bit, grey or colour) in natural name order, at a stated rate.
/// Every frame must have the size and bit depth of the first.
/// </summary>
internal sealed class ImageSequenceSource : IFrameSource
{
    private static readonly string[] Extensions = [".png", ".tif", ".tiff"];
    private readonly string[] files;
    private readonly Mat greyFull;
    private readonly double stepS;
    private readonly MatType depth;
    private int next;

    public ImageSequenceSource(string folder, FrameSourceOptions options)
    {
        Path = folder;
        files = Directory.EnumerateFiles(folder)
            .Where(f => Extensions.Contains(System.IO.Path.GetExtension(f).ToLowerInvariant()))
            .OrderBy(f => System.IO.Path.GetFileName(f), NaturalOrder.Instance)
            .ToArray();
        if (files.Length == 0)
        {
            throw new InputException(folder, $"{folder}: folder holds no PNG or TIFF frames; give a video file or a folder of frames");
        }

        double? fps = options.SequenceFps ?? options.CaptureFps;
        if (fps is not > 0)
        {
            throw new InputException(folder, $"{folder}: an image folder has no timestamps; state its frame rate (--capture-fps)");
        }

        stepS = 1.0 / fps.Value;
        DeclaredFps = fps.Value;
        DeclaredFrameCount = files.Length;

        using var first = Decode(files[0]);
        FrameWidth = first.Width;
        FrameHeight = first.Height;
        depth = first.Depth();
        IsSixteenBit = depth == MatType.CV_16U;
        Region = GreyConverter.Resolve(options.Region, FrameWidth, FrameHeight, folder);
        greyFull = new Mat(FrameHeight, FrameWidth, IsSixteenBit ? MatType.CV_16UC1 : MatType.CV_8UC1);
        Grey = new Mat(greyFull, new Rect(Region.X, Region.Y, Region.Width, Region.Height));
        FrameIndex = -1;
    }

    public string Path { get; }
    public int FrameWidth { get; }
    public int FrameHeight { get; }
    public RegionOfInterest Region { get; }
    public double DeclaredFps { get; }
    public int DeclaredFrameCount { get; }
    public bool IsSixteenBit { get; }
    public Mat Grey { get; }
    public int FrameIndex { get; private set; }
    public double TimeS { get; private set; }
    public IReadOnlyList<string> Warnings => [];

    public bool Read()
    {
        if (next >= files.Length)
        {
            return false;
        }

        string file = files[next];
        // Image decoders allocate their output; the frame is disposed at once so memory stays flat.
        using (var image = Decode(file))
        {
            if (image.Width != FrameWidth || image.Height != FrameHeight || image.Depth() != depth)
            {
                throw new InputException(file,
                    $"{file}: frame is {image.Width}x{image.Height} ({BitsOf(image.Depth())}-bit) but the first frame is {FrameWidth}x{FrameHeight} ({BitsOf(depth)}-bit); every frame of a folder must match, remove or convert the odd ones");
            }

            GreyConverter.ToGrey(image, greyFull);
        }

        FrameIndex = next;
        TimeS = next * stepS;
        next++;
        return true;
    }

    private static Mat Decode(string file)
    {
        var image = Cv2.ImRead(file, ImreadModes.Unchanged);
        if (image.Empty())
        {
            image.Dispose();
            throw new InputException(file, $"{file}: cannot decode this image; re-export it as PNG or TIFF");
        }

        var d = image.Depth();
        if (d != MatType.CV_8U && d != MatType.CV_16U)
        {
            image.Dispose();
            throw new InputException(file, $"{file}: only 8- and 16-bit integer images are supported; re-export as 8- or 16-bit PNG/TIFF");
        }

        return image;
    }

    private static int BitsOf(MatType depth) => depth == MatType.CV_16U ? 16 : 8;

    public void Dispose()
    {
        Grey.Dispose();
        greyFull.Dispose();
    }
}
