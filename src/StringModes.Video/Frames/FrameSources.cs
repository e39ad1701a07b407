using StringModes.Video.Files;

namespace StringModes.Video.Frames;

/// <summary>Opens a clip: a video file or a folder of images.</summary>
public static class FrameSources
{
    /// <summary>Opens <paramref name="path"/>; <paramref name="sequenceFps"/> is the rate of an image sequence.</summary>
    public static IFrameSource Open(string path, double? sequenceFps)
    {
        if (Directory.Exists(path)) return new ImageSequenceSource(path, sequenceFps ?? double.NaN);
        if (!File.Exists(path)) throw new InputFileException($"{path}: no such file or folder; check the path");
        return new VideoFileSource(path);
    }
}
