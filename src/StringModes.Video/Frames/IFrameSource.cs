using OpenCvSharp;

namespace StringModes.Video.Frames;

/// <summary>
/// A sequence of decoded frames with their capture timestamps. <see cref="Read"/> reuses one buffer, so a frame is
/// valid until the next call. Pixels are 8- or 16-bit, 1 or 3 channels (BGR); <see cref="PixelAccess"/> reads them
/// uniformly in 8-bit digital numbers.
/// </summary>
public interface IFrameSource : IDisposable
{
    /// <summary>Clip path as given.</summary>
    string Path { get; }

    /// <summary>Frame width in pixels.</summary>
    int WidthPx { get; }

    /// <summary>Frame height in pixels.</summary>
    int HeightPx { get; }

    /// <summary>Frame rate declared by the file (frames/s), NaN when none.</summary>
    double DeclaredFps { get; }

    /// <summary>Frame count declared by the file, or −1 when unknown.</summary>
    int DeclaredFrameCount { get; }

    /// <summary>Reads the next frame; false at the end of the clip (or at damage, see <see cref="Warnings"/>).</summary>
    bool Read(out Mat frame, out double timestampS);

    /// <summary>Reads the next frame into <paramref name="target"/> (reallocated only when its size or type differs); false at the end.</summary>
    bool ReadInto(Mat target, out double timestampS);

    /// <summary>
    /// Moves so that the next <see cref="Read"/> returns frame <paramref name="index"/> without decoding the frames
    /// before it where the format allows (a video seeks to the nearest key frame and decodes from there).
    /// False when the source cannot skip; it is then unchanged and can still be read in order.
    /// </summary>
    bool TrySkipTo(int index);

    /// <summary>Problems met while reading (truncation, damaged frames).</summary>
    IReadOnlyList<string> Warnings { get; }
}
