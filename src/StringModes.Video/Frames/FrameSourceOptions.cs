namespace StringModes.Video.Frames;

/// <summary>How to open a clip.</summary>
public sealed record FrameSourceOptions
{
    /// <summary>
    /// True capture rate in frames per second for slow-motion clips whose container declares the playback rate;
    /// &gt; 0; default null (use the container's timestamps as they are). When set, timestamps are scaled by
    /// declared rate / capture rate.
    /// </summary>
    public double? CaptureFps { get; init; }

    /// <summary>
    /// Frame rate of an image-sequence folder in frames per second; &gt; 0; default null, which is an error for folders
    /// (a folder has no timestamps). Ignored for video files unless <see cref="CaptureFps"/> is null and the file has no rate.
    /// </summary>
    public double? SequenceFps { get; init; }

    /// <summary>Part of the frame to deliver; default null (whole frame). Positions stay in full-frame pixels.</summary>
    public RegionOfInterest? Region { get; init; }
}
