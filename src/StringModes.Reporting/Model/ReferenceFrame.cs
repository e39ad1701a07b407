namespace StringModes.Reporting.Model;

/// <summary>A point in image pixels (origin top left, y down).</summary>
public readonly record struct ImagePoint(double XPx, double YPx);

/// <summary>A tracked mark: rest position and the extent of its track over the analysis (min/max excursion).</summary>
/// <param name="Index">Mark number shown beside it (1 = nearest the first end).</param>
/// <param name="RestPx">Position in the reference frame, pixels.</param>
/// <param name="MinPx">Smallest x and y reached by the track, pixels.</param>
/// <param name="MaxPx">Largest x and y reached by the track, pixels.</param>
public sealed record TrackedMark(int Index, ImagePoint RestPx, ImagePoint MinPx, ImagePoint MaxPx);

/// <summary>
/// The reference frame image and what was found on it. The image is either encoded (PNG, JPEG, …) or raw
/// 8-bit BGR pixels as a video decoder delivers them.
/// </summary>
public sealed record ReferenceFrame
{
    /// <summary>Encoded image bytes (PNG/JPEG/WebP/BMP); null when <see cref="BgrPixels"/> is used.</summary>
    public byte[]? EncodedImage { get; init; }

    /// <summary>Raw 8-bit BGR pixels, row-major; null when <see cref="EncodedImage"/> is used.</summary>
    public byte[]? BgrPixels { get; init; }

    /// <summary>Width of <see cref="BgrPixels"/> in pixels.</summary>
    public int BgrWidthPx { get; init; }

    /// <summary>Height of <see cref="BgrPixels"/> in pixels.</summary>
    public int BgrHeightPx { get; init; }

    /// <summary>Bytes per row of <see cref="BgrPixels"/>; 0 means 3 × width.</summary>
    public int BgrStrideBytes { get; init; }

    /// <summary>The two string ends, pixels.</summary>
    public required ImagePoint FirstEndPx { get; init; }

    /// <summary>The second string end, pixels.</summary>
    public required ImagePoint SecondEndPx { get; init; }

    /// <summary>The marks found and tracked.</summary>
    public required IReadOnlyList<TrackedMark> Marks { get; init; }
}
