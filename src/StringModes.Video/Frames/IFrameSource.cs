using OpenCvSharp;

namespace StringModes.Video.Frames;

/// <summary>
/// A clip read frame by frame into one reusable grey plane. Reading does not allocate per frame.
/// </summary>
public interface IFrameSource : IDisposable
{
    /// <summary>The clip file or folder.</summary>
    string Path { get; }

    /// <summary>Full frame width in pixels (before the region of interest).</summary>
    int FrameWidth { get; }

    /// <summary>Full frame height in pixels (before the region of interest).</summary>
    int FrameHeight { get; }

    /// <summary>The delivered part of the frame; the whole frame when no region was asked for.</summary>
    RegionOfInterest Region { get; }

    /// <summary>Rate the container declares (or the stated sequence rate), frames per second; 0 if unknown.</summary>
    double DeclaredFps { get; }

    /// <summary>Number of frames the container declares; 0 if unknown.</summary>
    int DeclaredFrameCount { get; }

    /// <summary>True when samples are 16-bit (CV_16UC1), false for 8-bit (CV_8UC1).</summary>
    bool IsSixteenBit { get; }

    /// <summary>
    /// The grey plane of the current frame, <see cref="Region"/> sized, CV_8UC1 or CV_16UC1. The same Mat is
    /// overwritten by every <see cref="Read"/>; copy it to keep a frame.
    /// </summary>
    Mat Grey { get; }

    /// <summary>Index of the current frame (0 for the first frame read).</summary>
    int FrameIndex { get; }

    /// <summary>Capture time of the current frame in seconds (presentation timestamp, slow-motion factor applied).</summary>
    double TimeS { get; }

    /// <summary>Things the user should know (truncation, suspicious timestamps). Grows while reading.</summary>
    IReadOnlyList<string> Warnings { get; }

    /// <summary>Reads the next frame into <see cref="Grey"/>; false at the end of the clip.</summary>
    bool Read();
}
