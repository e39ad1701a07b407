namespace StringModes.Video.Synthesis;

/// <summary>How a synthesised clip is stored.</summary>
public enum ClipFormat
{
    /// <summary>Lossless FFV1 in Matroska (.mkv).</summary>
    Ffv1,
    /// <summary>MPEG-4 part 2 in an MP4 container (.mp4, .mov); lossy.</summary>
    Mpeg4,
    /// <summary>Motion JPEG in AVI (.avi); lossy.</summary>
    Mjpeg,
    /// <summary>A folder of 8-bit PNG images.</summary>
    PngSequence,
    /// <summary>A folder of 16-bit TIFF images.</summary>
    Tiff16Sequence,
}

/// <summary>Picks a <see cref="ClipFormat"/> from an output path.</summary>
public static class ClipFormats
{
    /// <summary>
    /// .mkv → FFV1, .mp4/.mov → MPEG-4, .avi → MJPEG, a path without extension → PNG sequence folder
    /// (or 16-bit TIFF when <paramref name="sequenceFormat"/> is "tiff16").
    /// </summary>
    public static ClipFormat FromPath(string path, string? sequenceFormat)
    {
        var ext = Path.GetExtension(path.TrimEnd('/', '\\')).ToLowerInvariant();
        return ext switch
        {
            ".mkv" => ClipFormat.Ffv1,
            ".mp4" or ".mov" => ClipFormat.Mpeg4,
            ".avi" => ClipFormat.Mjpeg,
            "" => sequenceFormat?.ToLowerInvariant() switch
            {
                null or "png" => ClipFormat.PngSequence,
                "tiff16" => ClipFormat.Tiff16Sequence,
                _ => throw new ArgumentException($"unknown image-sequence format '{sequenceFormat}'; use png or tiff16"),
            },
            _ => throw new ArgumentException($"{path}: unknown clip extension '{ext}'; use .mkv (lossless FFV1), .mp4 (MPEG-4), .avi (MJPEG) or a folder name without extension for an image sequence"),
        };
    }

    /// <summary>True for image-sequence folders.</summary>
    public static bool IsSequence(this ClipFormat format) => format is ClipFormat.PngSequence or ClipFormat.Tiff16Sequence;
}
