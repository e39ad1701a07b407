namespace StringModes.Video.Frames;

/// <summary>Opens a clip: a video file (mp4, mov, mkv, avi, …) or a folder of PNG/TIFF frames.</summary>
public static class FrameSources
{
    /// <summary>Opens <paramref name="path"/>; throws <see cref="InputException"/> when it cannot be read.</summary>
    public static IFrameSource Open(string path, FrameSourceOptions? options = null)
    {
        options ??= new FrameSourceOptions();
        if (options.CaptureFps is <= 0 || options.SequenceFps is <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(options), "frame rates must be > 0");
        }

        if (Directory.Exists(path))
        {
            return new ImageSequenceSource(path, options);
        }

        string ext = System.IO.Path.GetExtension(path).ToLowerInvariant();
        if (ext is ".png" or ".tif" or ".tiff")
        {
            throw new InputException(path, $"{path}: a single image is not a clip; give the folder that holds the frames");
        }

        return new VideoFileSource(path, options);
    }
}
