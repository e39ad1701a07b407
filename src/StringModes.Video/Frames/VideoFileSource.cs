using OpenCvSharp;

namespace StringModes.Video.Frames;

/// <summary>
/// Video file read through OpenCV's FFmpeg back end. Times come from the presentation timestamps
/// (CAP_PROP_POS_MSEC after each read), not from the nominal rate, so variable-rate clips keep their true times.
/// </summary>
internal sealed class VideoFileSource : IFrameSource
{
    private readonly VideoCapture capture;
    private readonly Mat decoded = new();
    private readonly Mat greyFull;
    private readonly List<string> warnings = [];
    private readonly double timeScale;
    private readonly double fallbackStepS;
    private bool firstPending = true;
    private bool ended;
    private double lastRawS = double.NegativeInfinity;
    private bool warnedTimestamps;

    public VideoFileSource(string path, FrameSourceOptions options)
    {
        Path = path;
        if (!File.Exists(path))
        {
            throw new InputException(path, $"{path}: file not found; check the path");
        }

        capture = new VideoCapture(path, VideoCaptureAPIs.FFMPEG);
        if (!capture.IsOpened())
        {
            capture.Dispose();
            throw new InputException(path,
                $"{path}: cannot decode this file; convert it to MP4 (H.264) or MKV (FFV1), or give a folder of PNG/TIFF frames");
        }

        if (!capture.Read(decoded) || decoded.Empty())
        {
            capture.Dispose();
            throw new InputException(path, $"{path}: contains no decodable frames; check the file is complete and re-export it");
        }

        FrameWidth = decoded.Width;
        FrameHeight = decoded.Height;
        DeclaredFps = Sanitize(capture.Get(VideoCaptureProperties.Fps));
        DeclaredFrameCount = (int)Math.Max(0, Sanitize(capture.Get(VideoCaptureProperties.FrameCount)));
        IsSixteenBit = decoded.Depth() == MatType.CV_16U;
        Region = GreyConverter.Resolve(options.Region, FrameWidth, FrameHeight, path);
        greyFull = new Mat(FrameHeight, FrameWidth, IsSixteenBit ? MatType.CV_16UC1 : MatType.CV_8UC1);
        Grey = new Mat(greyFull, new Rect(Region.X, Region.Y, Region.Width, Region.Height));

        double? captureFps = options.CaptureFps;
        double nominal = DeclaredFps > 0 ? DeclaredFps : options.SequenceFps ?? 0;
        if (captureFps is > 0 && nominal > 0)
        {
            timeScale = nominal / captureFps.Value;
            fallbackStepS = 1.0 / captureFps.Value;
        }
        else
        {
            timeScale = 1;
            fallbackStepS = nominal > 0 ? 1.0 / nominal : captureFps is > 0 ? 1.0 / captureFps.Value : 0;
        }

        if (fallbackStepS <= 0)
        {
            capture.Dispose();
            throw new InputException(path, $"{path}: the file states no frame rate; give the capture rate (--capture-fps)");
        }

        GreyConverter.ToGrey(decoded, greyFull);
        StampCurrent();
        FrameIndex = 0;
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
    public IReadOnlyList<string> Warnings => warnings;

    public bool Read()
    {
        if (firstPending)
        {
            firstPending = false;
            return true;
        }

        if (ended)
        {
            return false;
        }

        if (!capture.Read(decoded) || decoded.Empty())
        {
            ended = true;
            CheckTruncation();
            return false;
        }

        if (decoded.Width != FrameWidth || decoded.Height != FrameHeight)
        {
            ended = true;
            warnings.Add($"{Path}: frame {FrameIndex + 1} changes size to {decoded.Width}x{decoded.Height}; reading stopped there");
            return false;
        }

        GreyConverter.ToGrey(decoded, greyFull);
        FrameIndex++;
        StampCurrent();
        return true;
    }

    private void StampCurrent()
    {
        double rawS = capture.Get(VideoCaptureProperties.PosMsec) / 1000.0;
        if (!double.IsFinite(rawS) || rawS <= lastRawS)
        {
            // Missing or repeated timestamps: fall back to the nominal step so times stay strictly increasing.
            if (FrameIndex > 0 && !warnedTimestamps)
            {
                warnings.Add($"{Path}: frame {FrameIndex} has a missing or non-increasing timestamp; nominal frame steps used from there");
                warnedTimestamps = true;
            }

            rawS = FrameIndex == 0 && lastRawS == double.NegativeInfinity ? 0 : lastRawS + fallbackStepS / timeScale;
        }

        lastRawS = rawS;
        TimeS = rawS * timeScale;
    }

    private void CheckTruncation()
    {
        int read = FrameIndex + 1;
        // Container frame counts are often estimated from duration × rate, so allow a little slack.
        if (DeclaredFrameCount > 0 && read < DeclaredFrameCount * 0.98 - 1)
        {
            warnings.Add($"{Path}: decoding stopped at frame {read} of {DeclaredFrameCount} declared; the file looks truncated or damaged, frames after that are missing");
        }
    }

    private static double Sanitize(double v) => double.IsFinite(v) && v > 0 ? v : 0;

    public void Dispose()
    {
        Grey.Dispose();
        greyFull.Dispose();
        decoded.Dispose();
        capture.Dispose();
    }
}
